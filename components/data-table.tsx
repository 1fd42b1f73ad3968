"use client";

import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type Column,
  type ColumnDef,
  type PaginationState,
  type RowData,
  type SortDirection,
  type SortingState,
  type Updater,
} from "@tanstack/react-table";
import Link from "next/link";
import { useId, useState, type ReactNode } from "react";
import { EmptyTableRow } from "@/components/ui/empty-table-row";

declare module "@tanstack/react-table" {
  // Type parameters must match the library's declaration for the merge to work, used or not.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Rendered as `<th scope="row">`: the cell that names the row for screen readers. */
    rowHeader?: boolean;
    /** Right-aligned in the figure face, for measured or rated numbers. */
    numeric?: boolean;
  }
}

const ariaSort: Record<SortDirection | "none", "ascending" | "descending" | "none"> = {
  asc: "ascending",
  desc: "descending",
  none: "none",
};

/**
 * Sorting and paging done elsewhere (a route handler): the table shows the rows it is given and reports what the
 * reader asked for. Filters then live outside the table, in the page's own form.
 */
export type ServerSideTable = {
  sorting: SortingState;
  onSortingChange: (sorting: SortingState) => void;
  pageIndex: number;
  pageSize: number;
  rowCount: number;
  onPageChange: (pageIndex: number) => void;
  /** While new rows are on their way: the table is marked busy for assistive technology. */
  busy?: boolean;
};

/**
 * A sortable, filterable, paged table. Columns are TanStack column definitions, so a page that wants links or badges in
 * its cells declares them in a small client component of its own (functions cannot cross from a server component).
 * With `serverSide` the rows are one page from a server, sorted there, and the text filter is left out.
 */
