import { composeInvitationMail, composePasswordResetMail } from "./compose";
import { deliverMail } from "./transport";

export async function sendInvitationEmail(params: {
  schoolId: string;
  to: string;
  schoolName: string;
  cohortName: string | null;
  inviterName: string | null;
  acceptUrl: string;
  expiresAt: Date;
}): Promise<void> {
  const { schoolId, to, ...content } = params;
  await deliverMail({ schoolId, to, mail: composeInvitationMail(content) });
}

export async function sendPasswordResetEmail(params: {
  schoolId: string;
  to: string;
  name: string;
  resetUrl: string;
  expiresAt: Date;
}): Promise<void> {
  const { schoolId, to, ...content } = params;
  await deliverMail({ schoolId, to, mail: composePasswordResetMail(content) });
}
