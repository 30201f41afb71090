import { beforeAll, describe, expect, inject, it } from "vitest";
import { signedIn, type Client } from "../helpers/http";

const baseUrl = inject("baseUrl");

type Check = {
  wireId: string;
  verdict: "pass" | "warn" | "fail";
  reasons: string[];
  fuseVerdict: string;
  dropPct: number | null;
  loopResistanceOhm: number | null;
  lossW: number | null;
  suggestedGauge: string | null;
  seriesResistorOhm: number | null;
  seriesResistorW: number | null;
};
type Checks = {
  summary: { runCount: number; pass: number; warn: number; fail: number; totalLossW: number };
  cautions: string[];
  items: Check[];
  total: number;
};

let tech: Client;
let projectId: string;

beforeAll(async () => {
  tech = await signedIn(baseUrl, "technician@example.test");
  const list = await tech.get<{ items: { id: string; name: string }[] }>("/api/projects");
  projectId = list.body.items.find((p) => p.name === "Harrow-3")!.id;
});

describe("checks of the demo project", () => {
  it("checks every run, sums up, and carries the cautions", async () => {
    const r = await tech.get<Checks>(`/api/projects/${projectId}/checks`);
    expect(r.status).toBe(200);
    const { summary, items, cautions } = r.body;
    expect(summary.runCount).toBe(items.length);
    expect(summary.pass + summary.warn + summary.fail).toBe(summary.runCount);
    // A run's lossW includes its return conductor, so a feed and its return count the pair's loss twice;
    // the project total counts each conductor once: it lies between the largest run and the plain sum.
    const sum = items.reduce((s, c) => s + (c.lossW ?? 0), 0);
    const largest = Math.max(...items.map((c) => c.lossW ?? 0));
    expect(summary.totalLossW).toBeGreaterThanOrEqual(largest);
    expect(summary.totalLossW).toBeLessThan(sum);
    expect(cautions.join(" ")).toMatch(/local codes/i);
    expect(cautions.join(" ")).toMatch(/fire/i);
    for (const c of items) expect(c.reasons.length).toBeGreaterThan(0);
  });

  it("fails the beacon feed whose 25 A fuse is larger than 18 AWG can carry, naming the rule", async () => {
    const r = await tech.get<Checks>(`/api/projects/${projectId}/checks?verdict=fail`);
    const beacon = r.body.items.find((c) => c.wireId === "HR3-047");
    expect(beacon).toBeDefined();
    expect(beacon!.fuseVerdict).not.toBe("ok");
    // ABYC E-11 / 33 CFR 183.425: the fuse protects the wire; the allowance is the next size up to 150 %.
    expect(beacon!.reasons.join(" ")).toMatch(/fuse/i);
    expect(beacon!.reasons.join(" ")).toMatch(/ABYC|183\.425/);
    expect(r.body.items.every((c) => c.verdict === "fail")).toBe(true);
  });

  it("suggests a series resistor for the status LEDs", async () => {
    const r = await tech.get<Checks>(`/api/projects/${projectId}/checks`);
    const led = r.body.items.find((c) => c.wireId === "HR3-049")!;
    // (24 V − 2.1 V) / 20 mA = 1095 Ω → next E12 value up is 1200 Ω (IEC 60063 E12).
    expect(led.seriesResistorOhm).toBe(1200);
    // 1200 Ω at (21.9 V / 1200 Ω)² × 1200 Ω = 0.40 W; ≥ 2× margin → 1 W (common practice).
    expect(led.seriesResistorW).toBe(1);
  });

  it("recomputes when a run changes", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const runs = await lead.get<{ items: { id: string; wireId: string; version: number; fuseA: number }[] }>(
      `/api/projects/${projectId}/runs?limit=1000`,
    );
    const beacon = runs.body.items.find((x) => x.wireId === "HR3-047")!;
    const fixed = await lead.patch(`/api/projects/${projectId}/runs/${beacon.id}`, {
      version: beacon.version,
      fuseA: 10,
    });
    expect(fixed.status).toBe(200);
    const r = await tech.get<Checks>(`/api/projects/${projectId}/checks`);
    expect(r.body.items.find((c) => c.wireId === "HR3-047")!.fuseVerdict).toBe("ok");
    await lead.patch(`/api/projects/${projectId}/runs/${beacon.id}`, {
      version: beacon.version + 1,
      fuseA: 25,
    });
  });

  it("pages and refuses a foreign team", async () => {
    const page = await tech.get<Checks>(`/api/projects/${projectId}/checks?limit=5&offset=5`);
    expect(page.body.items).toHaveLength(5);
    expect(page.body.total).toBeGreaterThan(50);
    expect((await tech.get(`/api/projects/00000000-0000-4000-8000-000000000000/checks`)).status).toBe(404);
  });
});
