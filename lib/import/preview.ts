// Turns a read table and a column mapping into an import preview: parsed runs, per-row and file errors, and a diff.

import { runCutLengthMm } from "../domain/cut-length";
import {
  RUN_FIELDS,
  RUN_FIELD_BY_KEY,
  blankValue,
  defaultUnit,
  isBlankValue,
  parseFieldValue,
  type FieldKind,
  type FieldParseContext,
  type FieldValue,
  type RunFieldDef,
  type RunFieldKey,
} from "../domain/run-fields";
import type { ProjectSettings, RunData } from "../domain/types";
import type { ParseResult } from "../domain/units";
import { diffRuns, wireIdKey, type IncomingRun } from "./diff";
import { columnLetter, findDuplicates } from "./header-match";
import type {
  CellNote,
  ColumnMapping,
  ImportIssue,
  ImportIssueCode,
  ImportPreview,
  ImportTable,
  PreviewRow,
  TableRow,
} from "./types";

interface ActiveColumn {
  def: RunFieldDef;
  col: ColumnMapping;
  ctx: FieldParseContext;
  /** Parse results by cell text: gauges, colours, terminations and the like repeat on most rows. */
  cache: Map<string, ParseResult<FieldValue>> | null;
}

/** Free text and wire IDs rarely repeat, so caching them would only cost memory. */
const UNCACHED: ReadonlySet<FieldKind> = new Set<FieldKind>(["wireId", "text"]);

function issue(
  severity: ImportIssue["severity"],
  code: ImportIssueCode,
  row: number | null,
  col: ColumnMapping | null,
  field: RunFieldKey | null,
  message: string,
  value: string | null = null,
): ImportIssue {
  const where = row === null ? "" : col ? `Row ${row}, column "${col.header}": ` : `Row ${row}: `;
  return { severity, code, row, column: col?.header ?? null, field, message: where + message, value };
}

function quoteList(items: readonly string[]): string {
  const q = items.map((s) => `"${s}"`);
  return q.length <= 1 ? (q[0] ?? "") : `${q.slice(0, -1).join(", ")} and ${q[q.length - 1]}`;
}

/** File-level problems that come from the mapping alone. */
function mappingIssues(
  table: ImportTable,
  columns: readonly ColumnMapping[],
): { errors: ImportIssue[]; warnings: ImportIssue[] } {
  const errors: ImportIssue[] = [];
  const warnings: ImportIssue[] = [];
  const mapped = new Set(columns.flatMap((c) => (c.field && !c.ignored ? [c.field] : [])));
  for (const def of RUN_FIELDS) {
    if (!def.required || mapped.has(def.key)) continue;
    errors.push(
      issue(
        "error",
        "missing_column",
        null,
        null,
        def.key,
        `No column holds ${def.label} (${def.key}), which every run needs, e.g. ${def.example}. The file's columns are ${quoteList(table.headers.filter((h) => h !== ""))}; add the column or map one of them to ${def.label}.`,
      ),
    );
  }
  for (const d of findDuplicates(columns)) {
    const def = RUN_FIELD_BY_KEY[d.field];
    const named = d.indexes.map((ix, k) => `"${d.headers[k]}" (${columnLetter(ix)})`);
    errors.push({
      ...issue(
        "error",
        "column_mapped_twice",
        null,
        null,
        d.field,
        `The columns ${named.join(" and ")} are both mapped to ${def.label}; keep one and set the other to "not imported".`,
      ),
      column: d.headers.slice(1).join(", "),
    });
  }
  for (const c of columns) {
    if (c.field !== null || c.ignored) continue;
    warnings.push({
      ...issue(
        "warning",
        "unmapped_column",
        null,
        null,
        null,
        `Column "${c.header}" (${columnLetter(c.index)}) matches no run field and is not imported.`,
      ),
      column: c.header,
    });
  }
  return { errors, warnings };
}

