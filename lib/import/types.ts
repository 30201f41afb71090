// Shapes shared by the run-list import: the table read from a file, column mappings, issues and the preview.

import type { RunData } from "../domain/types";
import type { FieldValue, RunFieldKey, UnitHint } from "../domain/run-fields";

/** Why a whole upload was refused before any row was looked at. */
export type ImportFileErrorCode =
  | "too_large"
  | "too_many_rows"
  | "unsupported_type"
  | "empty_file"
  | "not_utf8"
  | "not_text"
  | "unreadable"
  | "no_header_row"
  | "no_data_rows";

/** A refused upload: code for the API's error body, status for the HTTP mapper (413 for limits, else 422). */
export class ImportFileError extends Error {
  readonly code: ImportFileErrorCode;
  readonly status: 413 | 422;
  readonly details: Record<string, string | number> | null;

  constructor(
    code: ImportFileErrorCode,
    message: string,
    details: Record<string, string | number> | null = null,
  ) {
    super(message);
    this.name = "ImportFileError";
    this.code = code;
    this.status = code === "too_large" || code === "too_many_rows" ? 413 : 422;
    this.details = details;
  }
}

export function isImportFileError(e: unknown): e is ImportFileError {
  return e instanceof ImportFileError;
}

/** Something readTable noticed about one cell that a plain string cannot carry. */
export interface CellNote {
  /** 0-based column index. */
  column: number;
  kind: "formula_no_value" | "formula_error" | "merged";
  /** Short description, e.g. 'formula "=C2*1000" has no saved result'. */
  detail: string;
}

export interface TableRow {
  /** The row number the user sees in the spreadsheet (the header is row 1 in a plain file). */
  rowNumber: number;
  /** Cell text, trimmed of nothing; "" for an empty cell. */
  cells: string[];
  /** Only present when some cell needs a note. */
  notes?: CellNote[];
}

export interface ImportTable {
  filename: string;
  format: "csv" | "xlsx";
  /** The CSV delimiter found, or null for XLSX. */
  delimiter: "," | ";" | "\t" | null;
  /** The worksheet read, or null for CSV. */
  sheetName: string | null;
  headerRowNumber: number;
  headers: string[];
  /** Data rows only; fully blank rows are left out (and counted in blankRowsSkipped). */
  rows: TableRow[];
  blankRowsSkipped: number;
  /** File-level remarks from reading (which sheet was chosen, merged cells …). */
  warnings: ImportIssue[];
}

export interface ColumnMapping {
  /** 0-based column index in the table. */
  index: number;
  /** The header as written in the file ("Column C" when the header cell is blank). */
  header: string;
  field: RunFieldKey | null;
  /** Unit for values written without one, from the header ("Length (in)") or the field's own unit. */
  unit: UnitHint | null;
  matchedBy: "canonical" | "synonym" | "user" | null;
  /** A column the export writes and the import deliberately skips (cutLengthMm, state, version, traceCode). */
  ignored: boolean;
}

export interface HeaderMatch {
  columns: ColumnMapping[];
  /** Headers that matched no field and are not ignored columns. */
  unmatched: string[];
  /** Headers of ignored (computed) columns. */
  ignored: string[];
  /** Fields that more than one column maps to. */
  duplicates: { field: RunFieldKey; headers: string[]; indexes: number[] }[];
  /** Remarks such as a unit in a header that does not fit its field. */
  warnings: string[];
}

export type ImportIssueCode =
  // file level
  | "missing_column"
  | "column_mapped_twice"
  | "unmapped_column"
  | "merged_cells"
  | "sheet_chosen"
  | "rows_above_header"
  | "duplicate_wire_id"
  // row level
  | "invalid_value"
  | "missing_value"
  | "formula_no_value"
  | "formula_error"
  | "extra_values"
  | "return_run_missing"
  | "return_run_self"
  | "unknown_return_run"
  | "drop_limit_missing"
  | "drop_limit_unused"
  | "same_ends"
  | "peak_below_current"
  | "fuse_below_current";

export interface ImportIssue {
  severity: "error" | "warning";
  code: ImportIssueCode;
  /** Spreadsheet row number, or null for a file-level issue. */
  row: number | null;
  /** The column header as written in the file, or null. */
  column: string | null;
  field: RunFieldKey | null;
  /** A whole sentence naming the row, the column and what was expected. */
  message: string;
  /** The cell as written, when one cell is at fault. */
  value: string | null;
  /** Rows a file-level issue concerns (e.g. every row of a duplicated wire ID). */
  rows?: number[];
}

export interface FieldChange {
  field: RunFieldKey;
  old: FieldValue;
  new: FieldValue;
}

export interface RunDiff {
  added: { rowNumber: number; wireId: string | null }[];
  changed: { rowNumber: number; wireId: string; changes: FieldChange[] }[];
  unchanged: { rowNumber: number; wireId: string }[];
  /** Wire IDs of existing runs that the file does not mention. Never deleted unless the user asks. */
  missing: string[];
}

export type PreviewRowStatus = "added" | "changed" | "unchanged" | "invalid";

export interface PreviewRow {
  rowNumber: number;
  /** The wire ID as written (trimmed), or null when blank (generated from the project prefix on commit). */
  wireId: string | null;
  status: PreviewRowStatus;
  /** The complete run when the row has no errors, else null. */
  run: RunData | null;
  /** The fields that did parse, when the row has errors; else null. */
  partial: Partial<RunData> | null;
  /** Informational: the cut length under the project's settings, for a complete run. */
  cutLengthMm: number | null;
  errors: ImportIssue[];
  warnings: ImportIssue[];
}

export interface ImportPreview {
  formatVersion: 1;
  source: {
    filename: string;
    format: "csv" | "xlsx";
    delimiter: "," | ";" | "\t" | null;
    sheetName: string | null;
    headerRowNumber: number;
  };
  columns: ColumnMapping[];
  fileErrors: ImportIssue[];
  fileWarnings: ImportIssue[];
  rows: PreviewRow[];
  diff: RunDiff;
  summary: {
    rows: number;
    validRows: number;
    invalidRows: number;
    added: number;
    changed: number;
    unchanged: number;
    missing: number;
    errors: number;
    warnings: number;
    blankRowsSkipped: number;
  };
  /** True when nothing blocks a commit: no file-level error and no row error. */
  canCommit: boolean;
}
