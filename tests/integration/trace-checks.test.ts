// The trace endpoint computes one run's checks from the runs they depend on, and keeps built views only while the
// project is unchanged: both must give exactly what the whole project's checks and the current records give.
import { beforeAll, describe, expect, inject, it } from "vitest";
import { signedIn, type Client } from "../helpers/http";
import { generateRuns } from "../helpers/generate-runs-csv";

const baseUrl = inject("baseUrl");

type Checks = { wireId: string; verdict: string; reasons: string[] };
type Trace = {
  run: { id: string; wireId: string; state: string; version: number; circuit: string | null };
  project: { name: string };
  checks: Checks | null;
  history: { action: string }[];
};

let lead: Client;
let tech: Client;

beforeAll(async () => {
  lead = await signedIn(baseUrl, "lead@example.test");
  tech = await signedIn(baseUrl, "technician@example.test");
});

async function allCodes(projectId: string) {
  const r = await lead.get<{ items: { wireId: string; traceCode: string }[] }>(
    `/api/projects/${projectId}/runs?limit=1000`,
  );
  return r.body.items;
}

describe("a run's checks on the trace page", () => {
  it("equal the project's checks for every run of the demo and of a generated project with return runs", async () => {
    const projects = await lead.get<{ items: { id: string; name: string }[] }>("/api/projects");
    const demo = projects.body.items.find((p) => p.name === "Harrow-3")!;
    const gen = (
      await lead.post<{ id: string }>("/api/projects", {
        name: `Trace gen ${Date.now()}`,
        wireIdPrefix: "G-",
      })
    ).body;
    const made = await lead.post(`/api/projects/${gen.id}/runs`, { runs: generateRuns(150, 5) });
    expect(made.status).toBe(201);
    for (const projectId of [demo.id, gen.id]) {
      const checks = await lead.get<{ items: Checks[] }>(`/api/projects/${projectId}/checks`);
      const byWire = new Map(checks.body.items.map((c) => [c.wireId, c]));
      const runs = await allCodes(projectId);
      let withReturn = 0;
      for (const r of runs) {
        const t = await tech.get<Trace>(`/api/trace/${r.traceCode}`);
        expect(t.status).toBe(200);
        expect(t.body.checks).toEqual(byWire.get(r.wireId));
        if (t.body.checks?.reasons.some((x) => /return/i.test(x))) withReturn++;
      }
      expect(withReturn).toBeGreaterThan(0);
    }
  }, 120_000);

  it("shows every change at once: the run's own, another run's it depends on, and the project's", async () => {
    const p = (
      await lead.post<{ id: string; version: number }>("/api/projects", { name: `Trace fresh ${Date.now()}` })
    ).body;
    const made = await lead.post<{
      items: { id: string; wireId: string; traceCode: string; version: number }[];
    }>(`/api/projects/${p.id}/runs`, {
      runs: [
        {
          endA: "BAT1:+",
          endB: "M1:+",
          gauge: "10 AWG",
          colour: "RD",
          routedLengthMm: 3000,
          currentA: 20,
          returnKind: "run",
          returnRunWireId: "W002",
          wireId: "W001",
        },
        { endA: "M1:-", endB: "BAT1:-", gauge: "10 AWG", colour: "BK", routedLengthMm: 3000, wireId: "W002" },
      ],
    });
    const [supply, ret] = made.body.items;
    const first = (await tech.get<Trace>(`/api/trace/${supply!.traceCode}`)).body;
    expect(first.run.state).toBe("planned");
    const drop1 = first.checks!.reasons.join(" ");
    // Twice the same: served again, unchanged.
    expect((await tech.get<Trace>(`/api/trace/${supply!.traceCode}`)).body).toEqual(first);

    await lead.patch(`/api/projects/${p.id}/runs/${supply!.id}`, {
      version: 1,
      state: "cut",
      circuit: "Drive feed",
    });
    const second = (await tech.get<Trace>(`/api/trace/${supply!.traceCode}`)).body;
    expect(second.run).toMatchObject({ state: "cut", circuit: "Drive feed", version: 2 });
    expect(second.history.length).toBe(first.history.length + 1);

    // A longer return run changes this run's drop.
    await lead.patch(`/api/projects/${p.id}/runs/${ret!.id}`, { version: 1, routedLengthMm: 9000 });
    const third = (await tech.get<Trace>(`/api/trace/${supply!.traceCode}`)).body;
    expect(third.checks!.reasons.join(" ")).not.toBe(drop1);
    const checks = await lead.get<{ items: Checks[] }>(`/api/projects/${p.id}/checks`);
    expect(third.checks).toEqual(checks.body.items.find((c) => c.wireId === "W001"));

    await lead.patch(`/api/projects/${p.id}`, { version: p.version, name: `Renamed ${Date.now()}` });
    expect((await tech.get<Trace>(`/api/trace/${supply!.traceCode}`)).body.project.name).toMatch(/^Renamed/);
  });
});