function activeColumns(
  columns: readonly ColumnMapping[],
  settings: ProjectSettings,
): Map<RunFieldKey, ActiveColumn> {
  const active = new Map<RunFieldKey, ActiveColumn>();
  for (const col of columns) {
    if (col.field === null || col.ignored || active.has(col.field)) continue;
    const def = RUN_FIELD_BY_KEY[col.field];
    active.set(col.field, {
      def,
      col,
      ctx: { unit: col.unit ?? defaultUnit(def.kind), gaugeSystem: settings.gaugeSystem },
      cache: UNCACHED.has(def.kind) ? null : new Map(),
    });
  }
  return active;
}

function noteFor(row: TableRow, column: number): CellNote | undefined {
  return row.notes?.find((n) => n.column === column);
}

const FORMULA_FIX =
  "open the file in a spreadsheet program so that it calculates, save it, and upload it again";

interface ParsedRow {
  preview: PreviewRow;
  values: Partial<RunData>;
}

/** Every field in catalogue order with its column, if mapped: worked out once per preview, not per row. */
type FieldPlan = readonly { def: RunFieldDef; a: ActiveColumn | undefined }[];

function parseCell(a: ActiveColumn, raw: string): ParseResult<FieldValue> {
  if (!a.cache) return parseFieldValue(a.def, raw, a.ctx);
  let r = a.cache.get(raw);
  if (!r) {
    r = parseFieldValue(a.def, raw, a.ctx);
    a.cache.set(raw, r);
  }
  return r;
}

