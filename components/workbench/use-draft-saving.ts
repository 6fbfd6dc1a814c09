"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import type { LabChoices } from "@/lessons";
import { saveDraft } from "./attempts-api";

/** How long the workbench waits after the last change before saving: a drag or a typed word is saved once. */
const SAVE_AFTER_MS = 700;

export type DraftSaving = { status: "saved" } | { status: "saving" } | { status: "failed"; message: string };

/**
 * Keeps the learner's latest choices and typed answers on the server: saved a moment after the
 * last change, one save at a time and always the newest, and once more as the page is left. A
 * save that fails says so and is tried again with the next change or on request.
 */
export function useDraftSaving(labSlug: string, draft: { choices: LabChoices; answers: Record<string, string> }): { saving: DraftSaving; retry: () => void } {
  const body = JSON.stringify(draft);
  const latest = useRef(body);
  const stored = useRef(body);
  /** The body of the save under way, if any. */
  const inFlight = useRef<string | null>(null);
  const [saving, setSaving] = useState<DraftSaving>({ status: "saved" });

  const send = useCallback(async () => {
    if (inFlight.current !== null) return;
    while (latest.current !== stored.current) {
      const sending = latest.current;
      inFlight.current = sending;
      try {
        await saveDraft(labSlug, sending);
        stored.current = sending;
      } catch (error) {
        setSaving({ status: "failed", message: error instanceof Error ? error.message : String(error) });
        return;
      } finally {
        inFlight.current = null;
      }
    }
    setSaving({ status: "saved" });
  }, [labSlug]);

  useEffect(() => {
    latest.current = body;
    if (body === stored.current) return;
    setSaving((current) => (current.status === "failed" ? current : { status: "saving" }));
    const timer = setTimeout(() => void send(), SAVE_AFTER_MS);
    return () => clearTimeout(timer);
  }, [body, send]);

  // Leaving the page (a reload, a link, the tab closed) within the wait still saves the change.
  useEffect(() => {
    const flush = () => {
      const sending = latest.current;
      if (sending === stored.current || sending === inFlight.current) return;
      void saveDraft(labSlug, sending, { keepalive: true }).then(
        () => {
          stored.current = sending;
        },
        () => undefined,
      );
    };
    const onHidden = () => {
      if (document.visibilityState === "hidden") flush();
    };
    window.addEventListener("pagehide", flush);
    document.addEventListener("visibilitychange", onHidden);
    return () => {
      window.removeEventListener("pagehide", flush);
      document.removeEventListener("visibilitychange", onHidden);
    };
  }, [labSlug]);

  return { saving, retry: () => void send() };
}
