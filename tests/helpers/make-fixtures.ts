// Builds the malformed-upload corpus under tests/fixtures/imports/ and its manifest; same bytes on every run.
// Run: npx tsx tests/helpers/make-fixtures.ts

import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import ExcelJS from "exceljs";
import type { RunData } from "@/lib/domain/types";
import type { ImportFileErrorCode } from "@/lib/import/types";
import { mulberry32 } from "./generate-runs-csv";

export interface ExpectedIssue {
  code: string;
  row: number | null;
  column: string | null;
  field?: string | null;
  /** A fragment the message must contain. */
  message: string;
  rows?: number[];
}

export interface ManifestEntry {
  file: string;
  description: string;
  mimeType?: string;
  /** readTable refuses the file with this code and HTTP status; nothing can be committed. */
  readError?: { code: ImportFileErrorCode; status: 413 | 422; message: string };
  /** The exact set of errors in the preview (file-level and row-level together). */
  errors?: ExpectedIssue[];
  /** When present, the exact set of warnings in the preview. */
  warnings?: ExpectedIssue[];
  canCommit?: boolean;
  rowCount?: number;
  /** Spot checks on parsed values of complete rows: (spreadsheet row, field) → value. */
  values?: { row: number; field: keyof RunData; value: unknown }[];
  /** Runs already in the project, for entries that check the diff. */
  existing?: RunData[];
  diff?: {
    added: number;
    unchanged: number;
    changed: { wireId: string; fields: string[] }[];
    missing: string[];
  };
}

export interface Manifest {
  description: string;
  settings: "DEFAULT_PROJECT_SETTINGS";
  entries: ManifestEntry[];
}

export const FIXTURE_DIR = path.join(path.dirname(fileURLToPath(import.meta.url)), "../fixtures/imports");

// ---------------------------------------------------------------------------------------------------------
// A small valid run list of the Harrow-3 mower (our own demo data) to start each file from.

const HEADERS = [
  "Wire ID",
  "From",
  "To",
  "Gauge",
  "Colour",
  "Length (mm)",
  "Current (A)",
  "Fuse (A)",
  "Notes",
];
const ROWS: string[][] = [
  ["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", "350", "80", "100", "pack to main fuse"],
  ["HR3-002", "F1:2", "K1:1", "4 AWG", "RD", "420", "80", "", ""],
  ["HR3-003", "K1:2", "MC1:1", "8 AWG", "RD", "1250", "35", "40", "left drive feed"],
  ["HR3-004", "MC1:2", "GND1:1", "8 AWG", "BK", "1300", "35", "", ""],
  ["HR3-005", "FB1:3", "LID1:1", "18 AWG", "BU", "2100", "1.2", "3", "lidar feed"],
  ["HR3-006", "LID1:2", "GND1:2", "18 AWG", "BK", "2150", "1.2", "", ""],
];

