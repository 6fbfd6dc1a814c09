import Link from "next/link";
import { formatMoment } from "@/components/ui/dates";
import { rosterStateLabels, type RosterLine, type RosterState } from "@/lib/enrolment";
import { EntryButtons } from "../../entry-buttons";
import { StateBadge } from "./state-badge";

type Filter = { state: RosterState | "all"; query: string };

const filterOrder: (RosterState | "all")[] = ["all", "accepted", "unsent", "pending", "expired", "revoked", "deactivated"];

function hrefFor(cohortId: string, filter: Filter, page = 1): string {
  const search = new URLSearchParams();
  if (filter.state !== "all") search.set("state", filter.state);
  if (filter.query) search.set("q", filter.query);
  if (page > 1) search.set("page", String(page));
  const query = search.toString();
  return `/admin/cohorts/${cohortId}${query ? `?${query}` : ""}`;
}

/** The cohort's people, filtered and paged on the server so a cohort of thousands stays light. */
export function RosterTable({
  cohortId,
  lines,
  counts,
  total,
  filteredTotal,
  filter,
  page,
  pageCount,
  pageSize,
}: {
  cohortId: string;
  lines: RosterLine[];
  counts: Record<RosterState, number>;
  total: number;
  filteredTotal: number;
  filter: Filter;
  page: number;
  pageCount: number;
  pageSize: number;
}) {
  return (
    <>
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 className="text-lg font-semibold">Learners ({total})</h2>
        <form method="get" action={`/admin/cohorts/${cohortId}`} role="search" className="flex gap-2">
          {filter.state !== "all" ? <input type="hidden" name="state" value={filter.state} /> : null}
          <label htmlFor="roster-search" className="sr-only">
            Find by name or e-mail
          </label>
          <input
            id="roster-search"
            name="q"
            type="search"
            defaultValue={filter.query}
            placeholder="Find by name or e-mail"
            className="w-48 rounded-lg border border-line-strong bg-surface px-3 py-1.5 text-sm outline-none focus:border-accent focus:ring-2 focus:ring-accent/25 sm:w-56"
          />
          <button type="submit" className="rounded-lg border border-line-strong px-3 py-1.5 text-sm font-medium hover:bg-sunken">
            Find
          </button>
        </form>
      </div>
      <nav aria-label="Show learners by state" className="mt-3 flex flex-wrap gap-1.5">
        {filterOrder.map((state) => {
          const count = state === "all" ? total : counts[state];
          const current = filter.state === state;
          if (count === 0 && !current && state !== "all") return null;
          return (
            <Link
              key={state}
              href={hrefFor(cohortId, { ...filter, state })}
              aria-current={current ? "page" : undefined}
              className={`rounded-full border px-3 py-1 text-xs font-medium no-underline ${
                current ? "border-accent bg-accent text-white" : "border-line-strong text-ink-soft hover:bg-sunken"
              }`}
            >
              {state === "all" ? "All" : rosterStateLabels[state]} · {count}
            </Link>
          );
        })}
      </nav>

      {lines.length === 0 ? (
        <p className="mt-5 text-ink-soft">
          {total === 0 ? "Nobody is enrolled yet. Enrol a learner or import a CSV list." : "Nobody matches this filter."}
        </p>
      ) : (
        <div className="-mx-5 mt-4 sm:-mx-6">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-line text-ink-faint">
              <tr>
                <th scope="col" className="px-5 py-2 font-medium sm:px-6">
                  Learner
                </th>
                <th scope="col" className="hidden px-2 py-2 font-medium md:table-cell">
                  State
                </th>
                <th scope="col" className="px-5 py-2 text-right font-medium sm:px-6">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-line">
              {lines.map((line) => (
                <tr key={line.key} className="align-top">
                  <td className="px-5 py-3 sm:px-6">
                    <p className="font-medium">{line.name ?? <span className="text-ink-faint">Name not given yet</span>}</p>
                    <p className="break-all text-ink-soft">{line.email}</p>
                    <div className="mt-1.5 md:hidden">
                      <StateBadge state={line.state} />
                      {line.expiresAt ? <ExpiryNote state={line.state} expiresAt={line.expiresAt} /> : null}
                    </div>
                  </td>
                  <td className="hidden px-2 py-3 md:table-cell">
                    <StateBadge state={line.state} />
                    {line.expiresAt ? <ExpiryNote state={line.state} expiresAt={line.expiresAt} /> : null}
                  </td>
                  <td className="px-5 py-3 sm:px-6">
                    <EntryButtons
                      cohortId={cohortId}
                      state={line.state}
                      userId={line.userId}
                      invitationId={line.invitationId}
                      who={line.name ?? line.email}
                    />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}

      {pageCount > 1 ? (
        <nav aria-label="Pages" className="mt-4 flex items-center justify-between gap-3 text-sm">
          <p className="text-ink-soft">
            {(page - 1) * pageSize + 1}–{Math.min(page * pageSize, filteredTotal)} of {filteredTotal}
          </p>
          <div className="flex gap-2">
            {page > 1 ? (
              <Link href={hrefFor(cohortId, filter, page - 1)} className="rounded-lg border border-line-strong px-3 py-1.5 no-underline hover:bg-sunken">
                ← Previous
              </Link>
            ) : null}
            {page < pageCount ? (
              <Link href={hrefFor(cohortId, filter, page + 1)} className="rounded-lg border border-line-strong px-3 py-1.5 no-underline hover:bg-sunken">
                Next →
              </Link>
            ) : null}
          </div>
        </nav>
      ) : null}
    </>
  );
}

function ExpiryNote({ state, expiresAt }: { state: RosterState; expiresAt: Date }) {
  return (
    <p className="mt-1 text-xs text-ink-faint">
      {state === "expired" ? "expired" : "expires"} {formatMoment(expiresAt)}
    </p>
  );
}
