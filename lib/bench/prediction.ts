import type { BenchStatedValues } from "@/db/queries/bench";
import { buildSimInput, type Lesson } from "@/lessons";
import { CABLE_KINDS, parseSimInput, reasonHeading, SimInputError, simulateRun, type Outcome, type SimInput } from "@/lib/sim";

// What the line simulator predicts for the run a learner says they built, drawn the way a scope
// photo shows it: one rising edge at the first pixel.

export type PredictedPoint = { t: number; near: number; far: number };

export type BenchPrediction =
  | {
      ok: true;
      riseTime: number | null;
      overshoot: number;
      outcome: Outcome;
      /** The outcome in the simulator's words (lib/sim/verdict.ts). */
      summary: string;
      reasons: { heading: string; severity: "fail" | "warning"; message: string }[];
      z0: number;
      delay: number;
      assumed: { driverResistance: number; edgeTime: number; pixelSupply: number; highThreshold: number; lowThreshold: number };
      /** Around the first rising edge at the far end; t in nanoseconds from the start of the window. */
      trace: PredictedPoint[];
    }
  | { ok: false; reason: string };

// Long enough for a few round trips of the line, short enough that the edge itself stays readable.
const windowBefore = 40e-9;
const windowAfterRange = { min: 250e-9, max: 900e-9, roundTrips: 3 };
const windowStep = 50e-9;
const tracePoints = 500;

/**
 * The run of the lesson's lab (driver resistance and edge, pixel input, bit pattern) with the
 * learner's stated cable, length, resistor and driver level put in. The lab's first run stands in
 * for what the learner did not state.
 */
export function benchSimInput(lesson: Lesson, stated: BenchStatedValues): SimInput | null {
  const run = lesson.lab?.runs[0];
  const cable = CABLE_KINDS.find((kind) => kind === stated.cableKind);
  if (!run || !cable || stated.lengthM === null || stated.seriesResistanceOhm === null || stated.driverVoltageV === null) return null;
  const input = buildSimInput(run.scenario, { cable, length: stated.lengthM, seriesResistance: stated.seriesResistanceOhm });
  return { ...input, driver: { ...input.driver, highVoltage: stated.driverVoltageV } };
}

export function predictBenchRun(lesson: Lesson, stated: BenchStatedValues): BenchPrediction {
  const input = benchSimInput(lesson, stated);
  if (!input) return { ok: false, reason: "The learner has not stated the cable, length, resistor and driver level." };
  try {
    const resolved = parseSimInput(input);
    const result = simulateRun(resolved, { keepFullResolution: true });
    const { metrics, verdict, line, full } = result;
    const firstOne = result.bits.find((bit) => bit.sent === 1) ?? result.bits[0];
    const from = (firstOne?.start ?? 0) + line.delay - windowBefore;
    const after = Math.min(windowAfterRange.max, Math.max(windowAfterRange.min, windowAfterRange.roundTrips * 2 * line.delay));
    const to = from + Math.ceil((windowBefore + after) / windowStep) * windowStep;
    return {
      ok: true,
      riseTime: metrics.riseTime,
      overshoot: metrics.overshoot,
      outcome: verdict.outcome,
      summary: verdict.summary,
      reasons: verdict.reasons.map((reason) => ({ heading: reasonHeading(reason), severity: reason.severity, message: reason.message })),
      z0: line.z0,
      delay: line.delay,
      assumed: {
        driverResistance: resolved.driver.outputResistance,
        edgeTime: resolved.driver.edgeTime,
        pixelSupply: resolved.receiver.supplyVoltage,
        highThreshold: resolved.receiver.highThreshold,
        lowThreshold: resolved.receiver.lowThreshold,
      },
      trace: full ? sampleWindow(full, from, to) : [],
    };
  } catch (error) {
    if (error instanceof SimInputError) return { ok: false, reason: `The simulator cannot model this run: ${error.message}` };
    throw error;
  }
}

/** Evenly spaced points over [from, to], each taken at the nearest step of the full-resolution result. */
function sampleWindow(full: { time: Float64Array; nearEnd: Float64Array; farEnd: Float64Array }, from: number, to: number): PredictedPoint[] {
  const { time, nearEnd, farEnd } = full;
  const last = time.length - 1;
  const dt = last > 0 ? time[1]! - time[0]! : 1;
  const points: PredictedPoint[] = [];
  for (let k = 0; k < tracePoints; k += 1) {
    const at = from + ((to - from) * k) / (tracePoints - 1);
    const i = Math.min(last, Math.max(0, Math.round((at - time[0]!) / dt)));
    points.push({ t: round((at - from) * 1e9, 1e2), near: round(nearEnd[i]!, 1e3), far: round(farEnd[i]!, 1e3) });
  }
  return points;
}

const round = (value: number, scale: number) => Math.round(value * scale) / scale;
