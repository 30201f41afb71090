import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { Client, signedIn } from "../helpers/http";
import { waitForMail } from "../helpers/mail";

const baseUrl = inject("baseUrl");

type PlanResp = {
  id: string;
  status: string;
  stale: { changed: string[]; added: string[]; removed: string[] };
  plan: {
    cutCount: number;
    costCents: number;
    lowerBoundCents: number;
    gapPct: number | null;
    wireTypes: {
      wireTypeId: string;
      spools: {
        source: { kind: string; spoolId?: string };
        usableMm: number;
        usedMm: number;
        leftoverMm: number;
        keep: boolean;
        cuts: { runId: string; wireId: string; cutLengthMm: number }[];
      }[];
    }[];
    purchases: { count: number; totalCents: number }[];
    unplaced: { runId: string; reason: string }[];
  };
};

let lead: Client;
let projectId = "";
let runIds: string[] = [];
// A team of its own for the tests that commit, so the demo shelf the other tests read stays as seeded.
let own: Client;
let ownProjectId = "";

beforeAll(async () => {
  lead = await signedIn(baseUrl, "lead@example.test");
  const projects = await lead.get<{ items: { id: string; name: string }[] }>("/api/projects");
  projectId = projects.body.items.find((p) => p.name === "Harrow-3")!.id;
  const runs = await lead.get<{ items: { id: string }[] }>(`/api/projects/${projectId}/runs?limit=1000`);
  runIds = runs.body.items.map((r) => r.id);

  own = new Client(baseUrl);
  expect(
    (
      await own.post("/api/auth/sign-up", {
        email: `plans-${Date.now()}@example.test`,
        password: "plans-test-password",
        name: "Sol Reed",
        teamName: "Plan Test Works",
      })
    ).status,
  ).toBe(201);
  const wt = await own.post<{ id: string }>("/api/stock/wire-types", {
    gauge: "18 AWG",
    colour: "RD",
    insulation: "UL 1007",
  });
  expect(wt.status).toBe(201);
  await own.post("/api/stock/put-ups", {
    wireTypeId: wt.body.id,
    nominalLengthMm: 7620,
    priceCents: 1250,
    supplierName: "Test Supply",
    supplierPartNo: "TS-18-RD-25",
  });
  for (const [lot, lengthMm] of [
    ["LOT-A", 3000],
    ["LOT-B", 2600],
  ] as const)
    await own.post("/api/stock/spools", { wireTypeId: wt.body.id, lengthMm, lot, location: "Shelf 1" });
  ownProjectId = (await own.post<{ id: string }>("/api/projects", { name: "Plan test", wireIdPrefix: "PT-" }))
    .body.id;
  const lengths = [2400, 1800, 1500, 1200, 900, 700, 2200, 400];
  const made = await own.post(`/api/projects/${ownProjectId}/runs`, {
    runs: lengths.map((routedLengthMm, i) => ({
      endA: `TB1:${i + 1}`,
      endB: `X1:${i + 1}`,
      gauge: "18 AWG",
      colour: "RD",
      insulation: "UL 1007",
      routedLengthMm,
    })),
  });
  expect(made.status).toBe(201);
});

async function makePlan(c: Client = own, pid: string = ownProjectId): Promise<PlanResp> {
  const r = await c.post<PlanResp>(`/api/projects/${pid}/plans`);
  expect(r.status).toBe(201);
  return r.body;
}

