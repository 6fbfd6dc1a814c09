import { rosterStateLabels, type RosterState } from "@/lib/enrolment";

const styles: Record<RosterState, string> = {
  accepted: "bg-ok-soft text-ok",
  unsent: "bg-copper-soft text-copper",
  pending: "bg-accent-soft text-accent-strong",
  expired: "bg-copper-soft text-copper",
  revoked: "bg-sunken text-ink-soft",
  deactivated: "bg-danger-soft text-danger",
  "not-invited": "bg-sunken text-ink-soft",
};

export function StateBadge({ state }: { state: RosterState }) {
  return <span className={`inline-block rounded-full px-2.5 py-0.5 text-xs font-semibold ${styles[state]}`}>{rosterStateLabels[state]}</span>;
}
