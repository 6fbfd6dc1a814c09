import { z } from "zod";

// The one place where failures become HTTP statuses and sentences a person may read. Details
// of unexpected failures go to the server log, never to the client.

export const errorCatalogue = {
  "bad-request": { status: 400, message: "The request could not be read." },
  unauthenticated: { status: 401, message: "Sign in to continue." },
  forbidden: { status: 403, message: "Your account does not have access to this." },
  "not-found": { status: 404, message: "We could not find that." },
  conflict: { status: 409, message: "That conflicts with something that already exists." },
  "payload-too-large": { status: 413, message: "The request is larger than this address accepts, so it was not read." },
  "invalid-input": { status: 422, message: "Some of the values are not valid." },
  "rate-limited": { status: 429, message: "Too many attempts. Wait a little, then try again." },
  unavailable: { status: 503, message: "A service we depend on is not answering. Try again shortly." },
  internal: { status: 500, message: "Something went wrong on our side. Try again, and tell your admin if it keeps happening." },
} as const satisfies Record<string, { status: number; message: string }>;

export type ErrorCode = keyof typeof errorCatalogue;

export class AppError extends Error {
  override name = "AppError";
  constructor(
    readonly code: ErrorCode,
    message?: string,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message ?? errorCatalogue[code].message);
  }
}

/** Over a rate limit: answered 429 with Retry-After, and a message that says how long to wait. */
export class RateLimitedError extends AppError {
  override name = "RateLimitedError";
  constructor(
    readonly retryAfterSeconds: number,
    message = `Too many requests. Try again in ${describeWait(retryAfterSeconds)}.`,
  ) {
    super("rate-limited", message);
  }
}

/** "40 seconds", "1 minute", "15 minutes": a wait as a person reads it, rounded up. */
export function describeWait(seconds: number): string {
  if (seconds < 60) return `${seconds} second${seconds === 1 ? "" : "s"}`;
  const minutes = Math.ceil(seconds / 60);
  return `${minutes} minute${minutes === 1 ? "" : "s"}`;
}

export type ErrorBody = {
  error: { code: ErrorCode; message: string; fieldErrors?: Record<string, string[]>; moreFieldErrors?: number };
};

// An error reply names a few bad fields, never all of them: a body with thousands of unknown keys
// must not come back several times its own size.
export const errorReplyLimits = { fields: 5, messagesPerField: 3, nameLength: 100, messageLength: 300 } as const;

function clip(text: string, length: number): string {
  return text.length > length ? `${text.slice(0, length - 1)}…` : text;
}

/** The first few fields with their first few messages, each clipped; the rest are counted. */
function boundFieldErrors(fieldErrors: Record<string, string[]>): { fieldErrors: Record<string, string[]>; more: number } {
  const { fields, messagesPerField, nameLength, messageLength } = errorReplyLimits;
  const names = Object.keys(fieldErrors);
  // No prototype: a field named "__proto__" in hostile input must stay a plain key.
  const bounded: Record<string, string[]> = Object.create(null);
  for (const name of names.slice(0, fields)) {
    bounded[clip(name, nameLength)] = (fieldErrors[name] ?? []).slice(0, messagesPerField).map((message) => clip(message, messageLength));
  }
  return { fieldErrors: bounded, more: Math.max(0, names.length - fields) };
}

function describeAppError(error: AppError): ErrorBody {
  const message = clip(error.message, errorReplyLimits.messageLength);
  if (!error.fieldErrors) return { error: { code: error.code, message } };
  const { fieldErrors, more } = boundFieldErrors(error.fieldErrors);
  if (more === 0) return { error: { code: error.code, message, fieldErrors } };
  const counted = `${message.replace(/\.$/, "")} (and ${more} more ${more === 1 ? "field" : "fields"}).`;
  return { error: { code: error.code, message: counted, fieldErrors, moreFieldErrors: more } };
}

// Connection refused, database missing or shutting down, too many clients, connection lost, a
// statement cancelled by its timeout.
const unavailableCodes = new Set([
  "ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "3D000", "57P01", "57P02", "57P03", "53300", "08001", "08006", "57014",
]);
// The PostgreSQL client raises these without a code: no connection within its timeout, no free
// connection in the pool in time, the server gone mid-query, no answer to a query in time.
const unavailableMessages = new Set([
  "timeout expired",
  "timeout exceeded when trying to connect",
  "Connection terminated due to connection timeout",
  "Connection terminated unexpectedly",
  "Query read timeout",
  "Client has encountered a connection error and is not queryable",
]);

export function isServiceOutage(error: unknown): boolean {
  for (let current = error, depth = 0; current instanceof Error && depth < 4; current = current.cause, depth += 1) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === "string" && unavailableCodes.has(code)) return true;
    if (unavailableMessages.has(current.message)) return true;
  }
  return false;
}

export type DescribedError = { status: number; body: ErrorBody; headers?: Record<string, string> };

/** Maps any thrown value to a status and a safe body; logs what the client must not see. */
export function describeError(error: unknown): DescribedError {
  if (error instanceof AppError) {
    const { status } = errorCatalogue[error.code];
    const body = describeAppError(error);
    if (error instanceof RateLimitedError) return { status, body, headers: { "retry-after": String(error.retryAfterSeconds) } };
    return { status, body };
  }
  if (error instanceof z.ZodError) {
    const { fieldErrors } = z.flattenError(error);
    return describeError(new AppError("invalid-input", undefined, fieldErrors as Record<string, string[]>));
  }
  console.error(error);
  return describeError(new AppError(isServiceOutage(error) ? "unavailable" : "internal"));
}
