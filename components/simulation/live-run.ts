import type { RunMetrics, SimBit, SimInput, SimLine, SolveQuality, Verdict } from "@/lib/sim";

/** How much of a run to solve: the full run, or a quicker preview while a control is being dragged. */
export type RunSpan = {
  quality: SolveQuality;
  /** Solve only the first n bits of the pattern (a preview); undefined: all of them. */
  firstBits?: number;
};

/** A simulated run as the browser draws it: fine-grained traces as typed arrays, plus what decoding found. */
export type LiveRun = {
  /** Uniform samples (s, V); fine enough to show a 3 ns edge when zoomed. */
  trace: { time: Float64Array; nearEnd: Float64Array; farEnd: Float64Array };
  decoded: string;
  bits: SimBit[];
  metrics: RunMetrics;
  verdict: Verdict;
  line: SimLine;
  receiver: { supplyVoltage: number; highThreshold: number; lowThreshold: number };
  timing: { bitPeriod: number; zeroHigh: number; oneHigh: number; leadIn: number };
  /** How it was solved; `bits` may hold fewer bits than `patternBits` when the span cut the pattern short. */
  span: RunSpan;
  patternBits: number;
  /** Time the worker spent simulating (ms). */
  computeMs: number;
};

export type SimulationRequest = { id: number; input: SimInput; span: RunSpan };

export type SimulationReply = { id: number; ok: true; run: LiveRun } | { id: number; ok: false; error: string };
