import { composeInvitationMail, composePasswordResetMail } from "./compose";
import { getTransport, mailSender } from "./transport";

export async function sendInvitationEmail(params: {
  to: string;
  schoolName: string;
  cohortName: string | null;
  inviterName: string | null;
  acceptUrl: string;
  expiresAt: Date;
}): Promise<void> {
  const { to, ...content } = params;
  await getTransport().sendMail({ from: mailSender(), to, ...composeInvitationMail(content) });
}

export async function sendPasswordResetEmail(params: {
  to: string;
  name: string;
  resetUrl: string;
  expiresAt: Date;
}): Promise<void> {
  const { to, ...content } = params;
  await getTransport().sendMail({ from: mailSender(), to, ...composePasswordResetMail(content) });
}
