import type { LabChoices } from "@/lessons";
import type { AttemptView, VerdictLine } from "@/lib/grading";
import type { SimInput } from "@/lib/sim";

// The workbench's calls to the lab routes (attempts, and the saved workbench). Errors carry the server's sentence and, for a 422,
// the messages per field, so the form can show them where they belong.

export type Submission = { choices: LabChoices; answers?: Record<string, string>; idempotencyKey: string };
export type SubmitReply = { attempt: AttemptView; score: number; passed: boolean; reasons: VerdictLine[]; replayed: boolean };
export type StoredRun = { runId: string; label: string; input: SimInput };

export class AttemptRequestError extends Error {
  override name = "AttemptRequestError";
  constructor(
    message: string,
    readonly status: number,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
  }

  /** The request never got an answer: the same submission may be sent again with the same key. */
  get retryable(): boolean {
    return this.status === 0 || this.status >= 500;
  }
}

async function call<T>(url: string, init?: RequestInit): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, { ...init, headers: { accept: "application/json", ...init?.headers }, cache: "no-store" });
  } catch {
    throw new AttemptRequestError("The workbench could not reach the server. Check the connection and try again.", 0);
  }
  const body = (await response.json().catch(() => null)) as (T & { error?: { message: string; fieldErrors?: Record<string, string[]> } }) | null;
  if (!response.ok || body === null) {
    throw new AttemptRequestError(body?.error?.message ?? `The server answered ${response.status}.`, response.status, body?.error?.fieldErrors);
  }
  return body;
}

/**
 * A fresh version-4 UUID for one submission. Built from getRandomValues because randomUUID is
 * missing on pages served over plain http from a school's own network address.
 */
export function newSubmissionKey(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  bytes[6] = (bytes[6] & 0x0f) | 0x40;
  bytes[8] = (bytes[8] & 0x3f) | 0x80;
  const hex = Array.from(bytes, (b) => b.toString(16).padStart(2, "0")).join("");
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

const attemptsUrl = (labSlug: string) => `/api/labs/${encodeURIComponent(labSlug)}/attempts`;

export function submitAttempt(labSlug: string, submission: Submission): Promise<SubmitReply> {
  return call(attemptsUrl(labSlug), { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(submission) });
}

export type AttemptPage = { attempts: AttemptView[]; nextCursor: string | null };

/** One page of the learner's attempts, newest first; `cursor` is the previous page's `nextCursor`. */
export function listAttempts(labSlug: string, cursor: string | null): Promise<AttemptPage> {
  return call(cursor === null ? attemptsUrl(labSlug) : `${attemptsUrl(labSlug)}?cursor=${encodeURIComponent(cursor)}`);
}

export function fetchAttempt(labSlug: string, attemptId: string): Promise<{ attempt: AttemptView; runs: StoredRun[] }> {
  return call(`${attemptsUrl(labSlug)}/${encodeURIComponent(attemptId)}`);
}

/**
 * Saves the learner's latest workbench (`draft` as JSON: choices by run and typed answers).
 * `keepalive` lets the save outlive the page, for the one sent as the learner leaves it.
 */
export async function saveDraft(labSlug: string, draft: string, options: { keepalive?: boolean } = {}): Promise<void> {
  await call(`/api/labs/${encodeURIComponent(labSlug)}/draft`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: draft,
    keepalive: options.keepalive,
  });
}
