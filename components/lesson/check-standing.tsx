import type { ReactNode } from "react";
import type { QuickCheckState } from "./quick-check-state";

// Where a learner stands on a quick check of any kind: the answer just sent if there is one,
// otherwise what was stored from earlier visits; and the notes that follow from it.

export type SavedCheck = { answers: number; lastEntry: string | null; correctEntry: string | null };

const tones = { correct: "success", incorrect: "error", unreadable: "info", error: "error" } as const;

function savedStatus(saved: SavedCheck): { tone: "success" | "info"; message: string } | null {
  if (saved.correctEntry !== null) return { tone: "success", message: `You answered this correctly: ${saved.correctEntry}.` };
  if (saved.lastEntry !== null) return { tone: "info", message: `Your last answer, '${saved.lastEntry}', was not right yet. Try again.` };
  return null;
}

export function checkStanding(state: QuickCheckState, saved: SavedCheck) {
  const live = state.status === "idle" ? null : state;
  return {
    live,
    status: live ? { tone: tones[live.status], message: live.message } : savedStatus(saved),
    answeredRight: live ? live.status === "correct" : saved.correctEntry !== null,
    showHint: live ? live.status === "incorrect" : saved.answers > 0 && saved.correctEntry === null,
  };
}

export function AnsweredBadge() {
  return (
    <span className="inline-flex items-center gap-1 rounded-full bg-ok-soft px-2.5 py-0.5 text-xs font-semibold text-ok">
      <span aria-hidden="true">✓</span> Answered correctly
    </span>
  );
}

/** The hint after a wrong answer, and the explanation once the answer is right. */
export function CheckNotes(props: { showHint: boolean; hint: ReactNode; answeredRight: boolean; explanation: ReactNode | null }) {
  return (
    <>
      {props.showHint ? (
        <div className="mt-3 rounded-lg border border-line bg-sunken px-4 py-3 text-sm">
          <p className="font-semibold text-ink">Hint</p>
          <div className="mt-1">{props.hint}</div>
        </div>
      ) : null}
      {props.answeredRight && props.explanation ? (
        <div className="mt-3 rounded-lg border border-ok/30 bg-ok-soft/60 px-4 py-3 text-sm">
          <p className="font-semibold text-ink">Why</p>
          <div className="mt-1">{props.explanation}</div>
        </div>
      ) : null}
    </>
  );
}
