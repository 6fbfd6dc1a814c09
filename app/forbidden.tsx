import Link from "next/link";
import { AppFrame } from "@/components/shell/app-frame";
import { buttonClass } from "@/components/ui/button-class";
import { StatusPage } from "@/components/ui/status-page";
import { getCurrentUser } from "@/lib/auth/current-user";
import { homePathFor } from "@/lib/auth/permissions";

export default async function Forbidden() {
  const user = await getCurrentUser();
  return (
    <AppFrame user={user}>
      <StatusPage
        code="403"
        title="This page is not open to your account"
        actions={
          <>
            <Link href={user ? homePathFor(user.role) : "/"} className={buttonClass("primary")}>
              Go to my home page
            </Link>
            <Link href="/sign-out" className={buttonClass("secondary")}>
              Sign in as someone else
            </Link>
          </>
        }
      >
        <p>
          You are signed in{user ? ` as ${user.name}` : ""}, but your role does not include this part of Edgewise.
        </p>
        <p>If you think it should, ask your school&apos;s Edgewise admin.</p>
      </StatusPage>
    </AppFrame>
  );
}
