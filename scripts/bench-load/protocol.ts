// What the load benchmark's orchestrator (scripts/bench-load.ts) and its traffic driver
// (driver.ts, a child process) say to each other.

/**
 * A bench learner with a session, the lab they work on, choices that pass and fail it, the answers
 * to its questions, and the address they connect from, as the load balancer in front of the
 * instance reports it (X-Forwarded-For), so the rate limits count each learner's own address.
 */
export type BenchLearner = { userId: string; cookie: string; address: string; labSlug: string; passing: unknown; failing: unknown; answers: Record<string, string> };

export type RequestKind = "submit" | "retry" | "page";

export type DriverRequest = {
  baseUrl: string;
  seconds: number;
  learners: BenchLearner[];
  mode: "mix" | "pages" | "submits";
  /** Every n-th submission of a learner resends the previous one with the same key (0: never). */
  retryEvery: number;
  /** Requests per second offered, the learners taking turns; unset, each learner has a connection and sends its next request as soon as the last is answered. */
  requestsPerSecond?: number;
  /** Learners who only load their workbench alongside, on connections of their own. */
  probe?: BenchLearner[];
};

/**
 * A request that failed: answered with a status of 300 or more, or never answered (`status` null,
 * `lost` says how: "closed" by the other side, "timed out", or the socket error's code). `atMs`:
 * when, in ms since the epoch.
 */
export type FailedRequest = { kind: RequestKind; status: number | null; lost?: string; atMs: number };

export type KindFigures = { count: number; statuses: Record<string, number>; p50: number | null; p95: number | null; p99: number | null };

export type PhaseFigures = {
  seconds: number;
  /** Answered requests per second. */
  throughput: number;
  kinds: Partial<Record<RequestKind, KindFigures>>;
  /** First-time submissions answered 2xx, in the window or when resent after it. */
  firstTimeStored: number;
  /** Resends answered 200 with the attempt their first sending stored. */
  retriesReplayed: number;
  /** Resends answered 2xx with another attempt (must stay 0). */
  retriesDiverged: number;
  /** First-time submissions the learner would send again with their key: unanswered (cut off at the window's end, lost or timed out) or answered 5xx. */
  unanswered: number;
  settledByRetry: number;
  unsettled: number;
  /** Every failed request of the window, in the order answered (the window's end cutting requests off is no failure). */
  failures: FailedRequest[];
};

export type DriverReply = { figures: PhaseFigures } | { error: string };
