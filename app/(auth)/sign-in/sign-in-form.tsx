"use client";

import Link from "next/link";
import { useActionState } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import { idleFormState } from "@/lib/http/form-state";
import { signIn, type SignInState } from "./actions";

export function SignInForm({ next, notice }: { next: string | null; notice: string | null }) {
  const [state, formAction, pending] = useActionState<SignInState, FormData>(signIn, idleFormState);
  const values = state.status === "error" ? state.values : {};
  const errors = state.status === "error" ? state.fieldErrors : {};
  return (
    <form action={formAction} noValidate className="space-y-5">
      <FormAlert
        tone={state.status === "error" ? "error" : "info"}
        message={state.status === "error" ? state.message : notice}
      />
      {next ? <input type="hidden" name="next" value={next} /> : null}
      <TextField
        label="E-mail address"
        name="email"
        type="email"
        autoComplete="email"
        required
        defaultValue={values.email}
        error={errors.email}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        required
        error={errors.password}
      />
      <SubmitButton pending={pending} pendingLabel="Signing in…">
        Sign in
      </SubmitButton>
      <p className="text-sm text-ink-soft">
        <Link href="/reset-password" className="font-medium text-accent underline-offset-2 hover:underline">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
