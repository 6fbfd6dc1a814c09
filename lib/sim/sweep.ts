import { z } from "zod";
import { SimInputError } from "./errors";
import type { JudgementName } from "./receiver";
import { parseSimInput, type SimInput } from "./schema";
import { analyseRun } from "./simulate";
import type { Outcome } from "./verdict";

/**
 * The series resistor swept over a list of values (a resistor series on hand): per value, both
 * judgements' margins and the outcome, each from a full-accuracy run with bit replays; and the
 * value to fit.
 */

/** A judgement's margins at one resistor value. */
export type SweptJudgement = {
  pass: boolean;
  /** Worst bit's distance from a wrong reading in voltage (V). */
  voltageMargin: number;
  /** Worst bit's distance from a wrong reading in time (s); null when no bit holds a complete pulse. */
  timingMargin: number | null;
};

export type SweepPoint = { resistance: number; outcome: Outcome } & Record<JudgementName, SweptJudgement>;

export type SeriesRecommendation =
  | {
      resistance: number;
      /** The judgement the value is chosen under: guaranteed where any value reaches it, else typical. */
      judgement: JudgementName;
      voltageMargin: number;
      timingMargin: number | null;
      /** Every swept value that passes that judgement (the working window; not always one unbroken run). */
      window: number[];
    }
  | { resistance: null; judgement: null; voltageMargin: null; timingMargin: null; window: [] };

/**
 * Bit replays for the sweep (bit-replays.ts): a bit is copied on from an earlier one when the
 * line's states at their starts lie within 5 mV. Over the 49 E24 values on 20 m of lone lead
 * (96 bits, 3.3 V into 5 V; npm run bench:planner) the margins stay within 0.1 mV of solving every
 * bit and the far end within 5 mV (0.1 % of VDD), for about a quarter less solving.
 */
export const SWEEP_REPLAY_TOLERANCE = 5e-3;

const valuesSchema = z
  .array(
    z
      .number({ error: "must be a number (Ω)" })
      .refine(Number.isFinite, { error: "must be a finite number" })
      .min(0, { error: "must be at least 0 Ω" })
      .max(10_000, { error: "must be at most 10000 Ω" }),
  )
  .min(1, { error: "give at least one resistor value" })
  .max(200, { error: "at most 200 resistor values" });

function parseValues(values: readonly number[]): number[] {
  const parsed = valuesSchema.safeParse(values);
  if (parsed.success) return parsed.data;
  throw new SimInputError(parsed.error.issues.map((issue) => ({ path: ["values", ...issue.path].map(String).join("."), message: issue.message })));
}

const swept = (judgement: SweptJudgement): SweptJudgement => ({
  pass: judgement.pass,
  voltageMargin: judgement.voltageMargin,
  timingMargin: judgement.timingMargin,
});

/** Both judgements at every value, in the order given; the input's own seriesResistance is replaced. */
export function sweepSeriesResistance(input: SimInput, values: readonly number[]): SweepPoint[] {
  const resistances = parseValues(values);
  const resolved = parseSimInput(input);
  return resistances.map((resistance) => {
    const { verdict } = analyseRun({ ...resolved, seriesResistance: resistance }, { bitReplayTolerance: SWEEP_REPLAY_TOLERANCE });
    return { resistance, outcome: verdict.outcome, guaranteed: swept(verdict.guaranteed), typical: swept(verdict.typical) };
  });
}

/** Wider voltage margin first (the lessons' measure of a working value), then wider timing margin. */
function better(a: SweepPoint, b: SweepPoint, judgement: JudgementName): SweepPoint {
  const [x, y] = [a[judgement], b[judgement]];
  if (y.voltageMargin !== x.voltageMargin) return y.voltageMargin > x.voltageMargin ? b : a;
  return (y.timingMargin ?? -Infinity) > (x.timingMargin ?? -Infinity) ? b : a;
}

/**
 * The value with the widest margin under the guaranteed judgement, or under the typical one
 * where no value is guaranteed (labelled which); none when nothing works on typical pixels.
 */
export function recommendSeriesResistance(points: readonly SweepPoint[]): SeriesRecommendation {
  for (const judgement of ["guaranteed", "typical"] as const) {
    const passing = points.filter((point) => point[judgement].pass);
    if (passing.length === 0) continue;
    const best = passing.reduce((a, b) => better(a, b, judgement));
    return {
      resistance: best.resistance,
      judgement,
      voltageMargin: best[judgement].voltageMargin,
      timingMargin: best[judgement].timingMargin,
      window: passing.map((point) => point.resistance),
    };
  }
  return { resistance: null, judgement: null, voltageMargin: null, timingMargin: null, window: [] };
}
