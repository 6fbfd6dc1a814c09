import type { Metadata } from "next";
import Link from "next/link";
import { FormAlert } from "@/components/forms/form-alert";
import { buttonClass } from "@/components/ui/button-class";
import { tokenSchema } from "@/lib/auth/fields";
import { checkPasswordResetToken } from "@/lib/auth/password-reset";
import { AuthCard } from "../../auth-card";
import { passwordResetProblems } from "../../link-problems";
import { CompleteResetForm } from "./complete-form";

export const metadata: Metadata = { title: "Choose a new password", robots: { index: false } };

export default async function CompleteResetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const state = tokenSchema.safeParse(token).success ? await checkPasswordResetToken({ token }) : "unknown";

  if (state !== "usable") {
    return (
      <AuthCard title="This link cannot be used">
        <FormAlert tone="error" message={passwordResetProblems[state]} />
        <Link href="/reset-password" className={buttonClass("secondary", "mt-6")}>
          Ask for a new link
        </Link>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Choose a new password" lead="Saving it signs you out on every other device.">
      <CompleteResetForm token={token} />
    </AuthCard>
  );
}
