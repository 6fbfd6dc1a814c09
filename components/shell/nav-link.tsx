"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/** `sections` are further path prefixes that belong to this item, e.g. a lesson under "Course". */
export function NavLink({ href, sections = [], children }: { href: string; sections?: string[]; children: React.ReactNode }) {
  const pathname = usePathname();
  const current = [href, ...sections].some((prefix) => pathname === prefix || pathname.startsWith(`${prefix}/`));
  return (
    <Link
      href={href}
      aria-current={current ? "page" : undefined}
      className={`rounded-md px-3 py-2 text-sm font-medium no-underline transition-colors ${
        current ? "bg-accent-soft text-accent-strong" : "text-ink-soft hover:bg-sunken hover:text-ink"
      }`}
    >
      {children}
    </Link>
  );
}
