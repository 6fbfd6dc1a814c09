import type { LiveRun } from "@/components/simulation";

export type ZoomMode = "whole" | "bit" | "rise" | "fall";

export type TimeWindow = { from: number; to: number };

const EDGE_LEAD = 10e-9;
const EDGE_SPAN_MIN = 60e-9;
const EDGE_SPAN_MAX = 400e-9;

/** Time of the driver's falling edge in bit `index`. */
export function fallOf(run: LiveRun, index: number): number {
  const bit = run.bits[index];
  return bit.start + (bit.sent === 1 ? run.timing.oneHigh : run.timing.zeroHigh);
}

/**
 * The stretch of time to draw. An edge window starts just before the driver's edge and lasts a few
 * round trips of the line, so the far end's arrival, its staircase or its ringing all fit, while a
 * 3 ns edge is still a visible slope rather than a vertical line.
 */
export function timeWindow(run: LiveRun, mode: ZoomMode, bitIndex: number): TimeWindow {
  const { time } = run.trace;
  const whole = { from: 0, to: time[time.length - 1] ?? 0 };
  const bit = run.bits[Math.min(Math.max(bitIndex, 0), run.bits.length - 1)];
  if (mode === "whole" || !bit) return whole;
  const delay = run.line.delay;
  const period = run.timing.bitPeriod;
  if (mode === "bit") {
    return clamp({ from: bit.start + delay - 0.1 * period, to: bit.start + delay + 1.1 * period }, whole);
  }
  const edge = mode === "rise" ? bit.start : fallOf(run, run.bits.indexOf(bit));
  const span = Math.min(EDGE_SPAN_MAX, Math.max(EDGE_SPAN_MIN, 6 * 2 * delay + 40e-9));
  return clamp({ from: edge - EDGE_LEAD, to: edge + delay + span }, whole);
}

function clamp(window: TimeWindow, bounds: TimeWindow): TimeWindow {
  return { from: Math.max(bounds.from, window.from), to: Math.min(bounds.to, window.to) };
}

/** The bit a time falls in at the far end, for a verdict marker's "show me". */
export function bitAtFarEnd(run: LiveRun, time: number): number {
  const shifted = time - run.line.delay;
  const index = run.bits.findIndex((bit) => shifted < bit.start + run.timing.bitPeriod);
  return index === -1 ? run.bits.length - 1 : index;
}
