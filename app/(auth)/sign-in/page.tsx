import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { z } from "zod";
import { safeReturnPath } from "@/lib/auth/access";
import { getCurrentUser } from "@/lib/auth/current-user";
import { homePathFor } from "@/lib/auth/permissions";
import { AuthCard } from "../auth-card";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

const searchSchema = z.object({
  next: z.string().optional().catch(undefined),
  notice: z.enum(["signed-out"]).optional().catch(undefined),
});

const notices = { "signed-out": "You are signed out. See you next time." } as const;

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[]>> }) {
  const search = searchSchema.parse(await searchParams);
  const next = safeReturnPath(search.next);
  const user = await getCurrentUser();
  if (user) redirect(next ?? homePathFor(user.role));

  return (
    <AuthCard title="Sign in" lead="Use the e-mail address your school invited.">
      <SignInForm next={next} notice={search.notice ? notices[search.notice] : null} />
    </AuthCard>
  );
}
