import type { CertificateScoreSummary } from "@/db/schema";
import type { Course } from "@/lessons";

export type CompletionRule = Course["completion"];

/** What the rule needs to know of one learner, straight from their rows. */
export type CompletionFacts = {
  /** Best score among passing attempts, by lab slug. */
  bestPassingScores: ReadonlyMap<string, number>;
  /** Rubric points of the accepting review, by exercise slug, for work whose status is accepted. */
  acceptedBenchWork: ReadonlyMap<string, { points: number; maxPoints: number }>;
};

export type LabRequirement = { slug: string; title: string; minScore: number; bestScore: number | null; met: boolean };
export type BenchRequirement = { slug: string; title: string; accepted: boolean; points: number | null; maxPoints: number | null };

export type CompletionStatus = {
  labs: LabRequirement[];
  benchExercises: BenchRequirement[];
  complete: boolean;
  /** What the certificate will state; present only once the rule is met. */
  summary: CertificateScoreSummary | null;
};

/** Titles of the course's labs and bench exercises, for the learner-facing list. */
export function courseTitles(course: Course): { labs: Map<string, string>; benchExercises: Map<string, string> } {
  return {
    labs: new Map(course.lessons.flatMap((lesson) => (lesson.lab ? [[lesson.lab.slug, lesson.lab.title] as const] : []))),
    benchExercises: new Map(course.lessons.flatMap((lesson) => (lesson.bench ? [[lesson.bench.slug, lesson.bench.title] as const] : []))),
  };
}

/**
 * The course's completion rule against one learner's results: every listed lab has a passing
 * attempt scoring at least its minimum, and every listed bench exercise has been accepted.
 */
export function evaluateCompletion(course: Course, facts: CompletionFacts): CompletionStatus {
  const titles = courseTitles(course);
  const labs = course.completion.labs.map(({ lab, minScore }) => {
    const bestScore = facts.bestPassingScores.get(lab) ?? null;
    return { slug: lab, title: titles.labs.get(lab) ?? lab, minScore, bestScore, met: bestScore !== null && bestScore >= minScore };
  });
  const benchExercises = course.completion.benchExercises.map((slug) => {
    const accepted = facts.acceptedBenchWork.get(slug);
    return {
      slug,
      title: titles.benchExercises.get(slug) ?? slug,
      accepted: accepted !== undefined,
      points: accepted?.points ?? null,
      maxPoints: accepted?.maxPoints ?? null,
    };
  });
  const complete = labs.every((lab) => lab.met) && benchExercises.every((exercise) => exercise.accepted);
  return { labs, benchExercises, complete, summary: complete ? summarise(labs, benchExercises) : null };
}

function summarise(labs: LabRequirement[], benchExercises: BenchRequirement[]): CertificateScoreSummary {
  const scores = labs.map((lab) => lab.bestScore!);
  const average = scores.length === 0 ? 0 : scores.reduce((sum, score) => sum + score, 0) / scores.length;
  return {
    labs: labs.map(({ slug, title, bestScore, minScore }) => ({ slug, title, bestScore: bestScore!, minScore })),
    averageScore: Math.round(average * 10) / 10,
    benchExercises: benchExercises.map(({ slug, title, points, maxPoints }) => ({ slug, title, points: points!, maxPoints: maxPoints! })),
  };
}
