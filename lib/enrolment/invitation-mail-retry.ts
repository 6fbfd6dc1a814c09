import { claimDueInvitationMail, firstSendLeaseMs } from "@/db/queries/invitation-mail";
import { invitationExpiry, issueToken } from "./invitation-tokens";
import { invitationMailBackoff } from "./letter-outcomes";
import { sendInvitationLetters, type LetterOutcome } from "./send-invitations";

// The background half of the invitation outbox: every server process looks for invitations whose
// e-mail did not go out and whose next try is due, and sends them with a fresh link. A school
// expects an enrolment to reach the learner without anyone watching the mail server, so this
// runs on a timer rather than waiting for the admin's next visit.

const batchSize = 200;

/** Sends the due invitation e-mails once; what still fails is scheduled again with a longer wait. */
export async function sendDueInvitationMail(now = new Date()): Promise<LetterOutcome> {
  const due = await claimDueInvitationMail({ now, limit: batchSize, leaseMs: firstSendLeaseMs, expiresAt: invitationExpiry(now), issueToken });
  const bySender = new Map<string, typeof due>();
  for (const letter of due) {
    const sender = JSON.stringify([letter.schoolId, letter.inviterName]);
    bySender.set(sender, [...(bySender.get(sender) ?? []), letter]);
  }
  const total: LetterOutcome = { sent: 0, unsent: 0 };
  for (const letters of bySender.values()) {
    const outcome = await sendInvitationLetters({
      schoolId: letters[0]!.schoolId,
      schoolName: letters[0]!.schoolName,
      inviterName: letters[0]!.inviterName,
      letters: letters.map((letter) => ({ ...letter, to: letter.email })),
    });
    total.sent += outcome.sent;
    total.unsent += outcome.unsent;
  }
  return total;
}

/** Starts the timer in this server process; a round that is still running is not started twice. */
export function startInvitationMailRetries(): void {
  let running = false;
  const round = async () => {
    if (running) return;
    running = true;
    try {
      const outcome = await sendDueInvitationMail();
      if (outcome.sent > 0) console.log(`Sent ${outcome.sent} invitation e-mail(s) that had been waiting.`);
    } catch (error) {
      console.error("The invitation e-mail retry could not run:", error instanceof Error ? error.message : error);
    } finally {
      running = false;
    }
  };
  setInterval(round, invitationMailBackoff().baseDelayMs).unref();
}
