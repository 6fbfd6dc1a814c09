import { RECEIVER_DEFAULTS, type SimResult } from "@/lib/sim";

/** The shapes a predict-then-run check offers, in the order the form lists them. */
export const FAR_END_SHAPES = ["clean", "ringing", "staircase", "short"] as const;
export type FarEndShape = (typeof FAR_END_SHAPES)[number];

export const SHAPE_WORDS: Record<FarEndShape, string> = {
  clean: "A clean step",
  ringing: "Ringing",
  staircase: "A staircase",
  short: "Fails to reach the threshold",
};

/** Overshoot above the settled high, as a share of it, from which a far end counts as ringing. */
const RINGING_SHARE = 0.1;
/** A rise slower than this many round trips climbs in visible steps. */
const STAIRCASE_ROUND_TRIPS = 2;

export type ShapeReading = { shape: FarEndShape; peak: number; overshootShare: number; riseRoundTrips: number | null };

/**
 * The far end's shape, read from the simulator's run: it never reaches the pixel's guaranteed
 * high threshold (short); it overshoots the settled high by a tenth or more (ringing); it rises
 * over several round trips of the line without overshoot (staircase); otherwise a clean step.
 */
export function readFarEndShape(result: SimResult, supply: number): ShapeReading {
  const peak = Math.max(...result.farEnd);
  const settled = peak - result.metrics.overshoot;
  const overshootShare = settled > 0 ? result.metrics.overshoot / settled : 0;
  const roundTrip = 2 * result.line.delay;
  const riseRoundTrips = result.metrics.riseTime === null || roundTrip === 0 ? null : result.metrics.riseTime / roundTrip;
  const shape: FarEndShape =
    peak < RECEIVER_DEFAULTS.highThreshold * supply
      ? "short"
      : overshootShare >= RINGING_SHARE
        ? "ringing"
        : riseRoundTrips !== null && riseRoundTrips >= STAIRCASE_ROUND_TRIPS
          ? "staircase"
          : "clean";
  return { shape, peak, overshootShare, riseRoundTrips };
}
