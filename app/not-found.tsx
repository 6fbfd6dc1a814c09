import Link from "next/link";
import { AppFrame } from "@/components/shell/app-frame";
import { buttonClass } from "@/components/ui/button-class";
import { StatusPage } from "@/components/ui/status-page";
import { getCurrentUser } from "@/lib/auth/current-user";
import { homePathFor } from "@/lib/auth/permissions";

export default async function NotFound() {
  const user = await getCurrentUser();
  return (
    <AppFrame user={user}>
      <StatusPage
        code="404"
        title="We could not find that page"
        actions={
          <Link href={user ? homePathFor(user.role) : "/"} className={buttonClass("primary")}>
            {user ? "Go to my home page" : "Go to the start page"}
          </Link>
        }
      >
        <p>The address may be mistyped, or the page may have moved.</p>
      </StatusPage>
    </AppFrame>
  );
}
