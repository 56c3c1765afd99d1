"use client";
/**
 * The one table of Morphokin: TanStack Table for columns and sorting state, SWR for data,
 * server-side sorting, filtering and pagination through the API's `?page&pageSize&sort&dir&q`.
 */
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { useEffect, useMemo, useState } from "react";
import useSWR from "swr";
import { fetchJson } from "@/lib/client/api";
import { describeLoadError } from "./load-error";

declare module "@tanstack/react-table" {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars -- the generics must match TanStack's own declaration
  interface ColumnMeta<TData, TValue> {
    /** "sm": a secondary column, hidden below 640 px so the table fits a phone's width. */
    hideBelow?: "sm";
  }
}

/** The cell and header classes of a column hidden on narrow screens (Tailwind needs literal names). */
function hiddenClass(meta: { hideBelow?: "sm" } | undefined): string {
  return meta?.hideBelow === "sm" ? " hidden sm:table-cell" : "";
}

export interface Page<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

export interface DataTableProps<T> {
  /** API list endpoint, without query string. */
  url: string;
  columns: ColumnDef<T, unknown>[];
  defaultSort: { id: string; desc: boolean };
  pageSize?: number;
  filterPlaceholder?: string;
  empty: React.ReactNode;
  testId: string;
  /** Changes to this value refetch (e.g. after a create). */
  refreshKey?: number;
}

export function DataTable<T>({
  url,
  columns,
  defaultSort,
  pageSize = 25,
  filterPlaceholder = "Filter…",
  empty,
  testId,
  refreshKey = 0,
}: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>([defaultSort]);
  const [page, setPage] = useState(1);
  const [filter, setFilter] = useState("");
  const [q, setQ] = useState("");
  useEffect(() => {
    const t = setTimeout(() => {
      setQ(filter);
      setPage(1);
    }, 250);
    return () => clearTimeout(t);
  }, [filter]);
  const sort = sorting[0] ?? defaultSort;
  const key = `${url}?page=${page}&pageSize=${pageSize}&sort=${encodeURIComponent(sort.id)}&dir=${sort.desc ? "desc" : "asc"}&q=${encodeURIComponent(q)}`;
  const { data, error, isLoading, mutate } = useSWR<Page<T>>(key, fetchJson, { keepPreviousData: true });
  useEffect(() => {
    if (refreshKey) void mutate();
  }, [refreshKey, mutate]);
  // Sorting happens on the server by column id; TanStack only lets a column sort when it has an
  // accessor, so give every column one that reads the field of the same name.
  const sortableColumns = useMemo(
    () =>
      columns.map((c) =>
        "accessorFn" in c || "accessorKey" in c
          ? c
          : ({ accessorFn: (row: T) => (row as Record<string, unknown>)[c.id!], ...c } as ColumnDef<T, unknown>),
      ),
    [columns],
  );
  const table = useReactTable({
    data: data?.items ?? [],
    columns: sortableColumns,
    state: { sorting },
    onSortingChange: (s) => {
      setSorting(s);
      setPage(1);
    },
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    getCoreRowModel: getCoreRowModel(),
  });
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  return (
    <div className="space-y-3" data-testid={testId}>
      <div className="flex items-center justify-between gap-3">
        <input
          value={filter}
          onChange={(e) => setFilter(e.target.value)}
          placeholder={filterPlaceholder}
          aria-label="Filter rows"
          className="w-64 rounded-md border border-rule bg-card px-3 py-1.5 text-sm focus:border-moss focus:outline-none"
        />
        <span className="num text-xs text-ink-soft">
          {data ? `${data.total} row${data.total === 1 ? "" : "s"}` : isLoading ? "loading…" : ""}
        </span>
      </div>
      {error ? (
        <div
          role="alert"
          className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-brick/40 bg-brick-soft px-3 py-2 text-sm text-brick"
          data-testid="table-error"
        >
          <span>{describeLoadError("The rows", error)}</span>
          <button
            type="button"
            onClick={() => void mutate()}
            className="rounded border border-brick/40 bg-card px-2 py-0.5 text-ink hover:bg-paper-deep"
            data-testid="table-retry"
          >
            Try again
          </button>
        </div>
      ) : data && data.total === 0 && !q ? (
        empty
      ) : (
        <div className="overflow-x-auto rounded-lg border border-rule bg-card">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper-deep/60 text-xs uppercase tracking-wide text-ink-soft">
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id}>
                  {hg.headers.map((h) => {
                    const canSort = h.column.getCanSort();
                    const dir = h.column.getIsSorted();
                    return (
                      <th key={h.id} className={`px-3 py-2 font-medium${hiddenClass(h.column.columnDef.meta)}`}>
                        {canSort ? (
                          <button
                            type="button"
                            onClick={h.column.getToggleSortingHandler()}
                            className="inline-flex items-center gap-1 hover:text-ink"
                            data-testid={`sort-${h.column.id}`}
                          >
                            {flexRender(h.column.columnDef.header, h.getContext())}
                            <span aria-hidden>{dir === "asc" ? "▲" : dir === "desc" ? "▼" : "↕"}</span>
                          </button>
                        ) : (
                          flexRender(h.column.columnDef.header, h.getContext())
                        )}
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((row) => (
                <tr key={row.id} className="border-b border-rule/60 last:border-0 hover:bg-paper/70">
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className={`px-3 py-2 align-top${hiddenClass(cell.column.columnDef.meta)}`}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ))}
              {data && data.items.length === 0 && (
                <tr>
                  <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-soft">
                    No rows match “{q}”.
                  </td>
                </tr>
              )}
            </tbody>
          </table>
        </div>
      )}
      {data && data.total > data.pageSize && (
        <div className="flex items-center justify-end gap-2 text-sm">
          <button
            type="button"
            className="rounded border border-rule px-2 py-1 disabled:opacity-40"
            disabled={page <= 1}
            onClick={() => setPage(page - 1)}
          >
            ← Previous
          </button>
          <span className="num text-ink-soft">
            page {page} of {pages}
          </span>
          <button
            type="button"
            className="rounded border border-rule px-2 py-1 disabled:opacity-40"
            disabled={page >= pages}
            onClick={() => setPage(page + 1)}
            data-testid="next-page"
          >
            Next →
          </button>
        </div>
      )}
    </div>
  );
}
