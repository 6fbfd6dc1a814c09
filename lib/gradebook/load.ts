import "server-only";
import {
  findCohortForViewer,
  findCohortLearnerForViewer,
  listCohortAttemptDays,
  listGradebookCells,
  listGradebookLearners,
  listLearnerAttemptsForViewer,
  listLearnerBenchWorkForViewer,
  listLearnerQuickCheckAnswersForViewer,
  type CohortLearner,
  type GradebookViewer,
  type LearnerBenchWork,
} from "@/db/queries/gradebook";
import type { Cohort } from "@/db/schema";
import { getCourse, getLab, type Course } from "@/lessons";
import { assembleGradebook, type Gradebook } from "./assemble";
import { attemptRecord, type AttemptRecord } from "./attempt-record";
import { attemptsPerDay, scoreDistributions, type AttemptDay, type ScoreDistribution } from "./charts";
import { gradebookItems, itemKey, type GradebookItem } from "./items";
import { quickCheckRecords, type LessonChecksRecord } from "./quick-check-record";

export type CohortGradebook = { cohort: Cohort; gradebook: Gradebook };

// Names in the order people expect (accents beside their letters, case ignored), which the
// database's byte-order collation does not give.
const byName = new Intl.Collator("en", { sensitivity: "base", numeric: true });

/**
 * The progress grid's data: the access check and the two aggregate queries go out together (each
 * query checks access itself, so nothing leaks if the check loses the race), then the grid is
 * assembled in memory. Three statements whatever the size of the cohort.
 */
export async function loadCohortGradebook(params: {
  cohortId: string;
  viewer: GradebookViewer;
  now?: Date;
  course?: Course;
}): Promise<CohortGradebook | null> {
  const [cohort, learners, cells] = await Promise.all([
    findCohortForViewer(params),
    listGradebookLearners(params),
    listGradebookCells(params),
  ]);
  if (!cohort) return null;
  const gradebook = assembleGradebook({
    items: gradebookItems(params.course ?? getCourse()),
    learners: learners.sort((a, b) => byName.compare(a.name, b.name) || a.learnerId.localeCompare(b.learnerId)),
    cells,
    cohortStartsOn: cohort.startsOn,
    now: params.now ?? new Date(),
  });
  return { cohort, gradebook };
}

export type CohortOverview = CohortGradebook & { distributions: ScoreDistribution[]; days: AttemptDay[] };

/** The cohort page: the grid plus its charts, one more aggregate query for attempts per day. */
export async function loadCohortOverview(params: {
  cohortId: string;
  viewer: GradebookViewer;
  now?: Date;
  course?: Course;
}): Promise<CohortOverview | null> {
  const now = params.now ?? new Date();
  const [loaded, dayRows] = await Promise.all([loadCohortGradebook({ ...params, now }), listCohortAttemptDays(params)]);
  if (!loaded) return null;
  return {
    ...loaded,
    distributions: scoreDistributions(loaded.gradebook),
    days: attemptsPerDay({ rows: dayRows, startsOn: loaded.cohort.startsOn, endsOn: loaded.cohort.endsOn, now }),
  };
}

export type LabRecord = { item: GradebookItem; attempts: AttemptRecord[] };
export type BenchRecord = { item: GradebookItem; work: LearnerBenchWork | null };

export type LearnerRecord = {
  cohort: Cohort;
  learner: CohortLearner;
  labs: LabRecord[];
  bench: BenchRecord[];
  /** Quick-check answers, per lesson the learner has answered in. */
  checks: LessonChecksRecord[];
};

/** One learner of the cohort: every lab attempt, rebuilt for redrawing, and their bench work. */
export async function loadLearnerRecord(params: {
  cohortId: string;
  learnerId: string;
  viewer: GradebookViewer;
}): Promise<LearnerRecord | null> {
  const [cohort, learner, attempts, benchWork, answers] = await Promise.all([
    findCohortForViewer(params),
    findCohortLearnerForViewer(params),
    listLearnerAttemptsForViewer(params),
    listLearnerBenchWorkForViewer(params),
    listLearnerQuickCheckAnswersForViewer(params),
  ]);
  if (!cohort || !learner) return null;
  const items = gradebookItems(getCourse());
  const labs = items
    .filter((item) => item.kind === "lab")
    .map((item): LabRecord => {
      const lab = getLab(item.slug)!;
      return { item, attempts: attempts.filter((a) => a.labSlug === item.slug).map((a) => attemptRecord(lab, a)) };
    });
  const bench = items
    .filter((item) => item.kind === "bench")
    .map((item): BenchRecord => ({ item, work: benchWork.find((w) => itemKey("bench", w.exerciseSlug) === item.key) ?? null }));
  return { cohort, learner, labs, bench, checks: quickCheckRecords(getCourse(), params.learnerId, answers) };
}
