import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import { StatusPage } from "@/components/ui/status-page";

export default function Forbidden() {
  return (
    <StatusPage
      code="403"
      title="This page is not open to your account"
      actions={
        <>
          <Link href="/" className={buttonClass("primary")}>
            Go to my home page
          </Link>
          <Link href="/sign-out" className={buttonClass("secondary")}>
            Sign in as someone else
          </Link>
        </>
      }
    >
      <p>You are signed in, but your role does not include this part of Edgewise.</p>
      <p>If you think it should, ask your school&apos;s Edgewise admin.</p>
    </StatusPage>
  );
}
