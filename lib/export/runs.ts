// Writes a project's runs as CSV or XLSX under the canonical field names, so the file imports back unchanged.

import ExcelJS from "exceljs";
import Papa from "papaparse";
import { runCutLengthMm } from "../domain/cut-length";
import { RUN_FIELDS, type RunFieldKey } from "../domain/run-fields";
import {
  DEFAULT_PROJECT_SETTINGS,
  type BenchState,
  type ProjectSettings,
  type RunData,
} from "../domain/types";

/** A run as exported: its data, and optionally what the app computed or owns. */
export type ExportRun = RunData & { cutLengthMm?: number; state?: BenchState; traceCode?: string | null };

type ExportColumn = RunFieldKey | "cutLengthMm" | "state" | "traceCode";

/**
 * Column order: PRODUCT.md §6, with the computed cutLengthMm beside routedLengthMm. Headers are the canonical
 * names, whose unit is part of the name (routedLengthMm is in mm, currentA in A), so matchHeaders maps each one
 * back to its field without guessing; cutLengthMm, state and traceCode are columns the import ignores.
 */
export function exportColumns(runs: readonly ExportRun[]): ExportColumn[] {
  const cols: ExportColumn[] = [];
  for (const f of RUN_FIELDS) {
    cols.push(f.key);
    if (f.key === "routedLengthMm") cols.push("cutLengthMm");
  }
  if (runs.some((r) => r.state !== undefined)) cols.push("state");
  if (runs.some((r) => r.traceCode !== undefined)) cols.push("traceCode");
  return cols;
}

type CellValue = string | number | boolean | null;

function valueOf(run: ExportRun, col: ExportColumn, settings: ProjectSettings): CellValue {
  if (col === "cutLengthMm") return run.cutLengthMm ?? runCutLengthMm(run, settings);
  if (col === "state") return run.state ?? null;
  if (col === "traceCode") return run.traceCode ?? null;
  const v = run[col];
  return v === undefined ? null : v;
}

function csvText(v: CellValue): string {
  if (v === null) return "";
  if (typeof v === "boolean") return v ? "true" : "false";
  return String(v);
}

/**
 * CSV (RFC 4180: CRLF line ends, quotes where needed) in UTF-8 with a byte-order mark so spreadsheet programs
 * show "mm²" and "Ω" correctly. Text starting with = + - @ or a tab gets a leading ' so a spreadsheet does not
 * run it as a formula (OWASP "CSV injection"); readTable removes that ' again.
 */
export function runsToCsv(
  runs: readonly ExportRun[],
  settings: ProjectSettings = DEFAULT_PROJECT_SETTINGS,
): string {
  const cols = exportColumns(runs);
  const data = runs.map((r) => cols.map((c) => csvText(valueOf(r, c, settings))));
  const body = Papa.unparse({ fields: cols, data }, { newline: "\r\n", escapeFormulae: /^[=+\-@\t\r]/ });
  return `\uFEFF${body}\r\n`;
}

/** An .xlsx workbook with one sheet "Runs": numbers as numbers, booleans as booleans, blanks empty. */
export async function runsToXlsx(
  runs: readonly ExportRun[],
  settings: ProjectSettings = DEFAULT_PROJECT_SETTINGS,
  options: { created?: Date } = {},
): Promise<Buffer> {
  const cols = exportColumns(runs);
  const wb = new ExcelJS.Workbook();
  wb.creator = "Loomwright";
  const when = options.created ?? new Date();
  wb.created = when;
  wb.modified = when;
  const ws = wb.addWorksheet("Runs", { views: [{ state: "frozen", ySplit: 1 }] });
  ws.columns = cols.map((c) => ({
    header: c,
    key: c,
    width: Math.max(10, Math.min(40, c.length + 2)),
  }));
  ws.getRow(1).font = { bold: true };
  for (const r of runs) {
    ws.addRow(cols.map((c) => valueOf(r, c, settings)));
  }
  const out = await wb.xlsx.writeBuffer();
  return Buffer.from(out as ArrayBuffer);
}
