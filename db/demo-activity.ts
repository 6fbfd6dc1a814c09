import { correctChoice, gradeChoiceCheck, numericCheckFor, presentChoiceCheck, quickCheckSeed } from "@/lib/quick-checks";
// A few weeks of made-up work by the demo learners, so the instructor's grid, charts and review
// queue and the learners' own pages have something to show. Every number is produced by the code
// the app itself runs: lab attempts by the grader on the learner's own variant, quick-check
// answers by the quantity parser, lesson completion by the course map's rules, bench values by the
// bench form's reader. The first learner of each cohort is left untouched: browser tests sign in
// as them and expect a fresh start. A learner who already has a lab attempt is skipped, so
// seeding twice adds nothing.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { getCourse, labVariant, lengthsOnOffer, resistorValuesOnOffer, type Lab, type LabChoices, type LabVariant, type Lesson } from "../lessons";
import { formatInUnit, gradeNumericAnswer } from "../lib/answers";
import { parseBenchForm } from "../lib/bench/submission-form";
import { AppError } from "../lib/http/errors";
import { gradeWork, outcomeOf, scoreWork, variantSeedFor, type GradedWork } from "../lib/grading";
import { checkKey, computeCourseProgress, type CheckFact, type LabFact } from "../lib/progress/course-progress";
import type { Database } from "./connection";
import { demoCohorts, demoLearnerEmail } from "./demo-data";
import {
  benchSubmissions,
  cohortMemberships,
  cohorts,
  labAttempts,
  lessonProgress,
  quickCheckAnswers,
  users,
  type NewBenchSubmission,
  type NewLabAttempt,
} from "./schema";

/** Where a learner has got to: labs passed in course order, then what happens at the next one. */
type Story = {
  labsPassed: number;
  next: { kind: "trying"; failures: number } | { kind: "stuck"; failures: number; resistors: "too-large" | "too-small" } | { kind: "reading" };
  /** Days between the learner's last piece of work and now. */
  quietDays: number;
  benchHandIn?: { cable: string; driver: string; length: string; resistor: string; riseTime: string; overshoot: string; prediction: string; note: string };
};

// By learner name (db/demo-data.ts); the first learner of each cohort has no story on purpose.
const stories: Record<string, Story> = {
  "Emeka Thorvaldsen": {
    labsPassed: 7,
    next: { kind: "trying", failures: 1 },
    quietDays: 1.2,
    benchHandIn: {
      cable: "beside-ground",
      driver: "3.3 V",
      length: "14 m",
      resistor: "22 ohm",
      riseTime: "17 ns",
      overshoot: "0.45 V",
      prediction: "Z0 about 94 ohm and a 3.3 V driver: the first arrival clears the threshold only below about 40 ohm, and ringing stays inside the margin above about 15 ohm, so 22 ohm.",
      note: "Probe at the first pixel with the spring ground. One small overshoot on the rising edge, no second crossing of the threshold.",
    },
  },
  "Hana Kowalczyk": { labsPassed: 5, next: { kind: "stuck", failures: 6, resistors: "too-large" }, quietDays: 0.3 },
  "Mateo Ashgrove": { labsPassed: 2, next: { kind: "trying", failures: 1 }, quietDays: 10.5 },
  "Siobhan Nakamura": { labsPassed: 4, next: { kind: "trying", failures: 2 }, quietDays: 2.1 },
  "Dmitri Osei": { labsPassed: 1, next: { kind: "trying", failures: 1 }, quietDays: 3.4 },
  "Tariq Lindgren": {
    labsPassed: 6,
    next: { kind: "trying", failures: 2 },
    quietDays: 0.5,
    benchHandIn: {
      cable: "twisted-pair",
      driver: "5 V",
      length: "9.5 m",
      resistor: "47 ohm",
      riseTime: "21 ns",
      overshoot: "0.3 V",
      prediction: "Twisted pair near 100 ohm; with the 5 V shifter the first arrival clears 3.5 V up to roughly 40 ohm of source resistance, so 47 ohm is on the edge: measure it.",
      note: "Rise time a little slower than predicted; the probe's ground lead was 10 cm, which may add to it. No threshold re-crossing.",
    },
  },
  "Mei-Lin Oyelaran": { labsPassed: 4, next: { kind: "stuck", failures: 5, resistors: "too-small" }, quietDays: 1.1 },
  "Jonas Adebayo-Strand": { labsPassed: 5, next: { kind: "trying", failures: 2 }, quietDays: 4.2 },
  "Freya Montalvo": { labsPassed: 3, next: { kind: "trying", failures: 1 }, quietDays: 12.3 },
  "Kwame Rasmussen": { labsPassed: 3, next: { kind: "reading" }, quietDays: 1.6 },
};

