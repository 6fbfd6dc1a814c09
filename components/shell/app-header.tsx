import { signOut } from "@/app/(auth)/sign-out/actions";
import { BrandMark } from "@/components/brand/brand-mark";
import { homePathFor, type Role } from "@/lib/auth/permissions";
import { protectedRoutes } from "@/lib/auth/route-access";
import type { SessionUser } from "@/lib/auth/session-store";
import { isMailSinkEnabled } from "@/lib/mail/sink";
import { NavLink } from "./nav-link";

const roleLabels: Record<Role, string> = { learner: "Learner", instructor: "Instructor", admin: "School admin" };

type NavItem = { href: string; label: string; sections?: string[] };

function navItems(user: SessionUser): NavItem[] {
  const items: NavItem[] = {
    learner: [{ href: "/learn", label: "Course", sections: ["/lessons", "/labs", "/bench", "/certificate"] }],
    instructor: [
      { href: "/cohorts", label: "My cohorts" },
      { href: "/reviews", label: "Bench reviews" },
    ],
    admin: [
      { href: "/admin", label: "School" },
      { href: "/certificates", label: "Certificates" },
    ],
  }[user.role];
  if (isMailSinkEnabled() && (protectedRoutes["/dev/mail"] as readonly Role[]).includes(user.role)) {
    return [...items, { href: "/dev/mail", label: "Caught mail" }];
  }
  return items;
}

export function AppHeader({ user }: { user: SessionUser }) {
  return (
    <header className="border-b border-line bg-surface">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-3 px-5 py-3">
        <BrandMark href={homePathFor(user.role)} />
        <nav aria-label="Main" className="order-3 flex w-full gap-1 sm:order-none sm:w-auto">
          {navItems(user).map((item) => (
            <NavLink key={item.href} href={item.href} sections={item.sections}>
              {item.label}
            </NavLink>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3">
          <div className="hidden text-right leading-tight sm:block">
            <p className="text-sm font-semibold text-ink">{user.name}</p>
            <p className="text-xs text-ink-faint">{roleLabels[user.role]}</p>
          </div>
          <form action={signOut}>
            <button
              type="submit"
              className="rounded-md border border-line-strong px-3 py-1.5 text-sm font-medium text-ink-soft hover:bg-sunken hover:text-ink"
            >
              Sign out
            </button>
          </form>
        </div>
      </div>
    </header>
  );
}
