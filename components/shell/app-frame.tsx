import { AppHeader } from "./app-header";
import type { SessionUser } from "@/lib/auth/session-store";

/** The signed-in frame: header, then the page in a readable column. */
export function AppFrame({ user, children }: { user: SessionUser | null; children: React.ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      {user ? <AppHeader user={user} /> : null}
      <main className="mx-auto w-full max-w-6xl flex-1 px-5 py-8 sm:py-10">{children}</main>
      <footer className="border-t border-line">
        <p className="mx-auto max-w-6xl px-5 py-5 text-sm text-ink-faint">
          Edgewise teaches with a model of the line. Confirm every real run on the bench, and follow your local
          electrical codes and the manufacturer&apos;s instructions.
        </p>
      </footer>
    </div>
  );
}
