import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { FIXTURE_DIR, type Manifest } from "@/tests/helpers/make-fixtures";
import { generateRunsCsv } from "@/tests/helpers/generate-runs-csv";
import { signedIn, type Client } from "../helpers/http";

const baseUrl = inject("baseUrl");
const manifest = JSON.parse(readFileSync(path.join(FIXTURE_DIR, "manifest.json"), "utf8")) as Manifest;

type Issue = { code: string; row: number | null; column: string | null; message: string };
type Preview = {
  canCommit: boolean;
  fileErrors: Issue[];
  rows: { errors: Issue[]; status: string }[];
  columns: { index: number; header: string; field: string | null }[];
  summary: { added: number; changed: number; unchanged: number; missing: number; errors: number };
  diff: { changed: { wireId: string; changes: { field: string }[] }[]; missing: string[] };
};
type ImportView = { id: string; status: string; preview: Preview };

let lead: Client;

async function newProject(name: string): Promise<string> {
  const r = await lead.post<{ id: string }>("/api/projects", {
    name: `${name} ${Date.now()}-${Math.random()}`,
  });
  expect(r.status).toBe(201);
  return r.body.id;
}

async function upload(c: Client, projectId: string, name: string, data: Buffer | string, type = "text/csv") {
  const form = new FormData();
  form.append("file", new Blob([typeof data === "string" ? data : new Uint8Array(data)], { type }), name);
  const res = await fetch(`${baseUrl}/api/projects/${projectId}/imports`, {
    method: "POST",
    body: form,
    headers: { cookie: c.cookieHeader() },
  });
  return {
    status: res.status,
    body: (await res.json()) as ImportView & { error: { code: string; message: string } },
  };
}

async function runCount(projectId: string): Promise<number> {
  return (await lead.get<{ total: number }>(`/api/projects/${projectId}/runs?limit=1`)).body.total;
}

const key = (i: { code: string; row: number | null; column: string | null }) =>
  `${i.code}|${i.row}|${i.column}`;

beforeAll(async () => {
  lead = await signedIn(baseUrl, "lead@example.test");
});

describe("the malformed corpus through the import API", () => {
  for (const entry of manifest.entries) {
    it(`${entry.file}: ${entry.readError ? entry.readError.code : entry.canCommit ? "valid" : "errors"}`, async () => {
      const projectId = await newProject(`Corpus ${entry.file}`);
      if (entry.existing?.length) {
        expect((await lead.post(`/api/projects/${projectId}/runs`, { runs: entry.existing })).status).toBe(
          201,
        );
      }
      const before = await runCount(projectId);
      const data = readFileSync(path.join(FIXTURE_DIR, entry.file));
      const r = await upload(lead, projectId, entry.file, data, entry.mimeType ?? "application/octet-stream");
      if (entry.readError) {
        expect(r.status).toBe(entry.readError.status);
        expect(r.body.error.code).toBe(entry.readError.code);
        expect(r.body.error.message).toContain(entry.readError.message);
        expect(await runCount(projectId)).toBe(before);
        return;
      }
      expect(r.status).toBe(201);
      const p = r.body.preview;
      const actual = [...p.fileErrors, ...p.rows.flatMap((row) => row.errors)];
      expect(actual.map(key).sort()).toEqual((entry.errors ?? []).map(key).sort());
      expect(p.canCommit).toBe(entry.canCommit);
      const commit = await lead.post<{ added: number }>(
        `/api/projects/${projectId}/imports/${r.body.id}/commit`,
      );
      if (!entry.canCommit) {
        expect(commit.status).toBe(422);
        expect(await runCount(projectId)).toBe(before);
      } else {
        expect(commit.status).toBe(200);
        expect(await runCount(projectId)).toBe(before + commit.body.added);
      }
    });
  }
});

