"use client";

import { useEffect, useRef, useState } from "react";

/**
 * The rendered width of an element, so a drawing can use real pixels for its coordinates and its
 * labels stay legible on a phone instead of shrinking with a fixed viewBox.
 */
export function useElementWidth<E extends HTMLElement>(initial = 720) {
  const ref = useRef<E>(null);
  const [width, setWidth] = useState(initial);
  useEffect(() => {
    const element = ref.current;
    if (!element) return;
    const observer = new ResizeObserver(([entry]) => {
      if (entry) setWidth(Math.max(260, Math.round(entry.contentRect.width)));
    });
    observer.observe(element);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}
