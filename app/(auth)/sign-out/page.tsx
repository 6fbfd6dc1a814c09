import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { buttonClass } from "@/components/ui/button-class";
import { getCurrentUser } from "@/lib/auth/current-user";
import { homePathFor } from "@/lib/auth/permissions";
import { AuthCard } from "../auth-card";
import { signOut } from "./actions";

export const metadata: Metadata = { title: "Sign out" };

// Signing out changes state, so it happens on a POST from this button, never on a plain GET.
export default async function SignOutPage() {
  const user = await getCurrentUser();
  if (!user) redirect("/sign-in");
  return (
    <AuthCard title="Sign out" lead={<>You are signed in as {user.name}.</>}>
      <form action={signOut} className="flex flex-wrap gap-3">
        <button type="submit" className={buttonClass("primary")}>
          Sign out
        </button>
        <Link href={homePathFor(user.role)} className={buttonClass("secondary")}>
          Stay signed in
        </Link>
      </form>
    </AuthCard>
  );
}
