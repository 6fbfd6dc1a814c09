import { parseSimInput, SimInputError, simulateRun, type SimInput, type SolveQuality } from "@/lib/sim";
import type { LiveRun, SimulationReply, SimulationRequest } from "./live-run";

// Sampling for the scope view: fine enough for a 3 ns edge to keep its shape when zoomed to
// one edge, capped so a long pattern stays a few megabytes.
const FINEST_INTERVAL = 0.5e-9;
const MAX_POINTS = 100_000;

function sampleInterval(input: ReturnType<typeof parseSimInput>): number {
  const { signal } = input;
  const bitCount = signal.bits?.length ?? (signal.colours?.length ?? 0) * 24;
  const span = signal.leadIn + (bitCount + 2) * signal.bitPeriod + (signal.latchGap ?? 0) + 2e-6;
  return Math.max(FINEST_INTERVAL, span / MAX_POINTS);
}

function describe(error: unknown): string {
  if (error instanceof SimInputError) return error.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ");
  return error instanceof Error ? error.message : String(error);
}

function simulate(input: SimInput, quality: SolveQuality): LiveRun {
  const started = performance.now();
  const resolved = parseSimInput(input);
  const result = simulateRun({ ...resolved, output: { sampleInterval: sampleInterval(resolved) } }, { quality });
  const { receiver, signal } = resolved;
  return {
    trace: {
      time: Float64Array.from(result.time),
      nearEnd: Float64Array.from(result.nearEnd),
      farEnd: Float64Array.from(result.farEnd),
    },
    decoded: result.decoded,
    bits: result.bits,
    metrics: result.metrics,
    verdict: result.verdict,
    line: result.line,
    receiver: { supplyVoltage: receiver.supplyVoltage, highThreshold: receiver.highThreshold, lowThreshold: receiver.lowThreshold },
    timing: { bitPeriod: signal.bitPeriod, zeroHigh: signal.zeroHigh, oneHigh: signal.oneHigh, leadIn: signal.leadIn },
    computeMs: performance.now() - started,
  };
}

// The project's type library is the DOM's; this is the slice of a worker's global scope used here.
const scope = self as unknown as {
  onmessage: ((event: MessageEvent<SimulationRequest>) => void) | null;
  postMessage(message: SimulationReply, transfer?: Transferable[]): void;
};

scope.onmessage = (event) => {
  const { id, input, quality } = event.data;
  let reply: SimulationReply;
  try {
    reply = { id, ok: true, run: simulate(input, quality) };
  } catch (error) {
    scope.postMessage({ id, ok: false, error: describe(error) });
    return;
  }
  const { trace } = reply.run;
  scope.postMessage(reply, [trace.time.buffer, trace.nearEnd.buffer, trace.farEnd.buffer]);
};
