import { describe, expect, inject, it } from "vitest";
import { Client, signedIn } from "../helpers/http";

const baseUrl = inject("baseUrl");

type Trace = {
  run: { wireId: string; traceCode: string; cutLengthMm: number; routedLengthMm: number };
  project: { name: string };
  checks: { verdict: string } | null;
  history: { action: string }[];
  related: { wireId: string }[];
};

describe("trace codes", () => {
  it("resolves a run's code for its team, with checks, history and runs on the same devices", async () => {
    const tech = await signedIn(baseUrl, "technician@example.test");
    const projects = await tech.get<{ items: { id: string; name: string }[] }>("/api/projects");
    // By name: other test files add projects that may sort before it.
    const harrow = projects.body.items.find((p) => p.name === "Harrow-3")!;
    const runs = await tech.get<{ items: { wireId: string; traceCode: string }[] }>(
      `/api/projects/${harrow.id}/runs?limit=1000`,
    );
    const run = runs.body.items.find((r) => r.wireId === "HR3-047")!;
    const r = await tech.get<Trace>(`/api/trace/${run.traceCode}`);
    expect(r.status).toBe(200);
    expect(r.body.run.wireId).toBe("HR3-047");
    expect(r.body.project.name).toBe("Harrow-3");
    expect(r.body.checks?.verdict).toBe("fail");
    expect(r.body.run.cutLengthMm).toBeGreaterThan(r.body.run.routedLengthMm);
    // HR3-047 runs FB1:5 → BCN1:+; the beacon return and other fuse-block outputs share those devices.
    expect(r.body.related.map((x) => x.wireId)).toEqual(expect.arrayContaining(["HR3-048", "HR3-017"]));

    // What a person types or a scanner reads: lower case, a full trace URL.
    expect((await tech.get<Trace>(`/api/trace/${run.traceCode.toLowerCase()}`)).body.run.wireId).toBe(
      "HR3-047",
    );
    const url = encodeURIComponent(`${baseUrl}/r/${run.traceCode}`);
    expect((await tech.get<Trace>(`/api/trace/${url}`)).status).toBe(200);
  });

  it("never shows a run to another team or to anonymous callers", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const projects = await lead.get<{ items: { id: string; name: string }[] }>("/api/projects");
    const harrow = projects.body.items.find((p) => p.name === "Harrow-3")!;
    const runs = await lead.get<{ items: { traceCode: string }[] }>(
      `/api/projects/${harrow.id}/runs?limit=1`,
    );
    const code = runs.body.items[0]!.traceCode;
    expect((await new Client(baseUrl).get(`/api/trace/${code}`)).status).toBe(401);
    const outsider = new Client(baseUrl);
    await outsider.post("/api/auth/sign-up", {
      email: `trace-${Date.now()}@example.test`,
      password: "another-long-pw",
      name: "Wren Oake",
      teamName: "Elsewhere",
    });
    const r = await outsider.get(`/api/trace/${code}`);
    expect(r.status).toBe(404);
    expect(JSON.stringify(r.body)).not.toMatch(/HR3-/);
    expect((await lead.get(`/api/trace/NOTACODE`)).status).toBe(404);
  });
});
