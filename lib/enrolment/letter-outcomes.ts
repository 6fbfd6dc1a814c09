import { deferInvitationMail, markInvitationMailSent } from "@/db/queries/invitation-mail";
import { readMailRetryEnv } from "@/lib/env";

/** The wait before the first retry of an unsent invitation e-mail, and the longest wait between tries. */
export function invitationMailBackoff(): { baseDelayMs: number; maxDelayMs: number } {
  const baseDelayMs = readMailRetryEnv().INVITATION_MAIL_RETRY_SECONDS * 1_000;
  return { baseDelayMs, maxDelayMs: 30 * baseDelayMs };
}

/**
 * Writes down which invitation e-mails went out and schedules another try for the others. The
 * e-mails are already sent or not, so a database failure here is logged rather than thrown: the
 * rows stay waiting and the background job sends them again (with a new link) when their lease ends.
 */
export async function recordLetterOutcomes(params: { sentIds: string[]; unsentIds: string[]; now?: Date }): Promise<void> {
  try {
    await markInvitationMailSent(params.sentIds);
    await deferInvitationMail({ invitationIds: params.unsentIds, now: params.now ?? new Date(), ...invitationMailBackoff() });
  } catch (error) {
    console.error("Could not record which invitation e-mails were sent:", error);
  }
}