function parseRow(
  row: TableRow,
  plan: FieldPlan,
  active: Map<RunFieldKey, ActiveColumn>,
  headerCount: number,
): ParsedRow {
  const errors: ImportIssue[] = [];
  const warnings: ImportIssue[] = [];
  const values: Partial<Record<RunFieldKey, unknown>> = {};
  const given = new Set<RunFieldKey>();
  const n = row.rowNumber;

  for (const { def, a } of plan) {
    if (!a) {
      values[def.key] = blankValue(def.key);
      continue;
    }
    const raw = row.cells[a.col.index] ?? "";
    const note = row.notes ? noteFor(row, a.col.index) : undefined;
    if (note && (note.kind === "formula_no_value" || note.kind === "formula_error")) {
      const what =
        note.kind === "formula_no_value"
          ? `${note.detail}; ${FORMULA_FIX}`
          : `${note.detail}; expected ${def.label} such as ${def.example}`;
      errors.push(issue("error", note.kind, n, a.col, def.key, what));
      continue;
    }
    if (isBlankValue(raw, def.kind)) {
      if (def.required) {
        const merged =
          note?.kind === "merged"
            ? ` (this cell is ${note.detail}: only the top-left cell of merged cells holds a value; unmerge them and fill in every row)`
            : "";
        errors.push(
          issue(
            "error",
            "missing_value",
            n,
            a.col,
            def.key,
            `${def.label} is blank; expected ${def.label} such as ${def.example}${merged}`,
            raw,
          ),
        );
      } else values[def.key] = blankValue(def.key);
      continue;
    }
    const parsed = parseCell(a, raw);
    if (parsed.ok) {
      values[def.key] = parsed.value;
      given.add(def.key);
    } else {
      errors.push(issue("error", "invalid_value", n, a.col, def.key, parsed.message, raw));
    }
  }

  const v = values as Partial<RunData>;
  const col = (k: RunFieldKey) => active.get(k)?.col ?? null;
  // Rules between fields of one row.
  if (!given.has("dropClass") && v.dropLimitPct != null) v.dropClass = "custom";
  if (v.dropClass === "custom" && v.dropLimitPct == null && given.has("dropClass")) {
    errors.push(
      issue(
        "error",
        "drop_limit_missing",
        n,
        col("dropLimitPct") ?? col("dropClass"),
        "dropLimitPct",
        'the drop class is "custom" but no drop limit is given; expected a drop limit such as "3" or "3 %"',
      ),
    );
  }
  if (given.has("dropClass") && v.dropClass !== "custom" && v.dropLimitPct != null) {
    warnings.push(
      issue(
        "warning",
        "drop_limit_unused",
        n,
        col("dropLimitPct"),
        "dropLimitPct",
        `the drop limit applies only to the "custom" class; this run's class "${v.dropClass}" sets its own limit`,
      ),
    );
  }
  if (!given.has("returnKind") && v.returnRunWireId) v.returnKind = "run";
  if (v.returnKind === "run" && !v.returnRunWireId && !errors.some((e) => e.field === "returnRunWireId")) {
    errors.push(
      issue(
        "error",
        "return_run_missing",
        n,
        col("returnRunWireId") ?? col("returnKind"),
        "returnRunWireId",
        'the return kind is "run" but no return run wire ID is given; expected the wire ID of the return run, e.g. "HR3-042"',
      ),
    );
  }
  if (v.returnRunWireId && v.wireId && wireIdKey(v.returnRunWireId) === wireIdKey(v.wireId)) {
    errors.push(
      issue(
        "error",
        "return_run_self",
        n,
        col("returnRunWireId"),
        "returnRunWireId",
        `the return run "${v.returnRunWireId}" is this run itself; expected the wire ID of another run`,
        v.returnRunWireId,
      ),
    );
  }
  if (v.endA && v.endB && v.endA.toUpperCase() === v.endB.toUpperCase()) {
    warnings.push(
      issue("warning", "same_ends", n, col("endB"), "endB", `end A and end B are both "${v.endA}"`, v.endB),
    );
  }
  if (v.peakCurrentA != null && v.currentA != null && v.peakCurrentA < v.currentA) {
    warnings.push(
      issue(
        "warning",
        "peak_below_current",
        n,
        col("peakCurrentA"),
        "peakCurrentA",
        `the peak current ${v.peakCurrentA} A is below the current ${v.currentA} A`,
      ),
    );
  }
  if (v.fuseA != null && v.currentA != null && v.fuseA < v.currentA) {
    warnings.push(
      issue(
        "warning",
        "fuse_below_current",
        n,
        col("fuseA"),
        "fuseA",
        `the ${v.fuseA} A fuse is below the ${v.currentA} A current and would open in normal use`,
      ),
    );
  }
  for (let i = headerCount; i < row.cells.length; i++) {
    if (row.cells[i]!.trim() !== "") {
      warnings.push(
        issue(
          "warning",
          "extra_values",
          n,
          null,
          null,
          `has a value in column ${columnLetter(i)}, past the last named column; it is not imported`,
          row.cells[i]!,
        ),
      );
      break;
    }
  }

  const wireId = typeof v.wireId === "string" && v.wireId !== "" ? v.wireId : null;
  const complete = errors.length === 0;
  return {
    values: v,
    preview: {
      rowNumber: n,
      wireId,
      status: complete ? "added" : "invalid",
      run: complete ? (v as RunData) : null,
      partial: complete ? null : v,
      cutLengthMm: null,
      errors,
      warnings,
    },
  };
}

/**
 * Builds the preview of an import: every row parsed (a complete RunData, or the fields that parsed) with its
 * errors and warnings, the file-level errors, and the diff against the project's existing runs. The result is
 * plain JSON. Nothing is written anywhere; `canCommit` says whether a commit may go ahead.
 */
