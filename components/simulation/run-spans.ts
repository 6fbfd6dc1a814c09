import type { RunSpan } from "./live-run";

/** A run at rest: every bit, at the accuracy grades are given at. */
export const FULL_SPAN: RunSpan = { quality: "grade" };

/**
 * A run redrawn while a control is dragged, to fit an animation frame (16 ms) even when the line
 * rings for the whole pattern: coarser steps (usually within 1 % of VDD of the full run, always
 * within 2 % in the tests) and only the first pixel's 24 bits. Every lab pattern is 24 bits or
 * fewer, so there this cuts nothing; a longer pattern shows its first pixel while the control
 * moves and the whole run when it stops. Measured by `npm run bench:live`; bounded by
 * tests/unit/sim/drag-preview.test.ts.
 */
export const DRAG_SPAN: RunSpan = { quality: "preview", firstBits: 24 };

/**
 * Sampling of a drawn run: fine enough for a 3 ns edge to keep its shape when the scope zooms to
 * one edge, capped so a long pattern stays a few megabytes.
 */
export const DRAWING_SAMPLING = { finestInterval: 0.5e-9, maxPoints: 100_000 };
