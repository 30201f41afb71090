import ExcelJS from "exceljs";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { runCutLengthMm } from "@/lib/domain/cut-length";
import { RUN_FIELDS } from "@/lib/domain/run-fields";
import { DEFAULT_PROJECT_SETTINGS, type RunData } from "@/lib/domain/types";
import { exportColumns, runsToCsv, runsToXlsx, type ExportRun } from "@/lib/export/runs";
import { buildPreview, matchHeaders, readTable } from "@/lib/import";
import { generateRuns } from "@/tests/helpers/generate-runs-csv";

// Format facts: CSV per RFC 4180 (CRLF record ends, "" escapes a quote inside a quoted field); the UTF-8
// byte-order mark EF BB BF (Unicode Standard §23.8); spreadsheet formula injection and its leading-apostrophe
// defence per the OWASP "CSV Injection" page. Field names per PRODUCT.md §6.

const BASE: RunData = generateRuns(1, 1)[0]!;

/** Runs that stress the writers: blanks, quotes, separators, line breaks, formula-looking text, Unicode. */
const EDGE: RunData[] = [
  { ...BASE, wireId: "", notes: null, circuit: null },
  { ...BASE, wireId: "HR3-E01", notes: 'tie at "P-clip", then; shrink', circuit: "pack −, fused" },
  { ...BASE, wireId: "HR3-E02", notes: '=HYPERLINK("http://example.test")', endA: "+BAT:1", endB: "-BAT:1" },
  { ...BASE, wireId: "HR3-E03", notes: "@spare\tlabel\nsecond line\r\nthird", circuit: "deck motor (U)" },
  {
    ...BASE,
    wireId: "HR3-E04",
    gauge: "0.75 mm²",
    colour: "GNYE",
    returnKind: "chassis",
    returnResistanceOhm: 0.0015,
  },
  {
    ...BASE,
    wireId: "HR3-E05",
    gauge: "1/0 AWG",
    hotSpace: true,
    currentA: 0.1 + 0.2,
    ledCurrentA: 0.02,
    ledForwardV: 2.1,
  },
];

async function roundTrip(buffer: Buffer, filename: string) {
  const table = await readTable(buffer, filename);
  const mapping = matchHeaders(table.headers);
  return { table, mapping, preview: buildPreview(table, mapping, [], DEFAULT_PROJECT_SETTINGS) };
}

describe("runsToCsv / runsToXlsx: round trip through readTable → matchHeaders → buildPreview", () => {
  const runs = [...generateRuns(400, 8), ...EDGE];

  it.each([
    ["CSV", async () => Buffer.from(runsToCsv(runs), "utf8"), "runs.csv"],
    ["XLSX", async () => runsToXlsx(runs), "runs.xlsx"],
  ] as const)("%s gives back the same RunData", async (_kind, write, filename) => {
    const { table, mapping, preview } = await roundTrip(await write(), filename);
    expect(mapping.unmatched).toEqual([]);
    expect(mapping.ignored).toEqual(["cutLengthMm"]);
    expect(mapping.columns.filter((c) => c.field).every((c) => c.matchedBy === "canonical")).toBe(true);
    expect(preview.fileErrors).toEqual([]);
    expect(preview.rows.flatMap((r) => r.errors)).toEqual([]);
    // Notes come back with "\n" line breaks: XML 1.0 §2.11 turns CRLF into LF in XLSX, and the import does the same for CSV.
    const expected = runs.map((r) => ({ ...r, notes: r.notes?.replace(/\r\n/g, "\n") ?? null }));
    expect(preview.rows.map((r) => r.run)).toEqual(expected);
    // … and a re-import of an unchanged export shows nothing changed.
    const again = buildPreview(
      table,
      mapping,
      runs.filter((r) => r.wireId !== ""),
      DEFAULT_PROJECT_SETTINGS,
    );
    expect(again.summary).toMatchObject({ unchanged: runs.length - 1, added: 1, changed: 0, missing: 0 });
  });
});

describe("runsToCsv", () => {
  it("writes a BOM, the canonical headers with cutLengthMm beside routedLengthMm, and CRLF line ends", () => {
    const csv = runsToCsv([BASE]);
    expect(csv.startsWith("\uFEFF")).toBe(true);
    const lines = csv.slice(1).split("\r\n");
    const keys = RUN_FIELDS.map((f) => f.key as string);
    keys.splice(keys.indexOf("routedLengthMm") + 1, 0, "cutLengthMm");
    expect(lines[0]!.split(",")).toEqual(keys);
    expect(lines.at(-1)).toBe("");
    expect(csv.slice(1).replace(/\r\n/g, "")).not.toMatch(/[\r\n]/);
  });

  it("the cutLengthMm column holds the project's cut length", () => {
    const settings = { ...DEFAULT_PROJECT_SETTINGS, slackPct: 10, roundingMm: 10 };
    const rows = Papa.parse<Record<string, string>>(runsToCsv(generateRuns(20, 2), settings).slice(1), {
      header: true,
      skipEmptyLines: true,
    }).data;
    expect(rows.map((r) => Number(r.cutLengthMm))).toEqual(
      generateRuns(20, 2).map((r) => runCutLengthMm(r, settings)),
    );
  });

  it("guards text a spreadsheet would run as a formula with a leading ' (OWASP CSV injection)", () => {
    const rows = Papa.parse<Record<string, string>>(runsToCsv(EDGE).slice(1), {
      header: true,
      skipEmptyLines: true,
    }).data;
    const e2 = rows.find((r) => r.wireId === "HR3-E02")!;
    expect([e2.notes, e2.endA, e2.endB]).toEqual([
      '\'=HYPERLINK("http://example.test")',
      "'+BAT:1",
      "'-BAT:1",
    ]);
    expect(rows.find((r) => r.wireId === "HR3-E03")!.notes!.startsWith("'@spare")).toBe(true);
  });

  it("adds state and traceCode columns only when runs carry them", () => {
    const run: ExportRun = { ...BASE, state: "cut", traceCode: "K7Q2" };
    expect(exportColumns([BASE])).not.toContain("state");
    expect(exportColumns([run]).slice(-2)).toEqual(["state", "traceCode"]);
  });
});

describe("runsToXlsx", () => {
  it("writes one frozen-header sheet with numbers as numbers and booleans as booleans", async () => {
    const buf = await runsToXlsx([{ ...BASE, hotSpace: true, currentA: 7.5 }]);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(buf as unknown as ArrayBuffer);
    const ws = wb.worksheets[0]!;
    expect(ws.name).toBe("Runs");
    const header = (ws.getRow(1).values as unknown[]).slice(1);
    const col = (name: string) => header.indexOf(name) + 1;
    expect(ws.getRow(2).getCell(col("routedLengthMm")).value).toBe(BASE.routedLengthMm);
    expect(ws.getRow(2).getCell(col("currentA")).value).toBe(7.5);
    expect(ws.getRow(2).getCell(col("hotSpace")).value).toBe(true);
    expect(ws.getRow(2).getCell(col("cutLengthMm")).value).toBe(
      runCutLengthMm(BASE, DEFAULT_PROJECT_SETTINGS),
    );
    expect(ws.views[0]).toMatchObject({ state: "frozen", ySplit: 1 });
  });
});
