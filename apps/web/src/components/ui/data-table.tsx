import {
  flexRender,
  getCoreRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type OnChangeFn,
  type PaginationState,
  type RowData,
  type SortingState,
} from "@tanstack/react-table";
import { ArrowDown, ArrowUp, ArrowUpDown, ChevronLeft, ChevronRight, TriangleAlert } from "lucide-react";
import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { cn } from "@/lib/cn";
import { formatNumber } from "@/lib/format";
import { Button } from "./button";
import { Spinner } from "./spinner";

declare module "@tanstack/react-table" {
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Right-aligned with tabular figures: every column of numbers sets this. */
    numeric?: boolean;
    /** Extra classes for this column's cells (e.g. a width). */
    className?: string;
  }
}

/** Server-side mode: the parent owns sorting and paging and fetches one page at a time. */
export interface ServerSide {
  /** Rows matching the current filters on the server, across all pages. */
  rowCount: number;
  sorting: SortingState;
  onSortingChange: OnChangeFn<SortingState>;
  pagination: PaginationState;
  onPaginationChange: OnChangeFn<PaginationState>;
}

export interface DataTableProps<T> {
  /** TanStack column definitions; set `meta.numeric` on columns of numbers. */
  columns: Array<ColumnDef<T, any>>;
  /** The rows; `undefined` while the first load is pending. */
  data: T[] | undefined;
  /** Accessible name of the table (also the name of its scroll region). */
  label: string;
  getRowId?: (row: T) => string;
  /** First load: shows a loading row instead of the body. */
  isLoading?: boolean;
  /** A background refresh: a quiet spinner by the pager, the rows stay. */
  isFetching?: boolean;
  /** A failed load: shown in the body with a retry button. */
  error?: { message: string } | null;
  onRetry?: () => void;
  /** Shown in the body when there are no rows (say why, and what to do). */
  empty?: ReactNode;
  /** Row actions, rendered in a last column headed "Actions". */
  rowActions?: (row: T) => ReactNode;
  /** Client mode: the starting sort. */
  initialSorting?: SortingState;
  /** Client mode: rows per page (default 25). */
  pageSize?: number;
  /** Rows-per-page choices offered under the table. */
  pageSizeOptions?: number[];
  /** When given, sorting and paging happen on the server. */
  server?: ServerSide;
  /** Classes for a row, e.g. to mute retired ones. */
  rowClassName?: (row: T) => string | undefined;
  /** Height limit of the scroll box in which the header sticks. */
  maxHeightClassName?: string;
}

const ariaSort = { asc: "ascending", desc: "descending" } as const;

/**
 * The shop's tables: sticky header, sortable headers (aria-sort, ascending first even for
 * numbers), right-aligned numbers, loading, error and empty states, row actions at the end and
 * a pager. Sorting and paging run in the browser unless `server` is given.
 */
