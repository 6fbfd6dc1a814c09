"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createPaginatedRowModel,
  createSortedRowModel,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  tableFeatures,
  useTable,
  type ColumnFiltersState,
  type PaginationState,
  type SortingState,
} from "@tanstack/react-table";
import type { GradebookItem, GradebookRow, Standing } from "@/lib/gradebook";
import { formatActivityDay, standingLabels } from "@/lib/gradebook/words";
import { GridCell } from "./grid-cell";
import { StandingBadge } from "./standing-badge";

const features = tableFeatures({
  rowSortingFeature,
  columnFilteringFeature,
  rowPaginationFeature,
  sortedRowModel: createSortedRowModel(),
  filteredRowModel: createFilteredRowModel(),
  paginatedRowModel: createPaginatedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric },
});

/** Rows per page: a large cohort's grid stays quick to render and to scan; search and sorting cover every learner. */
export const GRID_PAGE_SIZE = 50;

const helper = createColumnHelper<typeof features, GradebookRow>();

/** Who needs the instructor first when the grid is sorted by standing. */
const standingOrder: Standing[] = ["stuck", "not-started", "on-track", "complete", "switched-off"];

const dayMs = 86_400_000;
const shortDay = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", timeZone: "UTC" });

function daysAgo(date: Date, now: Date): string {
  const days = Math.floor((now.getTime() - date.getTime()) / dayMs);
  return days <= 0 ? "today" : days === 1 ? "yesterday" : `${days} days ago`;
}

function buildColumns(items: GradebookItem[], cohortId: string, now: Date) {
  return helper.columns([
    helper.accessor((row) => row.learner.name, {
      id: "learner",
      header: "Learner",
      sortFn: "alphanumeric",
      filterFn: (row, _columnId, query: string) => {
        const needle = query.trim().toLowerCase();
        const { name, email } = row.original.learner;
        return name.toLowerCase().includes(needle) || email.toLowerCase().includes(needle);
      },
      cell: ({ row }) => {
        const { learner } = row.original;
        return (
          <div className="w-32 sm:w-40">
            <Link
              href={`/cohorts/${cohortId}/learners/${learner.id}`}
              className="font-semibold text-accent underline-offset-2 hover:underline"
            >
              {learner.name}
            </Link>
            <span className="block truncate text-xs text-ink-faint" title={learner.email}>
              {learner.email}
            </span>
          </div>
        );
      },
    }),
    helper.accessor((row) => row.standing, {
      id: "standing",
      header: "Standing",
      sortFn: (a, b) => standingOrder.indexOf(a.original.standing) - standingOrder.indexOf(b.original.standing),
      filterFn: (row, _columnId, wanted: Standing) => row.original.standing === wanted,
      cell: ({ row }) => <StandingBadge standing={row.original.standing} attention={row.original.attention} />,
    }),
    ...items.map((item, index) =>
      helper.accessor((row) => row.cells[index].bestScore ?? undefined, {
        id: item.key,
        header: item.label,
        sortUndefined: "last",
        enableColumnFilter: false,
        meta: { item },
        cell: ({ row }) => <GridCell item={item} cell={row.original.cells[index]} />,
      }),
    ),
    helper.accessor((row) => row.totalScore, {
      id: "total",
      header: "Total",
      enableColumnFilter: false,
      cell: ({ row }) => (
        <div className="text-center">
          <span className="block text-base font-semibold tabular-nums">{row.original.totalScore}</span>
          <span className="block whitespace-nowrap text-xs text-ink-soft">
            {row.original.passedCount}/{items.length} passed
          </span>
        </div>
      ),
    }),
    helper.accessor((row) => row.lastActivityAt?.getTime(), {
      id: "lastActivity",
      header: "Last activity",
      sortUndefined: "last",
      enableColumnFilter: false,
      cell: ({ row }) => {
        const last = row.original.lastActivityAt;
        return last ? (
          <div className="whitespace-nowrap text-sm" title={formatActivityDay(last)}>
            <span className="block">{shortDay.format(last)}</span>
            <span className="block text-xs text-ink-faint">{daysAgo(last, now)}</span>
          </div>
        ) : (
          <span className="text-sm text-ink-faint">none yet</span>
        );
      },
    }),
  ]);
}

const sortMarks = { asc: "▲", desc: "▼" } as const;
const ariaSort = { asc: "ascending", desc: "descending" } as const;

type Props = { items: GradebookItem[]; rows: GradebookRow[]; cohortId: string; now: Date };

/**
 * The progress grid: learners down, the course's labs and bench exercises across. Sorting and
 * filtering run in the browser over the rows the server sent; the server did the aggregating.
 */
