import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import {
  ImportFileError,
  MAX_DATA_ROWS,
  MAX_UPLOAD_BYTES,
  detectDelimiter,
  readTable,
  zipUnpackedBytes,
  type ImportFileErrorCode,
} from "@/lib/import";
import { storedZip } from "@/tests/helpers/make-fixtures";

// Byte-level facts used here: UTF-8 per RFC 3629 (C0/C1 and F5–FF never appear; encoded surrogates D800–DFFF are
// invalid); "é" is C3 A9 in UTF-8 and E9 in ISO/IEC 8859-1; the UTF-8 byte-order mark is EF BB BF (Unicode
// Standard §23.8); CSV quoting per RFC 4180; ZIP central-directory layout per PKWARE APPNOTE.TXT §4.3.12.

async function refusal(buffer: Buffer, filename: string, mimeType?: string): Promise<ImportFileError> {
  const e = await readTable(buffer, filename, mimeType).then(
    () => null,
    (err: unknown) => err,
  );
  expect(e).toBeInstanceOf(ImportFileError);
  return e as ImportFileError;
}

const HEAD = "wireId,endA,endB,gauge,colour,routedLengthMm";
const ROW = (i: number) => `HR3-${i},MC1:${i},DM1:${i},18 AWG,RD,${100 + i}`;

describe("detectDelimiter", () => {
  it.each([
    ["a,b,c\n1,2,3", ","],
    ["a;b;c\n1;2;3", ";"],
    ["a\tb\tc\n1\t2\t3", "\t"],
    ['"Length, routed";Colour;Gauge', ";"],
    ["\n\n a;b,c;d", ";"],
    ["single", ","],
  ] as const)("%j → %j", (text, d) => {
    expect(detectDelimiter(text)).toBe(d);
  });
});

describe("readTable: CSV", () => {
  it("keeps spreadsheet row numbers across blank lines and quoted line breaks (RFC 4180)", async () => {
    const text = `${HEAD}\r\n${ROW(1)}\r\n\r\n"HR3-2",MC1:2,DM1:2,18 AWG,RD,"10\r\n2"\r\n,,,,,\r\n${ROW(3)}\r\n\r\n`;
    const t = await readTable(Buffer.from(text), "runs.csv");
    expect(t.rows.map((r) => r.rowNumber)).toEqual([2, 4, 6]);
    expect(t.rows[1]!.cells[5]).toBe("10\r\n2");
    expect(t.blankRowsSkipped).toBe(2); // rows 3 and 5; the trailing blank line is not counted
    expect(t).toMatchObject({ format: "csv", delimiter: ",", headerRowNumber: 1, sheetName: null });
  });

  it("drops a UTF-8 byte-order mark so it does not stick to the first header", async () => {
    const t = await readTable(
      Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(`${HEAD}\n${ROW(1)}\n`)]),
      "a.csv",
    );
    expect(t.headers[0]).toBe("wireId");
  });

  it("reads UTF-8 text such as é (C3 A9), Ω and mm²", async () => {
    const t = await readTable(Buffer.from(`${HEAD},notes\n${ROW(1)},câble é Ω mm²\n`, "utf8"), "a.csv");
    expect(t.rows[0]!.cells[6]).toBe("câble é Ω mm²");
  });

  it("removes the formula guard ' that our export puts before = + - @", async () => {
    const t = await readTable(
      Buffer.from(`${HEAD},notes\n${ROW(1)},'=spare\n${ROW(2)},'-BAT\n${ROW(3)},'quoted'\n`),
      "a.csv",
    );
    expect(t.rows.map((r) => r.cells[6])).toEqual(["=spare", "-BAT", "'quoted'"]);
  });

  it.each([
    [[0xc0, 0xaf], "0xC0", "overlong encoding (RFC 3629 §3)"],
    [[0xed, 0xa0, 0x80], "0xED", "an encoded surrogate (RFC 3629 §3)"],
    [[0xe9], "0xE9", "Latin-1 é (ISO/IEC 8859-1)"],
    [[0xf5, 0x80, 0x80, 0x80], "0xF5", "a lead byte above U+10FFFF"],
  ])("refuses invalid UTF-8 %j and names byte %s on its line: %s", async (bytes, name) => {
    const buf = Buffer.concat([
      Buffer.from(`${HEAD},notes\n${ROW(1)},ok\n${ROW(2)},`),
      Buffer.from(bytes),
      Buffer.from("\n"),
    ]);
    const e = await refusal(buf, "a.csv");
    expect(e.code).toBe("not_utf8");
    expect(e.message).toContain(`byte ${name} on line 3`);
  });

  it("refuses a quote that is never closed", async () => {
    const e = await refusal(Buffer.from(`${HEAD}\n${ROW(1)}\n"HR3-2,x\n${ROW(3)}\n`), "a.csv");
    expect({ code: e.code, status: e.status }).toEqual({ code: "unreadable", status: 422 });
  });

  it("uses the MIME type only when the name has no extension", async () => {
    const body = Buffer.from(`${HEAD}\n${ROW(1)}\n`);
    expect((await readTable(body, "upload", "text/csv; charset=utf-8")).format).toBe("csv");
    expect((await refusal(body, "upload", "application/octet-stream")).code).toBe("unsupported_type");
    expect((await refusal(body, "runs.txt", "text/csv")).code).toBe("unsupported_type");
  });
});

