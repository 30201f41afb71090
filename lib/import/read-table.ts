// Reads an uploaded run list (CSV or XLSX) into a plain table of strings, refusing files it cannot trust.

import ExcelJS from "exceljs";
import Papa from "papaparse";
import { countMatchedHeaders } from "./header-match";
import { ImportFileError, type CellNote, type ImportIssue, type ImportTable, type TableRow } from "./types";

export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;
export const MAX_DATA_ROWS = 20_000;
/** An XLSX is a ZIP; refuse one that would unpack to more than this (a "zip bomb"). */
export const MAX_XLSX_UNPACKED_BYTES = 200 * 1024 * 1024;

const XLSX_MIME = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
const CSV_MIMES = new Set(["text/csv", "text/tab-separated-values", "application/csv", "text/x-csv"]);

type Delimiter = "," | ";" | "\t";

/**
 * Reads the first sheet-like table of an upload: CSV (delimiter , ; or tab, found from the header line) through
 * papaparse, XLSX through exceljs. Throws ImportFileError for an unsupported, empty, non-UTF-8, headerless,
 * too large or unreadable file. Row numbers are the ones the user sees (a CSV's header line is row 1).
 */
export async function readTable(buffer: Buffer, filename: string, mimeType?: string): Promise<ImportTable> {
  if (buffer.length > MAX_UPLOAD_BYTES) {
    throw new ImportFileError(
      "too_large",
      `The file is ${(buffer.length / 1024 / 1024).toFixed(1)} MB; the limit is ${MAX_UPLOAD_BYTES / 1024 / 1024} MB. Split the run list into smaller files.`,
      { bytes: buffer.length, limitBytes: MAX_UPLOAD_BYTES },
    );
  }
  const kind = detectKind(buffer, filename, mimeType);
  if (buffer.length === 0)
    throw new ImportFileError("empty_file", `"${filename}" is empty: it has no bytes at all.`);
  return kind === "xlsx" ? readXlsx(buffer, filename) : readCsv(buffer, filename);
}

// ---------------------------------------------------------------------------------------------------------
// File type.

function startsWith(buffer: Buffer, bytes: number[]): boolean {
  return bytes.every((b, i) => buffer[i] === b);
}

const ZIP_MAGIC = [0x50, 0x4b, 0x03, 0x04];
const EMPTY_ZIP_MAGIC = [0x50, 0x4b, 0x05, 0x06];
const OLE_MAGIC = [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1];
const PDF_MAGIC = [0x25, 0x50, 0x44, 0x46, 0x2d];

/** Names what a binary file looks like, for messages. */
function sniff(buffer: Buffer): string | null {
  if (startsWith(buffer, PDF_MAGIC)) return "a PDF document";
  if (startsWith(buffer, OLE_MAGIC)) return "an old-format Excel (.xls) or other Office 97–2003 file";
  if (startsWith(buffer, ZIP_MAGIC) || startsWith(buffer, EMPTY_ZIP_MAGIC))
    return "a ZIP archive (such as an .xlsx workbook)";
  if (startsWith(buffer, [0x89, 0x50, 0x4e, 0x47])) return "a PNG image";
  if (startsWith(buffer, [0xff, 0xd8, 0xff])) return "a JPEG image";
  return null;
}

function extensionOf(filename: string): string {
  const m = /\.([A-Za-z0-9]+)$/.exec(filename.trim());
  return m ? m[1]!.toLowerCase() : "";
}

const ACCEPTED = "Upload a .csv (comma, semicolon or tab separated, UTF-8) or an .xlsx workbook.";

