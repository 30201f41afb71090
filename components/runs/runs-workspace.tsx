"use client";
// The desk view of a project's runs: sortable, filterable, virtualised table with inline edits, bulk edits,
// keyboard navigation and a detail drawer. Every write goes through the runs API with the run's version.
import { useCallback, useMemo, useRef, useState, type KeyboardEvent } from "react";
import {
  columnVisibilityFeature,
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_text,
  tableFeatures,
  useTable,
} from "@tanstack/react-table";
import { useVirtualizer } from "@tanstack/react-virtual";
import { ApiError, sendJson } from "@/lib/client/fetcher";
import { useRuns } from "@/lib/client/use-runs";
import type { RunView as RunRecord } from "@/lib/services/runs";
import type { Role } from "@/lib/auth/roles";
import { BENCH_STATES, type BenchState } from "@/lib/domain/types";
import { NUMERIC_FIELDS, parseCellEdit } from "@/lib/client/run-edit";
import { ColourSwatch } from "@/components/ui/colour-swatch";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";
import { Button, buttonClass } from "@/components/ui/button";
import { ImportPanel } from "@/components/runs/import-panel";
import { VerdictBadge } from "@/components/checks/verdict-badge";
import { useChecks } from "@/lib/client/use-checks";
import type { Verdict } from "@/lib/domain/checks";
import { StateBadge } from "@/components/runs/state-badge";
import { TestBadge } from "@/components/runs/test-badge";
import { RunDrawer } from "@/components/runs/run-drawer";
import { BulkEditBar } from "@/components/runs/bulk-edit-bar";

const features = tableFeatures({
  rowSortingFeature,
  columnVisibilityFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text },
});
const col = createColumnHelper<typeof features, RunRecord>();
const EMPTY: RunRecord[] = [];

/** Columns: id, header, width in px, and whether the lead may edit it in place. */
const RUN_COLUMNS = [
  { id: "wireId", header: "Wire ID", width: 110, editable: true },
  { id: "endA", header: "End A", width: 130, editable: true },
  { id: "endB", header: "End B", width: 130, editable: true },
  { id: "circuit", header: "Circuit", width: 280, editable: true },
  { id: "gauge", header: "Gauge", width: 100, editable: true },
  { id: "colour", header: "Colour", width: 100, editable: true },
  { id: "insulation", header: "Insulation", width: 140, editable: true },
  { id: "routedLengthMm", header: "Routed (mm)", width: 110, editable: true },
  { id: "cutLengthMm", header: "Cut (mm)", width: 95, editable: false },
  { id: "currentA", header: "Current (A)", width: 100, editable: true },
  { id: "fuseA", header: "Fuse (A)", width: 90, editable: true },
  { id: "state", header: "State", width: 110, editable: false },
  { id: "lastTest", header: "Test", width: 150, editable: false },
  { id: "verdict", header: "Check", width: 90, editable: false },
] as const;
type ColumnId = (typeof RUN_COLUMNS)[number]["id"];

const columns = col.columns([
  col.accessor("wireId", { id: "wireId", header: "Wire ID", sortFn: "alphanumeric" }),
  col.accessor("endA", { id: "endA", header: "End A", sortFn: "alphanumeric" }),
  col.accessor("endB", { id: "endB", header: "End B", sortFn: "alphanumeric" }),
  col.accessor((r) => r.circuit ?? "", { id: "circuit", header: "Circuit", sortFn: "text" }),
  col.accessor("gauge", { id: "gauge", header: "Gauge", sortFn: "alphanumeric" }),
  col.accessor("colour", { id: "colour", header: "Colour", sortFn: "text" }),
  col.accessor((r) => r.insulation ?? "", { id: "insulation", header: "Insulation", sortFn: "text" }),
  col.accessor("routedLengthMm", { id: "routedLengthMm", header: "Routed (mm)", sortDescFirst: false }),
  col.accessor("cutLengthMm", { id: "cutLengthMm", header: "Cut (mm)", sortDescFirst: false }),
  col.accessor((r) => r.currentA ?? -1, { id: "currentA", header: "Current (A)", sortDescFirst: false }),
  col.accessor((r) => r.fuseA ?? -1, { id: "fuseA", header: "Fuse (A)", sortDescFirst: false }),
  col.accessor((r) => BENCH_STATES.indexOf(r.state), { id: "state", header: "State", sortDescFirst: false }),
  col.accessor("wireId", { id: "verdict", header: "Check", enableSorting: false }),
  // Sorted: no test first, then failed, then passed.
  col.accessor((r) => (r.lastTest ? (r.lastTest.passed ? 2 : 1) : 0), {
    id: "lastTest",
    header: "Test",
    sortDescFirst: false,
  }),
]);

