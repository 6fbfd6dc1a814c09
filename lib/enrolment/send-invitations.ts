import { readAppEnv } from "@/lib/env";
import { sendInvitationEmail } from "@/lib/mail/send";
import { recordLetterOutcomes } from "./letter-outcomes";

// E-mails invitation links after their rows are committed. A failure never undoes an invitation:
// the caller reports how many letters did not go out, the rows stay in the outbox and are tried
// again in the background, and the admin can also send them again at once.

export type InvitationLetter = { invitationId: string; to: string; token: string; cohortName: string | null; expiresAt: Date };
export type LetterOutcome = { sent: number; unsent: number };

// Each message opens its own SMTP connection, so several run side by side to keep a large import
// from waiting on one round trip at a time.
const parallelLetters = 16;

// These concern one message (a refused recipient); anything else means the mail server is not
// usable right now, and trying thousands more would only repeat the wait.
const perMessageErrorCodes = new Set(["EENVELOPE", "EMESSAGE"]);

const smtpErrorCodes = new Set(["ECONNECTION", "ETIMEDOUT", "ESOCKET", "EDNS", "EAUTH", "ETLS", "EPROTOCOL", "EENVELOPE", "EMESSAGE", "ESTREAMING"]);

/** An error raised by the SMTP client (it names the SMTP step), as opposed to one from the database. */
export function isMailDeliveryError(error: unknown): boolean {
  const { code, command } = (error ?? {}) as { code?: unknown; command?: unknown };
  return typeof code === "string" && smtpErrorCodes.has(code) && typeof command === "string";
}

function isPerMessageFailure(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === "string" && perMessageErrorCodes.has(code);
}

function acceptUrlFor(token: string): string {
  return `${readAppEnv().APP_URL}/invitations/${token}`;
}

/** One letter per person invited to a cohort, each carrying the invitation written for their address. */
export function cohortLetters(
  people: { email: string; token: string }[],
  invitationIds: Map<string, string>,
  cohort: { cohortName: string; expiresAt: Date },
): InvitationLetter[] {
  return people.map((person) => ({ invitationId: invitationIds.get(person.email)!, to: person.email, token: person.token, ...cohort }));
}

export async function sendInvitationLetters(params: {
  schoolId: string;
  schoolName: string;
  inviterName: string | null;
  letters: InvitationLetter[];
}): Promise<LetterOutcome> {
  let next = 0;
  const sentIds: string[] = [];
  let serverDown = false;
  const worker = async () => {
    while (!serverDown && next < params.letters.length) {
      const letter = params.letters[next++]!;
      try {
        await sendInvitationEmail({
          schoolId: params.schoolId,
          to: letter.to,
          schoolName: params.schoolName,
          cohortName: letter.cohortName,
          inviterName: params.inviterName,
          acceptUrl: acceptUrlFor(letter.token),
          expiresAt: letter.expiresAt,
        });
        sentIds.push(letter.invitationId);
      } catch (error) {
        console.error("An invitation e-mail was not sent:", error);
        if (!isPerMessageFailure(error)) serverDown = true;
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(parallelLetters, params.letters.length) }, worker));
  const sent = new Set(sentIds);
  await recordLetterOutcomes({ sentIds, unsentIds: params.letters.map((letter) => letter.invitationId).filter((id) => !sent.has(id)) });
  return { sent: sentIds.length, unsent: params.letters.length - sentIds.length };
}

/** The sentence an admin reads when some letters did not go out. */
export function describeUnsent(outcome: LetterOutcome): string | null {
  if (outcome.unsent === 0) return null;
  const what = outcome.unsent === 1 ? "1 invitation e-mail was" : `${outcome.unsent.toLocaleString("en-GB")} invitation e-mails were`;
  return `${what} not sent because the mail server did not answer. The invitations are saved and Edgewise keeps trying to send them on its own; “Resend” (or “Resend all waiting”) tries again at once.`;
}
