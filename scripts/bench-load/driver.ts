/**
 * The load benchmark's traffic, run in a child process of scripts/bench-load.ts so that sending
 * requests and timing them never competes with the orchestrating process (database set-up and
 * counting) for its event loop. It runs one phase per message and answers with its figures.
 */
import { randomUUID } from "node:crypto";
import autocannon, { type Client, type Request } from "autocannon";
import type { BenchLearner, DriverRequest, FailedRequest, KindFigures, PhaseFigures, RequestKind } from "./protocol";

const TIMEOUT_SECONDS = 30;

class PhaseRecorder {
  private readonly latencies = new Map<RequestKind, number[]>();
  private readonly statuses = new Map<RequestKind, Map<number, number>>();
  /** First-time submissions to send again with their key: never answered (cut off at the end of the window, lost or timed out) or answered 5xx. */
  readonly unanswered: { learner: BenchLearner; body: string }[] = [];
  readonly failures: FailedRequest[] = [];
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

  figures(seconds: number): Omit<PhaseFigures, "unanswered" | "settledByRetry" | "unsettled" | "failures"> {
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

function attemptIdOf(body: string): string | null {
  try {
    return (JSON.parse(body) as { attempt: { id: string } }).attempt.id;
  } catch {
    return null;
  }
}

/** `offset` staggers the resends, so that some learners resend as early as their second submission. */
type LearnerState = { learner: BenchLearner; offset: number; turns: number; submissions: number; last: { body: string; attemptId: string } | null };
type Sent = { learnerState: LearnerState; kind: RequestKind; body?: string };

/**
 * The requests of one connection, shared in turn by its learners. Each learner submits an attempt
 * (passing and failing choices in turn, every `retryEvery`-th submission a resend of the previous
 * one with its key, as a browser resends after a lost answer) and loads its workbench, again and again; or, by `mode`, only one of the two.
 */
function connectionRequests(learners: BenchLearner[], recorder: PhaseRecorder, client: Client, mode: DriverRequest["mode"], retryEvery: number): Request[] {
  // Half the learners start by loading their workbench, so that even a short window sees both kinds.
  const states: LearnerState[] = learners.map((learner, i) => ({ learner, offset: i % Math.max(1, retryEvery), turns: i % 2, submissions: 0, last: null }));
  let turn = 0;
  let inFlight: Sent | null = null;
  let answered: RequestKind = "page";
  let lostHow = "closed";

  const nextSubmission = (state: LearnerState): Sent => {
    state.submissions += 1;
    if (retryEvery > 0 && (state.submissions + state.offset) % retryEvery === 0 && state.last) return { learnerState: state, kind: "retry", body: state.last.body };
    const { passing, failing, answers } = state.learner;
    const choices = state.submissions % 2 ? passing : failing;
    return { learnerState: state, kind: "submit", body: JSON.stringify({ choices, answers, idempotencyKey: randomUUID() }) };
  };
  /** `failed`: the connection was lost or timed out, rather than the window having ended. */
  const loseInFlight = (failed: boolean) => {
    if (inFlight?.kind === "submit") recorder.unanswered.push({ learner: inFlight.learnerState.learner, body: inFlight.body! });
    if (inFlight && failed) recorder.failures.push({ kind: inFlight.kind, status: null, lost: lostHow, atMs: Date.now() });
    inFlight = null;
    lostHow = "closed";
  };

  const request: Request = {
    path: "/",
    setupRequest(base): Request {
      // A request still in flight when the next is set up was never answered: autocannon moves on
      // once the connection closes or the request times out.
      loseInFlight(true);
      const state = states[turn++ % states.length];
      const submits = mode === "submits" || (mode === "mix" && state.turns++ % 2 === 0);
      inFlight = submits ? nextSubmission(state) : { learnerState: state, kind: "page" };
      const { cookie, address, labSlug } = state.learner;
      const headers = { cookie, "x-forwarded-for": address };
      if (inFlight.body === undefined) return { ...base, method: "GET", path: `/labs/${labSlug}`, headers };
      return { ...base, method: "POST", path: `/api/labs/${labSlug}/attempts`, headers: { ...headers, "content-type": "application/json" }, body: inFlight.body };
    },
    onResponse(status, body) {
      const sent = inFlight!;
      inFlight = null;
      answered = sent.kind;
      recorder.record(sent.kind, status);
      if (status >= 300) recorder.failures.push({ kind: sent.kind, status, atMs: Date.now() });
      // The workbench keeps the key of a submission answered 5xx and sends it again.
      if (sent.kind === "submit" && status >= 500) recorder.unanswered.push({ learner: sent.learnerState.learner, body: sent.body! });
      if (sent.kind === "page" || !isSuccess(status)) return;
      const attemptId = attemptIdOf(body);
      const state = sent.learnerState;
      if (attemptId === null) {
        // autocannon keeps its response parser when it reconnects after a connection closed in the
        // middle of an answer, so the rest of a page cut off can be read as this request's answer.
        recorder.failures.push({ kind: sent.kind, status, lost: "unreadable answer", atMs: Date.now() });
        if (sent.kind === "submit") recorder.unanswered.push({ learner: state.learner, body: sent.body! });
        return;
      }
      if (sent.kind === "submit") {
        recorder.firstTimeStored += 1;
        state.last = { body: sent.body!, attemptId };
      } else if (attemptId === state.last?.attemptId && status === 200) recorder.retriesReplayed += 1;
      else recorder.retriesDiverged += 1;
    },
  };
  // autocannon reports each response's time right after its onResponse, so `answered` names its kind.
  client.on("response", (_status, _bytes, durationMs) => recorder.addLatency(answered, durationMs));
  client.on("done", () => loseInFlight(false));
  client.on("timeout", () => (lostHow = "timed out"));
  client.on("connError", (error: NodeJS.ErrnoException) => (lostHow = error.code ?? error.message));
  return [request];
}

/**
 * One connection per learner, each sending its next request as soon as the last is answered; or,
 * with `requestsPerSecond`, that many connections at one request a second each (autocannon's
 * smallest pace), the learners taking turns on them. autocannon paces all connections of one run
 * on the same second ticks, which would send every second's requests at one instant; one run per
 * paced connection, started a fraction of a second after the last, spreads them over the second.
 */
async function load(params: {
  baseUrl: string;
  learners: BenchLearner[];
  seconds: number;
  mode: DriverRequest["mode"];
  recorder: PhaseRecorder;
  retryEvery: number;
  requestsPerSecond?: number;
}): Promise<void> {
  const run = (learners: BenchLearner[][], paced: boolean) => {
    let next = 0;
    return autocannon({
      url: params.baseUrl,
      connections: learners.length,
      duration: params.seconds,
      timeout: TIMEOUT_SECONDS,
      ...(paced ? { connectionRate: 1 } : {}),
      setupClient(client) {
        client.setRequests(connectionRequests(learners[next++], params.recorder, client, params.mode, params.retryEvery));
      },
    });
  };
  if (!params.requestsPerSecond) {
    await run(params.learners.map((learner) => [learner]), false);
    return;
  }
  const connections = Math.min(params.learners.length, params.requestsPerSecond);
  const shares = Array.from({ length: connections }, (_, c) => params.learners.filter((_, i) => i % connections === c));
  await Promise.all(
    shares.map(async (share, c) => {
      await new Promise((resolve) => setTimeout(resolve, (c * 1000) / connections));
      await run([share], true);
    }),
  );
}

/**
 * A submission whose answer was lost or was a 5xx is sent again with its key, as the workbench does; its answer
 * stands for the first one. A key the server had already stored must come back as a replay.
 */
async function settleUnanswered(baseUrl: string, recorder: PhaseRecorder): Promise<{ settled: number; failed: number }> {
  let settled = 0;
  let failed = 0;
  for (const { learner, body } of recorder.unanswered) {
    const response = await fetch(`${baseUrl}/api/labs/${learner.labSlug}/attempts`, {
      method: "POST",
      headers: { cookie: learner.cookie, "x-forwarded-for": learner.address, "content-type": "application/json" },
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
  const runs = [load({ ...common, learners: request.learners, seconds: request.seconds, mode: request.mode, requestsPerSecond: request.requestsPerSecond })];
  if (request.probe) {
    runs.push(load({ ...common, learners: request.probe, seconds: request.seconds, mode: "pages" }));
  }
  await Promise.all(runs);
  const lost = await settleUnanswered(request.baseUrl, recorder);
  return {
    ...recorder.figures(request.seconds),
    unanswered: lost.settled + lost.failed,
    settledByRetry: lost.settled,
    unsettled: lost.failed,
    failures: recorder.failures,
  };
}

process.on("message", (request: DriverRequest) => {
  runPhase(request).then(
    (figures) => process.send!({ figures }),
    (error: unknown) => process.send!({ error: error instanceof Error ? (error.stack ?? error.message) : String(error) }),
  );
});