export function buildPreview(
  table: ImportTable,
  mapping: { columns: readonly ColumnMapping[] },
  existingRuns: readonly RunData[],
  settings: ProjectSettings,
): ImportPreview {
  const { errors: fileErrors, warnings: mappingWarnings } = mappingIssues(table, mapping.columns);
  const fileWarnings: ImportIssue[] = [...table.warnings, ...mappingWarnings];
  const active = activeColumns(mapping.columns, settings);
  const headerCount = Math.max(table.headers.length, ...mapping.columns.map((c) => c.index + 1));

  const plan: FieldPlan = RUN_FIELDS.map((def) => ({ def, a: active.get(def.key) }));
  const rows: PreviewRow[] = table.rows.map((r) => parseRow(r, plan, active, headerCount).preview);

  // Wire IDs must be unique within the file.
  const rowsByKey = new Map<string, PreviewRow[]>();
  for (const r of rows) {
    const id = r.run?.wireId ?? r.partial?.wireId ?? "";
    const key = wireIdKey(id);
    if (key === "") continue;
    const list = rowsByKey.get(key);
    if (list) list.push(r);
    else rowsByKey.set(key, [r]);
  }
  const idCol = active.get("wireId")?.col ?? null;
  for (const list of rowsByKey.values()) {
    if (list.length < 2) continue;
    const numbers = list.map((r) => r.rowNumber);
    const id = list[0]!.wireId ?? "";
    fileErrors.push({
      ...issue(
        "error",
        "duplicate_wire_id",
        null,
        null,
        "wireId",
        `The wire ID "${id}" appears on rows ${numbers.join(", ")}; each wire ID must be unique in the file.`,
      ),
      column: idCol?.header ?? null,
      rows: numbers,
    });
    for (const r of list) {
      const others = numbers.filter((x) => x !== r.rowNumber);
      r.errors.push(
        issue(
          "error",
          "duplicate_wire_id",
          r.rowNumber,
          idCol,
          "wireId",
          `the wire ID "${r.wireId}" is also on row${others.length > 1 ? "s" : ""} ${others.join(", ")}; expected a wire ID used once in the file`,
          r.wireId,
        ),
      );
      demote(r);
    }
  }

  // A return run should exist in the file or the project.
  const existingKeys = new Set(existingRuns.map((r) => wireIdKey(r.wireId)));
  const retCol = active.get("returnRunWireId")?.col ?? null;
  for (const r of rows) {
    const ret = r.run?.returnRunWireId ?? r.partial?.returnRunWireId ?? null;
    if (!ret) continue;
    const key = wireIdKey(ret);
    if (!rowsByKey.has(key) && !existingKeys.has(key)) {
      r.warnings.push(
        issue(
          "warning",
          "unknown_return_run",
          r.rowNumber,
          retCol,
          "returnRunWireId",
          `the return run "${ret}" is neither in this file nor in the project`,
          ret,
        ),
      );
    }
  }

  const incoming: IncomingRun[] = [];
  const mentioned: string[] = [];
  for (const r of rows) {
    if (r.run) incoming.push({ rowNumber: r.rowNumber, run: r.run });
    else if (r.partial?.wireId) mentioned.push(wireIdKey(r.partial.wireId));
  }
  const diff = diffRuns(incoming, existingRuns, mentioned);
  const changedRows = new Set(diff.changed.map((c) => c.rowNumber));
  const unchangedRows = new Set(diff.unchanged.map((c) => c.rowNumber));
  for (const r of rows) {
    if (!r.run) continue;
    r.status = changedRows.has(r.rowNumber)
      ? "changed"
      : unchangedRows.has(r.rowNumber)
        ? "unchanged"
        : "added";
    r.cutLengthMm = runCutLengthMm(r.run, settings);
  }

  const rowErrors = rows.reduce((s, r) => s + r.errors.length, 0);
  const rowWarnings = rows.reduce((s, r) => s + r.warnings.length, 0);
  const validRows = rows.filter((r) => r.run !== null).length;
  return {
    formatVersion: 1,
    source: {
      filename: table.filename,
      format: table.format,
      delimiter: table.delimiter,
      sheetName: table.sheetName,
      headerRowNumber: table.headerRowNumber,
    },
    columns: mapping.columns.map((c) => ({ ...c })),
    fileErrors,
    fileWarnings,
    rows,
    diff,
    summary: {
      rows: rows.length,
      validRows,
      invalidRows: rows.length - validRows,
      added: diff.added.length,
      changed: diff.changed.length,
      unchanged: diff.unchanged.length,
      missing: diff.missing.length,
      errors: fileErrors.length + rowErrors,
      warnings: fileWarnings.length + rowWarnings,
      blankRowsSkipped: table.blankRowsSkipped,
    },
    canCommit: fileErrors.length === 0 && rowErrors === 0,
  };
}

/** A row that gained an error after parsing keeps what it parsed, as a partial. */
function demote(r: PreviewRow): void {
  if (r.run) {
    r.partial = r.run;
    r.run = null;
  }
  r.status = "invalid";
}
