"use client";
// The project's run list as a sortable table (TanStack Table v9), fed by SWR from the runs API.
import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_text,
  tableFeatures,
  useTable,
} from "@tanstack/react-table";
import { useRuns } from "@/lib/client/use-runs";
import type { RunRecord } from "@/lib/db/runs";
import { ColourSwatch } from "@/components/ui/colour-swatch";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";
import { Button } from "@/components/ui/button";
import { StateBadge } from "@/components/runs/state-badge";

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text },
});
const col = createColumnHelper<typeof features, RunRecord>();
const EMPTY: RunRecord[] = [];

const columns = col.columns([
  col.accessor("wireId", {
    header: "Wire ID",
    sortFn: "alphanumeric",
    cell: (c) => <span className="font-mono font-semibold">{c.getValue()}</span>,
  }),
  col.accessor("endA", { header: "End A", cell: (c) => <span className="font-mono">{c.getValue()}</span> }),
  col.accessor("endB", { header: "End B", cell: (c) => <span className="font-mono">{c.getValue()}</span> }),
  col.accessor("circuit", { header: "Circuit", sortFn: "text", cell: (c) => c.getValue() ?? "—" }),
  col.accessor("gauge", { header: "Gauge", sortFn: "alphanumeric" }),
  col.accessor("colour", { header: "Colour", cell: (c) => <ColourSwatch code={c.getValue()} /> }),
  col.accessor("routedLengthMm", {
    header: "Routed (mm)",
    sortDescFirst: false,
    cell: (c) => <span className="tabular-nums">{c.getValue().toLocaleString("en-GB")}</span>,
  }),
  col.accessor("currentA", {
    header: "Current (A)",
    sortDescFirst: false,
    sortUndefined: "last",
    cell: (c) => {
      const v = c.getValue();
      return <span className="tabular-nums">{v === null ? "—" : v.toLocaleString("en-GB")}</span>;
    },
  }),
  col.accessor("state", { header: "State", cell: (c) => <StateBadge state={c.getValue()} /> }),
]);

export function RunsTable({ projectId }: { projectId: string }) {
  const { data, error, isLoading, mutate } = useRuns(projectId);
  const table = useTable({ features, columns, data: data?.items ?? EMPTY, getRowId: (r) => r.id });

  if (error) {
    return (
      <Notice tone="error" title="The run list could not be loaded">
        <p>{error instanceof Error ? error.message : "Unknown error."}</p>
        <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
          Try again
        </Button>
      </Notice>
    );
  }
  if (isLoading && !data) return <SkeletonRows rows={10} label="Loading runs" />;
  if (data && data.total === 0) {
    return (
      <EmptyState title="No runs in this project yet">
        A run is one wire from end A to end B. Import the routed run list from a spreadsheet to start.
      </EmptyState>
    );
  }
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-white shadow-sm">
      <table className="w-full min-w-[900px] border-collapse text-sm" aria-label="Runs">
        <thead className="sticky top-0 bg-paper-deep text-left">
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                return (
                  <th
                    key={h.id}
                    scope="col"
                    aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}
                    className="border-b border-line px-3 py-2 font-semibold text-ink-soft"
                  >
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
      <p className="border-t border-line px-3 py-2 text-xs text-ink-faint">
        {data?.total ?? 0} runs
        {data && data.total > data.items.length ? ` (showing ${data.items.length})` : ""}
      </p>
    </div>
  );
}
