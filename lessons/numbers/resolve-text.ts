import type { LessonNumbers } from "./lesson-number";
import { resolvePlaceholders } from "./placeholders";

export type TextProblem = { path: (string | number)[]; message: string };

/**
 * A copy of `value` (lesson content: plain objects, arrays, strings, numbers, booleans) with the
 * placeholders of every string printed from `numbers`; each placeholder that cannot be printed is
 * reported at the path of its string.
 */
export function resolveText<T>(value: T, numbers: LessonNumbers, report: (problem: TextProblem) => void, path: (string | number)[] = []): T {
  if (typeof value === "string") {
    const resolved = resolvePlaceholders(value, numbers);
    for (const message of resolved.problems) report({ path, message });
    return resolved.text as T;
  }
  if (Array.isArray(value)) return value.map((item, i) => resolveText(item, numbers, report, [...path, i])) as T;
  if (value !== null && typeof value === "object") {
    return Object.fromEntries(Object.entries(value).map(([key, item]) => [key, resolveText(item, numbers, report, [...path, key])])) as T;
  }
  return value;
}