const NUMERIC: ReadonlySet<ColumnId> = new Set([...NUMERIC_FIELDS, "cutLengthMm"]);

function display(run: RunRecord, id: Exclude<ColumnId, "verdict" | "lastTest">): string {
  const v = run[id];
  if (v === null || v === undefined || v === "") return "—";
  if (typeof v === "number") return v.toLocaleString("en-GB");
  return String(v);
}

function editValue(run: RunRecord, id: ColumnId): string {
  if (id === "verdict" || id === "lastTest") return "";
  const v = run[id];
  return v === null || v === undefined ? "" : String(v);
}

export function RunsWorkspace({ projectId, role }: { projectId: string; role: Role }) {
  const [importing, setImporting] = useState(false);
  const { data, error, isLoading, mutate: mutateRuns } = useRuns(projectId);
  const checks = useChecks(projectId);
  const verdicts = useMemo(
    () => new Map((checks.data?.items ?? []).map((c) => [c.wireId, c.verdict] as const)),
    [checks.data],
  );
  const mutateChecks = checks.mutate;
  const mutate = useCallback(
    (...args: Parameters<typeof mutateRuns>) => {
      void mutateChecks();
      return mutateRuns(...args);
    },
    [mutateRuns, mutateChecks],
  );
  const [text, setText] = useState("");
  const [gauge, setGauge] = useState("");
  const [colour, setColour] = useState("");
  const [state, setState] = useState<BenchState | "">("");
  const [selected, setSelected] = useState<ReadonlySet<string>>(new Set());
  const [active, setActive] = useState({ row: 0, col: 0 });
  const [editing, setEditing] = useState<{
    runId: string;
    col: ColumnId;
    value: string;
    error?: string;
  } | null>(null);
  const [drawerRunId, setDrawerRunId] = useState<string | null>(null);
  const [message, setMessage] = useState<{ tone: "error" | "ok" | "caution"; text: string } | null>(null);
  const [showColumns, setShowColumns] = useState(false);
  const scrollRef = useRef<HTMLDivElement>(null);
  const canEdit = role === "lead";

  const all = data?.items ?? EMPTY;
  const gauges = useMemo(() => [...new Set(all.map((r) => r.gauge))].sort(), [all]);
  const colours = useMemo(() => [...new Set(all.map((r) => r.colour))].sort(), [all]);
  const filtered = useMemo(() => {
    const q = text.trim().toLowerCase();
    if (!q && !gauge && !colour && !state) return all;
    return all.filter(
      (r) =>
        (!gauge || r.gauge === gauge) &&
        (!colour || r.colour === colour) &&
        (!state || r.state === state) &&
        (!q ||
          r.wireId.toLowerCase().includes(q) ||
          r.endA.toLowerCase().includes(q) ||
          r.endB.toLowerCase().includes(q) ||
          (r.circuit ?? "").toLowerCase().includes(q)),
    );
  }, [all, text, gauge, colour, state]);

  const table = useTable({ features, columns, data: filtered, getRowId: (r) => r.id });
  const rows = table.getRowModel().rows;
  const visible = RUN_COLUMNS.filter((c) => table.getColumn(c.id)?.getIsVisible() ?? true);

  // TanStack Virtual returns fresh functions each render; the compiler skips this component, which is intended.
  // eslint-disable-next-line react-hooks/incompatible-library
  const virtualizer = useVirtualizer({
    count: rows.length,
    getScrollElement: () => scrollRef.current,
    estimateSize: () => 37,
    overscan: 12,
  });

  const replaceRuns = useCallback(
    (updated: RunRecord[]) => {
      const byId = new Map(updated.map((r) => [r.id, r]));
      void mutate((page) => (page ? { ...page, items: page.items.map((r) => byId.get(r.id) ?? r) } : page), {
        revalidate: false,
      });
    },
    [mutate],
  );

  const onWriteError = useCallback(
    (e: unknown) => {
      if (e instanceof ApiError && e.status === 409) {
        setMessage({ tone: "caution", text: `${e.message} The table now shows the current values.` });
        void mutate();
      } else {
        setMessage({ tone: "error", text: e instanceof Error ? e.message : "The change was not saved." });
      }
    },
    [mutate],
  );

  async function saveEdit() {
    if (!editing) return;
    const run = all.find((r) => r.id === editing.runId);
    if (!run) return setEditing(null);
    if (
      editing.col === "verdict" ||
      editing.col === "lastTest" ||
      editValue(run, editing.col) === editing.value
    )
      return setEditing(null);
    const parsed = parseCellEdit(run, editing.col, editing.value);
    if (!parsed.ok) return setEditing({ ...editing, error: parsed.message });
    try {
      const updated = await sendJson<RunRecord>(
        `/api/projects/${projectId}/runs/${run.id}`,
        "PATCH",
        parsed.body,
      );
      replaceRuns([updated]);
      setEditing(null);
      setMessage(null);
      scrollRef.current?.focus();
    } catch (e) {
      setEditing(null);
      onWriteError(e);
    }
  }

  function startEdit(rowIndex: number, colIndex: number) {
    const run = rows[rowIndex]?.original;
    const c = visible[colIndex];
    if (!run || !c) return;
    if (!canEdit || !c.editable) {
      if (c.id === "wireId" || !canEdit) setDrawerRunId(run.id);
      return;
    }
    setEditing({ runId: run.id, col: c.id, value: editValue(run, c.id) });
  }

  function toggle(id: string) {
    setSelected((s) => {
      const n = new Set(s);
      if (n.has(id)) n.delete(id);
      else n.add(id);
      return n;
    });
  }

  function onGridKey(e: KeyboardEvent<HTMLDivElement>) {
    if (editing) return;
    const maxRow = rows.length - 1;
    const maxCol = visible.length - 1;
    let { row, col: c } = active;
    if (e.key === "ArrowDown") row = Math.min(maxRow, row + 1);
    else if (e.key === "ArrowUp") row = Math.max(0, row - 1);
    else if (e.key === "ArrowRight") c = Math.min(maxCol, c + 1);
    else if (e.key === "ArrowLeft") c = Math.max(0, c - 1);
    else if (e.key === "PageDown") row = Math.min(maxRow, row + 15);
    else if (e.key === "PageUp") row = Math.max(0, row - 15);
    else if (e.key === "Home") row = 0;
    else if (e.key === "End") row = maxRow;
    else if (e.key === "Enter" || e.key === "F2") {
      e.preventDefault();
      return startEdit(row, c);
    } else if (e.key === " ") {
      e.preventDefault();
      const id = rows[row]?.id;
      if (id) toggle(id);
      return;
    } else return;
    e.preventDefault();
    setActive({ row, col: c });
    virtualizer.scrollToIndex(row, { align: "auto" });
  }

  if (error && !data) {
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
  const importPanel = importing ? (
    <ImportPanel
      projectId={projectId}
      onClose={() => setImporting(false)}
      onCommitted={(text) => {
        setImporting(false);
        setMessage({ tone: "ok", text });
        void mutate();
      }}
    />
  ) : null;
  if (data && data.total === 0) {
    return (
      <div className="flex flex-col gap-3">
        {importPanel}
        {!importing ? (
          <EmptyState
            title="No runs in this project yet"
            action={
              canEdit ? <Button onClick={() => setImporting(true)}>Import a run list</Button> : undefined
            }
          >
            A run is one wire from end A to end B. Import the routed run list from a spreadsheet to start.
          </EmptyState>
        ) : null}
        {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      </div>
    );
  }

  const items = virtualizer.getVirtualItems();
  const padTop = items[0]?.start ?? 0;
  const padBottom = virtualizer.getTotalSize() - (items[items.length - 1]?.end ?? 0);
  const drawerRun = drawerRunId ? (all.find((r) => r.id === drawerRunId) ?? null) : null;
  const selectedRuns = all.filter((r) => selected.has(r.id));
  const allFilteredSelected = filtered.length > 0 && filtered.every((r) => selected.has(r.id));

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter runs">
        <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
          Search
          <input
            type="search"
            value={text}
            onChange={(e) => setText(e.target.value)}
            placeholder="Wire ID, end or circuit"
            className="h-9 w-56 rounded-md border border-line-strong bg-white px-2 text-sm font-normal text-ink"
          />
        </label>
        <FilterSelect label="Gauge" value={gauge} onChange={setGauge} options={gauges} />
        <FilterSelect label="Colour" value={colour} onChange={setColour} options={colours} />
        <FilterSelect
          label="State"
          value={state}
          onChange={(v) => setState(v as BenchState | "")}
          options={[...BENCH_STATES]}
        />
        <div className="relative">
          <Button
            variant="secondary"
            size="sm"
            onClick={() => setShowColumns((s) => !s)}
            aria-expanded={showColumns}
          >
            Columns
          </Button>
          {showColumns ? (
            <div className="absolute z-20 mt-1 w-48 rounded-md border border-line bg-white p-2 shadow-lg">
              {RUN_COLUMNS.map((c) => {
                const column = table.getColumn(c.id);
                return (
                  <label key={c.id} className="flex items-center gap-2 py-1 text-sm">
                    <input
                      type="checkbox"
                      checked={column?.getIsVisible() ?? true}
                      disabled={c.id === "wireId"}
                      onChange={(e) => column?.toggleVisibility(e.target.checked)}
                    />
                    {c.header}
                  </label>
                );
              })}
            </div>
          ) : null}
        </div>
        <div className="flex items-center gap-2">
          {canEdit ? (
            <Button size="sm" onClick={() => setImporting((v) => !v)} aria-expanded={importing}>
              Import
            </Button>
          ) : null}
          <a
            className={buttonClass("secondary", "sm")}
            href={`/api/projects/${projectId}/runs/export?format=csv`}
          >
            Export CSV
          </a>
          <a
            className={buttonClass("secondary", "sm")}
            href={`/api/projects/${projectId}/runs/export?format=xlsx`}
          >
            Export XLSX
          </a>
        </div>
        <p className="ml-auto text-xs text-ink-faint" aria-live="polite">
          {filtered.length === all.length ? `${all.length} runs` : `${filtered.length} of ${all.length} runs`}
          {selected.size ? ` · ${selected.size} selected` : ""}
        </p>
      </div>

      {importPanel}
      {message ? (
        <div className="flex items-start gap-2">
          <div className="flex-1">
            <Notice tone={message.tone}>{message.text}</Notice>
          </div>
          <Button variant="quiet" size="sm" onClick={() => setMessage(null)} aria-label="Dismiss message">
            ✕
          </Button>
        </div>
      ) : null}

      {selectedRuns.length ? (
        <BulkEditBar
          projectId={projectId}
          role={role}
          runs={selectedRuns}
          onDone={(updated) => {
            replaceRuns(updated);
            setSelected(new Set());
            setMessage({ tone: "ok", text: `${updated.length} runs changed.` });
          }}
          onError={onWriteError}
          onClear={() => setSelected(new Set())}
        />
      ) : null}

      <div
        ref={scrollRef}
        tabIndex={0}
        onKeyDown={onGridKey}
        className="relative max-h-[70vh] overflow-auto rounded-lg border border-line bg-white shadow-sm focus:outline-2 focus:outline-copper"
        aria-label="Runs table; arrow keys move, Enter edits, Space selects"
      >
        <table
          className="w-full border-collapse text-sm"
          style={{ tableLayout: "fixed", minWidth: 40 + visible.reduce((s, c) => s + c.width, 0) }}
          aria-label="Runs"
          aria-rowcount={rows.length}
        >
          <colgroup>
            <col style={{ width: 40 }} />
            {visible.map((c) => (
              <col key={c.id} style={{ width: c.width }} />
            ))}
          </colgroup>
          <thead className="sticky top-0 z-10 bg-paper-deep text-left">
            <tr>
              <th scope="col" className="border-b border-line px-2 py-2">
                <input
                  type="checkbox"
                  aria-label="Select all shown runs"
                  checked={allFilteredSelected}
                  onChange={(e) =>
                    setSelected(e.target.checked ? new Set(filtered.map((r) => r.id)) : new Set())
                  }
                />
              </th>
              {visible.map((c) => {
                const column = table.getColumn(c.id);
                const sorted = column?.getIsSorted();
                return (
                  <th
                    key={c.id}
                    scope="col"
                    aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}
                    className="border-b border-line px-3 py-2 font-semibold text-ink-soft"
                  >
                    <button
                      type="button"
                      className="inline-flex items-center gap-1 hover:text-ink"
                      onClick={column?.getToggleSortingHandler()}
                    >
                      {c.header}
                      <span aria-hidden="true" className="text-xs text-copper">
                        {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
                      </span>
                    </button>
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody>
            {padTop > 0 ? (
              <tr aria-hidden="true">
                <td style={{ height: padTop }} colSpan={visible.length + 1} />
              </tr>
            ) : null}
            {items.map((vi) => {
              const row = rows[vi.index]!;
              const run = row.original;
              const isSel = selected.has(run.id);
              return (
                <tr
                  key={row.id}
                  data-run={run.wireId}
                  aria-selected={isSel}
                  className={`h-[37px] border-b border-line/70 ${isSel ? "bg-copper-light/50" : "hover:bg-paper"}`}
                >
                  <td className="px-2">
                    <input
                      type="checkbox"
                      aria-label={`Select ${run.wireId}`}
                      checked={isSel}
                      onChange={() => toggle(run.id)}
                    />
                  </td>
                  {visible.map((c, ci) => {
                    const isActive = active.row === vi.index && active.col === ci;
                    const isEditing = editing?.runId === run.id && editing.col === c.id;
                    return (
                      <td
                        key={c.id}
                        className={`truncate px-3 ${isActive ? "outline-2 -outline-offset-2 outline-copper" : ""} ${NUMERIC.has(c.id) ? "text-right tabular-nums" : ""}`}
                        onClick={() => setActive({ row: vi.index, col: ci })}
                        onDoubleClick={() => startEdit(vi.index, ci)}
                      >
                        {isEditing ? (
                          <CellEditor
                            label={`${c.header} of ${run.wireId}`}
                            value={editing.value}
                            error={editing.error}
                            onChange={(v) => setEditing({ ...editing, value: v, error: undefined })}
                            onSave={() => void saveEdit()}
                            onCancel={() => {
                              setEditing(null);
                              scrollRef.current?.focus();
                            }}
                          />
                        ) : (
                          <CellView
                            run={run}
                            id={c.id}
                            verdict={verdicts.get(run.wireId)}
                            onOpen={() => setDrawerRunId(run.id)}
                          />
                        )}
                      </td>
                    );
                  })}
                </tr>
              );
            })}
            {padBottom > 0 ? (
              <tr aria-hidden="true">
                <td style={{ height: padBottom }} colSpan={visible.length + 1} />
              </tr>
            ) : null}
          </tbody>
        </table>
        {rows.length === 0 ? (
          <p className="p-6 text-center text-sm text-ink-soft">No run matches the filters.</p>
        ) : null}
      </div>
      <p className="text-xs text-ink-faint">
        {canEdit
          ? "Double-click or press Enter on a cell to edit; Enter saves, Escape cancels. Space selects a row."
          : "Press Enter or click a wire ID to see a run's details."}
      </p>

      {drawerRun ? (
        <RunDrawer
          projectId={projectId}
          run={drawerRun}
          canEdit={canEdit}
          onClose={() => setDrawerRunId(null)}
          onSaved={(r) => replaceRuns([r])}
          onError={onWriteError}
        />
      ) : null}
    </div>
  );
}

function CellView({
  run,
  id,
  verdict,
  onOpen,
}: {
  run: RunRecord;
  id: ColumnId;
  verdict: Verdict | undefined;
  onOpen: () => void;
}) {
  if (id === "verdict")
    return verdict ? <VerdictBadge verdict={verdict} /> : <span className="text-ink-faint">…</span>;
  if (id === "wireId") {
    return (
      <button
        type="button"
        onClick={onOpen}
        className="font-mono font-semibold text-ink hover:text-copper-dark"
      >
        {run.wireId}
      </button>
    );
  }
  if (id === "lastTest")
    return run.lastTest ? <TestBadge test={run.lastTest} /> : <span className="text-ink-faint">—</span>;
  if (id === "colour") return <ColourSwatch code={run.colour} />;
  if (id === "state") return <StateBadge state={run.state} />;
  if (id === "endA" || id === "endB") return <span className="font-mono">{display(run, id)}</span>;
  return <span title={display(run, id)}>{display(run, id)}</span>;
}

function CellEditor(props: {
  label: string;
  value: string;
  error?: string;
  onChange: (v: string) => void;
  onSave: () => void;
  onCancel: () => void;
}) {
  return (
    <span className="relative block">
      <input
        autoFocus
        aria-label={props.label}
        aria-invalid={props.error ? true : undefined}
        value={props.value}
        onChange={(e) => props.onChange(e.target.value)}
        onKeyDown={(e) => {
          if (e.key === "Enter") {
            e.preventDefault();
            props.onSave();
          } else if (e.key === "Escape") {
            e.preventDefault();
            props.onCancel();
          }
        }}
        onBlur={props.onSave}
        className={`h-8 w-full rounded border px-1 text-sm ${props.error ? "border-fail" : "border-copper"}`}
      />
      {props.error ? (
        <span
          role="alert"
          className="absolute left-0 top-9 z-20 w-64 rounded bg-fail px-2 py-1 text-xs text-white"
        >
          {props.error}
        </span>
      ) : null}
    </span>
  );
}

function FilterSelect(props: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  options: string[];
}) {
  return (
    <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
      {props.label}
      <select
        value={props.value}
        onChange={(e) => props.onChange(e.target.value)}
        className="h-9 rounded-md border border-line-strong bg-white px-2 text-sm font-normal capitalize text-ink"
      >
        <option value="">All</option>
        {props.options.map((o) => (
          <option key={o} value={o}>
            {o}
          </option>
        ))}
      </select>
    </label>
  );
}
