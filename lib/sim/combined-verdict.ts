import type { Judgement } from "./judgement";
import { OUTCOMES, OUTCOME_WORDS, type Outcome, type Verdict, type VerdictReason } from "./verdict";

/**
 * The verdict on a run made of stages that each start afresh (a regenerating pixel part-way, a
 * differential link then the local lead to the pixel): the data must survive every stage, so the
 * run is as good as its worst. Each reason names the stage it comes from.
 */

export type StageVerdict = { stage: string; verdict: Verdict };

export type StageReason = VerdictReason & { stage: string };

export type CombinedVerdict = Omit<Verdict, "reasons"> & {
  /** The stage that decides the outcome: the first of the worst. */
  decidingStage: string;
  stages: { stage: string; outcome: Outcome }[];
  reasons: StageReason[];
};

const rank = (outcome: Outcome) => OUTCOMES.indexOf(outcome);

/** The judgement nearer a wrong reading: a failing one first, then the thinner voltage margin. */
function worseJudgement(a: Judgement, b: Judgement): Judgement {
  if (a.pass !== b.pass) return a.pass ? b : a;
  return b.voltageMargin < a.voltageMargin ? b : a;
}

export function combineVerdicts(stages: StageVerdict[]): CombinedVerdict {
  if (stages.length === 0) throw new Error("a run has at least one stage");
  const deciding = stages.reduce((worst, stage) => (rank(stage.verdict.outcome) > rank(worst.verdict.outcome) ? stage : worst));
  const outcome = deciding.verdict.outcome;
  const reasons: StageReason[] = [];
  // The deciding stage's reasons first: they say why the whole run is judged as it is.
  for (const { stage, verdict } of [deciding, ...stages.filter((s) => s !== deciding)]) {
    for (const reason of verdict.reasons) reasons.push({ ...reason, stage, message: `${stage}: ${reason.message}` });
  }
  if (outcome !== "guaranteed") {
    const failing = stages.filter((s) => s.verdict.outcome === outcome).map((s) => s.stage);
    reasons.unshift({
      code: "stage-decides",
      severity: outcome === "fails" ? "fail" : "warning",
      judgement: outcome === "fails" ? "typical" : "guaranteed",
      stage: deciding.stage,
      message: `${failing.join(" and ")} ${failing.length > 1 ? "decide" : "decides"} the run: ${OUTCOME_WORDS[outcome]}`,
    });
  }
  return {
    outcome,
    summary: OUTCOME_WORDS[outcome],
    guaranteed: stages.map((s) => s.verdict.guaranteed).reduce(worseJudgement),
    typical: stages.map((s) => s.verdict.typical).reduce(worseJudgement),
    decidingStage: deciding.stage,
    stages: stages.map(({ stage, verdict }) => ({ stage, outcome: verdict.outcome })),
    reasons,
  };
}
