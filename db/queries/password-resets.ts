import { and, eq, isNull } from "drizzle-orm";
import { db } from "../client";
import { passwordResets, users, type PasswordReset, type Role } from "../schema";

export async function createPasswordReset(params: { userId: string; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db.insert(passwordResets).values(params);
}

export async function findPasswordResetByTokenHash(params: { tokenHash: string }): Promise<PasswordReset | undefined> {
  const [row] = await db.select().from(passwordResets).where(eq(passwordResets.tokenHash, params.tokenHash)).limit(1);
  return row;
}

export type PasswordResetState = "usable" | "unknown" | "used" | "expired";

export function describePasswordResetState(reset: PasswordReset | undefined, now: Date): PasswordResetState {
  if (!reset) return "unknown";
  if (reset.usedAt) return "used";
  if (reset.expiresAt <= now) return "expired";
  return "usable";
}

export type CompletePasswordResetResult =
  | { ok: true; userId: string; role: Role }
  | { ok: false; reason: Exclude<PasswordResetState, "usable"> };

/** Sets the new password and spends this and every other open reset link of the account. */
export async function completePasswordReset(params: {
  tokenHash: string;
  passwordHash: string;
  now: Date;
}): Promise<CompletePasswordResetResult> {
  return db.transaction(async (tx) => {
    const [reset] = await tx
      .select()
      .from(passwordResets)
      .where(eq(passwordResets.tokenHash, params.tokenHash))
      .for("update")
      .limit(1);
    const state = describePasswordResetState(reset, params.now);
    if (state !== "usable" || !reset) return { ok: false, reason: state === "usable" ? "unknown" : state };

    const [user] = await tx
      .update(users)
      .set({ passwordHash: params.passwordHash, updatedAt: params.now })
      .where(and(eq(users.id, reset.userId), eq(users.active, true)))
      .returning({ id: users.id, role: users.role });
    if (!user) return { ok: false, reason: "unknown" };
    await tx
      .update(passwordResets)
      .set({ usedAt: params.now })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)));
    return { ok: true, userId: user.id, role: user.role };
  });
}