function detectKind(buffer: Buffer, filename: string, mimeType?: string): "csv" | "xlsx" {
  const ext = extensionOf(filename);
  if (ext === "csv" || ext === "tsv") return "csv";
  if (ext === "xlsx") return "xlsx";
  if (ext === "") {
    const mime = (mimeType ?? "").split(";")[0]!.trim().toLowerCase();
    if (mime === XLSX_MIME) return "xlsx";
    if (CSV_MIMES.has(mime)) return "csv";
  }
  const looks = sniff(buffer);
  const what =
    ext === "xls"
      ? "an old-format Excel workbook (.xls); save it as .xlsx or CSV UTF-8"
      : ext === "xlsm" || ext === "xlsb"
        ? `a .${ext} workbook; save it as .xlsx (without macros) or CSV UTF-8`
        : ext === "ods"
          ? "an OpenDocument spreadsheet; save it as .xlsx or CSV UTF-8"
          : ext !== ""
            ? `a .${ext} file${looks ? ` (it looks like ${looks})` : ""}`
            : `a file without an extension${looks ? ` (it looks like ${looks})` : ""}`;
  throw new ImportFileError("unsupported_type", `"${filename}" is ${what}. ${ACCEPTED}`, {
    extension: ext,
    mimeType: mimeType ?? "",
  });
}

// ---------------------------------------------------------------------------------------------------------
// CSV.

const BOM = [0xef, 0xbb, 0xbf];

/** Offset of the first byte that breaks UTF-8 (RFC 3629), or -1. Only called once the fast check failed. */
function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i]!;
    let need = 0;
    let min = 0;
    if (b < 0x80) {
      i++;
      continue;
    } else if (b >= 0xc2 && b <= 0xdf) {
      need = 1;
      min = 0x80;
    } else if (b >= 0xe0 && b <= 0xef) {
      need = 2;
      min = 0x800;
    } else if (b >= 0xf0 && b <= 0xf4) {
      need = 3;
      min = 0x10000;
    } else return i;
    let cp = b & (0x3f >> need);
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      if (c === undefined || (c & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (c & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += need + 1;
  }
  return -1;
}

function lineOf(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

function decodeCsv(buffer: Buffer, filename: string): string {
  if (startsWith(buffer, [0xff, 0xfe]) || startsWith(buffer, [0xfe, 0xff])) {
    throw new ImportFileError(
      "not_utf8",
      `"${filename}" is UTF-16 text (it starts with a UTF-16 byte-order mark), not UTF-8. Save it as "CSV UTF-8" and upload it again.`,
      { encoding: "UTF-16" },
    );
  }
  const looks = sniff(buffer);
  if (looks) {
    throw new ImportFileError(
      "not_text",
      `"${filename}" is named like a CSV file but looks like ${looks}, not text. ${ACCEPTED}`,
    );
  }
  const sample = buffer.subarray(0, Math.min(buffer.length, 64 * 1024));
  let nul = 0;
  let nulEven = 0;
  for (let i = 0; i < sample.length; i++) {
    if (sample[i] === 0) {
      nul++;
      if (i % 2 === 0) nulEven++;
    }
  }
  if (nul > 0) {
    // UTF-16 without a mark puts a zero byte beside every ASCII letter: on one side only.
    const oneSided = nul > sample.length / 4 && (nulEven / nul > 0.9 || nulEven / nul < 0.1);
    if (oneSided) {
      throw new ImportFileError(
        "not_utf8",
        `"${filename}" looks like UTF-16 text, not UTF-8. Save it as "CSV UTF-8" and upload it again.`,
        { encoding: "UTF-16" },
      );
    }
    throw new ImportFileError(
      "not_text",
      `"${filename}" contains binary data (zero bytes), so it is not a CSV text file. ${ACCEPTED}`,
    );
  }
  const body = startsWith(buffer, BOM) ? buffer.subarray(3) : buffer;
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(body);
  } catch {
    const at = firstInvalidUtf8(body);
    const byte = body[at] ?? 0;
    const hint = byte >= 0x80 ? ' It was probably saved as Latin-1 or Windows-1252 ("ANSI").' : "";
    throw new ImportFileError(
      "not_utf8",
      `"${filename}" is not UTF-8 text: byte 0x${byte.toString(16).toUpperCase().padStart(2, "0")} on line ${lineOf(body, at)} is not valid UTF-8.${hint} Save it as "CSV UTF-8" and upload it again.`,
      { offset: at + (body === buffer ? 0 : 3), line: lineOf(body, at) },
    );
  }
}

/** Counts each candidate outside quotes in the first non-blank line; the most frequent wins (ties: , then ;). */
export function detectDelimiter(text: string): Delimiter {
  const lines = text.split(/\r\n|\n|\r/);
  const first = lines.find((l) => l.trim() !== "") ?? "";
  const counts: Record<Delimiter, number> = { ",": 0, ";": 0, "\t": 0 };
  let quoted = false;
  for (const ch of first) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === "," || ch === ";" || ch === "\t")) counts[ch]++;
  }
  let best: Delimiter = ",";
  for (const d of [";", "\t"] as const) if (counts[d] > counts[best]) best = d;
  return best;
}

