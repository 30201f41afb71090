"use client";
// A sortable table shell (TanStack Table v9): header buttons that sort, aria-sort, and a footer line.
// The wrapper is `relative` so visually hidden (absolute) header text cannot widen the page on a phone.
import type { ReactNode } from "react";
import {
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
} from "@tanstack/react-table";

export const sortingFeatures = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, basic: sortFn_basic },
});
export type SortingFeatures = typeof sortingFeatures;

export function SortableTable<T extends RowData>({
  label,
  columns,
  data,
  getRowId,
  minWidthPx = 720,
  footer,
}: {
  label: string;
  columns: ReadonlyArray<ColumnDef<SortingFeatures, T, unknown>>;
  /** Keep this stable (SWR data or a module-level empty array), or the row model rebuilds on every render. */
  data: T[];
  getRowId: (row: T) => string;
  minWidthPx?: number;
  footer?: ReactNode;
}) {
  const table = useTable({ features: sortingFeatures, columns, data, getRowId });
  return (
    <div className="relative overflow-x-auto rounded-lg border border-line bg-white shadow-sm">
      <table className="w-full border-collapse text-sm" style={{ minWidth: minWidthPx }} aria-label={label}>
        <thead className="bg-paper-deep text-left">
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                const canSort = h.column.getCanSort();
                return (
                  <th
                    key={h.id}
                    scope="col"
                    aria-sort={
                      !canSort
                        ? undefined
                        : sorted === "asc"
                          ? "ascending"
                          : sorted === "desc"
                            ? "descending"
                            : "none"
                    }
                    className="whitespace-nowrap border-b border-line px-3 py-2 font-semibold text-ink-soft"
                  >
                    {canSort ? (
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 hover:text-ink"
                        onClick={h.column.getToggleSortingHandler()}
                      >
                        <table.FlexRender header={h} />
                        <span aria-hidden="true" className="text-xs text-copper">
                          {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
                        </span>
                      </button>
                    ) : (
                      <table.FlexRender header={h} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-line/70 last:border-0 hover:bg-paper">
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className="px-3 py-2 align-middle">
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {footer ? <div className="border-t border-line px-3 py-2 text-xs text-ink-faint">{footer}</div> : null}
    </div>
  );
}