const minute = 60_000;
const day = 86_400_000;
/** Learners start their first lesson between 19 and 23 days before the seed runs. */
const firstDaysAgo = { min: 19, max: 23 };

/** FNV-1a then mulberry32: the same learner gets the same story details on every machine. */
function randomFor(text: string): () => number {
  let hash = 0x811c9dc5;
  for (let i = 0; i < text.length; i += 1) hash = Math.imul(hash ^ text.charCodeAt(i), 0x01000193);
  let state = hash >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const pick = <T>(items: readonly T[], random: () => number): T => items[Math.floor(random() * items.length)]!;
const passes = (work: GradedWork) => work.runs.every((run) => run.pass);

/** A clock that only moves forward, a few minutes per step, as a learner works through a session. */
function sessionClock(start: Date, random: () => number) {
  let time = start.getTime();
  return (minMinutes: number, maxMinutes: number) => {
    time += (minMinutes + random() * (maxMinutes - minMinutes)) * minute;
    return new Date(time);
  };
}

/** Any choice the learner's controls allow, picked at random: what someone guessing would submit. */
function guessedChoices(lab: Lab, variant: LabVariant, random: () => number): LabChoices {
  const choices: LabChoices = {};
  lab.runs.forEach((run, i) => {
    const scenario = variant.runs[i]!.scenario;
    const spec = run.choices;
    const timing = spec.timing && {
      zeroHigh: Number((spec.timing.zeroHigh.min + spec.timing.zeroHigh.step * Math.floor(random() * 8)).toPrecision(6)),
      oneHigh: Number((spec.timing.oneHigh.max - spec.timing.oneHigh.step * Math.floor(random() * 8)).toPrecision(6)),
    };
    choices[run.id] = {
      ...(spec.cable && scenario.cableOptions && { cable: pick(scenario.cableOptions, random) }),
      ...(spec.driver && scenario.driverOptions && { driver: pick(scenario.driverOptions, random).id }),
      ...(spec.seriesResistance && { seriesResistance: pick(resistorValuesOnOffer(run), random) }),
      ...(spec.length && { length: pick(lengthsOnOffer(run, scenario), random) }),
      ...timing,
    };
  });
  return choices;
}

/** The author's solution first, then the resistors nearest to it: how a learner closes in on a window. */
function candidateSolutions(lab: Lab, variant: LabVariant, random: () => number): LabChoices[] {
  const candidates: LabChoices[] = [lab.reference.solution];
  const [run] = lab.runs;
  if (lab.runs.length === 1 && run!.choices.seriesResistance) {
    const start = lab.reference.solution[run!.id]!.seriesResistance!;
    const distance = (value: number) => Math.abs(Math.log(value / start));
    const nearest = [...resistorValuesOnOffer(run!)].sort((a, b) => distance(a) - distance(b));
    candidates.push(...nearest.map((seriesResistance) => ({ [run!.id]: { seriesResistance } })));
  } else {
    for (let i = 0; i < 20; i += 1) candidates.push(guessedChoices(lab, variant, random));
  }
  return candidates;
}

/** Resistors on the wrong side of the window, for a learner who keeps pushing the same way. */
function oneSidedResistors(lab: Lab, side: "too-large" | "too-small", random: () => number): LabChoices[] {
  const [run] = lab.runs;
  const solution = lab.reference.solution[run!.id]!.seriesResistance!;
  const values = resistorValuesOnOffer(run!).filter((value) => (side === "too-large" ? value > solution * 1.5 : value < solution / 2.5));
  const shuffled = values.map((value) => ({ value, key: random() })).sort((a, b) => a.key - b.key);
  return shuffled.map(({ value }) => ({ [run!.id]: { seriesResistance: value } }));
}

function labAnswers(lab: Lab, slip: boolean, random: () => number): Record<string, string> {
  const slipped = slip && lab.questions.length > 0 ? pick(lab.questions, random).id : null;
  return Object.fromEntries(
    lab.questions.map((q) => [q.id, formatInUnit(q.id === slipped ? q.answer.value * pick([1.25, 0.5, 2], random) : q.answer.value, q.answer.unit)]),
  );
}

type LearnerWork = {
  attempts: NewLabAttempt[];
  answers: (typeof quickCheckAnswers.$inferInsert)[];
  labs: Map<string, LabFact>;
  checks: Map<string, CheckFact>;
  lessonsStarted: Map<string, Date>;
};

/** The grader's verdict, or null where the attempts route would refuse the submission without storing it. */
function grade(lab: Lab, seed: string, choices: LabChoices, answers: Record<string, string>): GradedWork | null {
  try {
    return gradeWork({ lab, seed, choices, answers });
  } catch (error) {
    if (error instanceof AppError && error.code === "invalid-input") return null;
    throw error;
  }
}

/** Grades and numbers an attempt exactly as the attempts route does, stamped with the session's clock. */
function recordAttempt(work: LearnerWork, learner: { id: string; cohortId: string }, lab: Lab, graded: GradedWork, at: Date) {
  const attemptNumber = work.attempts.filter((a) => a.labSlug === lab.slug).length + 1;
  const scored = scoreWork(lab, graded, attemptNumber);
  work.attempts.push({
    userId: learner.id,
    labSlug: lab.slug,
    cohortId: learner.cohortId,
    idempotencyKey: randomUUID(),
    attemptNumber,
    variantSeed: graded.seed,
    choices: scored.choices,
    outcome: outcomeOf(scored),
    score: scored.score,
    passed: scored.passed,
    createdAt: at,
  });
  const fact = work.labs.get(lab.slug) ?? { attempts: 0, bestScore: 0, bestPassingScore: null, firstPassedAt: null };
  work.labs.set(lab.slug, {
    attempts: fact.attempts + 1,
    bestScore: Math.max(fact.bestScore, scored.score),
    bestPassingScore: scored.passed ? Math.max(fact.bestPassingScore ?? 0, scored.score) : fact.bestPassingScore,
    firstPassedAt: fact.firstPassedAt ?? (scored.passed ? at : null),
  });
}

function answerChecks(work: LearnerWork, userId: string, lesson: Lesson, share: number, clock: ReturnType<typeof sessionClock>, random: () => number) {
  const checks = lesson.blocks.flatMap((block) => (block.kind === "check" || block.kind === "choice" ? [block] : []));
  for (const check of checks.slice(0, Math.ceil(checks.length * share))) {
    const seed = quickCheckSeed(userId, lesson.slug, check.id);
    const slips = random() < 0.35 ? (random() < 0.3 ? 2 : 1) : 0;
    const graded =
      check.kind === "check"
        ? (() => {
            const { answer } = numericCheckFor(check, seed);
            const entries = [
              ...Array.from({ length: slips }, () => formatInUnit(answer.value * pick([10, 0.1, 1.5, 0.5, 2], random), answer.unit)),
              formatInUnit(answer.value, answer.unit),
            ];
            return entries.map((entry) => {
              const result = gradeNumericAnswer(entry, answer);
              return { entry, value: result.value, correct: result.correct };
            });
          })()
        : (() => {
            const right = correctChoice(check, seed);
            const wrong = presentChoiceCheck(check, seed).options.filter((o) => o.key !== right);
            return [...wrong.slice(0, slips).map((o) => o.key), right].map((key) => {
              const result = gradeChoiceCheck(check, seed, key);
              if (result.status === "unreadable") throw new Error(`demo answer ${key} is not an option of ${check.id}`);
              return { entry: result.entry, value: null, correct: result.correct };
            });
          })();
    for (const { entry, value, correct } of graded) {
      const at = clock(1, 6);
      work.answers.push({ userId, lessonSlug: lesson.slug, checkId: check.id, entry, value, correct, createdAt: at });
      const key = checkKey(lesson.slug, check.id);
      const fact = work.checks.get(key) ?? { answers: 0, firstCorrectAt: null };
      work.checks.set(key, { answers: fact.answers + 1, firstCorrectAt: fact.firstCorrectAt ?? (correct ? at : null) });
    }
  }
}

/** One learner's story played through: a session per lesson, spread from three weeks ago to their last day of work. */
function playStory(learner: { id: string; cohortId: string; email: string }, story: Story, now: Date): LearnerWork {
  const random = randomFor(learner.email);
  const work: LearnerWork = { attempts: [], answers: [], labs: new Map(), checks: new Map(), lessonsStarted: new Map() };
  const course = getCourse();
  const touched = course.lessons.slice(0, story.labsPassed + 1);
  const lastDaysAgo = story.quietDays;
  const startDaysAgo = firstDaysAgo.min + random() * (firstDaysAgo.max - firstDaysAgo.min);

  touched.forEach((lesson, index) => {
    const daysAgo = startDaysAgo - ((startDaysAgo - lastDaysAgo) * index) / Math.max(1, touched.length - 1);
    const start = new Date(now.getTime() - daysAgo * day - random() * 90 * minute);
    // The last session must end before the learner's quiet spell begins (and before now).
    const clock = sessionClock(index === touched.length - 1 ? new Date(Math.min(start.getTime(), now.getTime() - lastDaysAgo * day - 120 * minute)) : start, random);
    work.lessonsStarted.set(lesson.slug, clock(0, 1));
    const finishing = index < story.labsPassed;
    answerChecks(work, learner.id, lesson, finishing ? 1 : story.next.kind === "reading" ? 0.6 : 1, clock, random);
    const lab = lesson.lab;
    if (!lab) return;
    const seed = variantSeedFor(learner.id, lab.slug);
    const variant = labVariant(lab, seed);

    if (finishing) {
      const wrongTries = Math.floor(random() * 7);
      const tries = [...lab.reference.mistakes.map((m) => m.choices), ...Array.from({ length: 6 }, () => guessedChoices(lab, variant, random))];
      for (const choices of tries.slice(0, wrongTries)) {
        const graded = grade(lab, seed, choices, labAnswers(lab, random() < 0.4, random));
        if (!graded) continue;
        recordAttempt(work, learner, lab, graded, clock(3, 12));
        if (passes(graded)) return;
      }
      const answers = labAnswers(lab, false, random);
      for (const choices of candidateSolutions(lab, variant, random)) {
        const graded = grade(lab, seed, choices, answers);
        if (graded && passes(graded)) return recordAttempt(work, learner, lab, graded, clock(4, 15));
      }
      return;
    }

    if (story.next.kind === "reading") return;
    const wrong =
      story.next.kind === "stuck"
        ? oneSidedResistors(lab, story.next.resistors, random)
        : [...lab.reference.mistakes.map((m) => m.choices), ...Array.from({ length: 6 }, () => guessedChoices(lab, variant, random))];
    let failures = 0;
    for (const choices of wrong) {
      if (failures === story.next.failures) break;
      const graded = grade(lab, seed, choices, labAnswers(lab, random() < 0.3, random));
      // Still working on it: a guess that would have passed is one this learner has not tried yet.
      if (!graded || passes(graded)) continue;
      recordAttempt(work, learner, lab, graded, clock(3, 14));
      failures += 1;
    }
  });
  return work;
}

/** lesson_progress as the course map would stamp it: opened when first visited, done when the rule was met. */
function lessonRows(userId: string, work: LearnerWork) {
  const progress = computeCourseProgress(getCourse(), {
    labs: work.labs,
    checks: work.checks,
    lessons: new Map([...work.lessonsStarted].map(([slug, startedAt]) => [slug, { startedAt, completedAt: null }])),
    // Only the lessons' done rule is read here, which bench work does not enter.
    bench: new Map(),
  });
  return progress.lessons.flatMap((lesson) => {
    const startedAt = work.lessonsStarted.get(lesson.slug);
    return startedAt ? [{ userId, lessonSlug: lesson.slug, startedAt, completedAt: lesson.state === "done" ? lesson.completedAt : null }] : [];
  });
}

/** A hand-in waiting for review, its stated values read by the bench form's own parser (SI units). */
function benchHandIn(learner: { id: string; cohortId: string }, handIn: NonNullable<Story["benchHandIn"]>, at: Date): NewBenchSubmission {
  const exercise = getCourse().lessons.find((lesson) => lesson.bench)!.bench!;
  const form = new FormData();
  const entries: Record<string, string> = {
    cable: handIn.cable,
    "driver-voltage": handIn.driver,
    length: handIn.length,
    resistor: handIn.resistor,
    "rise-time": handIn.riseTime,
    overshoot: handIn.overshoot,
    prediction: handIn.prediction,
    note: handIn.note,
  };
  for (const [name, value] of Object.entries(entries)) form.set(name, value);
  const parsed = parseBenchForm(exercise, form);
  if (!parsed.ok) throw new Error(`demo bench hand-in does not read: ${JSON.stringify(parsed.fieldErrors)}`);
  return {
    learnerId: learner.id,
    cohortId: learner.cohortId,
    exerciseSlug: exercise.slug,
    status: "submitted",
    ...parsed.values,
    submittedAt: at,
    createdAt: new Date(at.getTime() - 40 * minute),
    updatedAt: at,
  };
}

export type DemoActivitySummary = { learners: number; attempts: number; answers: number; benchHandIns: number };

async function findDemoLearner(db: Database, cohortName: string, name: string) {
  const [row] = await db
    .select({ id: users.id, email: users.email, cohortId: cohorts.id })
    .from(users)
    .innerJoin(cohortMemberships, eq(cohortMemberships.userId, users.id))
    .innerJoin(cohorts, eq(cohorts.id, cohortMemberships.cohortId))
    .where(and(eq(users.email, demoLearnerEmail(name)), eq(cohorts.name, cohortName), eq(cohortMemberships.role, "learner")))
    .limit(1);
  return row;
}

/** Plays every story whose learner exists and has no lab attempt yet; each learner in one transaction. */
export async function seedDemoActivity(db: Database, now = new Date()): Promise<DemoActivitySummary> {
  const summary: DemoActivitySummary = { learners: 0, attempts: 0, answers: 0, benchHandIns: 0 };
  for (const cohort of demoCohorts) {
    for (const name of cohort.learners.slice(1)) {
      const story = stories[name];
      const learner = story && (await findDemoLearner(db, cohort.name, name));
      if (!story || !learner) continue;
      const [started] = await db.select({ id: labAttempts.id }).from(labAttempts).where(eq(labAttempts.userId, learner.id)).limit(1);
      if (started) continue;

      const work = playStory(learner, story, now);
      const lastWork = work.attempts.at(-1)?.createdAt ?? now;
      const bench = story.benchHandIn && benchHandIn(learner, story.benchHandIn, new Date((lastWork as Date).getTime() + 25 * minute));
      await db.transaction(async (tx) => {
        if (work.attempts.length > 0) await tx.insert(labAttempts).values(work.attempts);
        if (work.answers.length > 0) await tx.insert(quickCheckAnswers).values(work.answers);
        await tx.insert(lessonProgress).values(lessonRows(learner.id, work)).onConflictDoNothing();
        if (bench) await tx.insert(benchSubmissions).values(bench).onConflictDoNothing();
      });
      summary.learners += 1;
      summary.attempts += work.attempts.length;
      summary.answers += work.answers.length;
      summary.benchHandIns += bench ? 1 : 0;
    }
  }
  return summary;
}
