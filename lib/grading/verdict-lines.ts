import { reasonHeading } from "@/lib/sim/verdict";
import type { AttemptReason, AttemptView } from "./attempt-view";

// Types only from attempt-view: the workbench imports this in the browser, without zod.

/** Every reason of an attempt, run by run: the lab rule's failures first, then the simulator's verdict. */
export type VerdictLine = {
  runId: string;
  runLabel: string;
  source: "rule" | "simulator";
  severity: "fail" | "warning";
  /** "Fails", "Not guaranteed" or "Warning": the simulator's words (lib/sim/verdict.ts). */
  heading: string;
  message: string;
  at?: AttemptReason["at"];
};

export function verdictLines(view: Pick<AttemptView, "runs">): VerdictLine[] {
  return view.runs.flatMap((run) => [
    ...run.failures.map((failure) => ({
      runId: run.runId,
      runLabel: run.label,
      source: "rule" as const,
      severity: "fail" as const,
      heading: "Fails the lab's rule",
      message: failure.message,
    })),
    ...run.verdict.reasons.map((reason) => ({
      runId: run.runId,
      runLabel: run.label,
      source: "simulator" as const,
      severity: reason.severity,
      heading: reasonHeading(reason),
      message: reason.message,
      ...(reason.at && { at: reason.at }),
    })),
  ]);
}
