import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { DEFAULT_PROJECT_SETTINGS } from "@/lib/domain/types";
import { ImportFileError, buildPreview, matchHeaders, readTable, type ImportIssue } from "@/lib/import";
import {
  FIXTURE_DIR,
  buildFixtures,
  manifestJson,
  type ExpectedIssue,
  type Manifest,
} from "@/tests/helpers/make-fixtures";

// Every file of the malformed corpus goes through readTable → matchHeaders → buildPreview and must give exactly
// the errors its manifest entry names. The inputs are what they claim by outside definitions: Latin-1 bytes per
// ISO/IEC 8859-1 (ü = 0xFC), Windows-1252 curly quotes 0x93/0x94, UTF-16 byte-order marks FF FE / FE FF (Unicode
// Standard §23.8), ZIP signatures per PKWARE APPNOTE.TXT, PDF "%PDF-" (ISO 32000-1 §7.5.2), OLE D0 CF 11 E0
// ([MS-CFB] §2.2); lengths convert by the 1959 yard-and-pound agreement and SI prefixes (SI Brochure Table 7).

const manifest = JSON.parse(readFileSync(path.join(FIXTURE_DIR, "manifest.json"), "utf8")) as Manifest;

function matches(actual: ImportIssue, want: ExpectedIssue): boolean {
  return (
    actual.code === want.code &&
    actual.row === want.row &&
    actual.column === want.column &&
    (want.field === undefined || actual.field === want.field) &&
    (want.rows === undefined || JSON.stringify(actual.rows) === JSON.stringify(want.rows)) &&
    actual.message.includes(want.message)
  );
}

/** Pairs each expected issue with one actual issue; anything left on either side is a failure. */
function expectExactly(actual: ImportIssue[], expected: ExpectedIssue[]): void {
  const left = [...actual];
  const missing: ExpectedIssue[] = [];
  for (const want of expected) {
    const i = left.findIndex((a) => matches(a, want));
    if (i >= 0) left.splice(i, 1);
    else missing.push(want);
  }
  expect({
    missing,
    unexpected: left.map((a) => ({ code: a.code, row: a.row, column: a.column, message: a.message })),
  }).toEqual({
    missing: [],
    unexpected: [],
  });
}

describe("malformed import corpus", () => {
  it("has at least 30 files, and the manifest and the folder list the same files", () => {
    const onDisk = readdirSync(FIXTURE_DIR)
      .filter((f) => f !== "manifest.json")
      .sort();
    const listed = manifest.entries.map((e) => e.file).sort();
    expect(listed).toEqual(onDisk);
    expect(listed.length).toBeGreaterThanOrEqual(30);
    expect(new Set(listed).size).toBe(listed.length);
  });

  it.each(manifest.entries.map((e) => [e.file, e] as const))("%s", async (_file, entry) => {
    const buffer = readFileSync(path.join(FIXTURE_DIR, entry.file));
    if (entry.readError) {
      const err = await readTable(buffer, entry.file, entry.mimeType).then(
        () => null,
        (e: unknown) => e,
      );
      expect(err).toBeInstanceOf(ImportFileError);
      const fe = err as ImportFileError;
      expect({ code: fe.code, status: fe.status }).toEqual({
        code: entry.readError.code,
        status: entry.readError.status,
      });
      expect(fe.message).toContain(entry.readError.message);
      return;
    }
    const table = await readTable(buffer, entry.file, entry.mimeType);
    const preview = buildPreview(
      table,
      matchHeaders(table.headers),
      entry.existing ?? [],
      DEFAULT_PROJECT_SETTINGS,
    );
    const errors = [...preview.fileErrors, ...preview.rows.flatMap((r) => r.errors)];
    expectExactly(errors, entry.errors ?? []);
    if (entry.warnings)
      expectExactly([...preview.fileWarnings, ...preview.rows.flatMap((r) => r.warnings)], entry.warnings);
    if (entry.canCommit !== undefined) expect(preview.canCommit).toBe(entry.canCommit);
    if (entry.rowCount !== undefined) expect(preview.summary.rows).toBe(entry.rowCount);
    for (const v of entry.values ?? []) {
      const row = preview.rows.find((r) => r.rowNumber === v.row);
      expect(row?.run, `row ${v.row} should be complete`).not.toBeNull();
      expect(row?.run?.[v.field]).toEqual(v.value);
    }
    if (entry.diff) {
      expect({
        added: preview.diff.added.length,
        unchanged: preview.diff.unchanged.length,
        changed: preview.diff.changed.map((c) => ({
          wireId: c.wireId,
          fields: c.changes.map((x) => x.field),
        })),
        missing: preview.diff.missing,
      }).toEqual(entry.diff);
    }
    // Every message names its row (when it has one) and its column header (when it has one).
    for (const e of errors) {
      if (e.row !== null) expect(e.message).toMatch(new RegExp(`^Row ${e.row}[,:]`));
      if (e.row !== null && e.column !== null) expect(e.message).toContain(`column "${e.column}"`);
    }
  });

  it("the committed files are exactly what the generator makes (reproducible)", async () => {
    const { files, manifest: built } = await buildFixtures();
    for (const [name, data] of Object.entries(files)) {
      expect(readFileSync(path.join(FIXTURE_DIR, name)).equals(data), name).toBe(true);
    }
    expect(readFileSync(path.join(FIXTURE_DIR, "manifest.json"), "utf8")).toBe(manifestJson(built));
  });
});
