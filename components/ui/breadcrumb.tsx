import Link from "next/link";
import { Fragment } from "react";

/** The way back up to the course map: links for the levels above, plain text for the page itself. */
export function Breadcrumb({ trail, current }: { trail: { href: string; label: string }[]; current: string }) {
  return (
    <nav aria-label="Breadcrumb" className="mb-4 text-sm text-ink-soft print:hidden">
      {trail.map((step) => (
        <Fragment key={step.href}>
          <Link href={step.href} className="font-medium text-accent no-underline hover:underline">
            {step.label}
          </Link>
          <span aria-hidden="true" className="mx-2 text-ink-faint">
            /
          </span>
        </Fragment>
      ))}
      <span aria-current="page">{current}</span>
    </nav>
  );
}