export function DataTable<Row>({
  caption,
  captionVisible = false,
  columns,
  data,
  filterLabel = "Filter",
  filterPlaceholder,
  emptyMessage = "Nothing here yet.",
  pageSize = 20,
  initialSorting = [],
  minWidth = "40rem",
  newItem,
  actions,
  serverSide,
  getRowId,
  rowNoun = ["row", "rows"],
}: {
  caption: string;
  captionVisible?: boolean;
  // Columns of different value types live in one array; TanStack's own examples type them this way.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: ColumnDef<Row, any>[];
  data: Row[];
  filterLabel?: string;
  filterPlaceholder?: string;
  emptyMessage?: ReactNode;
  pageSize?: number;
  initialSorting?: SortingState;
  minWidth?: string;
  /** The page's main way to add a row, shown as a button beside the filter. */
  newItem?: { href: string; label: string };
  /** Anything else beside the filter. */
  actions?: ReactNode;
  serverSide?: ServerSideTable;
  /** A stable key per row, so rows fetched anew keep their identity. */
  getRowId?: (row: Row) => string;
  rowNoun?: [singular: string, plural: string];
}) {
  const filterId = useId();
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const [globalFilter, setGlobalFilter] = useState("");
  const table = useReactTable({
    data,
    columns,
    getRowId,
    getCoreRowModel: getCoreRowModel(),
    ...(serverSide
      ? {
          state: { sorting: serverSide.sorting, pagination: { pageIndex: serverSide.pageIndex, pageSize: serverSide.pageSize } },
          manualSorting: true,
          manualPagination: true,
          rowCount: serverSide.rowCount,
          // A server sorts by one column at a time and always by something, so a sorted column only turns over.
          enableSortingRemoval: false,
          enableMultiSort: false,
          sortDescFirst: false,
          onSortingChange: (updater: Updater<SortingState>) =>
            serverSide.onSortingChange(typeof updater === "function" ? updater(serverSide.sorting) : updater),
          onPaginationChange: (updater: Updater<PaginationState>) => {
            const current = { pageIndex: serverSide.pageIndex, pageSize: serverSide.pageSize };
            serverSide.onPageChange((typeof updater === "function" ? updater(current) : updater).pageIndex);
          },
        }
      : {
          state: { sorting, globalFilter },
          initialState: { pagination: { pageIndex: 0, pageSize } },
          onSortingChange: setSorting,
          onGlobalFilterChange: setGlobalFilter,
          globalFilterFn: "includesString" as const,
          // Text typed into the filter matches every column that shows text or numbers, not just the first row's types.
          getColumnCanGlobalFilter: (column: Column<Row>) => column.columnDef.enableGlobalFilter !== false,
          getSortedRowModel: getSortedRowModel(),
          getFilteredRowModel: getFilteredRowModel(),
          getPaginationRowModel: getPaginationRowModel(),
          // A new filter should show its first matches, not an empty page further on.
          autoResetPageIndex: true,
        }),
  });

  const rows = table.getRowModel().rows;
  const matching = serverSide ? serverSide.rowCount : table.getFilteredRowModel().rows.length;
  const pageCount = Math.max(1, table.getPageCount());
  const columnCount = table.getVisibleLeafColumns().length;

  return (
    <div className="space-y-3">
      {serverSide && !newItem && !actions ? null : (
        <div className="flex flex-wrap items-end justify-between gap-3">
          {serverSide ? null : (
            <div className="flex flex-col gap-1">
              <label htmlFor={filterId} className="text-sm font-semibold">
                {filterLabel}
              </label>
              <input
                id={filterId}
                type="search"
                value={globalFilter}
                onChange={(event) => setGlobalFilter(event.target.value)}
                placeholder={filterPlaceholder}
                className="w-64 max-w-full rounded border border-rule bg-paper-raised px-3 py-2"
              />
            </div>
          )}
          {newItem || actions ? (
            <div className="flex flex-wrap gap-2">
              {newItem ? (
                <Link href={newItem.href} className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised hover:bg-ink-soft">
                  {newItem.label}
                </Link>
              ) : null}
              {actions}
            </div>
          ) : null}
        </div>
      )}

      {/* relative: screen-reader-only text in cells is positioned absolutely and must scroll with the table, not widen the page. */}
      <div className="relative overflow-x-auto rounded border border-rule bg-paper-raised">
        <table className="w-full text-left text-sm" style={{ minWidth }} aria-busy={serverSide?.busy || undefined}>
          <caption className={captionVisible ? "px-3 py-2 text-left font-serif text-lg" : "sr-only"}>{caption}</caption>
          <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sortable = header.column.getCanSort();
                  const direction = header.column.getIsSorted();
                  const numeric = header.column.columnDef.meta?.numeric;
                  const label = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      colSpan={header.colSpan}
                      aria-sort={sortable ? ariaSort[direction || "none"] : undefined}
                      className={`px-3 py-2 ${numeric ? "text-right" : ""}`}
                    >
                      {sortable ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={`inline-flex items-center gap-1 uppercase tracking-wide hover:text-copper ${numeric ? "flex-row-reverse" : ""}`}
                        >
                          {label}
                          <span aria-hidden="true" className="figure text-ink-faint">
                            {direction === "asc" ? "▲" : direction === "desc" ? "▼" : "↕"}
                          </span>
                        </button>
                      ) : (
                        label
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.id} className="border-t border-rule">
                {row.getVisibleCells().map((cell) => {
                  const meta = cell.column.columnDef.meta;
                  const className = `px-3 py-2 ${meta?.numeric ? "figure text-right" : ""} ${meta?.rowHeader ? "font-semibold" : ""}`;
                  const content = flexRender(cell.column.columnDef.cell, cell.getContext());
                  return meta?.rowHeader ? (
                    <th key={cell.id} scope="row" className={className}>
                      {content}
                    </th>
                  ) : (
                    <td key={cell.id} className={className}>
                      {content}
                    </td>
                  );
                })}
              </tr>
            ))}
            {rows.length === 0 ? (
              <EmptyTableRow columns={columnCount}>{globalFilter ? "Nothing matches that filter." : emptyMessage}</EmptyTableRow>
            ) : null}
          </tbody>
        </table>
      </div>

      <nav aria-label={`Pages of ${caption}`} className="flex flex-wrap items-center gap-4 text-sm">
        <button
          type="button"
          onClick={() => table.previousPage()}
          disabled={!table.getCanPreviousPage()}
          className="hover:text-copper disabled:text-ink-faint disabled:hover:text-ink-faint"
        >
          ← Previous
        </button>
        <span className="text-ink-faint" aria-live="polite">
          Page {table.getState().pagination.pageIndex + 1} of {pageCount} · {matching} {matching === 1 ? rowNoun[0] : rowNoun[1]}
        </span>
        <button
          type="button"
          onClick={() => table.nextPage()}
          disabled={!table.getCanNextPage()}
          className="hover:text-copper disabled:text-ink-faint disabled:hover:text-ink-faint"
        >
          Next →
        </button>
      </nav>
    </div>
  );
}