/** Undoes the spreadsheet-formula guard our CSV export adds ("'=…" → "=…"). */
function unguard(cell: string): string {
  return cell.length > 1 && cell[0] === "'" && "=+-@\t\r".includes(cell[1]!) ? cell.slice(1) : cell;
}

function readCsv(buffer: Buffer, filename: string): ImportTable {
  let text = decodeCsv(buffer, filename);
  if (text.trim() === "") {
    throw new ImportFileError("empty_file", `"${filename}" is empty: it holds only blank lines or spaces.`);
  }
  let delimiter: Delimiter;
  const sep = /^sep=(.)\r?\n/i.exec(text);
  const warnings: ImportIssue[] = [];
  if (sep && (sep[1] === "," || sep[1] === ";" || sep[1] === "\t")) {
    // A spreadsheet hint line; spreadsheet programs hide it, so the next line is row 1.
    delimiter = sep[1];
    text = text.slice(sep[0].length);
  } else {
    delimiter = detectDelimiter(text);
  }
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false, header: false });
  const quoteError = parsed.errors.find((e) => e.code === "MissingQuotes");
  if (quoteError) {
    const row = (quoteError.row ?? 0) + 1;
    throw new ImportFileError(
      "unreadable",
      `"${filename}" cannot be read: a quoted value that starts on row ${row} is never closed, so the rest of the file would run into it. Check that row for a stray " character.`,
      { row },
    );
  }
  const records = parsed.data.map((cells, i): TableRow => ({ rowNumber: i + 1, cells: cells.map(unguard) }));
  return finishTable(records, { filename, format: "csv", delimiter, sheetName: null, warnings });
}

// ---------------------------------------------------------------------------------------------------------
// Common: blank rows, header row, limits.

function isBlankRow(cells: readonly string[]): boolean {
  return cells.every((c) => c.trim() === "");
}

