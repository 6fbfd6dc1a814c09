import type { Metadata } from "next";
import Link from "next/link";
import { AuthCard } from "../auth-card";
import { RequestResetForm } from "./request-form";

export const metadata: Metadata = { title: "Reset your password" };

export default function RequestResetPage() {
  return (
    <AuthCard
      title="Reset your password"
      lead="Enter the e-mail address you sign in with. We will send a link to choose a new password."
    >
      <RequestResetForm />
      <p className="mt-6 text-sm text-ink-soft">
        Remembered it?{" "}
        <Link href="/sign-in" className="font-medium text-accent underline-offset-2 hover:underline">
          Back to sign in
        </Link>
      </p>
    </AuthCard>
  );
}
