import type { Gradebook } from "./assemble";

export type ScoreBin = { label: string; from: number; to: number; learners: number };

/** Per item: how many learners' best scores fall in each tenth of the scale, and how many have none yet. */
export type ScoreDistribution = { itemKey: string; label: string; title: string; bins: ScoreBin[]; unscored: number };

const binEdges = Array.from({ length: 10 }, (_, i) => ({ from: i * 10, to: i === 9 ? 100 : i * 10 + 9 }));

/** Best score per learner, binned 0–9, 10–19, … 90–100. Switched-off accounts are left out. */
export function scoreDistributions(gradebook: Gradebook): ScoreDistribution[] {
  const learners = gradebook.rows.filter((row) => row.learner.active);
  return gradebook.items.map((item, index) => {
    const bins = binEdges.map(({ from, to }) => ({ label: `${from}–${to}`, from, to, learners: 0 }));
    let unscored = 0;
    for (const row of learners) {
      const score = row.cells[index].bestScore;
      if (score === null) unscored += 1;
      else bins[Math.min(9, Math.floor(score / 10))].learners += 1;
    }
    return { itemKey: item.key, label: item.label, title: item.title, bins, unscored };
  });
}

/** Lab attempts of the cohort on one UTC day, as the query returns them. */
export type AttemptDayRow = { day: string; attempts: number; passed: number };

export type AttemptDay = { day: string; passed: number; failed: number };

const dayMs = 86_400_000;
const maxDays = 366;

function isoDay(time: number): string {
  return new Date(time).toISOString().slice(0, 10);
}

/**
 * Every day from the cohort's start (or the first attempt, if earlier) to today (or the cohort's
 * end, if earlier, but never before the last attempt), days without attempts as zero. At most a
 * year is shown: the most recent one.
 */
export function attemptsPerDay(params: { rows: AttemptDayRow[]; startsOn: string; endsOn: string; now: Date }): AttemptDay[] {
  const byDay = new Map(params.rows.map((row) => [row.day, row]));
  const days = [...byDay.keys()].sort();
  const today = isoDay(params.now.getTime());
  const first = [params.startsOn, days[0]].filter(Boolean).sort()[0]!;
  const end = [params.endsOn, today].sort()[0]!;
  const last = [end, days.at(-1) ?? end].sort().at(-1)!;
  if (first > last) return [];

  const lastTime = Date.parse(`${last}T00:00:00Z`);
  const firstTime = Math.max(Date.parse(`${first}T00:00:00Z`), lastTime - (maxDays - 1) * dayMs);
  const result: AttemptDay[] = [];
  for (let time = firstTime; time <= lastTime; time += dayMs) {
    const day = isoDay(time);
    const row = byDay.get(day);
    result.push({ day, passed: row?.passed ?? 0, failed: row ? row.attempts - row.passed : 0 });
  }
  return result;
}
