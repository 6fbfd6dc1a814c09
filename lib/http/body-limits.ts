import { AppError } from "./errors";

// How many bytes of request body each kind of request may carry. Every body is counted as it
// arrives and refused with 413 at its limit, whether or not the request declared a length.
// README.md ("Request bodies") lists the same table.

export type BodyLimit = { bytes: number; what: string };

const kilobytes = (count: number) => count * 1024;

export const bodyLimits = {
  /** A graded lab submission: its choices for a few runs and short typed answers (at most 200 characters each). */
  labSubmission: { bytes: kilobytes(32), what: "A lab submission" },
  /** The workbench saving a learner's latest choices and typed answers (at most 200 characters each). */
  labDraft: { bytes: kilobytes(16), what: "A saved workbench" },
  /** The browser asking to upload bench photos: at most four file names, sizes and types. */
  uploadRequest: { bytes: kilobytes(16), what: "A photo upload request" },
  /** The upload service reporting a finished or failed upload. */
  uploadCallback: { bytes: kilobytes(64), what: "An upload service report" },
  /** Any form (server action) but the roster import: the longest field is a 4,000-character review. */
  form: { bytes: kilobytes(64), what: "This form" },
  /** The roster import form: a CSV file of at most 900 kB (lib/enrolment/roster-file.ts) and its fields. */
  rosterImportForm: { bytes: kilobytes(1024), what: "A roster import" },
} as const satisfies Record<string, BodyLimit>;

/** The largest body any server action may receive: Next's own action limit is set to it. */
export const largestFormBytes = Math.max(bodyLimits.form.bytes, bodyLimits.rosterImportForm.bytes);

const rosterImportPage = /^\/admin\/cohorts\/[^/]+\/import\/?$/;

/**
 * The limit of a form posted to `pathname`. Actions are posted to the page their form lives on;
 * one posted elsewhere gets that page's limit, so a page never receives more than its own forms need.
 */
export function formBodyLimitFor(pathname: string): BodyLimit {
  return rosterImportPage.test(pathname) ? bodyLimits.rosterImportForm : bodyLimits.form;
}

/** "16 KB", "1 MB": counted in 1024s, as the rest of the app and the upload library count. */
export function formatByteSize(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${Number((bytes / (1024 * 1024)).toFixed(1))} MB` : `${Math.round(bytes / 1024)} KB`;
}

export function bodyTooLarge(limit: BodyLimit): AppError {
  return new AppError("payload-too-large", `${limit.what} may be at most ${formatByteSize(limit.bytes)}; this one is larger, so it was not read.`);
}
