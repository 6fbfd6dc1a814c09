"use client";

import { useEffect } from "react";
import { buttonClass } from "./button-class";

/** What every segment's error boundary shows: a plain sentence, a reference to quote, a retry. */
export function ErrorPanel({ error, retry, what }: { error: unknown; retry: () => void; what: string }) {
  const digest = error instanceof Error && "digest" in error ? String(error.digest) : null;
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div role="alert" className="mx-auto max-w-xl rounded-card border border-danger/30 bg-surface p-6">
      <h2 className="text-xl font-semibold">Something went wrong while loading {what}</h2>
      <p className="mt-2 text-ink-soft">
        It is not something you did. Try again; if it keeps happening, tell your school&apos;s Edgewise admin
        {digest ? (
          <>
            {" "}
            and quote reference <code className="rounded bg-sunken px-1.5 py-0.5 text-sm">{digest}</code>
          </>
        ) : null}
        .
      </p>
      <button type="button" onClick={retry} className={buttonClass("primary", "mt-5")}>
        Try again
      </button>
    </div>
  );
}
