"use client";

import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createPaginatedRowModel,
  filterFn_equals,
  rowPaginationFeature,
  tableFeatures,
  useTable,
  type ColumnFiltersState,
  type PaginationState,
} from "@tanstack/react-table";
import { useState } from "react";
import type { ClassifiedRow, RosterCounts, RowStatus } from "@/lib/enrolment/classify-roster";

const features = tableFeatures({
  columnFilteringFeature,
  rowPaginationFeature,
  filteredRowModel: createFilteredRowModel(),
  paginatedRowModel: createPaginatedRowModel(),
  filterFns: { equals: filterFn_equals },
});

const statusLabels: Record<RowStatus, string> = { valid: "Valid", duplicate: "Duplicate", invalid: "Invalid" };
const statusStyles: Record<RowStatus, string> = {
  valid: "bg-ok-soft text-ok",
  duplicate: "bg-copper-soft text-copper",
  invalid: "bg-danger-soft text-danger",
};

const helper = createColumnHelper<typeof features, ClassifiedRow>();
const columns = helper.columns([
  helper.accessor("row", {
    header: "Row",
    cell: (info) => <span className="tabular-nums text-ink-faint">{info.getValue()}</span>,
  }),
  helper.accessor("name", {
    header: "Learner",
    cell: (info) => (
      <>
        <span className="block font-medium">{info.getValue() || <span className="text-ink-faint">(no name)</span>}</span>
        <span className="block break-all text-ink-soft">{info.row.original.email || "(no e-mail)"}</span>
        <span className="mt-1.5 block sm:hidden">
          <StatusVerdict row={info.row.original} />
        </span>
      </>
    ),
  }),
  helper.accessor("status", {
    header: "Status",
    filterFn: "equals",
    cell: (info) => <StatusVerdict row={info.row.original} />,
  }),
]);

function StatusVerdict({ row }: { row: ClassifiedRow }) {
  return (
    <>
      <span className={`inline-block rounded-full px-2.5 py-0.5 text-xs font-semibold ${statusStyles[row.status]}`}>{statusLabels[row.status]}</span>
      {row.reason ? <span className="mt-1 block text-ink-soft">{row.reason}</span> : null}
    </>
  );
}

const cellClasses: Record<string, string> = {
  row: "w-12 py-2.5 pl-5 pr-2 align-top sm:w-14 sm:pl-6",
  name: "py-2.5 pl-2 pr-5 align-top sm:pr-2",
  status: "hidden w-2/5 py-2.5 pl-2 pr-5 align-top sm:table-cell sm:pr-6",
};

const pageSize = 50;

/** Every row of the checked file, filterable by status and paged, before anything is written. */
export function RosterPreviewTable({ rows, counts }: { rows: ClassifiedRow[]; counts: RosterCounts }) {
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize });
  const table = useTable({
    features,
    columns,
    data: rows,
    state: { columnFilters, pagination },
    onColumnFiltersChange: setColumnFilters,
    onPaginationChange: setPagination,
  });
  const shownStatus = (columnFilters[0]?.value as RowStatus | undefined) ?? "all";
  const statusColumn = table.getColumn("status");
  const filteredCount = table.getFilteredRowModel().rows.length;

  return (
    <div>
      <div role="group" aria-label="Show rows by status" className="flex flex-wrap gap-1.5">
        {(["all", "valid", "duplicate", "invalid"] as const).map((status) => {
          const count = status === "all" ? counts.total : counts[status];
          const current = shownStatus === status;
          return (
            <button
              key={status}
              type="button"
              aria-pressed={current}
              onClick={() => {
                statusColumn?.setFilterValue(status === "all" ? undefined : status);
                table.setPageIndex(0);
              }}
              className={`rounded-full border px-3 py-1 text-xs font-medium ${
                current ? "border-accent bg-accent text-white" : "border-line-strong text-ink-soft hover:bg-sunken"
              }`}
            >
              {status === "all" ? "All rows" : statusLabels[status]} · {count}
            </button>
          );
        })}
      </div>
      <div className="-mx-5 mt-3 sm:-mx-6">
        <table className="w-full text-left text-sm">
          <thead className="border-b border-line text-ink-faint">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => (
                  <th key={header.id} scope="col" className={`${cellClasses[header.column.id]} font-medium`}>
                    <table.FlexRender header={header} />
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-line">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} data-status={row.original.status}>
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className={cellClasses[cell.column.id]}>
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {filteredCount === 0 ? <p className="mt-3 text-sm text-ink-soft">No rows with this status.</p> : null}
      {table.getPageCount() > 1 ? (
        <div className="mt-3 flex items-center justify-between gap-3 text-sm">
          <p className="text-ink-soft">
            Rows {pagination.pageIndex * pageSize + 1}–{Math.min((pagination.pageIndex + 1) * pageSize, filteredCount)} of {filteredCount}
          </p>
          <div className="flex gap-2">
            <button
              type="button"
              onClick={() => table.previousPage()}
              disabled={!table.getCanPreviousPage()}
              className="rounded-lg border border-line-strong px-3 py-1.5 hover:bg-sunken disabled:opacity-50"
            >
              ← Previous
            </button>
            <button
              type="button"
              onClick={() => table.nextPage()}
              disabled={!table.getCanNextPage()}
              className="rounded-lg border border-line-strong px-3 py-1.5 hover:bg-sunken disabled:opacity-50"
            >
              Next →
            </button>
          </div>
        </div>
      ) : null}
    </div>
  );
}
