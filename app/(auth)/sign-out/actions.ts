"use server";

import { redirect } from "next/navigation";
import { getCurrentSession } from "@/lib/auth/current-user";
import { writeSessionCookie } from "@/lib/auth/session-cookie";
import { blankSessionCookie, invalidateSession } from "@/lib/auth/session-store";

export async function signOut(): Promise<never> {
  const session = await getCurrentSession();
  await writeSessionCookie(session ? await invalidateSession(session.sessionId) : blankSessionCookie());
  redirect("/sign-in?notice=signed-out");
}
