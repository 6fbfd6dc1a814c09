"use client";

import { useCallback, useState } from "react";

/**
 * Whether the learner is dragging a control: from a pointer going down on it until that pointer
 * is released or cancelled anywhere on the page (a slider's thumb is often let go beside it).
 * Keyboard steps are not drags: each is a settled choice.
 */
export function useControlDrag(): { dragging: boolean; startDrag: () => void } {
  const [dragging, setDragging] = useState(false);
  const startDrag = useCallback(() => {
    setDragging(true);
    // Listening from the pointer-down itself, not from an effect after the render, so that even
    // the release of a quick click cannot slip past.
    const end = () => {
      setDragging(false);
      window.removeEventListener("pointerup", end);
      window.removeEventListener("pointercancel", end);
    };
    window.addEventListener("pointerup", end);
    window.addEventListener("pointercancel", end);
  }, []);
  return { dragging, startDrag };
}
