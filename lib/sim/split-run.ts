import { z } from "zod";
import { combineVerdicts, type CombinedVerdict } from "./combined-verdict";
import { SimInputError } from "./errors";
import { runSegmentSchema, signalSchema, type SimInput } from "./schema";
import { simulateRun, type SimResult, type SimulateOptions } from "./simulate";

/**
 * A run split by regenerating pixels: each re-drives the data from its own output stage, so
 * the next segment starts from a fresh driver (the pixel re-times every bit it forwards) and
 * sees nothing of the ringing before it. Each segment is simulated as a run of its own, with the
 * same bit pattern (a segment's margins depend on the pattern's timing, not on which pixel's
 * colour it carries); the run is as good as its worst segment.
 */

export const splitRunSchema = z.strictObject({
  signal: signalSchema,
  /** From the controller to the first regenerating pixel, then from each such pixel's output stage on. */
  segments: z.array(runSegmentSchema).min(2, { error: "a split run has at least two segments" }).max(16, { error: "at most 16 segments" }),
});

export type SplitRunInput = z.input<typeof splitRunSchema>;

export type SplitRunResult = { segments: SimResult[]; verdict: CombinedVerdict };

/** "segment 1 (controller to the regenerating pixel, 12 m)". */
function segmentLabel(index: number, count: number, length: number): string {
  const ends = index === 0 ? "controller to the regenerating pixel" : index === count - 1 ? "regenerating pixel to the end" : "between regenerating pixels";
  return `segment ${index + 1} (${ends}, ${Number(length.toPrecision(3))} m)`;
}

export function simulateSplitRun(input: SplitRunInput, options: SimulateOptions = {}): SplitRunResult {
  const parsed = splitRunSchema.safeParse(input);
  if (!parsed.success) {
    throw new SimInputError(parsed.error.issues.map((issue) => ({ path: issue.path.map(String).join("."), message: issue.message })));
  }
  const { signal, segments } = parsed.data;
  const results = segments.map((segment) => simulateRun({ ...segment, signal } as SimInput, options));
  const verdict = combineVerdicts(
    results.map((result, i) => ({ stage: segmentLabel(i, results.length, result.line.length), verdict: result.verdict })),
  );
  return { segments: results, verdict };
}
