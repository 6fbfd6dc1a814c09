import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import { StatusPage } from "@/components/ui/status-page";

export default function NotFound() {
  return (
    <StatusPage
      code="404"
      title="We could not find that page"
      actions={
        <Link href="/" className={buttonClass("primary")}>
          Go to the start page
        </Link>
      }
    >
      <p>The address may be mistyped, or the page may have moved.</p>
    </StatusPage>
  );
}