describe("spool plans of the demo project", () => {
  it("places every cut exactly once or says why not, within each spool's length, cost at or above the bound", async () => {
    const p = await makePlan(lead, projectId);
    const placed = p.plan.wireTypes.flatMap((w) => w.spools.flatMap((s) => s.cuts.map((c) => c.runId)));
    const unplaced = p.plan.unplaced.map((u) => u.runId);
    expect([...placed, ...unplaced].sort()).toEqual([...runIds].sort());
    expect(new Set(placed).size).toBe(placed.length);
    for (const w of p.plan.wireTypes)
      for (const s of w.spools) {
        const used = s.cuts.reduce((a, c) => a + c.cutLengthMm, 0);
        expect(used).toBe(s.usedMm);
        expect(used).toBeLessThanOrEqual(s.usableMm);
        expect(s.leftoverMm).toBe(s.usableMm - used);
        // Cutting order: longest first (common practice).
        const lengths = s.cuts.map((c) => c.cutLengthMm);
        expect([...lengths].sort((a, b) => b - a)).toEqual(lengths);
      }
    expect(p.plan.costCents).toBeGreaterThanOrEqual(p.plan.lowerBoundCents);
    expect(p.plan.costCents).toBe(p.plan.purchases.reduce((s, x) => s + x.totalCents, 0));
    // The demo shelf holds remnants, so some cuts go on shelf spools at no cost.
    expect(p.plan.wireTypes.some((w) => w.spools.some((s) => s.source.kind === "shelf"))).toBe(true);
    expect(p.stale).toEqual({ changed: [], added: [], removed: [] });
  });

  it("two commits racing for the same shelf spool: exactly one wins, the other gets 409", async () => {
    const a = await makePlan();
    const b = await makePlan();
    expect(a.plan.wireTypes.some((w) => w.spools.some((s) => s.source.kind === "shelf"))).toBe(true);
    const [ra, rb] = await Promise.all([
      own.post(`/api/plans/${a.id}/commit`),
      own.post(`/api/plans/${b.id}/commit`),
    ]);
    expect([ra.status, rb.status].sort()).toEqual([200, 409]);
    const winner = ra.status === 200 ? a : b;
    const shelf = winner.plan.wireTypes.flatMap((w) =>
      w.spools.filter((s) => s.source.kind === "shelf").map((s) => s.source.spoolId!),
    );
    for (const id of shelf) {
      const s = await own.get<{ state: string }>(`/api/stock/spools/${id}`);
      expect(s.body.state).toBe("reserved");
    }
    expect((await own.post(`/api/plans/${winner.id}/commit`)).status).toBe(409);
  });

  it("shows itself stale when a run changes, and refuses to commit", async () => {
    const p = await makePlan();
    const run = (
      await own.get<{ items: { id: string; wireId: string; version: number; routedLengthMm: number }[] }>(
        `/api/projects/${ownProjectId}/runs?limit=1`,
      )
    ).body.items[0]!;
    await own.patch(`/api/projects/${ownProjectId}/runs/${run.id}`, {
      version: run.version,
      routedLengthMm: run.routedLengthMm + 10,
    });
    const got = await own.get<PlanResp>(`/api/plans/${p.id}`);
    expect(got.body.stale.changed).toEqual([run.wireId]);
    expect((await own.post(`/api/plans/${p.id}/commit`)).status).toBe(409);
  });

  it("gives the purchase list as CSV and mails it with the list attached", async () => {
    const p = await makePlan(lead, projectId);
    const csv = await fetch(`${baseUrl}/api/plans/${p.id}/purchases?format=csv`, {
      headers: { cookie: lead.cookieHeader() },
    });
    const text = await csv.text();
    expect(text.split("\r\n")[0]).toBe(
      "supplier,partNumber,wireType,putUpLengthM,putUpLengthFt,quantity,unitPrice,total,currency",
    );
    const to = `buyer-${Date.now()}@example.test`;
    const sent = await lead.post(`/api/plans/${p.id}/purchase-mail`, { to });
    expect(sent.status).toBe(202);
    const mail = await waitForMail(baseUrl, to);
    expect(mail.subject).toMatch(/Purchase list — Harrow-3/);
    const builder = await signedIn(baseUrl, "builder@example.test");
    expect((await builder.post(`/api/plans/${p.id}/purchase-mail`, { to })).status).toBe(403);
    expect((await lead.post(`/api/plans/${p.id}/purchase-mail`, { to: "not an address" })).status).toBe(422);
  });

  it("prints a cut sheet that lists every cut exactly once, with numbered pages and embedded fonts", async () => {
    const p = await makePlan(lead, projectId);
    const res = await fetch(`${baseUrl}/api/plans/${p.id}/cut-sheet.pdf`, {
      headers: { cookie: lead.cookieHeader() },
    });
    expect(res.status).toBe(200);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "loomwright-cutsheet-"));
    const file = path.join(dir, "sheet.pdf");
    fs.writeFileSync(file, Buffer.from(await res.arrayBuffer()));
    const text = spawnSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" }).stdout;
    const placed = p.plan.wireTypes.flatMap((w) => w.spools.flatMap((s) => s.cuts.map((c) => c.wireId)));
    for (const w of placed) expect(text.split(w).length - 1, `${w} on the cut sheet`).toBe(1);
    expect(text).toMatch(/page 1 of \d+/i);
    expect(spawnSync("pdffonts", [file], { encoding: "utf8" }).stdout).toMatch(/yes\s+yes/);
    fs.rmSync(dir, { recursive: true, force: true });
  });
});
