import { invitationLifetimeDays } from "@/lib/auth/invitations";
import { generateToken, hashToken } from "@/lib/auth/tokens";

export type IssuedToken = { token: string; tokenHash: string };

/** A fresh link secret and the digest the database keeps in its place. */
export function issueToken(): IssuedToken {
  const token = generateToken();
  return { token, tokenHash: hashToken(token) };
}

export function invitationExpiry(now: Date): Date {
  return new Date(now.getTime() + invitationLifetimeDays * 24 * 60 * 60_000);
}
