// The Progress endpoint: runs per bench state, overall and per wire type, scoped to the caller's team.
import { beforeAll, describe, expect, inject, it } from "vitest";
import { Client, signedIn } from "../helpers/http";

const baseUrl = inject("baseUrl");

type Counts = Record<"planned" | "cut" | "marked" | "terminated" | "tested" | "failed", number>;
type Progress = {
  total: number;
  byState: Counts;
  builtPct: number;
  testedPct: number;
  wireTypes: { gauge: string; colour: string; insulation: string | null; total: number; byState: Counts }[];
};

let lead: Client;
let technician: Client;

beforeAll(async () => {
  lead = await signedIn(baseUrl, "lead@example.test");
  technician = await signedIn(baseUrl, "technician@example.test");
});

const sum = (c: Counts) => Object.values(c).reduce((a, b) => a + b, 0);

describe("progress", () => {
  it("counts the demo project's runs per state and per wire type, adding up", async () => {
    const projects = await lead.get<{ items: { id: string; name: string; runCount: number }[] }>(
      "/api/projects",
    );
    const demo = projects.body.items.find((p) => p.name === "Harrow-3")!;
    const r = await technician.get<Progress>(`/api/projects/${demo.id}/progress`);
    expect(r.status).toBe(200);
    expect(r.body.total).toBe(demo.runCount);
    expect(sum(r.body.byState)).toBe(r.body.total);
    expect(r.body.wireTypes.length).toBeGreaterThanOrEqual(12);
    expect(r.body.wireTypes.reduce((s, t) => s + t.total, 0)).toBe(r.body.total);
    for (const t of r.body.wireTypes) expect(sum(t.byState)).toBe(t.total);
  });

  it("follows state changes, with built and tested shares", async () => {
    const p = (
      await lead.post<{ id: string }>("/api/projects", {
        name: `Progress ${Date.now()}`,
        wireIdPrefix: "PG-",
      })
    ).body;
    const mk = (gauge: string, colour: string) => ({
      endA: "A1:1",
      endB: "B1:1",
      gauge,
      colour,
      routedLengthMm: 500,
    });
    const made = await lead.post<{ items: { id: string; version: number }[] }>(`/api/projects/${p.id}/runs`, {
      runs: [mk("18 AWG", "RD"), mk("18 AWG", "RD"), mk("18 AWG", "BK"), mk("10 AWG", "RD")],
    });
    const [a, b, c] = made.body.items;
    const patch = (id: string, body: object) =>
      lead.patch<{ version: number }>(`/api/projects/${p.id}/runs/${id}`, body);
    const a2 = (await patch(a!.id, { version: 1, state: "terminated" })).body;
    await patch(a!.id, { version: a2.version, state: "tested", testKind: "continuity", testValue: 0.01 });
    await patch(b!.id, { version: 1, state: "failed", testKind: "insulation" });
    await patch(c!.id, { version: 1, state: "cut" });

    const r = (await technician.get<Progress>(`/api/projects/${p.id}/progress`)).body;
    expect(r.total).toBe(4);
    expect(r.byState).toEqual({ planned: 1, cut: 1, marked: 0, terminated: 0, tested: 1, failed: 1 });
    expect(r.builtPct).toBe(50);
    expect(r.testedPct).toBe(25);
    // Thickest first: 10 AWG, then 18 AWG by colour.
    expect(r.wireTypes.map((t) => `${t.gauge} ${t.colour} ${t.total}`)).toEqual([
      "10 AWG RD 1",
      "18 AWG BK 1",
      "18 AWG RD 2",
    ]);
    expect(r.wireTypes[2]!.byState).toMatchObject({ tested: 1, failed: 1 });

    const empty = (await lead.post<{ id: string }>("/api/projects", { name: `Progress empty ${Date.now()}` }))
      .body;
    expect((await lead.get<Progress>(`/api/projects/${empty.id}/progress`)).body).toMatchObject({
      total: 0,
      builtPct: 0,
      wireTypes: [],
    });
  });

  it("is closed to anonymous callers and to other teams", async () => {
    const projects = await lead.get<{ items: { id: string }[] }>("/api/projects");
    const id = projects.body.items[0]!.id;
    expect((await new Client(baseUrl).get(`/api/projects/${id}/progress`)).status).toBe(401);
    const outsider = new Client(baseUrl);
    await outsider.post("/api/auth/sign-up", {
      email: `progress-${Date.now()}@example.test`,
      password: "another-long-pw",
      name: "Ide Farrow",
      teamName: "Elsewhere",
    });
    expect((await outsider.get(`/api/projects/${id}/progress`)).status).toBe(404);
  });
});