function csvCell(s: string, delimiter = ","): string {
  return s.includes(delimiter) || /["\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

function csv(rows: readonly (readonly string[])[], delimiter = ","): string {
  return rows.map((r) => r.map((c) => csvCell(c, delimiter)).join(delimiter)).join("\r\n") + "\r\n";
}

function withCell(rows: string[][], rowIndex: number, header: string, value: string): string[][] {
  const col = HEADERS.indexOf(header);
  return rows.map((r, i) => (i === rowIndex ? r.map((c, j) => (j === col ? value : c)) : [...r]));
}

function dropColumns(headers: string[], rows: string[][], names: string[]): string[][] {
  const keep = headers.map((h, i) => (names.includes(h) ? -1 : i)).filter((i) => i >= 0);
  return [headers, ...rows].map((r) => keep.map((i) => r[i] ?? ""));
}

function latin1(text: string): Buffer {
  return Buffer.from(text, "latin1");
}

function utf16le(text: string, bom: boolean): Buffer {
  const body = Buffer.from(text, "utf16le");
  return bom ? Buffer.concat([Buffer.from([0xff, 0xfe]), body]) : body;
}

function utf16be(text: string): Buffer {
  const le = Buffer.from(text, "utf16le");
  const be = Buffer.alloc(le.length);
  for (let i = 0; i < le.length; i += 2) {
    be[i] = le[i + 1]!;
    be[i + 1] = le[i]!;
  }
  return Buffer.concat([Buffer.from([0xfe, 0xff]), be]);
}

// ---------------------------------------------------------------------------------------------------------
// Deterministic ZIP and XLSX output.

const CRC_TABLE = (() => {
  const t = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    t[n] = c >>> 0;
  }
  return t;
})();

function crc32(buf: Buffer): number {
  let c = 0xffffffff;
  for (const b of buf) c = CRC_TABLE[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

/** A stored (uncompressed) ZIP per APPNOTE.TXT, with a fixed 1980-01-01 timestamp. */
export function storedZip(files: { name: string; data: Buffer }[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const f of files) {
    const name = Buffer.from(f.name, "utf8");
    const crc = crc32(f.data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(0, 6);
    local.writeUInt16LE(0, 8);
    local.writeUInt16LE(0, 10);
    local.writeUInt16LE(0x21, 12);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(f.data.length, 18);
    local.writeUInt32LE(f.data.length, 22);
    local.writeUInt16LE(name.length, 26);
    local.writeUInt16LE(0, 28);
    locals.push(local, name, f.data);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(0, 8);
    central.writeUInt16LE(0, 10);
    central.writeUInt16LE(0, 12);
    central.writeUInt16LE(0x21, 14);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(f.data.length, 20);
    central.writeUInt32LE(f.data.length, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    centrals.push(central, name);
    offset += 30 + name.length + f.data.length;
  }
  const cd = Buffer.concat(centrals);
  const eocd = Buffer.alloc(22);
  eocd.writeUInt32LE(0x06054b50, 0);
  eocd.writeUInt16LE(files.length, 8);
  eocd.writeUInt16LE(files.length, 10);
  eocd.writeUInt32LE(cd.length, 12);
  eocd.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, cd, eocd]);
}

const FIXED_TIME = Date.UTC(2026, 0, 1);

/** The ZIP writer inside exceljs stamps entries with `new Date()`; pin the clock so the bytes repeat. */
async function withFixedClock<T>(fn: () => Promise<T>): Promise<T> {
  const RealDate = Date;
  class FixedDate extends RealDate {
    constructor(...args: unknown[]) {
      if (args.length === 0) super(FIXED_TIME);
      else super(...(args as [string | number]));
    }
    static override now(): number {
      return FIXED_TIME;
    }
  }
  globalThis.Date = FixedDate as DateConstructor;
  try {
    return await fn();
  } finally {
    globalThis.Date = RealDate;
  }
}

async function xlsx(build: (wb: ExcelJS.Workbook) => void): Promise<Buffer> {
  return withFixedClock(async () => {
    const wb = new ExcelJS.Workbook();
    wb.creator = "Loomwright fixtures";
    wb.created = new Date(FIXED_TIME);
    wb.modified = new Date(FIXED_TIME);
    build(wb);
    return Buffer.from((await wb.xlsx.writeBuffer()) as ArrayBuffer);
  });
}

function sheetWithBase(wb: ExcelJS.Workbook, name = "Runs"): ExcelJS.Worksheet {
  const ws = wb.addWorksheet(name);
  ws.addRow(HEADERS);
  for (const r of ROWS)
    ws.addRow(r.map((c, i) => (c !== "" && i >= 5 && i <= 7 ? Number(c) : c === "" ? null : c)));
  return ws;
}

// ---------------------------------------------------------------------------------------------------------
// The corpus.

const e = (
  code: string,
  row: number | null,
  column: string | null,
  message: string,
  extra: Partial<ExpectedIssue> = {},
): ExpectedIssue => ({ code, row, column, message, ...extra });

export async function buildFixtures(): Promise<{ files: Record<string, Buffer>; manifest: Manifest }> {
  const files: Record<string, Buffer> = {};
  const entries: ManifestEntry[] = [];
  const add = (file: string, data: Buffer | string, entry: Omit<ManifestEntry, "file">) => {
    files[file] = typeof data === "string" ? Buffer.from(data, "utf8") : data;
    entries.push({ file, ...entry });
  };
  const base = [HEADERS, ...ROWS];

  // --- encodings -------------------------------------------------------------------------------------
  add("latin1.csv", latin1(csv([HEADERS, ...withCell(ROWS, 2, "Notes", "Führung über Rahmen")])), {
    description: "Saved as ISO/IEC 8859-1 (Latin-1): ü is the single byte 0xFC, which is not UTF-8",
    readError: { code: "not_utf8", status: 422, message: "byte 0xFC on line 4" },
  });
  add(
    "windows-1252.csv",
    Buffer.concat([
      Buffer.from(csv([HEADERS, ROWS[0]!]), "latin1"),
      Buffer.from("HR3-002,F1:2,K1:1,4 AWG,RD,420,80,,\x93main\x94 feed\r\n", "latin1"),
    ]),
    {
      description: "Windows-1252 curly quotes (0x93, 0x94) in a note",
      readError: { code: "not_utf8", status: 422, message: "byte 0x93 on line 3" },
    },
  );
  add("utf16le-bom.csv", utf16le(csv(base), true), {
    description: "UTF-16 little-endian with a byte-order mark (a spreadsheet's 'Unicode text')",
    readError: { code: "not_utf8", status: 422, message: "UTF-16" },
  });
  add("utf16be-bom.csv", utf16be(csv(base)), {
    description: "UTF-16 big-endian with a byte-order mark",
    readError: { code: "not_utf8", status: 422, message: "UTF-16" },
  });
  add("utf16le-no-bom.csv", utf16le(csv(base), false), {
    description: "UTF-16 little-endian without a byte-order mark",
    readError: { code: "not_utf8", status: 422, message: "looks like UTF-16" },
  });
  add("utf8-bom.csv", Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(csv(base))]), {
    description: "UTF-8 with a byte-order mark: valid, the mark must not stick to the first header",
    errors: [],
    canCommit: true,
    rowCount: 6,
    values: [
      { row: 2, field: "wireId", value: "HR3-001" },
      { row: 4, field: "routedLengthMm", value: 1250 },
    ],
  });

  // --- not a CSV or XLSX at all ------------------------------------------------------------------------
  const rnd = mulberry32(2026);
  const junk = Buffer.alloc(4096);
  for (let i = 0; i < junk.length; i++) junk[i] = Math.floor(rnd() * 256);
  junk[0] = 0x13; // never a known file signature
  add("binary-junk.csv", junk, {
    description: "4 KiB of random bytes named .csv",
    readError: { code: "not_text", status: 422, message: "binary data" },
  });
  add("notes.txt", "Harrow-3 wiring notes\r\nremember the deck guard\r\n", {
    description: "A plain .txt file",
    readError: { code: "unsupported_type", status: 422, message: "is a .txt file" },
  });
  add(
    "drawing.pdf",
    "%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n",
    {
      description: "A PDF document",
      readError: { code: "unsupported_type", status: 422, message: "looks like a PDF document" },
    },
  );
  add(
    "legacy.xls",
    Buffer.concat([Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]), Buffer.alloc(504)]),
    {
      description: "An old-format .xls workbook (OLE compound file signature)",
      readError: { code: "unsupported_type", status: 422, message: "old-format Excel workbook (.xls)" },
    },
  );
  add("no-extension", csv(base), {
    description: "CSV text without an extension, sent as text/csv: accepted by its MIME type",
    mimeType: "text/csv",
    errors: [],
    canCommit: true,
    rowCount: 6,
  });

  // --- empty, headerless -------------------------------------------------------------------------------
  add("empty.csv", Buffer.alloc(0), {
    description: "Zero bytes",
    readError: { code: "empty_file", status: 422, message: "no bytes at all" },
  });
  add("blank-lines-only.csv", "\r\n\r\n   \r\n,,,\r\n", {
    description: "Only blank lines, spaces and delimiters",
    readError: { code: "empty_file", status: 422, message: "only blank" },
  });
  add("header-only.csv", csv([HEADERS]), {
    description: "A header row and nothing else",
    readError: { code: "no_data_rows", status: 422, message: "no runs below it" },
  });
  add("no-header.csv", csv(ROWS), {
    description: "Data rows without a header row",
    readError: { code: "no_header_row", status: 422, message: "row 1 holds data" },
  });

  // --- valid variants ------------------------------------------------------------------------------------
  const order = [5, 0, 8, 2, 4, 1, 7, 3, 6];
  add("shuffled-headers.csv", csv(base.map((r) => order.map((i) => r[i]!))), {
    description: "Valid: the same columns in another order",
    errors: [],
    warnings: [],
    canCommit: true,
    rowCount: 6,
    values: [
      { row: 2, field: "endA", value: "BAT1:+" },
      { row: 4, field: "routedLengthMm", value: 1250 },
      { row: 6, field: "currentA", value: 1.2 },
    ],
  });
  add(
    "canonical-headers.csv",
    csv([
      [
        "wireId",
        "endA",
        "endB",
        "gauge",
        "colour",
        "routedLengthMm",
        "cutLengthMm",
        "currentA",
        "fuseA",
        "endATermination",
        "endAStripMm",
      ],
      ["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", "350", "999", "80", "100", "lug", "16"],
      ["HR3-002", "F1:2", "K1:1", "4 AWG", "RD", "420", "999", "80", "", "ring", "8"],
    ]),
    {
      description: "Valid: PRODUCT.md §6 field names, with the computed cutLengthMm column ignored",
      errors: [],
      warnings: [],
      canCommit: true,
      rowCount: 2,
      values: [
        { row: 2, field: "endATermination", value: "lug" },
        { row: 2, field: "endAStripMm", value: 16 },
      ],
    },
  );
  add(
    "semicolon-decimal-comma.csv",
    csv(
      [
        ["Wire ID", "From", "To", "Gauge", "Colour", "Length [m]", "Current (A)"],
        ["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", "0,35", "80"],
        ["HR3-002", "F1:2", "K1:1", "0,75 mm²", "RD", "1,25", "7,5"],
      ],
      ";",
    ),
    {
      description: "Valid: semicolon-delimited with decimal commas and a length column in metres",
      errors: [],
      canCommit: true,
      rowCount: 2,
      values: [
        { row: 3, field: "routedLengthMm", value: 1250 },
        { row: 3, field: "gauge", value: "0.75 mm²" },
        { row: 3, field: "currentA", value: 7.5 },
      ],
    },
  );
  add("tab-delimited.tsv", csv(base, "\t"), {
    description: "Valid: tab-delimited",
    errors: [],
    canCommit: true,
    rowCount: 6,
    values: [{ row: 7, field: "routedLengthMm", value: 2150 }],
  });
  add("excel-sep-line.csv", `sep=;\r\n${csv(base, ";")}`, {
    description: "Valid: a 'sep=;' hint line, which spreadsheet programs hide, so the header is still row 1",
    errors: [],
    canCommit: true,
    rowCount: 6,
    values: [{ row: 2, field: "wireId", value: "HR3-001" }],
  });
  add(
    "mixed-length-units.csv",
    csv([
      ["Wire ID", "From", "To", "AWG", "Color", "Length", "Amps"],
      ["HR3-001", "MC1:3", "DM1:1", "8", "red", "4' 1\"", "35"],
      ["HR3-002", "MC1:4", "DM1:2", "8", "black", "49.2 in", "35"],
      ["HR3-003", "MC1:5", "DM1:3", "8", "white/blue", "1.25 m", "35"],
      ["HR3-004", "ECU1:7", "LED1:1", "22", "GN/YE", "4 ft 1 in", "20 mA"],
    ]),
    {
      description:
        "Valid: lengths in feet and inches, inches, metres; AWG column of bare numbers; colour names",
      errors: [],
      canCommit: true,
      rowCount: 4,
      values: [
        { row: 2, field: "routedLengthMm", value: 1245 },
        { row: 3, field: "routedLengthMm", value: 1250 },
        { row: 4, field: "colour", value: "WHBU" },
        { row: 5, field: "gauge", value: "22 AWG" },
        { row: 5, field: "currentA", value: 0.02 },
      ],
    },
  );
  add("title-row.csv", csv([["Harrow-3 main harness, run list rev B"], [], HEADERS, ...ROWS]), {
    description: "A title line and a blank line above the header row",
    errors: [],
    warnings: [e("rows_above_header", null, null, "Took row 3 as the header row", { rows: [1] })],
    canCommit: true,
    rowCount: 6,
    values: [{ row: 4, field: "wireId", value: "HR3-001" }],
  });
  add("quoted-newlines.csv", csv([HEADERS, ...withCell(ROWS, 1, "Notes", 'feed via "K1"\nsee note 4')]), {
    description: "Valid: a quoted note that spans two lines and contains quotes",
    errors: [],
    canCommit: true,
    rowCount: 6,
    values: [
      { row: 3, field: "notes", value: 'feed via "K1"\nsee note 4' },
      { row: 4, field: "wireId", value: "HR3-003" },
    ],
  });

  // --- structure errors ---------------------------------------------------------------------------------
  add(
    "blank-lines.csv",
    csv([
      HEADERS,
      ROWS[0]!,
      [],
      ROWS[1]!,
      ROWS[2]!,
      ["", "", ""],
      withCell(ROWS, 3, "Colour", "mauve")[3]!,
      ROWS[4]!,
    ]),
    {
      description: "Blank lines inside the data are skipped; row numbers stay those a spreadsheet shows",
      errors: [e("invalid_value", 7, "Colour", '"mauve" is not an IEC 60757 code')],
      canCommit: false,
      rowCount: 5,
    },
  );
  add("missing-required-column.csv", csv(dropColumns(HEADERS, ROWS, ["Gauge"])), {
    description: "No gauge column",
    errors: [e("missing_column", null, null, "No column holds gauge", { field: "gauge" })],
    canCommit: false,
  });
  add("missing-ends.csv", csv(dropColumns(HEADERS, ROWS, ["From", "To"])), {
    description: "No end A or end B column",
    errors: [
      e("missing_column", null, null, "No column holds end A", { field: "endA" }),
      e("missing_column", null, null, "No column holds end B", { field: "endB" }),
    ],
    canCommit: false,
  });
  add("column-mapped-twice.csv", csv([[...HEADERS, "Color"], ...ROWS.map((r) => [...r, r[4]!])]), {
    description: "Both 'Colour' and 'Color' columns: one field mapped twice",
    errors: [
      e(
        "column_mapped_twice",
        null,
        "Color",
        'columns "Colour" (E) and "Color" (J) are both mapped to colour',
      ),
    ],
    canCommit: false,
  });
  add("duplicate-wire-ids.csv", csv([HEADERS, ...withCell(ROWS, 4, "Wire ID", "hr3-002")]), {
    description: "The same wire ID on two rows (case differs)",
    errors: [
      e("duplicate_wire_id", null, "Wire ID", 'The wire ID "HR3-002" appears on rows 3, 6', { rows: [3, 6] }),
      e("duplicate_wire_id", 3, "Wire ID", "is also on row 6"),
      e("duplicate_wire_id", 6, "Wire ID", "is also on row 3"),
    ],
    canCommit: false,
  });
  add("ragged-rows.csv", csv([HEADERS, ROWS[0]!, ROWS[1]!.slice(0, 4), [...ROWS[2]!, "stray"], ROWS[3]!]), {
    description: "A short row (missing colour and length) and a row with a value past the last header",
    errors: [
      e("missing_value", 3, "Colour", "colour is blank"),
      e("missing_value", 3, "Length (mm)", "routed length is blank"),
    ],
    warnings: [e("extra_values", 4, null, "past the last named column")],
    canCommit: false,
  });
  add(
    "unterminated-quote.csv",
    `${HEADERS.join(",")}\r\n${ROWS[0]!.join(",")}\r\nHR3-002,F1:2,K1:1,4 AWG,RD,420,80,,"oops\r\n${ROWS[2]!.join(",")}\r\n`,
    {
      description: "A quoted note that is never closed",
      readError: { code: "unreadable", status: 422, message: "starts on row 3 is never closed" },
    },
  );
  add(
    "unmapped-and-computed-columns.csv",
    csv([
      [...HEADERS, "Cut length (mm)", "Supplier part", ""],
      ...ROWS.map((r) => [...r, "9999", "X-1", ""]),
    ]),
    {
      description: "Valid: an unknown column is reported, the computed cut length is silently ignored",
      errors: [],
      warnings: [
        e("unmapped_column", null, "Supplier part", 'Column "Supplier part" (K) matches no run field'),
      ],
      canCommit: true,
    },
  );

  // --- bad values ---------------------------------------------------------------------------------------
  add("negative-length.csv", csv([HEADERS, ...withCell(ROWS, 1, "Length (mm)", "-420")]), {
    description: "A negative routed length",
    errors: [e("invalid_value", 3, "Length (mm)", '"-420" is negative')],
    canCommit: false,
  });
  add(
    "absurd-lengths.csv",
    csv([
      HEADERS,
      ...withCell(
        withCell(withCell(ROWS, 2, "Length (mm)", "250000"), 4, "Length (mm)", "0"),
        5,
        "Length (mm)",
        "0.3 mm",
      ),
    ]),
    {
      description: "A 250 m run, a zero length and one that rounds to 0 mm",
      errors: [
        e("invalid_value", 4, "Length (mm)", "250 m, more than the 100 m limit"),
        e("invalid_value", 6, "Length (mm)", '"0" is zero'),
        e("invalid_value", 7, "Length (mm)", "rounds to 0 mm"),
      ],
      canCommit: false,
    },
  );
  add(
    "length-in-wrong-unit.csv",
    csv([
      ["Wire ID", "From", "To", "Gauge", "Colour", "Length (m)"],
      ["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", "0.35"],
      ["HR3-002", "F1:2", "K1:1", "4 AWG", "RD", "420"],
    ]),
    {
      description: "Millimetres typed into a column headed in metres",
      errors: [e("invalid_value", 3, "Length (m)", 'write "420 mm" if you meant millimetres')],
      canCommit: false,
    },
  );
  add(
    "unknown-gauges.csv",
    csv([
      HEADERS,
      ...withCell(withCell(withCell(ROWS, 0, "Gauge", "0.8 mm²"), 2, "Gauge", "45 AWG"), 4, "Gauge", "thick"),
    ]),
    {
      description: "A metric size outside IEC 60228, an AWG outside 4/0–30, and a word",
      errors: [
        e("invalid_value", 2, "Gauge", "is not a standard metric size (IEC 60228"),
        e("invalid_value", 4, "Gauge", "outside the supported AWG range"),
        e("invalid_value", 6, "Gauge", '"thick" is not a wire size'),
      ],
      canCommit: false,
    },
  );
  add(
    "unknown-colours.csv",
    csv([HEADERS, ...withCell(withCell(ROWS, 1, "Colour", "mauve"), 3, "Colour", "RDRD")]),
    {
      description: "A colour with no IEC 60757 code, and the same colour twice",
      errors: [
        e("invalid_value", 3, "Colour", '"mauve" is not an IEC 60757 code'),
        e("invalid_value", 5, "Colour", "names the same colour twice"),
      ],
      canCommit: false,
    },
  );
  add(
    "unknown-units.csv",
    csv([HEADERS, ...withCell(withCell(ROWS, 0, "Length (mm)", "12 furlongs"), 2, "Current (A)", "5 kW")]),
    {
      description: "Units that are not lengths or currents",
      errors: [
        e("invalid_value", 2, "Length (mm)", 'unknown unit "furlongs"'),
        e("invalid_value", 4, "Current (A)", 'unknown unit "kW"'),
      ],
      canCommit: false,
    },
  );
  add("missing-values.csv", csv([HEADERS, ...withCell(withCell(ROWS, 1, "To", ""), 3, "Gauge", "-")]), {
    description: "A blank end B and a gauge written as '-'",
    errors: [e("missing_value", 3, "To", "end B is blank"), e("missing_value", 5, "Gauge", "gauge is blank")],
    canCommit: false,
  });
  add(
    "bad-numbers.csv",
    csv([
      [
        "Wire ID",
        "From",
        "To",
        "Gauge",
        "Colour",
        "Length (mm)",
        "Current (A)",
        "Fuse (A)",
        "Temp (°C)",
        "Bundle",
      ],
      ["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", "350", "lots", "100", "105", "2"],
      ["HR3-002", "F1:2", "K1:1", "4 AWG", "RD", "420", "80", "-5", "105", "2"],
      ["HR3-003", "K1:2", "MC1:1", "8 AWG", "RD", "1250", "35", "40", "hot", "2"],
      ["HR3-004", "MC1:2", "GND1:1", "8 AWG", "BK", "1300", "35", "40", "105", "2.5"],
    ]),
    {
      description: "Words and negative numbers where numbers belong; a fractional bundle count",
      errors: [
        e("invalid_value", 2, "Current (A)", '"lots" is not a number'),
        e("invalid_value", 3, "Fuse (A)", '"-5" is negative'),
        e("invalid_value", 4, "Temp (°C)", '"hot" is not a number'),
        e("invalid_value", 5, "Bundle", '"2.5" is not a whole number'),
      ],
      canCommit: false,
    },
  );
  add(
    "ambiguous-thousands.csv",
    csv(
      [
        ["Wire ID", "From", "To", "Gauge", "Colour", "Length (mm)"],
        ["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", "1,250"],
        ["HR3-002", "F1:2", "K1:1", "4 AWG", "RD", "1250"],
      ],
      ";",
    ),
    {
      description: "'1,250' could be 1250 or 1.25: refused rather than guessed",
      errors: [e("invalid_value", 2, "Length (mm)", '"1,250" is ambiguous')],
      canCommit: false,
    },
  );
  add(
    "cross-field-rules.csv",
    csv([
      [
        "wireId",
        "endA",
        "endB",
        "gauge",
        "colour",
        "routedLengthMm",
        "endATermination",
        "returnKind",
        "returnRunWireId",
        "dropClass",
        "dropLimitPct",
        "supplyV",
      ],
      ["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", "350", "wire nut", "", "", "", "", ""],
      ["HR3-002", "F1:2", "K1:1", "4 AWG", "RD", "420", "ring", "run", "", "", "", ""],
      ["HR3-003", "K1:2", "MC1:1", "8 AWG", "RD", "1250", "ring", "", "HR3-003", "", "", ""],
      ["HR3-004", "MC1:2", "GND1:1", "8 AWG", "BK", "1300", "ring", "", "", "custom", "", ""],
      ["HR3-005", "FB1:3", "LID1:1", "18 AWG", "BU", "2100", "pin", "", "", "", "", "230 VAC"],
      ["HR3-006", "LID1:2", "LID1:2", "18 AWG", "BK", "2150", "pin", "", "HR3-099", "critical", "5", ""],
    ]),
    {
      description:
        "Rules across a row: unknown termination, return run missing or itself, custom class without a limit, AC supply",
      errors: [
        e("invalid_value", 2, "endATermination", '"wire nut" is not a termination kind'),
        e("return_run_missing", 3, "returnRunWireId", "no return run wire ID is given"),
        e("return_run_self", 4, "returnRunWireId", "is this run itself"),
        e("drop_limit_missing", 5, "dropLimitPct", 'the drop class is "custom" but no drop limit'),
        e("invalid_value", 6, "supplyV", "is an AC value"),
      ],
      warnings: [
        e("same_ends", 7, "endB", 'end A and end B are both "LID1:2"'),
        e("unknown_return_run", 7, "returnRunWireId", '"HR3-099" is neither in this file nor in the project'),
        e("drop_limit_unused", 7, "dropLimitPct", 'applies only to the "custom" class'),
      ],
      canCommit: false,
    },
  );

  // --- diff against existing runs ---------------------------------------------------------------------
  const existing: RunData[] = ["HR3-001", "HR3-002", "HR3-003", "HR3-099"].map((wireId, i) => ({
    wireId,
    endA: ROWS[i]?.[1] ?? "ECU1:9",
    endB: ROWS[i]?.[2] ?? "CP1:1",
    endATermination: null,
    endBTermination: null,
    endAStripMm: null,
    endBStripMm: null,
    circuit: null,
    gauge: ROWS[i]?.[3] ?? "18 AWG",
    colour: ROWS[i]?.[4] ?? "WH",
    insulation: null,
    insulationTempC: null,
    bundleSize: null,
    hotSpace: false,
    routedLengthMm: i === 1 ? 400 : Number(ROWS[i]?.[5] ?? 900),
    currentA: ROWS[i] ? Number(ROWS[i]![6]) : null,
    peakCurrentA: null,
    supplyV: null,
    dropClass: "standard",
    dropLimitPct: null,
    fuseA: ROWS[i]?.[7] ? Number(ROWS[i]![7]) : null,
    returnKind: "same",
    returnRunWireId: null,
    returnResistanceOhm: null,
    ledForwardV: null,
    ledCurrentA: null,
    notes: ROWS[i]?.[8] ? ROWS[i]![8]! : null,
  }));
  add("update-existing.csv", csv([HEADERS, ...ROWS.slice(0, 4)]), {
    description:
      "Valid: against four existing runs, one added, one changed, two unchanged, one missing from the file",
    errors: [],
    canCommit: true,
    existing,
    diff: {
      added: 1,
      unchanged: 2,
      changed: [{ wireId: "HR3-002", fields: ["routedLengthMm"] }],
      missing: ["HR3-099"],
    },
  });

  // --- XLSX ----------------------------------------------------------------------------------------------
  add(
    "merged-cells.xlsx",
    await xlsx((wb) => {
      const ws = sheetWithBase(wb);
      ws.getCell("B3").value = "BAT1:+";
      ws.mergeCells("B2:B3");
    }),
    {
      description: "End A merged over two rows: only the top-left cell holds the value",
      errors: [e("missing_value", 3, "From", "merged into B2")],
      warnings: [e("merged_cells", null, null, "read from its top-left cell only")],
      canCommit: false,
    },
  );
  add(
    "formulas-cached.xlsx",
    await xlsx((wb) => {
      const ws = sheetWithBase(wb);
      ws.getCell("F4").value = { formula: "F2+900", result: 1250 };
      ws.getCell("G6").value = { formula: "G7*1", result: 1.2 };
    }),
    {
      description: "Valid: formulas with saved results are read as their results",
      errors: [],
      canCommit: true,
      values: [
        { row: 4, field: "routedLengthMm", value: 1250 },
        { row: 6, field: "currentA", value: 1.2 },
      ],
    },
  );
  add(
    "formulas-no-cache.xlsx",
    await xlsx((wb) => {
      const ws = sheetWithBase(wb);
      ws.getCell("F3").value = { formula: "F2+70" };
    }),
    {
      description: "A formula saved without a result (written by a program that does not calculate)",
      errors: [e("formula_no_value", 3, "Length (mm)", 'the formula "=F2+70" has no saved result')],
      canCommit: false,
    },
  );
  add(
    "formula-error.xlsx",
    await xlsx((wb) => {
      const ws = sheetWithBase(wb);
      ws.getCell("G5").value = { formula: "G4/0", result: { error: "#DIV/0!" } };
    }),
    {
      description: "A formula whose saved result is an error",
      errors: [e("formula_error", 5, "Current (A)", "gives the error #DIV/0!")],
      canCommit: false,
    },
  );
  add(
    "second-sheet.xlsx",
    await xlsx((wb) => {
      const cover = wb.addWorksheet("Cover");
      cover.addRow(["Cedar Flats Robotics"]);
      cover.addRow(["Harrow-3 main harness"]);
      cover.addRow(["Revision", "B"]);
      for (let i = 0; i < 10; i++) cover.addRow([`note ${i + 1}`]);
      sheetWithBase(wb, "Runs");
    }),
    {
      description: "Valid: a cover sheet first; the run list is on the second sheet",
      errors: [],
      warnings: [e("sheet_chosen", null, null, 'Read the worksheet "Runs"')],
      canCommit: true,
      rowCount: 6,
    },
  );
  add(
    "empty-workbook.xlsx",
    await xlsx((wb) => {
      wb.addWorksheet("Sheet1");
    }),
    {
      description: "A workbook whose only sheet has no cells",
      readError: { code: "empty_file", status: 422, message: "none of its worksheets has any cells" },
    },
  );
  const good = await xlsx((wb) => {
    sheetWithBase(wb);
  });
  add("truncated.xlsx", good.subarray(0, Math.floor(good.length / 2)), {
    description: "An .xlsx cut off half-way (an interrupted download)",
    readError: { code: "unreadable", status: 422, message: "damaged or cut short" },
  });
  add("not-a-workbook.xlsx", storedZip([{ name: "readme.txt", data: Buffer.from("not a workbook\n") }]), {
    description: "A ZIP archive named .xlsx that holds no workbook",
    readError: { code: "unreadable", status: 422, message: "holds no Excel workbook" },
  });
  add("csv-named-xlsx.xlsx", csv(base), {
    description: "CSV text named .xlsx",
    readError: { code: "unreadable", status: 422, message: "not a ZIP-based Excel file" },
  });
  add("xlsx-named-csv.csv", good, {
    description: "An .xlsx workbook named .csv",
    readError: { code: "not_text", status: 422, message: "looks like a ZIP archive" },
  });
  add(
    "rich-text-dates-numbers.xlsx",
    await xlsx((wb) => {
      const ws = sheetWithBase(wb);
      ws.getCell("E2").value = { richText: [{ text: "R", font: { bold: true } }, { text: "D" }] };
      ws.getCell("I3").value = new Date(Date.UTC(2026, 2, 4));
      ws.getCell("I3").numFmt = "yyyy-mm-dd";
      ws.getCell("D6").value = 18;
      ws.getCell("I4").value = { text: "deck guard drawing", hyperlink: "https://example.test/d/4" };
    }),
    {
      description: "Valid: rich text, a date, a hyperlink and a bare-number gauge are read as text",
      errors: [],
      canCommit: true,
      values: [
        { row: 2, field: "colour", value: "RD" },
        { row: 3, field: "notes", value: "2026-03-04" },
        { row: 4, field: "notes", value: "deck guard drawing" },
        { row: 6, field: "gauge", value: "18 AWG" },
      ],
    },
  );
  add(
    "percent-format.xlsx",
    await xlsx((wb) => {
      const ws = wb.addWorksheet("Runs");
      ws.addRow(["Wire ID", "From", "To", "Gauge", "Colour", "Length (m)", "Drop limit (%)", "Hot space"]);
      ws.addRow(["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", 0.35, 0.03, true]);
      ws.addRow(["HR3-002", "F1:2", "K1:1", "4 AWG", "RD", 0.42, 0.05, false]);
      ws.getColumn(7).numFmt = "0%";
    }),
    {
      description: "Valid: a drop limit stored as 0.03 and shown as 3 %, lengths in metres, booleans",
      errors: [],
      canCommit: true,
      values: [
        { row: 2, field: "dropLimitPct", value: 3 },
        { row: 2, field: "dropClass", value: "custom" },
        { row: 2, field: "routedLengthMm", value: 350 },
        { row: 2, field: "hotSpace", value: true },
        { row: 3, field: "hotSpace", value: false },
      ],
    },
  );

  return {
    files,
    manifest: {
      description:
        "Malformed and edge-case run-list uploads. Each entry gives either the readTable refusal (readError) or the exact errors of readTable → matchHeaders → buildPreview with DEFAULT_PROJECT_SETTINGS and `existing` (default none). An entry with readError or canCommit false must commit nothing. Regenerate with: npx tsx tests/helpers/make-fixtures.ts",
      settings: "DEFAULT_PROJECT_SETTINGS",
      entries,
    },
  };
}

export function manifestJson(manifest: Manifest): string {
  return JSON.stringify(manifest, null, 2) + "\n";
}

async function main(): Promise<void> {
  const { files, manifest } = await buildFixtures();
  mkdirSync(FIXTURE_DIR, { recursive: true });
  for (const [name, data] of Object.entries(files)) writeFileSync(path.join(FIXTURE_DIR, name), data);
  writeFileSync(path.join(FIXTURE_DIR, "manifest.json"), manifestJson(manifest));
  console.log(`wrote ${Object.keys(files).length} fixtures and manifest.json to ${FIXTURE_DIR}`);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  void main();
}