export function ProgressGrid({ items, rows, cohortId, now }: Props) {
  const columns = useMemo(() => buildColumns(items, cohortId, now), [items, cohortId, now]);
  const [sorting, setSorting] = useState<SortingState>([]);
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: GRID_PAGE_SIZE });
  const table = useTable({
    features,
    columns,
    data: rows,
    getRowId: (row) => row.learner.id,
    state: { sorting, columnFilters, pagination },
    onSortingChange: setSorting,
    onColumnFiltersChange: setColumnFilters,
    onPaginationChange: setPagination,
    autoResetPageIndex: true,
    enableSortingRemoval: true,
  });

  const query = (columnFilters.find((f) => f.id === "learner")?.value as string | undefined) ?? "";
  const shown = (columnFilters.find((f) => f.id === "standing")?.value as Standing | undefined) ?? "";
  const counts = useMemo(() => {
    const tally = Object.fromEntries(standingOrder.map((s) => [s, 0])) as Record<Standing, number>;
    for (const row of rows) tally[row.standing] += 1;
    return tally;
  }, [rows]);
  const visibleRows = table.getRowModel().rows;
  const matching = table.getFilteredRowModel().rows.length;
  const firstShown = pagination.pageIndex * pagination.pageSize + 1;

  return (
    <div>
      <div className="mb-4 flex flex-wrap items-end gap-3" role="search" aria-label="Filter the grid">
        <label className="flex min-w-52 flex-1 flex-col gap-1 text-sm font-medium sm:max-w-xs">
          Find a learner
          <input
            type="search"
            value={query}
            onChange={(event) => table.getColumn("learner")?.setFilterValue(event.target.value || undefined)}
            placeholder="Name or e-mail"
            className="rounded-lg border border-line-strong bg-surface px-3 py-2 font-normal"
          />
        </label>
        <label className="flex flex-col gap-1 text-sm font-medium">
          Show
          <select
            value={shown}
            onChange={(event) => table.getColumn("standing")?.setFilterValue(event.target.value || undefined)}
            className="rounded-lg border border-line-strong bg-surface px-3 py-2 font-normal"
          >
            <option value="">Everyone ({rows.length})</option>
            {standingOrder.map((standing) => (
              <option key={standing} value={standing} disabled={counts[standing] === 0}>
                {standingLabels[standing]} ({counts[standing]})
              </option>
            ))}
          </select>
        </label>
        {query || shown || sorting.length > 0 ? (
          <button
            type="button"
            onClick={() => {
              table.resetColumnFilters();
              table.resetSorting();
            }}
            className="rounded-lg px-3 py-2 text-sm font-semibold text-accent hover:bg-accent-soft"
          >
            Clear sorting and filters
          </button>
        ) : null}
        <p className="ml-auto text-sm text-ink-soft" aria-live="polite">
          {visibleRows.length === matching
            ? `Showing ${matching} of ${rows.length} learners`
            : `Showing ${firstShown}–${firstShown + visibleRows.length - 1} of ${matching} ${matching === rows.length ? "learners" : `matching (${rows.length} in all)`}`}
        </p>
      </div>

      <p className="mb-2 text-xs text-ink-soft sm:hidden">Swipe the grid sideways for each lab and bench exercise.</p>
      <div className="relative overflow-x-auto rounded-lg border border-line">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">
            Progress of each learner on each lab and bench exercise; column headers sort the grid.
          </caption>
          <thead className="bg-sunken">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const item = (header.column.columnDef.meta as { item?: GradebookItem } | undefined)?.item;
                  const sticky = header.column.id === "learner" ? "sticky left-0 z-20 bg-sunken" : "";
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted ? ariaSort[sorted] : "none"}
                      className={`border-b border-line px-1 py-2 text-left align-bottom font-semibold ${sticky}`}
                    >
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        title={item ? `${item.label}: ${item.title} — sort by best score` : `Sort by ${String(header.column.columnDef.header).toLowerCase()}`}
                        className="inline-flex items-center gap-0.5 whitespace-nowrap rounded px-1 py-0.5 underline decoration-line-strong decoration-dotted underline-offset-4 hover:bg-line/60"
                      >
                        <table.FlexRender header={header} />
                        {sorted ? (
                          <span aria-hidden="true" className="text-xs text-accent">
                            {sortMarks[sorted]}
                          </span>
                        ) : null}
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {visibleRows.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-4 py-8 text-center text-ink-soft">
                  No learner matches these filters.
                </td>
              </tr>
            ) : (
              visibleRows.map((row) => {
                const stuck = row.original.standing === "stuck";
                return (
                  <tr
                    key={row.id}
                    data-standing={row.original.standing}
                    className={`border-b border-line last:border-b-0 ${stuck ? "bg-danger-soft/40" : "bg-surface"}`}
                  >
                    {row.getAllCells().map((cell) => {
                      const isLearner = cell.column.id === "learner";
                      return isLearner ? (
                        <th
                          key={cell.id}
                          scope="row"
                          className={`sticky left-0 z-10 border-r border-line px-3 py-2 text-left align-top font-normal ${stuck ? "border-l-4 border-l-danger bg-danger-soft" : "bg-surface"}`}
                        >
                          <table.FlexRender cell={cell} />
                        </th>
                      ) : (
                        <td key={cell.id} className="px-1 py-1 align-top">
                          <table.FlexRender cell={cell} />
                        </td>
                      );
                    })}
                  </tr>
                );
              })
            )}
          </tbody>
        </table>
      </div>
      {table.getPageCount() > 1 ? (
        <GridPages
          page={pagination.pageIndex + 1}
          pages={table.getPageCount()}
          onPrevious={table.getCanPreviousPage() ? () => table.previousPage() : undefined}
          onNext={table.getCanNextPage() ? () => table.nextPage() : undefined}
        />
      ) : null}
    </div>
  );
}

function GridPages({ page, pages, onPrevious, onNext }: { page: number; pages: number; onPrevious?: () => void; onNext?: () => void }) {
  const button = "rounded-lg border border-line-strong px-3 py-1.5 text-sm font-semibold enabled:hover:bg-accent-soft disabled:opacity-40";
  return (
    <nav className="mt-3 flex items-center justify-end gap-2" aria-label="Grid pages">
      <button type="button" className={button} onClick={onPrevious} disabled={!onPrevious}>
        ← Previous {GRID_PAGE_SIZE}
      </button>
      <p className="px-2 text-sm tabular-nums text-ink-soft">
        Page {page} of {pages}
      </p>
      <button type="button" className={button} onClick={onNext} disabled={!onNext}>
        Next {GRID_PAGE_SIZE} →
      </button>
    </nav>
  );
}
