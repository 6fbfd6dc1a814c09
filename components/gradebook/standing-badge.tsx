import type { Attention, Standing } from "@/lib/gradebook";
import { describeAttention, standingLabels } from "@/lib/gradebook/words";

const tones: Record<Standing, string> = {
  stuck: "border-danger/40 bg-danger-soft text-danger",
  "not-started": "border-line-strong bg-sunken text-ink-soft",
  "on-track": "border-accent/30 bg-accent-soft text-accent-strong",
  complete: "border-ok/30 bg-ok-soft text-ok",
  "switched-off": "border-line bg-paper text-ink-faint",
};

const marks: Record<Standing, string> = {
  stuck: "⚠",
  "not-started": "○",
  "on-track": "→",
  complete: "✓",
  "switched-off": "–",
};

/** The learner's standing as a labelled badge, with every reason for attention written out below it. */
export function StandingBadge({ standing, attention }: { standing: Standing; attention: Attention[] }) {
  return (
    <div className="w-36 sm:w-40">
      <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs font-semibold ${tones[standing]}`}>
        <span aria-hidden="true">{marks[standing]}</span>
        {standingLabels[standing]}
      </span>
      {attention.length > 0 ? (
        <ul className="mt-1 space-y-0.5 text-xs leading-snug text-ink-soft">
          {attention.map((reason) => (
            <li key={reason.kind === "failing" ? reason.itemKey : "idle"}>{describeAttention(reason)}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
