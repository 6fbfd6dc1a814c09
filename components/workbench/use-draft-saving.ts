"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import type { LabDraft } from "@/lib/lab-drafts";
import { saveDraft } from "./attempts-api";

/** How long the workbench waits after the last change before saving: a drag or a typed word is saved once. */
const SAVE_AFTER_MS = 700;

export type DraftSaving = { status: "saved" } | { status: "saving" } | { status: "failed"; message: string };

/** Where the browser keeps a change until the server has it: per learner and lab, so a shared computer mixes no one's work. */
type Unsaved = { body: string; at: number };

function readUnsaved(key: string): Unsaved | null {
  try {
    const stored = window.localStorage.getItem(key);
    const parsed = stored === null ? null : (JSON.parse(stored) as Partial<Unsaved>);
    return parsed && typeof parsed.body === "string" && typeof parsed.at === "number" ? { body: parsed.body, at: parsed.at } : null;
  } catch {
    return null;
  }
}

function writeUnsaved(key: string, unsaved: Unsaved | null): void {
  try {
    if (unsaved) window.localStorage.setItem(key, JSON.stringify(unsaved));
    else window.localStorage.removeItem(key);
  } catch {
    // Storage refused (private browsing, full): the server saves still run, only the spare copy is missing.
  }
}

/**
 * Keeps the learner's latest choices and typed answers on the server: saved a moment after the
 * last change, one save at a time and always the newest, and once more as the page is left. Until
 * the server has a change the browser keeps a copy, which the next visit takes up when it is newer
 * than the server's (a page left before its save arrived). A save that fails says so and is tried
 * again with the next change or on request.
 */
export function useDraftSaving(params: {
  labSlug: string;
  draft: LabDraft;
  /** When the server's copy was saved (ms since the epoch), null when it has none. */
  savedAt: number | null;
  storageKey: string;
  restore: (draft: LabDraft) => void;
}): { saving: DraftSaving; retry: () => void } {
  const { labSlug, storageKey, savedAt, restore } = params;
  const body = JSON.stringify(params.draft);
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
    writeUnsaved(storageKey, null);
    setSaving({ status: "saved" });
  }, [labSlug, storageKey]);

  // Once, on opening: a change the server never received, newer than its copy, is taken up again.
  const opened = useRef(false);
  useEffect(() => {
    if (opened.current) return;
    opened.current = true;
    const unsaved = readUnsaved(storageKey);
    if (!unsaved || unsaved.body === stored.current || unsaved.at <= (savedAt ?? 0)) {
      writeUnsaved(storageKey, null);
      return;
    }
    try {
      restore(JSON.parse(unsaved.body) as LabDraft);
    } catch {
      writeUnsaved(storageKey, null);
    }
  }, [storageKey, savedAt, restore]);

  useEffect(() => {
    latest.current = body;
    if (body === stored.current) return;
    writeUnsaved(storageKey, { body, at: Date.now() });
    setSaving((current) => (current.status === "failed" ? current : { status: "saving" }));
    const timer = setTimeout(() => void send(), SAVE_AFTER_MS);
    return () => clearTimeout(timer);
  }, [body, send, storageKey]);

  // Leaving the page (a reload, a link, the tab closed) within the wait still sends the change.
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
