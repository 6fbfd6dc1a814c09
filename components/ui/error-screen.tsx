"use client";

import { BrandMark } from "@/components/brand/brand-mark";
import { ErrorPanel } from "./error-panel";

/** A failed page outside any frame: the brand bar, then the error panel. */
export function ErrorScreen(props: { error: unknown; retry: () => void; what: string }) {
  return (
    <div className="min-h-dvh">
      <header className="border-b border-line bg-surface">
        <div className="mx-auto max-w-6xl px-5 py-3">
          <BrandMark />
        </div>
      </header>
      <main className="px-5 py-10">
        <ErrorPanel {...props} />
      </main>
    </div>
  );
}
