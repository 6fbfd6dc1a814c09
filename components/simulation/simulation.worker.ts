import { parseSimInput, SimInputError, simulateForDrawing, type SimInput } from "@/lib/sim";
import type { LiveRun, RunSpan, SimulationReply, SimulationRequest } from "./live-run";
import { DRAWING_SAMPLING } from "./run-spans";

function describe(error: unknown): string {
  if (error instanceof SimInputError) return error.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ");
  return error instanceof Error ? error.message : String(error);
}

function simulate(input: SimInput, span: RunSpan): LiveRun {
  const started = performance.now();
  const resolved = parseSimInput(input);
  // The traces are new arrays every run: they are handed to the page (transferred, not copied), which keeps them while it draws.
  const run = simulateForDrawing(resolved, { ...DRAWING_SAMPLING, ...span });
  const { receiver, signal } = resolved;
  return {
    trace: run.trace,
    decoded: run.decoded,
    bits: run.bits,
    metrics: run.metrics,
    verdict: run.verdict,
    line: run.line,
    receiver: { supplyVoltage: receiver.supplyVoltage, highThreshold: receiver.highThreshold, lowThreshold: receiver.lowThreshold },
    timing: { bitPeriod: signal.bitPeriod, zeroHigh: signal.zeroHigh, oneHigh: signal.oneHigh, leadIn: signal.leadIn },
    span,
    patternBits: run.patternBits,
    computeMs: performance.now() - started,
  };
}

// The project's type library is the DOM's; this is the slice of a worker's global scope used here.
const scope = self as unknown as {
  onmessage: ((event: MessageEvent<SimulationRequest>) => void) | null;
  postMessage(message: SimulationReply, transfer?: Transferable[]): void;
};

scope.onmessage = (event) => {
  const { id, input, span } = event.data;
  let reply: SimulationReply;
  try {
    reply = { id, ok: true, run: simulate(input, span) };
  } catch (error) {
    scope.postMessage({ id, ok: false, error: describe(error) });
    return;
  }
  const { trace } = reply.run;
  scope.postMessage(reply, [trace.time.buffer, trace.nearEnd.buffer, trace.farEnd.buffer]);
};
