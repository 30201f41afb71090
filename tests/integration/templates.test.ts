import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { signedIn, type Client } from "../helpers/http";

const baseUrl = inject("baseUrl");
type Template = { id: string; name: string; builtIn: boolean; version: number | null } & Record<
  string,
  unknown
>;

let lead: Client;
let projectId = "";

beforeAll(async () => {
  lead = await signedIn(baseUrl, "lead@example.test");
  const projects = await lead.get<{ items: { id: string; name: string }[] }>("/api/projects");
  projectId = projects.body.items.find((p) => p.name === "Harrow-3")!.id;
});

async function pdfPageSize(url: string): Promise<string> {
  const res = await fetch(`${baseUrl}${url}`, { headers: { cookie: lead.cookieHeader() } });
  expect(res.status).toBe(200);
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "loomwright-tpl-")), "x.pdf");
  fs.writeFileSync(file, Buffer.from(await res.arrayBuffer()));
  return /Page size:\s+([\d.]+ x [\d.]+) pts/.exec(
    spawnSync("pdfinfo", [file], { encoding: "utf8" }).stdout,
  )![1]!;
}

describe("marker templates and paper size", () => {
  it("saves a team template from a built-in one, prints with it, refuses layouts that do not fit", async () => {
    const list = await lead.get<{ items: Template[] }>("/api/print/templates");
    const base = list.body.items.find((t) => t.id === "a4-sleeve-6.4")!;
    expect(base.builtIn).toBe(true);
    const { id: _i, builtIn: _b, version: _v, ...body } = base;
    const name = `Bench printer ${Date.now()}`;
    const created = await lead.post<Template>("/api/print/templates", {
      ...body,
      name,
      printerOffsetXMm: 0.4,
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ name, builtIn: false, printerOffsetXMm: 0.4, version: 1 });
    expect((await lead.post("/api/print/templates", { ...body, name })).status).toBe(409);

    // 20 columns of 60 mm do not fit on an A4 page (ISO 216: 210 mm wide).
    const wide = await lead.post<{ error: { message: string } }>("/api/print/templates", {
      ...body,
      name: `${name} wide`,
      columns: 20,
    });
    expect(wide.status).toBe(422);
    expect(wide.body.error.message).toMatch(/wide; the page is 210 mm/);

    // A4 is 595.28 × 841.89 pt (ISO 216, 72 pt per inch).
    expect(
      await pdfPageSize(`/api/projects/${projectId}/markers.pdf?template=${created.body.id}&runs=HR3-010`),
    ).toBe("595.276 x 841.89");
    const stale = await lead.patch(`/api/print/templates/${created.body.id}`, { ...body, name, version: 7 });
    expect(stale.status).toBe(409);
    const builder = await signedIn(baseUrl, "builder@example.test");
    expect((await builder.post("/api/print/templates", { ...body, name: "x" })).status).toBe(403);
    expect((await lead.delete(`/api/print/templates/a4-sleeve-6.4`)).status).toBe(409);
    expect((await lead.delete(`/api/print/templates/${created.body.id}`)).status).toBe(200);
  });

  it("prints cut sheets on the team's paper: US Letter is 612 × 792 pt (ANSI/ASME Y14.1, 8.5 × 11 in)", async () => {
    const plan = await lead.post<{ id: string }>(`/api/projects/${projectId}/plans`);
    expect((await lead.patch("/api/team/page-size", { pageSize: "Letter" })).status).toBe(200);
    expect(await pdfPageSize(`/api/plans/${plan.body.id}/cut-sheet.pdf`)).toBe("612 x 792");
    expect((await lead.patch("/api/team/page-size", { pageSize: "A4" })).status).toBe(200);
    expect(await pdfPageSize(`/api/plans/${plan.body.id}/cut-sheet.pdf`)).toBe("595.276 x 841.89");
    expect((await lead.patch("/api/team/page-size", { pageSize: "A3" })).status).toBe(422);
  });
});
