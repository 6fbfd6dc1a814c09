import type { Metadata } from "next";
import Link from "next/link";
import { FormAlert } from "@/components/forms/form-alert";
import { buttonClass } from "@/components/ui/button-class";
import { tokenSchema } from "@/lib/auth/fields";
import { previewInvitation } from "@/lib/auth/invitations";
import { AuthCard } from "../../auth-card";
import { invitationProblems } from "../../link-problems";
import { AcceptInvitationForm } from "./accept-form";

export const metadata: Metadata = { title: "Accept your invitation", robots: { index: false } };

const roleLabels = { learner: "a learner", instructor: "an instructor", admin: "an admin" } as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const preview = tokenSchema.safeParse(token).success ? await previewInvitation({ token }) : { state: "unknown" as const };

  if (preview.state !== "usable") {
    return (
      <AuthCard title="This link cannot be used">
        <FormAlert tone="error" message={invitationProblems[preview.state]} />
        <Link href="/sign-in" className={buttonClass("secondary", "mt-6")}>
          Go to sign in
        </Link>
      </AuthCard>
    );
  }

  const where = preview.cohortName ? `${preview.cohortName}, ${preview.schoolName}` : preview.schoolName;
  return (
    <AuthCard
      title="Welcome to Edgewise"
      lead={
        <>
          You are joining <strong className="font-semibold text-ink">{where}</strong> as {roleLabels[preview.role]}.
          Choose your name and password to finish.
        </>
      }
    >
      <AcceptInvitationForm token={token} email={preview.email} />
    </AuthCard>
  );
}