describe("readTable: limits (413)", () => {
  it(`refuses more than ${MAX_UPLOAD_BYTES} bytes before reading anything`, async () => {
    const e = await refusal(Buffer.alloc(MAX_UPLOAD_BYTES + 1, 0x41), "big.csv");
    expect({ code: e.code, status: e.status }).toEqual({ code: "too_large", status: 413 });
    expect(e.message).toContain("the limit is 10 MB");
  });

  const rows = (n: number) => [HEAD, ...Array.from({ length: n }, (_, i) => ROW(i + 1))].join("\n");

  it(`accepts exactly ${MAX_DATA_ROWS} data rows`, async () => {
    const t = await readTable(Buffer.from(rows(MAX_DATA_ROWS)), "a.csv");
    expect(t.rows.length).toBe(MAX_DATA_ROWS);
  });

  it(`refuses ${MAX_DATA_ROWS + 1} data rows`, async () => {
    const e = await refusal(Buffer.from(rows(MAX_DATA_ROWS + 1)), "a.csv");
    expect({ code: e.code, status: e.status }).toEqual({ code: "too_many_rows", status: 413 });
    expect(e.message).toContain("the limit is 20000");
  });

  it(`refuses an XLSX with more than ${MAX_DATA_ROWS} data rows`, async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet("Runs");
    ws.addRow(HEAD.split(","));
    for (let i = 1; i <= MAX_DATA_ROWS + 1; i++) ws.addRow(ROW(i).split(","));
    const e = await refusal(Buffer.from((await wb.xlsx.writeBuffer()) as ArrayBuffer), "big.xlsx");
    expect({ code: e.code, status: e.status }).toEqual({ code: "too_many_rows", status: 413 });
  }, 30_000);

  it("refuses an XLSX whose ZIP directory claims more than 200 MB unpacked (a ZIP bomb)", async () => {
    const zip = storedZip([{ name: "xl/workbook.xml", data: Buffer.from("<workbook/>") }]);
    const info = zipUnpackedBytes(zip);
    expect(info).toEqual({ entries: 1, bytes: 11, names: ["xl/workbook.xml"] });
    // Central-directory "uncompressed size" sits 24 bytes into the entry (APPNOTE.TXT §4.3.12).
    const cd = zip.indexOf(Buffer.from([0x50, 0x4b, 0x01, 0x02]));
    zip.writeUInt32LE(300 * 1024 * 1024, cd + 24);
    const e = await refusal(zip, "bomb.xlsx");
    expect({ code: e.code, status: e.status }).toEqual({ code: "too_large", status: 413 });
  });
});

describe("readTable: XLSX", () => {
  async function book(build: (wb: ExcelJS.Workbook) => void): Promise<Buffer> {
    const wb = new ExcelJS.Workbook();
    build(wb);
    return Buffer.from((await wb.xlsx.writeBuffer()) as ArrayBuffer);
  }

  it("picks the sheet whose header names the most run fields, then the one with most rows", async () => {
    const buf = await book((wb) => {
      const a = wb.addWorksheet("Parts");
      a.addRow(["Part", "Qty"]);
      for (let i = 0; i < 50; i++) a.addRow([`P${i}`, i]);
      const b = wb.addWorksheet("Runs");
      b.addRow(HEAD.split(","));
      b.addRow(ROW(1).split(","));
    });
    const t = await readTable(buf, "w.xlsx");
    expect(t.sheetName).toBe("Runs");
    expect(t.warnings.map((w) => w.code)).toEqual(["sheet_chosen"]);
  });

  it("reads numbers, booleans, percentages and dates as the text a user sees", async () => {
    const buf = await book((wb) => {
      const ws = wb.addWorksheet("Runs");
      ws.addRow([...HEAD.split(","), "hotSpace", "dropLimitPct", "notes"]);
      ws.addRow([
        "HR3-1",
        "MC1:1",
        "DM1:1",
        "18 AWG",
        "RD",
        1250.5,
        true,
        0.075,
        new Date(Date.UTC(2026, 0, 2)),
      ]);
      ws.getCell("H2").numFmt = "0.0%";
      ws.getCell("I2").numFmt = "yyyy-mm-dd";
    });
    const t = await readTable(buf, "w.xlsx");
    expect(t.rows[0]!.cells.slice(5)).toEqual(["1250.5", "TRUE", "7.5%", "2026-01-02"]);
  });

  it("notes formulas without a saved result, and reads cells of a merge as blank except the top-left", async () => {
    const buf = await book((wb) => {
      const ws = wb.addWorksheet("Runs");
      ws.addRow(HEAD.split(","));
      ws.addRow(["HR3-1", "MC1:1", "DM1:1", "18 AWG", "RD", { formula: "100+1" }]);
      ws.addRow(["HR3-2", "MC1:2", "DM1:2", "18 AWG", "RD", 102]);
      ws.addRow(["HR3-3", "", "DM1:3", "18 AWG", "RD", 103]);
      ws.mergeCells("B3:B4");
    });
    const t = await readTable(buf, "w.xlsx");
    expect(t.rows[0]!.notes).toEqual([
      { column: 5, kind: "formula_no_value", detail: 'the formula "=100+1" has no saved result' },
    ]);
    expect(t.rows[1]!.cells[1]).toBe("MC1:2");
    expect(t.rows[2]!.cells[1]).toBe("");
    expect(t.rows[2]!.notes).toEqual([{ column: 1, kind: "merged", detail: "merged into B3" }]);
    expect(t.warnings.map((w) => w.code)).toEqual(["merged_cells"]);
  });
});

describe("ImportFileError", () => {
  it.each([
    ["too_large", 413],
    ["too_many_rows", 413],
    ["not_utf8", 422],
    ["unsupported_type", 422],
    ["no_header_row", 422],
  ] as [ImportFileErrorCode, number][])("%s maps to HTTP %i", (code, status) => {
    expect(new ImportFileError(code, "x").status).toBe(status);
  });
});
