import { cableCatalogue, type SimResult } from "@/lib/sim";
import { buffer5v } from "@/lessons/drivers";
import type { CheckFixes, CheckRun, ChoiceCheckBlock } from "@/lessons/schema";
import { describeCheckRun, inSentence, simulateCheckRun } from "./check-runs";
import { FAR_END_SHAPES, SHAPE_WORDS, readFarEndShape } from "./far-end-shape";
import { seededIndex, seededOrder } from "./seed";

const SUPPLY = 5;
const LETTERS = ["A", "B", "C", "D"] as const;

/** The changes a diagnose check offers, in the order the form lists them. */
export const FIXES = ["more-resistance", "less-resistance", "other-cable", "level-shifter"] as const;
export type Fix = (typeof FIXES)[number];

export type ChoiceOption = { key: string; label: string };

/** A far-end trace to draw: the simulator's samples and when the first 1 bit left the driver (s). */
export type DrawnTrace = { key: string; label: string; time: number[]; farEnd: number[]; firstOneStart: number };

/** One learner's copy of a choice check: what the page shows before an answer, nothing that tells the right option. */
export type PresentedChoiceCheck = {
  ask: ChoiceCheckBlock["ask"];
  /** The run the question is about, in words (pick-trace, predict, diagnose). */
  run: string;
  /** diagnose: what the installer sees on site, from the simulator's verdict. */
  symptom: string | null;
  options: ChoiceOption[];
  /** Drawn before answering: every candidate (pick-trace), the failing run (diagnose); none for predict. */
  traces: DrawnTrace[];
};

function drawn(key: string, label: string, result: SimResult): DrawnTrace {
  const firstOne = result.bits.find((bit) => bit.sent === 1) ?? result.bits[0];
  return { key, label, time: result.time, farEnd: result.farEnd, firstOneStart: firstOne.start };
}

/** The run the seed gives this learner: for pick-trace the one described, otherwise the one asked about. */
function givenRunIndex(block: ChoiceCheckBlock, seed: string): number {
  return seededIndex(seed, `${block.id}:run`, block.runs.length);
}

/** pick-trace: the order the traces are lettered in, so the described run's letter differs between learners. */
function traceOrder(block: ChoiceCheckBlock, seed: string): number[] {
  return seededOrder(seed, `${block.id}:order`, block.runs.length);
}

/** The run a fix turns the given run into. */
export function applyFix(run: CheckRun, fixes: CheckFixes, fix: Fix): CheckRun {
  switch (fix) {
    case "more-resistance":
      return { ...run, seriesResistance: run.seriesResistance * fixes.resistanceFactor };
    case "less-resistance":
      return { ...run, seriesResistance: run.seriesResistance / fixes.resistanceFactor };
    case "other-cable":
      return { ...run, cable: fixes.cable };
    case "level-shifter":
      return { ...run, driver: buffer5v };
  }
}

function fixWords(fix: Fix, fixes: CheckFixes): string {
  switch (fix) {
    case "more-resistance":
      return `More series resistance: ${fixes.resistanceFactor} times as much`;
    case "less-resistance":
      return `Less series resistance: a ${ordinal(fixes.resistanceFactor)} of it`;
    case "other-cable":
      return `Another cable: ${inSentence(cableCatalogue[fixes.cable].label)}, same length`;
    case "level-shifter":
      return `A level shifter: drive the line from a ${inSentence(buffer5v.label)}`;
  }
}

const ordinal = (factor: number) => (factor === 2 ? "half" : factor === 3 ? "third" : factor === 4 ? "quarter" : `1/${factor}`);

/** A run fixes the fault when every pixel that meets its datasheet reads it. */
const works = (result: SimResult) => result.verdict.outcome === "guaranteed";

/** What an installer sees of a failing run, in the simulator's words. */
function symptomOf(result: SimResult): string {
  // The verdict's reasons name the cause; the symptom is what a learner would see, not why.
  const sent = result.bits.map((bit) => bit.sent).join("");
  return `Sent ${sent}, typical pixels read ${result.decoded}. The simulator's verdict: ${result.verdict.summary}.`;
}

export function presentChoiceCheck(block: ChoiceCheckBlock, seed: string): PresentedChoiceCheck {
  const given = block.runs[givenRunIndex(block, seed)];
  if (block.ask === "pick-trace") {
    const order = traceOrder(block, seed);
    const options = presentOptions(block);
    const traces = order.map((runIndex, position) => drawn(LETTERS[position], `Trace ${LETTERS[position]}`, simulateCheckRun(block.runs[runIndex])));
    return { ask: block.ask, run: describeCheckRun(given), symptom: null, options, traces };
  }
  if (block.ask === "predict") {
    return { ask: block.ask, run: describeCheckRun(given), symptom: null, options: presentOptions(block), traces: [] };
  }
  const result = simulateCheckRun(given);
  return { ask: block.ask, run: describeCheckRun(given), symptom: symptomOf(result), options: presentOptions(block), traces: [drawn("given", "The failing run", result)] };
}

/** The right option's key for this learner, computed from the simulator. */
export function correctChoice(block: ChoiceCheckBlock, seed: string): string {
  const givenIndex = givenRunIndex(block, seed);
  const given = block.runs[givenIndex];
  if (block.ask === "pick-trace") return LETTERS[traceOrder(block, seed).indexOf(givenIndex)];
  if (block.ask === "predict") return readFarEndShape(simulateCheckRun(given), SUPPLY).shape;
  const fixing = FIXES.filter((fix) => works(simulateCheckRun(applyFix(given, block.fixes!, fix))));
  if (fixing.length !== 1) throw new Error(`diagnose check ${block.id}: ${fixing.length} fixes work for run ${givenIndex}; exactly one must`);
  return fixing[0];
}

/** Traces shown once the learner has answered: the run they predicted (predict), nothing new otherwise. */
export function revealedTraces(block: ChoiceCheckBlock, seed: string): DrawnTrace[] {
  if (block.ask !== "predict") return [];
  return [drawn("run", "The run", simulateCheckRun(block.runs[givenRunIndex(block, seed)]))];
}

export type ChoiceGrade = { status: "correct" | "incorrect"; correct: boolean; entry: string; message: string } | { status: "unreadable"; message: string };

/** Grades a chosen option on the server; `entry` is the option's words as stored. */
export function gradeChoiceCheck(block: ChoiceCheckBlock, seed: string, key: string): ChoiceGrade {
  const option = presentOptions(block).find((o) => o.key === key);
  if (!option) return { status: "unreadable", message: "Choose one of the options first." };
  const correct = correctChoice(block, seed) === key;
  return {
    status: correct ? "correct" : "incorrect",
    correct,
    entry: option.label,
    message: correct ? `Correct: ${option.label}.` : `Not yet: ${option.label} is not the answer.`,
  };
}

/** The options in the order the form lists them; for pick-trace the letters, whose runs the seed shuffles. */
function presentOptions(block: ChoiceCheckBlock): ChoiceOption[] {
  if (block.ask === "pick-trace") return block.runs.map((_, position) => ({ key: LETTERS[position], label: `Trace ${LETTERS[position]}` }));
  if (block.ask === "predict") return FAR_END_SHAPES.map((shape) => ({ key: shape, label: SHAPE_WORDS[shape] }));
  return FIXES.map((fix) => ({ key: fix, label: fixWords(fix, block.fixes!) }));
}
