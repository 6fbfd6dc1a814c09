import { and, gt, isNull, type SQL } from "drizzle-orm";
import { invitations } from "../schema";

/** An invitation nobody has accepted and the school has not revoked. */
export function isOpenInvitation(): SQL {
  return and(isNull(invitations.usedAt), isNull(invitations.revokedAt))!;
}

/** An open invitation whose link still works at `now`. */
export function isUsableInvitation(now: Date): SQL {
  return and(isOpenInvitation(), gt(invitations.expiresAt, now))!;
}
