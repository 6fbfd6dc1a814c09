import { BrandMark } from "@/components/brand/brand-mark";
import type { SessionUser } from "@/lib/auth/session-store";
import { AppHeader } from "./app-header";

/**
 * The page frame: the signed-in header when there is a user, the plain brand bar when not. Pages
 * and the 403/404 screens render it themselves, so a status screen never sits inside a second frame.
 */
export function AppFrame({ user, children }: { user: SessionUser | null; children: React.ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      {/* A printed page is a handout: no header, no navigation. */}
      <div className="print:hidden">
        {user ? (
          <AppHeader user={user} />
        ) : (
          <header className="border-b border-line bg-surface">
            <div className="mx-auto max-w-6xl px-5 py-3">
              <BrandMark />
            </div>
          </header>
        )}
      </div>
      <main className="mx-auto w-full max-w-6xl flex-1 px-5 py-8 sm:py-10 print:max-w-none print:p-0">{children}</main>
      <footer className="border-t border-line print:mt-6">
        <p className="mx-auto max-w-6xl px-5 py-5 text-sm text-ink-faint">
          Edgewise teaches with a model of the line. Confirm every real run on the bench, and follow your local
          electrical codes and the manufacturer&apos;s instructions.
        </p>
      </footer>
    </div>
  );
}