export function DataTable<T>({
  columns,
  data,
  label,
  getRowId,
  isLoading = false,
  isFetching = false,
  error,
  onRetry,
  empty,
  rowActions,
  initialSorting = [],
  pageSize = 25,
  pageSizeOptions = [10, 25, 50, 100],
  server,
  rowClassName,
  maxHeightClassName = "max-h-[70vh]",
}: DataTableProps<T>) {
  const [clientSorting, setClientSorting] = useState<SortingState>(initialSorting);
  const [clientPagination, setClientPagination] = useState<PaginationState>({ pageIndex: 0, pageSize });
  const captionId = useId();

  const rows = data ?? [];
  const table = useReactTable<T>({
    data: rows,
    columns,
    getRowId: getRowId ? (row) => getRowId(row) : undefined,
    getCoreRowModel: getCoreRowModel(),
    // TanStack sorts number columns descending on the first click; readers expect ascending.
    sortDescFirst: false,
    enableSortingRemoval: true,
    ...(server
      ? {
          manualSorting: true,
          manualPagination: true,
          rowCount: server.rowCount,
          state: { sorting: server.sorting, pagination: server.pagination },
          onSortingChange: server.onSortingChange,
          onPaginationChange: server.onPaginationChange,
        }
      : {
          getSortedRowModel: getSortedRowModel(),
          getPaginationRowModel: getPaginationRowModel(),
          state: { sorting: clientSorting, pagination: clientPagination },
          onSortingChange: (updater: SortingState | ((old: SortingState) => SortingState)) => {
            setClientSorting(updater);
            // A new order starts at the first page.
            setClientPagination((p) => ({ ...p, pageIndex: 0 }));
          },
          onPaginationChange: setClientPagination,
          autoResetPageIndex: false,
        }),
  });

  const columnCount = table.getVisibleLeafColumns().length + (rowActions ? 1 : 0);
  const pageRows = table.getRowModel().rows;
  const total = server ? server.rowCount : table.getPrePaginationRowModel().rows.length;
  const { pageIndex, pageSize: size } = table.getState().pagination;
  const first = total === 0 ? 0 : pageIndex * size + 1;
  const last = Math.min(total, (pageIndex + 1) * size);
  const pageCount = Math.max(1, Math.ceil(total / size));
  const showBody = !isLoading && !error;

  // Reaching the first or last page disables the button just pressed; the keyboard's focus then
  // moves to the other page button instead of falling back to the top of the page.
  const previousButton = useRef<HTMLButtonElement>(null);
  const nextButton = useRef<HTMLButtonElement>(null);
  const pressed = useRef<"previous" | "next" | null>(null);
  useEffect(() => {
    const which = pressed.current;
    pressed.current = null;
    const [button, other] = which === "next" ? [nextButton.current, previousButton.current] : [previousButton.current, nextButton.current];
    if (which && button?.disabled && other && !other.disabled) other.focus();
  }, [pageIndex]);

  // Fewer rows after a filter change: stay on a page that exists.
  useEffect(() => {
    if (!server && pageIndex > pageCount - 1) setClientPagination((p) => ({ ...p, pageIndex: pageCount - 1 }));
  }, [server, pageIndex, pageCount]);

  return (
    <div className="flex flex-col">
      <div
        role="region"
        aria-labelledby={captionId}
        // The scroll box must be reachable by keyboard to scroll it (WCAG 2.1.1).
        tabIndex={0}
        className={cn("overflow-auto rounded-lg border border-rule bg-surface", maxHeightClassName)}
      >
        <table className="w-full border-collapse text-sm" aria-busy={isLoading || undefined}>
          <caption id={captionId} className="sr-only">
            {label}
          </caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const meta = header.column.columnDef.meta;
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  const content = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={canSort ? (sorted ? ariaSort[sorted] : "none") : undefined}
                      className={cn(
                        "sticky top-0 z-10 border-b border-rule bg-paper px-3 py-2 text-xs font-medium whitespace-nowrap text-muted",
                        meta?.numeric ? "text-right" : "text-left",
                        meta?.className,
                      )}
                    >
                      {canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={cn(
                            "-mx-1 inline-flex cursor-pointer items-center gap-1 rounded px-1 py-0.5 hover:text-ink",
                            meta?.numeric && "flex-row-reverse",
                            sorted && "text-ink",
                          )}
                        >
                          <span>{content}</span>
                          {sorted === "asc" ? (
                            <ArrowUp className="size-3.5" aria-hidden />
                          ) : sorted === "desc" ? (
                            <ArrowDown className="size-3.5" aria-hidden />
                          ) : (
                            <ArrowUpDown className="size-3.5 opacity-40" aria-hidden />
                          )}
                        </button>
                      ) : (
                        content
                      )}
                    </th>
                  );
                })}
                {rowActions && (
                  <th scope="col" className="sticky top-0 z-10 border-b border-rule bg-paper px-3 py-2 text-right text-xs font-medium text-muted">
                    Actions
                  </th>
                )}
              </tr>
            ))}
          </thead>
          <tbody>
            {isLoading && (
              <tr>
                <td colSpan={columnCount} className="px-3 py-10">
                  <div role="status" className="flex items-center justify-center gap-2 text-muted">
                    <Spinner />
                    <span>Loading…</span>
                  </div>
                </td>
              </tr>
            )}
            {!isLoading && error && (
              <tr>
                <td colSpan={columnCount} className="px-3 py-8">
                  <div role="alert" className="flex flex-col items-center gap-3 text-center">
                    <p className="flex items-center gap-2 text-limit">
                      <TriangleAlert className="size-4" aria-hidden />
                      {error.message}
                    </p>
                    {onRetry && (
                      <Button variant="secondary" size="sm" onClick={onRetry}>
                        Try again
                      </Button>
                    )}
                  </div>
                </td>
              </tr>
            )}
            {showBody && pageRows.length === 0 && (
              <tr>
                <td colSpan={columnCount} className="px-3">
                  {empty ?? <p className="py-10 text-center text-muted">Nothing to show.</p>}
                </td>
              </tr>
            )}
            {showBody &&
              pageRows.map((row) => (
                <tr key={row.id} className={cn("border-b border-rule/70 last:border-b-0 hover:bg-paper/60", rowClassName?.(row.original))}>
                  {row.getVisibleCells().map((cell) => {
                    const meta = cell.column.columnDef.meta;
                    return (
                      <td
                        key={cell.id}
                        className={cn("px-3 py-2 align-middle", meta?.numeric ? "tabular text-right whitespace-nowrap" : "text-left", meta?.className)}
                      >
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    );
                  })}
                  {rowActions && (
                    <td className="px-3 py-1.5 text-right whitespace-nowrap">
                      <div className="flex items-center justify-end gap-1">{rowActions(row.original)}</div>
                    </td>
                  )}
                </tr>
              ))}
          </tbody>
        </table>
      </div>

      {showBody && total > 0 && (
        <nav aria-label={`${label}: pages`} className="mt-2 flex flex-wrap items-center justify-between gap-3 px-1 text-sm text-muted">
          <p className="tabular flex items-center gap-2" aria-live="polite">
            {isFetching && <Spinner className="size-3.5" label="Refreshing" />}
            Rows {formatNumber(first)}–{formatNumber(last)} of {formatNumber(total)}
          </p>
          {/* Page controls only when there is more than one page's worth of rows. */}
          {total > Math.min(size, ...pageSizeOptions) && (
            <div className="flex items-center gap-3">
              <label className="flex items-center gap-2">
                <span>Rows per page</span>
                <select
                  value={size}
                  onChange={(event) => table.setPagination({ pageIndex: 0, pageSize: Number(event.target.value) })}
                  className="h-8 rounded-md border border-rule-strong bg-surface px-2 text-sm text-ink"
                >
                  {[...new Set([...pageSizeOptions, size])]
                    .sort((a, b) => a - b)
                    .map((n) => (
                      <option key={n} value={n}>
                        {n}
                      </option>
                    ))}
                </select>
              </label>
              <span className="tabular">
                Page {formatNumber(pageIndex + 1)} of {formatNumber(pageCount)}
              </span>
              <div className="flex gap-1">
                <Button
                  ref={previousButton}
                  variant="secondary"
                  size="sm"
                  onClick={() => {
                    pressed.current = "previous";
                    table.previousPage();
                  }}
                  disabled={!table.getCanPreviousPage()}
                >
                  <ChevronLeft className="size-4" aria-hidden />
                  Previous
                </Button>
                <Button
                  ref={nextButton}
                  variant="secondary"
                  size="sm"
                  onClick={() => {
                    pressed.current = "next";
                    table.nextPage();
                  }}
                  disabled={!table.getCanNextPage()}
                >
                  Next
                  <ChevronRight className="size-4" aria-hidden />
                </Button>
              </div>
            </div>
          )}
        </nav>
      )}
    </div>
  );
}