/** A header cell never looks like a quantity; a data row of a run list always has one. */
const DATA_LIKE = /^[-+]?\d+(?:[.,]\d+)?\s*(?:mm|cm|m|in|ft|a|ma|v|awg|mm²|mm2|"|')?$/i;

/** Blank unless a cell has text or a formula note (a formula without a result is not an empty cell). */
function isBlankRecord(r: TableRow): boolean {
  return isBlankRow(r.cells) && !(r.notes ?? []).some((n) => n.kind !== "merged");
}

function trimmedHeaders(row: TableRow): string[] {
  const headers = row.cells.map((c) => c.trim());
  while (headers.length > 0 && headers[headers.length - 1] === "") headers.pop();
  return headers;
}

/** Title rows above the header ("Harrow-3 run list, rev B") name no field; look a few rows further. */
const HEADER_SEARCH_ROWS = 5;

function finishTable(
  records: TableRow[],
  meta: Pick<ImportTable, "filename" | "format" | "delimiter" | "sheetName" | "warnings">,
): ImportTable {
  let nonBlank = records.filter((r) => !isBlankRecord(r));
  if (nonBlank.length === 0) {
    throw new ImportFileError("empty_file", `"${meta.filename}" is empty: it holds only blank rows.`);
  }
  if (countMatchedHeaders(trimmedHeaders(nonBlank[0]!)) === 0) {
    const later = nonBlank
      .slice(1, HEADER_SEARCH_ROWS)
      .findIndex((r) => countMatchedHeaders(trimmedHeaders(r)) >= 3);
    if (later >= 0) {
      const skipped = nonBlank.slice(0, later + 1).map((r) => r.rowNumber);
      meta.warnings.push({
        severity: "warning",
        code: "rows_above_header",
        row: null,
        column: null,
        field: null,
        message: `Took row ${nonBlank[later + 1]!.rowNumber} as the header row; ${skipped.length === 1 ? `row ${skipped[0]} above it names` : `rows ${skipped.join(", ")} above it name`} no run field and ${skipped.length === 1 ? "is" : "are"} not imported.`,
        value: null,
        rows: skipped,
      });
      nonBlank = nonBlank.slice(later + 1);
    }
  }
  const headerRow = nonBlank[0]!;
  const headers = trimmedHeaders(headerRow);
  const dataLike = headers.filter((h) => DATA_LIKE.test(h));
  if (dataLike.length > 0 && countMatchedHeaders(headers) === 0) {
    throw new ImportFileError(
      "no_header_row",
      `"${meta.filename}" has no header row: row ${headerRow.rowNumber} holds data (such as "${dataLike[0]}") instead of column names. Add a first row naming the columns, e.g. wireId, endA, endB, gauge, colour, routedLengthMm.`,
      { row: headerRow.rowNumber },
    );
  }
  const rows = nonBlank.slice(1);
  if (rows.length === 0) {
    throw new ImportFileError(
      "no_data_rows",
      `"${meta.filename}" has a header row (row ${headerRow.rowNumber}) but no runs below it.`,
      { row: headerRow.rowNumber },
    );
  }
  if (rows.length > MAX_DATA_ROWS) tooManyRows(meta.filename, rows.length);
  const blankRowsSkipped =
    records.filter((r) => r.rowNumber > headerRow.rowNumber && isBlankRecord(r)).length -
    countTrailingBlank(records);
  return { ...meta, headerRowNumber: headerRow.rowNumber, headers, rows, blankRowsSkipped };
}

/** Blank lines at the very end (a trailing newline) are not worth reporting. */
function countTrailingBlank(records: readonly TableRow[]): number {
  let n = 0;
  for (let i = records.length - 1; i >= 0 && isBlankRecord(records[i]!); i--) n++;
  return n;
}

function tooManyRows(filename: string, count: number): never {
  throw new ImportFileError(
    "too_many_rows",
    `"${filename}" has ${count > MAX_DATA_ROWS + 1 ? count : "more than " + MAX_DATA_ROWS} data rows; the limit is ${MAX_DATA_ROWS}. Split the run list into smaller files.`,
    { limitRows: MAX_DATA_ROWS },
  );
}

// ---------------------------------------------------------------------------------------------------------
// XLSX.

/** Sums the unpacked sizes in a ZIP's central directory (APPNOTE.TXT §4.3.12, §4.3.16) without unpacking. */
export function zipUnpackedBytes(buffer: Buffer): { entries: number; bytes: number; names: string[] } | null {
  const minEocd = 22;
  const start = Math.max(0, buffer.length - minEocd - 0xffff);
  let eocd = -1;
  for (let i = buffer.length - minEocd; i >= start; i--) {
    if (buffer.readUInt32LE(i) === 0x06054b50) {
      eocd = i;
      break;
    }
  }
  if (eocd < 0) return null;
  const entries = buffer.readUInt16LE(eocd + 10);
  let p = buffer.readUInt32LE(eocd + 16);
  let bytes = 0;
  const names: string[] = [];
  for (let n = 0; n < entries; n++) {
    if (p + 46 > buffer.length || buffer.readUInt32LE(p) !== 0x02014b50) return null;
    const size = buffer.readUInt32LE(p + 24);
    const nameLen = buffer.readUInt16LE(p + 28);
    const extraLen = buffer.readUInt16LE(p + 30);
    const commentLen = buffer.readUInt16LE(p + 32);
    // 0xFFFFFFFF means the real size is in a ZIP64 record: far beyond anything we accept.
    bytes += size === 0xffffffff ? Number.MAX_SAFE_INTEGER / 2 : size;
    names.push(buffer.toString("utf8", p + 46, p + 46 + nameLen));
    p += 46 + nameLen + extraLen + commentLen;
  }
  return { entries, bytes, names };
}

function unreadableXlsx(filename: string, why: string): ImportFileError {
  return new ImportFileError(
    "unreadable",
    `"${filename}" cannot be read as an .xlsx workbook: ${why}. ${ACCEPTED}`,
  );
}

async function loadWorkbook(buffer: Buffer, filename: string): Promise<ExcelJS.Workbook> {
  if (!startsWith(buffer, ZIP_MAGIC) && !startsWith(buffer, EMPTY_ZIP_MAGIC)) {
    const looks = sniff(buffer);
    throw unreadableXlsx(filename, looks ? `it looks like ${looks}` : "it is not a ZIP-based Excel file");
  }
  const zip = zipUnpackedBytes(buffer);
  if (!zip) throw unreadableXlsx(filename, "the ZIP archive inside it is damaged or cut short");
  if (zip.bytes > MAX_XLSX_UNPACKED_BYTES) {
    throw new ImportFileError(
      "too_large",
      `"${filename}" would unpack to more than ${MAX_XLSX_UNPACKED_BYTES / 1024 / 1024} MB; the limit keeps the server safe. Save only the run list in its own workbook.`,
      { unpackedBytes: zip.bytes, limitBytes: MAX_XLSX_UNPACKED_BYTES },
    );
  }
  if (!zip.names.includes("xl/workbook.xml")) {
    const ods = zip.names.includes("content.xml");
    throw unreadableXlsx(
      filename,
      ods ? "it is an OpenDocument spreadsheet; save it as .xlsx" : "the archive holds no Excel workbook",
    );
  }
  const wb = new ExcelJS.Workbook();
  try {
    await wb.xlsx.load(buffer as unknown as ArrayBuffer);
  } catch (e) {
    throw unreadableXlsx(
      filename,
      `the workbook is damaged (${e instanceof Error ? e.message.slice(0, 120) : "unknown error"})`,
    );
  }
  return wb;
}

interface CellText {
  text: string;
  note: Omit<CellNote, "column"> | null;
}

function isoDate(d: Date): string {
  const iso = d.toISOString();
  return iso.endsWith("T00:00:00.000Z") ? iso.slice(0, 10) : iso.slice(0, 19).replace("T", " ");
}

function numberText(n: number, numFmt: string | undefined): string {
  // A cell formatted as a percentage holds 0.03 and shows "3%"; keep what the user sees.
  if (numFmt && /%/.test(numFmt.replace(/"[^"]*"/g, ""))) return `${Number((n * 100).toPrecision(12))}%`;
  return String(n);
}

function scalarText(v: unknown, numFmt: string | undefined): string {
  if (v === null || v === undefined) return "";
  if (typeof v === "number") return numberText(v, numFmt);
  if (typeof v === "string") return v;
  if (typeof v === "boolean") return v ? "TRUE" : "FALSE";
  if (v instanceof Date) return isoDate(v);
  return "";
}

function richText(v: ExcelJS.CellRichTextValue): string {
  return v.richText.map((r) => r.text).join("");
}

/** The text a user sees in a cell, plus a note for formulas without a saved result or with an error. */
function cellText(cell: ExcelJS.Cell): CellText {
  const v = cell.value;
  if (v === null || v === undefined) return { text: "", note: null };
  if (typeof v !== "object" || v instanceof Date) return { text: scalarText(v, cell.numFmt), note: null };
  if ("richText" in v) return { text: richText(v), note: null };
  if ("hyperlink" in v) {
    const t = v.text as unknown;
    return {
      text:
        typeof t === "string"
          ? t
          : t && typeof t === "object" && "richText" in t
            ? richText(t as ExcelJS.CellRichTextValue)
            : "",
      note: null,
    };
  }
  if ("formula" in v || "sharedFormula" in v) {
    const f = "formula" in v && v.formula ? v.formula : cell.formula;
    const result = v.result;
    if (result === undefined || result === null) {
      return {
        text: "",
        note: { kind: "formula_no_value", detail: `the formula "=${f}" has no saved result` },
      };
    }
    if (typeof result === "object" && !(result instanceof Date) && "error" in result) {
      return {
        text: "",
        note: { kind: "formula_error", detail: `the formula "=${f}" gives the error ${result.error}` },
      };
    }
    return { text: scalarText(result, cell.numFmt), note: null };
  }
  if ("error" in v)
    return { text: "", note: { kind: "formula_error", detail: `the cell holds the error ${v.error}` } };
  return { text: "", note: null };
}

interface SheetRows {
  records: TableRow[];
  merged: number;
}

function readSheetRows(ws: ExcelJS.Worksheet, limit: number, filename: string): SheetRows {
  const records: TableRow[] = [];
  let merged = 0;
  let nonBlank = 0;
  ws.eachRow({ includeEmpty: false }, (row) => {
    const cells: string[] = [];
    const notes: CellNote[] = [];
    row.eachCell({ includeEmpty: false }, (cell, colNumber) => {
      const column = colNumber - 1;
      while (cells.length < column) cells.push("");
      if (cell.isMerged && cell.master.address !== cell.address) {
        // exceljs hands every cell of a merge the top-left value; only the top-left cell really holds it.
        merged++;
        cells.push("");
        notes.push({ column, kind: "merged", detail: `merged into ${cell.master.address}` });
        return;
      }
      const t = cellText(cell);
      cells.push(t.text);
      if (t.note) notes.push({ column, ...t.note });
    });
    const rec: TableRow = { rowNumber: row.number, cells };
    if (notes.length > 0) rec.notes = notes;
    records.push(rec);
    if (!isBlankRecord(rec)) nonBlank++;
    // Header plus the row limit: stop early rather than read a huge sheet to the end.
    if (nonBlank > limit + 1) tooManyRows(filename, nonBlank - 1);
  });
  return { records, merged };
}

function firstRowHeaders(ws: ExcelJS.Worksheet): string[] {
  let headers: string[] = [];
  let found = false;
  ws.eachRow({ includeEmpty: false }, (row) => {
    if (found) return;
    const cells: string[] = [];
    row.eachCell({ includeEmpty: false }, (cell, colNumber) => {
      while (cells.length < colNumber - 1) cells.push("");
      cells.push(cellText(cell).text);
    });
    if (!isBlankRow(cells)) {
      headers = cells;
      found = true;
    }
  });
  return headers;
}

async function readXlsx(buffer: Buffer, filename: string): Promise<ImportTable> {
  const wb = await loadWorkbook(buffer, filename);
  const sheets = wb.worksheets.filter((ws) => ws.actualRowCount > 0);
  if (sheets.length === 0) {
    throw new ImportFileError("empty_file", `"${filename}" is empty: none of its worksheets has any cells.`);
  }
  // The run list is the sheet whose first row names the most run fields; then the one with most rows; then the first.
  let best = sheets[0]!;
  let bestScore = -1;
  let bestRows = -1;
  for (const ws of sheets) {
    const score = countMatchedHeaders(firstRowHeaders(ws));
    const rows = ws.actualRowCount;
    if (score > bestScore || (score === bestScore && rows > bestRows)) {
      best = ws;
      bestScore = score;
      bestRows = rows;
    }
  }
  const warnings: ImportIssue[] = [];
  if (wb.worksheets.length > 1) {
    const others = wb.worksheets.filter((ws) => ws !== best).map((ws) => `"${ws.name}"`);
    warnings.push({
      severity: "warning",
      code: "sheet_chosen",
      row: null,
      column: null,
      field: null,
      message: `Read the worksheet "${best.name}", whose header row names the most run fields; ignored ${others.join(", ")}.`,
      value: null,
    });
  }
  const { records, merged } = readSheetRows(best, MAX_DATA_ROWS, filename);
  if (merged > 0) {
    warnings.push({
      severity: "warning",
      code: "merged_cells",
      row: null,
      column: null,
      field: null,
      message: `The worksheet has merged cells: each merged value is read from its top-left cell only, and the other ${merged} merged cell${merged === 1 ? " is" : "s are"} read as blank. Unmerge them and fill in every row.`,
      value: null,
    });
  }
  return finishTable(records, { filename, format: "xlsx", delimiter: null, sheetName: best.name, warnings });
}
