/**
 * The load benchmark's traffic, run in a child process of scripts/bench-load.ts so that sending
 * requests and timing them never competes with the orchestrating process (database set-up and
 * counting) for its event loop. It runs one phase per message and answers with its figures.
 */
import { randomUUID } from "node:crypto";
import autocannon, { type Client, type Request } from "autocannon";
import type { BenchLearner, DriverRequest, KindFigures, PhaseFigures, RequestKind } from "./protocol";

const TIMEOUT_SECONDS = 30;

class PhaseRecorder {
  private readonly latencies = new Map<RequestKind, number[]>();
  private readonly statuses = new Map<RequestKind, Map<number, number>>();
  /** First-time submissions sent but never answered: cut off at the end of the window or timed out. */
  readonly unanswered: { learner: BenchLearner; body: string }[] = [];
  firstTimeStored = 0;
  retriesReplayed = 0;
  retriesDiverged = 0;

  record(kind: RequestKind, status: number): void {
    const byStatus = this.statuses.get(kind) ?? new Map<number, number>();
    byStatus.set(status, (byStatus.get(status) ?? 0) + 1);
    this.statuses.set(kind, byStatus);
  }

  addLatency(kind: RequestKind, durationMs: number): void {
    const list = this.latencies.get(kind) ?? [];
    list.push(durationMs);
    this.latencies.set(kind, list);
  }

  figures(seconds: number): Omit<PhaseFigures, "unanswered" | "settledByRetry" | "unsettled"> {
    const kinds: Partial<Record<RequestKind, KindFigures>> = {};
    for (const [kind, byStatus] of this.statuses) {
      const sorted = [...(this.latencies.get(kind) ?? [])].sort((a, b) => a - b);
      const count = [...byStatus.values()].reduce((sum, n) => sum + n, 0);
      kinds[kind] = {
        count,
        statuses: Object.fromEntries([...byStatus].sort(([a], [b]) => a - b)),
        p50: percentile(sorted, 50),
        p95: percentile(sorted, 95),
        p99: percentile(sorted, 99),
      };
    }
    const answered = Object.values(kinds).reduce((sum, k) => sum + (k.count ?? 0), 0);
    return {
      seconds,
      throughput: answered / seconds,
      kinds,
      firstTimeStored: this.firstTimeStored,
      retriesReplayed: this.retriesReplayed,
      retriesDiverged: this.retriesDiverged,
    };
  }
}

function percentile(sorted: number[], p: number): number | null {
  if (sorted.length === 0) return null;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

const isSuccess = (status: number) => status >= 200 && status < 300;

type SubmissionState = { count: number; last: { body: string; attemptId: string } | null; inFlight: { body: string; retry: boolean } | null };

/**
 * One virtual learner on one connection: submits an attempt (passing and failing choices in turn,
 * every `retryEvery`-th submission a resend of the previous one with its key), then loads the
 * workbench, and again; or, by `mode`, only loads the workbench or only submits.
 */
function learnerRequests(learner: BenchLearner, recorder: PhaseRecorder, client: Client, mode: "mix" | "pages" | "submits", retryEvery: number): Request[] {
  const headers = { cookie: learner.cookie };
  const state: SubmissionState = { count: 0, last: null, inFlight: null };
  let answering: RequestKind = "page";

  const submit: Request = {
    method: "POST",
    path: `/api/labs/${learner.labSlug}/attempts`,
    headers: { ...headers, "content-type": "application/json" },
    setupRequest(request) {
      if (state.inFlight && !state.inFlight.retry) recorder.unanswered.push({ learner, body: state.inFlight.body });
      state.count += 1;
      const retry = retryEvery > 0 && state.count % retryEvery === 0 && state.last !== null;
      const body = retry
        ? state.last!.body
        : JSON.stringify({ choices: state.count % 2 ? learner.passing : learner.failing, idempotencyKey: randomUUID() });
      state.inFlight = { body, retry };
      return { ...request, body };
    },
    onResponse(status, body) {
      const sent = state.inFlight!;
      state.inFlight = null;
      answering = sent.retry ? "retry" : "submit";
      recorder.record(answering, status);
      if (!isSuccess(status)) return;
      const attemptId = (JSON.parse(body) as { attempt: { id: string } }).attempt.id;
      if (!sent.retry) {
        recorder.firstTimeStored += 1;
        state.last = { body: sent.body, attemptId };
      } else if (attemptId === state.last?.attemptId && status === 200) recorder.retriesReplayed += 1;
      else recorder.retriesDiverged += 1;
    },
  };
  const page: Request = {
    method: "GET",
    path: `/labs/${learner.labSlug}`,
    headers,
    onResponse(status) {
      answering = "page";
      recorder.record("page", status);
    },
  };
  // autocannon reports each response's time after its onResponse, so `answering` names its kind.
  client.on("response", (_status, _bytes, durationMs) => recorder.addLatency(answering, durationMs));
  client.on("done", () => {
    if (state.inFlight && !state.inFlight.retry) recorder.unanswered.push({ learner, body: state.inFlight.body });
    state.inFlight = null;
  });
  return mode === "mix" ? [submit, page] : mode === "pages" ? [page] : [submit];
}

async function load(params: {
  baseUrl: string;
  learners: BenchLearner[];
  seconds: number;
  mode: "mix" | "pages" | "submits";
  recorder: PhaseRecorder;
  retryEvery: number;
  connectionRate?: number;
}): Promise<void> {
  let next = 0;
  await autocannon({
    url: params.baseUrl,
    connections: params.learners.length,
    duration: params.seconds,
    timeout: TIMEOUT_SECONDS,
    ...(params.connectionRate ? { connectionRate: params.connectionRate } : {}),
    setupClient(client) {
      const learner = params.learners[next++ % params.learners.length];
      client.setRequests(learnerRequests(learner, params.recorder, client, params.mode, params.retryEvery));
    },
  });
}

/**
 * A submission whose answer was lost is sent again with its key, as the workbench does; its answer
 * stands for the first one. A key the server had already stored must come back as a replay.
 */
async function settleUnanswered(baseUrl: string, recorder: PhaseRecorder): Promise<{ settled: number; failed: number }> {
  let settled = 0;
  let failed = 0;
  for (const { learner, body } of recorder.unanswered) {
    const response = await fetch(`${baseUrl}/api/labs/${learner.labSlug}/attempts`, {
      method: "POST",
      headers: { cookie: learner.cookie, "content-type": "application/json" },
      body,
    });
    await response.arrayBuffer();
    if (isSuccess(response.status)) {
      settled += 1;
      recorder.firstTimeStored += 1;
    } else failed += 1;
  }
  return { settled, failed };
}

async function runPhase(request: DriverRequest): Promise<PhaseFigures> {
  const recorder = new PhaseRecorder();
  const common = { baseUrl: request.baseUrl, recorder, retryEvery: request.retryEvery };
  const runs = [load({ ...common, learners: request.learners, seconds: request.seconds, mode: request.mode, connectionRate: request.connectionRate })];
  if (request.probe) {
    runs.push(load({ ...common, learners: request.probe, seconds: request.seconds, mode: "pages" }));
  }
  await Promise.all(runs);
  const lost = await settleUnanswered(request.baseUrl, recorder);
  return { ...recorder.figures(request.seconds), unanswered: lost.settled + lost.failed, settledByRetry: lost.settled, unsettled: lost.failed };
}

process.on("message", (request: DriverRequest) => {
  runPhase(request).then(
    (figures) => process.send!({ figures }),
    (error: unknown) => process.send!({ error: error instanceof Error ? (error.stack ?? error.message) : String(error) }),
  );
});
