import { beforeAll, describe, expect, inject, it } from "vitest";
import { signedIn, type Client } from "../helpers/http";

const baseUrl = inject("baseUrl");

type Run = { id: string; wireId: string; version: number; gauge: string; colour: string; state: string };
type Project = { id: string; name: string; version: number; wireIdPrefix: string; archivedAt: string | null };

let lead: Client;
let builder: Client;
let technician: Client;
let project: Project;

const base = { endA: "TB9:1", endB: "X9:2", gauge: "18awg", colour: "white/blue", routedLengthMm: 800 };

beforeAll(async () => {
  lead = await signedIn(baseUrl, "lead@example.test");
  builder = await signedIn(baseUrl, "builder@example.test");
  technician = await signedIn(baseUrl, "technician@example.test");
  const r = await lead.post<Project>("/api/projects", {
    name: `Runs test ${Date.now()}`,
    wireIdPrefix: "RT-",
  });
  expect(r.status).toBe(201);
  project = r.body;
});

describe("projects", () => {
  it("creates with defaults shown, refuses a duplicate name, renames with a version, archives", async () => {
    expect(project).toMatchObject({ wireIdPrefix: "RT-", slackPct: 5, slackMinMm: 50, roundingMm: 5 });
    expect((await lead.post("/api/projects", { name: project.name.toUpperCase() })).status).toBe(409);
    expect((await builder.post("/api/projects", { name: "Not allowed" })).status).toBe(403);

    const renamed = await lead.patch<Project>(`/api/projects/${project.id}`, {
      version: project.version,
      name: `${project.name} (rev B)`,
    });
    expect(renamed.status).toBe(200);
    const stale = await lead.patch<{ error: { code: string; details: { current: Project } } }>(
      `/api/projects/${project.id}`,
      { version: project.version, name: "stale" },
    );
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.current.version).toBe(renamed.body.version);
    project = renamed.body;

    const scrap = (await lead.post<Project>("/api/projects", { name: `Scrap ${Date.now()}` })).body;
    const archived = await lead.delete<Project>(`/api/projects/${scrap.id}?version=${scrap.version}`);
    expect(archived.status).toBe(200);
    expect(archived.body.archivedAt).not.toBeNull();
    const list = await lead.get<{ items: Project[] }>("/api/projects");
    expect(list.body.items.map((p) => p.id)).not.toContain(scrap.id);
  });
});

describe("runs", () => {
  it("creates runs, normalising gauge and colour, and generates wire IDs from the prefix", async () => {
    const one = await lead.post<Run>(`/api/projects/${project.id}/runs`, { ...base, wireId: "RT-007" });
    expect(one.status).toBe(201);
    expect(one.body).toMatchObject({
      wireId: "RT-007",
      gauge: "18 AWG",
      colour: "WHBU",
      state: "planned",
      version: 1,
    });
    const many = await lead.post<{ items: Run[] }>(`/api/projects/${project.id}/runs`, {
      runs: [base, { ...base, endB: "X9:3" }],
    });
    expect(many.status).toBe(201);
    expect(many.body.items.map((r) => r.wireId)).toEqual(["RT-008", "RT-009"]);
  });

  it("gives a new run the project's default drop class unless it names one", async () => {
    const p = (
      await lead.post<Project>("/api/projects", {
        name: `Defaults ${Date.now()}`,
        defaultDropClass: "critical",
      })
    ).body;
    const plain = await lead.post<Run & { dropClass: string }>(`/api/projects/${p.id}/runs`, base);
    expect(plain.body.dropClass).toBe("critical");
    const named = await lead.post<Run & { dropClass: string }>(`/api/projects/${p.id}/runs`, {
      ...base,
      dropClass: "motor",
    });
    expect(named.body.dropClass).toBe("motor");
  });

  it("refuses a wire-ID clash with 409 and writes nothing of the batch", async () => {
    const before = (await lead.get<{ total: number }>(`/api/projects/${project.id}/runs`)).body.total;
    const r = await lead.post<{ error: { code: string } }>(`/api/projects/${project.id}/runs`, {
      runs: [
        { ...base, wireId: "RT-100" },
        { ...base, wireId: "RT-007" },
      ],
    });
    expect(r.status).toBe(409);
    expect((await lead.get<{ total: number }>(`/api/projects/${project.id}/runs`)).body.total).toBe(before);
  });

  it("answers bad fields with 422 naming the field", async () => {
    const r = await lead.post<{ error: { details: { path: string }[] } }>(
      `/api/projects/${project.id}/runs`,
      {
        ...base,
        gauge: "19.5 AWG",
        routedLengthMm: -4,
      },
    );
    expect(r.status).toBe(422);
    expect(r.body.error.details.map((d) => d.path).sort()).toEqual(["gauge", "routedLengthMm"]);
  });

  it("refuses a stale version with 409 and the current record, so no edit is silently lost", async () => {
    const created = (await lead.post<Run>(`/api/projects/${project.id}/runs`, base)).body;
    const url = `/api/projects/${project.id}/runs/${created.id}`;
    const first = await lead.patch<Run>(url, { version: 1, gauge: "16 AWG" });
    expect(first.status).toBe(200);
    expect(first.body.version).toBe(2);
    const second = await lead.patch<{ error: { details: { current: Run } } }>(url, {
      version: 1,
      colour: "RD",
    });
    expect(second.status).toBe(409);
    expect(second.body.error.details.current).toMatchObject({ version: 2, gauge: "16 AWG", colour: "WHBU" });
    const got = await lead.get<Run>(url);
    expect(got.body).toMatchObject({ version: 2, gauge: "16 AWG", colour: "WHBU" });
  });

  it("lets builders and technicians change only the states of their role", async () => {
    const created = (await lead.post<Run>(`/api/projects/${project.id}/runs`, base)).body;
    const url = `/api/projects/${project.id}/runs/${created.id}`;
    expect((await builder.patch(url, { version: 1, gauge: "10 AWG" })).status).toBe(403);
    expect((await builder.patch(url, { version: 1, state: "tested" })).status).toBe(403);
    const cut = await builder.patch<Run>(url, { version: 1, state: "cut" });
    expect(cut.status).toBe(200);
    expect((await technician.patch(url, { version: 2, state: "cut" })).status).toBe(403);
    expect((await technician.patch(url, { version: 2, notes: "x" })).status).toBe(403);
    expect((await builder.delete(url)).status).toBe(403);
    expect((await lead.delete(url)).status).toBe(200);
    expect((await lead.get(url)).status).toBe(404);
  });

  it("checks rules across fields on the merged record", async () => {
    const created = (await lead.post<Run>(`/api/projects/${project.id}/runs`, base)).body;
    const url = `/api/projects/${project.id}/runs/${created.id}`;
    expect((await lead.patch(url, { version: 1, dropClass: "custom" })).status).toBe(422);
    expect((await lead.patch(url, { version: 1, dropClass: "custom", dropLimitPct: 4 })).status).toBe(200);
  });
});