describe("import preview, mapping, commit and re-import", () => {
  it("maps, refuses to commit with errors left, commits all rows, then updates from a changed file", async () => {
    const projectId = await newProject("Import flow");
    const csv = generateRunsCsv(40, 7, "canonical");
    const up = await upload(lead, projectId, "runs.csv", csv);
    expect(up.status).toBe(201);
    expect(up.body.preview.canCommit).toBe(true);
    expect(up.body.preview.summary.added).toBe(40);

    // Unmap the gauge column: every row now lacks a required field, and a commit writes nothing.
    const gaugeCol = up.body.preview.columns.find((c) => c.field === "gauge")!;
    const unmapped = await lead.patch<ImportView>(`/api/projects/${projectId}/imports/${up.body.id}`, {
      columns: [{ index: gaugeCol.index, field: null }],
    });
    expect(unmapped.status).toBe(200);
    expect(unmapped.body.preview.canCommit).toBe(false);
    expect(unmapped.body.preview.fileErrors.map((e) => e.code)).toContain("missing_column");
    const refused = await lead.post(`/api/projects/${projectId}/imports/${up.body.id}/commit`);
    expect(refused.status).toBe(422);
    expect(await runCount(projectId)).toBe(0);

    const remapped = await lead.patch<ImportView>(`/api/projects/${projectId}/imports/${up.body.id}`, {
      columns: [{ index: gaugeCol.index, field: "gauge" }],
    });
    expect(remapped.body.preview.canCommit).toBe(true);
    const done = await lead.post<{ added: number }>(
      `/api/projects/${projectId}/imports/${up.body.id}/commit`,
    );
    expect(done.status).toBe(200);
    expect(done.body.added).toBe(40);
    expect(await runCount(projectId)).toBe(40);
    expect((await lead.post(`/api/projects/${projectId}/imports/${up.body.id}/commit`)).status).toBe(409);

    // The export imports back unchanged.
    const exported = await fetch(`${baseUrl}/api/projects/${projectId}/runs/export?format=csv`, {
      headers: { cookie: lead.cookieHeader() },
    });
    expect(exported.headers.get("content-disposition")).toMatch(/attachment; filename=".*\.csv"/);
    const exportText = await exported.text();
    const back = await upload(lead, projectId, "export.csv", exportText);
    expect(back.body.preview.summary).toMatchObject({ added: 0, changed: 0, unchanged: 40, errors: 0 });

    // A changed file: one run longer, one row dropped. The diff names the field; the dropped run is kept.
    const lines = exportText
      .replace(/^\uFEFF/, "")
      .split("\r\n")
      .filter(Boolean);
    const header = lines[0]!.split(",");
    const lenIdx = header.indexOf("routedLengthMm");
    const cells = lines[1]!.split(",");
    const wireId = cells[header.indexOf("wireId")]!;
    cells[lenIdx] = String(Number(cells[lenIdx]) + 250);
    const changed = [lines[0], cells.join(","), ...lines.slice(3)].join("\r\n");
    const re = await upload(lead, projectId, "changed.csv", changed);
    expect(re.body.preview.summary).toMatchObject({ added: 0, changed: 1, unchanged: 38, missing: 1 });
    expect(re.body.preview.diff.changed[0]).toMatchObject({ wireId, changes: [{ field: "routedLengthMm" }] });
    const commit = await lead.post<{ changed: number; missing: string[] }>(
      `/api/projects/${projectId}/imports/${re.body.id}/commit`,
    );
    expect(commit.body.changed).toBe(1);
    expect(commit.body.missing).toHaveLength(1);
    expect(await runCount(projectId)).toBe(40);
  });

  it("refuses uploads over 10 MB with 413, other roles with 403, and missing files with 422", async () => {
    const projectId = await newProject("Import limits");
    const big = Buffer.alloc(10 * 1024 * 1024 + 10, 0x41);
    expect((await upload(lead, projectId, "big.csv", big)).status).toBe(413);
    const builder = await signedIn(baseUrl, "builder@example.test");
    expect((await upload(builder, projectId, "runs.csv", generateRunsCsv(3))).status).toBe(403);
    expect((await lead.post(`/api/projects/${projectId}/imports`, {})).status).toBe(422);
  });
});
