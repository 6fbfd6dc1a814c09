"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export function NavLink({ href, children }: { href: string; children: React.ReactNode }) {
  const pathname = usePathname();
  const current = pathname === href || pathname.startsWith(`${href}/`);
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
