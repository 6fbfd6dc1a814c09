/**
 * Every quick check that asks for a resistance takes it as the trade writes it, through the same
 * grading the lesson page's action uses: the resistor code of IEC 60062 ("321R", "4k7") and the
 * unit's name in any case or plural ("321 Ohm", "321 ohms"), besides "321 Ω".
 */
import { describe, expect, it } from "vitest";
import { getCourse } from "@/lessons";
import { quantityMath } from "@/lib/answers/quantity-math";
import { gradeNumericCheck, numericCheckFor, quickCheckSeed } from "@/lib/quick-checks";

const SEEDS = ["learner-1", "learner-2", "learner-3"];
const ohm = quantityMath.unit("ohm");
const resistanceChecks = getCourse().lessons.flatMap((lesson) =>
  lesson.blocks.flatMap((block) =>
    block.kind === "check" && block.variants.some((v) => v.answer.unit !== "" && quantityMath.unit(v.answer.unit).equalBase(ohm))
      ? [[`${lesson.slug}/${block.id}`, lesson.slug, block] as const]
      : [],
  ),
);

/** A value in ohms as a resistor's code, to three figures: 321 → "321R", 4700 → "4k70", 0.47 → "R470". */
function resistorCode(ohms: number): string {
  const [multiplier, letter] = ohms >= 1e6 ? [1e6, "M"] : ohms >= 1e3 ? [1e3, "k"] : [1, "R"];
  const digits = (ohms / multiplier).toPrecision(3);
  const [whole, fraction = ""] = digits.split(".");
  return whole === "0" ? `${letter}${fraction}` : `${whole}${letter}${fraction}`;
}

describe("the course's resistance checks", () => {
  it("are there to test", () => {
    expect(resistanceChecks.length).toBeGreaterThanOrEqual(5);
  });

  describe.each(resistanceChecks)("%s", (_, lessonSlug, block) => {
    it.each(SEEDS)("accepts the trade's notations for %s and still refuses a wrong value written the same way", (learner) => {
      const seed = quickCheckSeed(learner, lessonSlug, block.id);
      const ohms = numericCheckFor(block, seed).answer.value;
      const three = Number(ohms.toPrecision(3));
      for (const entry of [resistorCode(ohms), `${three} Ohm`, `${three} ohms`, `${three} OHM`, `${three} Ω`, `${three}Ω`]) {
        expect(gradeNumericCheck(block, seed, entry), entry).toMatchObject({ status: "correct" });
      }
      expect(gradeNumericCheck(block, seed, resistorCode(ohms * 1.5))).toMatchObject({ status: "incorrect" });
      expect(gradeNumericCheck(block, seed, `${Number((ohms * 1.5).toPrecision(3))} ohms`)).toMatchObject({ status: "incorrect" });
    });
  });
});

describe("codes through a check's grading", () => {
  const [, lessonSlug, block] = resistanceChecks[0]!;
  const seed = quickCheckSeed("learner-1", lessonSlug, block.id);

  it("reads 4k7, 1K and R47 at their values, which a wrong answer then refuses", () => {
    expect(resistorCode(4700)).toBe("4k70");
    expect(resistorCode(321)).toBe("321R");
    for (const entry of ["4k7", "1K", "R47"]) expect(gradeNumericCheck(block, seed, entry).status).not.toBe("unreadable");
  });
});
