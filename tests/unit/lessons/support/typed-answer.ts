import { evaluate, isUnit, type Unit } from "mathjs";
import type { NumericAnswer } from "@/lessons";

/** What a learner's entry is worth in SI, as the quick-check grader reads it with mathjs. */
export function entryInSi(entry: string): number {
  const value: unknown = evaluate(entry);
  if (typeof value === "number") return value;
  if (isUnit(value)) return (value as Unit).toSI().toNumeric() as number;
  throw new Error(`not a number or quantity: ${entry}`);
}

/** The entry a learner would type for an exact answer: the value expressed in the answer's unit. */
export function entryFor(answer: NumericAnswer, value = answer.value): string {
  if (answer.unit === "") return String(value);
  const scale = entryInSi(`1 ${answer.unit}`);
  return `${value / scale} ${answer.unit}`;
}

export function accepts(answer: NumericAnswer, entry: string): boolean {
  return Math.abs(entryInSi(entry) - answer.value) <= answer.tolerance * Math.abs(answer.value);
}
