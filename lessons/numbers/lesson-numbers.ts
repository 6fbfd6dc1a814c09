import { flattenNumbers, type LessonNumbers, type NumberTree } from "./lesson-number";
import { sharedNumbers } from "./shared-numbers";

/** A lesson's own numbers with the shared ones, flat by dotted name, for the lesson's `numbers` field. */
export function lessonNumbers(own: NumberTree): LessonNumbers {
  const clash = Object.keys(own).find((name) => Object.hasOwn(sharedNumbers, name));
  if (clash) throw new Error(`"${clash}" names a group of shared numbers (lessons/numbers/shared-numbers.ts); choose another name`);
  return flattenNumbers({ ...sharedNumbers, ...own });
}
