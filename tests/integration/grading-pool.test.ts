/**
 * The server grades on worker threads (lib/grading/grading-pool.ts): real threads here, started
 * from the TypeScript sources, compared with grading on the test's own thread.
 */
import { describe, expect, it } from "vitest";
import { getCourse, type Lab } from "@/lessons";
import { formatInUnit } from "@/lib/answers";
import { gradeWork, variantSeedFor } from "@/lib/grading";
import { gradeWorkOffThread } from "@/lib/grading/grade-off-thread";
import { gradingThreadCount, simulateOffThread } from "@/lib/grading/grading-pool";

const labs = getCourse().lessons.flatMap((lesson) => (lesson.lab ? [lesson.lab] : []));
const rightAnswers = (lab: Lab) => Object.fromEntries(lab.questions.map((q) => [q.id, formatInUnit(q.answer.value, q.answer.unit)]));

/** Every lab, its reference solution and its first catalogued mistake, for two learners' variants. */
const submissions = labs.flatMap((lab) =>
  ["learner-a", "learner-b"].flatMap((learner) =>
    [lab.reference.solution, lab.reference.mistakes[0].choices].map((choices) => ({
      lab,
      seed: variantSeedFor(learner, lab.slug),
      choices,
      answers: rightAnswers(lab),
    })),
  ),
);

describe("grading on worker threads", () => {
  it("grades every lab exactly as the request thread does, passes and failures alike, all submitted at once", async () => {
    const offThread = await Promise.all(submissions.map((submission) => gradeWorkOffThread(submission)));
    expect(offThread).toEqual(submissions.map((submission) => gradeWork(submission)));
    // Both outcomes occur, so the comparison covers failing runs' reasons as well as passes.
    const passes = offThread.map((work) => work.runs.every((run) => run.pass));
    expect(passes).toContain(true);
    expect(passes).toContain(false);
  });

  it("refuses bad choices on the request thread with the same 422 as before, naming the field", async () => {
    const lab = labs.find((l) => l.slug === "lone-lead-termination")!;
    const submission = { lab, seed: variantSeedFor("learner-a", lab.slug), choices: { main: { seriesResistance: 151 } } };
    await expect(gradeWorkOffThread(submission)).rejects.toMatchObject({ code: "invalid-input", fieldErrors: { "choices.main.seriesResistance": [expect.stringMatching(/E24/)] } });
  });

  it("fails only the job a thread cannot grade, and goes on grading the next ones", async () => {
    await expect(simulateOffThread({ labSlug: "no-such-lab", seed: "s", choices: {} })).rejects.toThrow(/no lab "no-such-lab"/);
    const [first] = submissions;
    expect(await gradeWorkOffThread(first)).toEqual(gradeWork(first));
  });

  it("takes its size from GRADING_THREADS, 0 meaning the request thread, and refuses anything else", () => {
    expect(gradingThreadCount({ GRADING_THREADS: "0" })).toBe(0);
    expect(gradingThreadCount({ GRADING_THREADS: "3" })).toBe(3);
    expect(gradingThreadCount({})).toBeGreaterThanOrEqual(1);
    expect(() => gradingThreadCount({ GRADING_THREADS: "two" })).toThrow(/GRADING_THREADS must be a whole number/);
    expect(() => gradingThreadCount({ GRADING_THREADS: "-1" })).toThrow(/GRADING_THREADS/);
  });
});
