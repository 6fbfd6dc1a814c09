"use client";

import { useSyncExternalStore } from "react";

/** Below Tailwind's `lg` breakpoint, where the workbench stacks its panels and the scope stays on screen. */
const NARROW = "(max-width: 1023.98px)";

function subscribe(onChange: () => void): () => void {
  const query = window.matchMedia(NARROW);
  query.addEventListener("change", onChange);
  return () => query.removeEventListener("change", onChange);
}

/** Whether the screen is phone- or tablet-narrow; false while rendered on the server. */
export function useNarrowScreen(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => window.matchMedia(NARROW).matches,
    () => false,
  );
}
