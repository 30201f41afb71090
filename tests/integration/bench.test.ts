import { beforeAll, describe, expect, inject, it } from "vitest";
import { randomUUID } from "node:crypto";
import { signedIn, type Client } from "../helpers/http";

const baseUrl = inject("baseUrl");

type Run = {
  id: string;
  wireId: string;
  version: number;
  state: string;
  cutLengthMm: number;
  traceCode: string;
};
type Spool = { id: string; lengthMm: number; lot: string | null; location: string | null; state: string };
type BenchSpool = {
  index: number;
  source: { kind: "shelf"; spoolId: string } | { kind: "putup"; putUpId: string; nominalMm: number };
  cuts: { runId: string; wireId: string; cutLengthMm: number; markerCount: number }[];
  stock: Spool | null;
};
type Bench = {
  status: string;
  wireTypes: { wireTypeId: string; spools: BenchSpool[] }[];
  runs: Record<string, { state: string; version: number; cutFromSpoolId: string | null }>;
};
type Err = { error: { code: string; details?: { current?: Run } } };

let lead: Client;
let builder: Client;
let technician: Client;
let projectId = "";
let planId = "";
let wireTypeId = "";
let shelf: Spool;
let runs: Run[] = [];

const runUrl = (id: string) => `/api/projects/${projectId}/runs/${id}`;
const spoolLength = async (id: string) => (await lead.get<Spool>(`/api/stock/spools/${id}`)).body.lengthMm;

beforeAll(async () => {
  lead = await signedIn(baseUrl, "lead@example.test");
  builder = await signedIn(baseUrl, "builder@example.test");
  technician = await signedIn(baseUrl, "technician@example.test");
  const tag = `BENCH-${Date.now()}`;
  const wt = await lead.post<{ id: string }>("/api/stock/wire-types", {
    gauge: "22 AWG",
    colour: "VT",
    insulation: tag,
  });
  expect(wt.status).toBe(201);
  wireTypeId = wt.body.id;
  const pu = await lead.post("/api/stock/put-ups", {
    wireTypeId,
    nominalLengthMm: 4000,
    priceCents: 900,
    supplierName: "Bench Test Supply",
    supplierPartNo: "BT-22-VT",
  });
  expect(pu.status).toBe(201);
  const sp = await lead.post<Spool>("/api/stock/spools", {
    wireTypeId,
    lengthMm: 4000,
    lot: "LOT-A7",
    location: "Rack 2, shelf B",
  });
  expect(sp.status).toBe(201);
  shelf = sp.body;
  const pr = await lead.post<{ id: string }>("/api/projects", {
    name: `Bench test ${tag}`,
    wireIdPrefix: "BT-",
  });
  projectId = pr.body.id;
  const made = await lead.post<{ items?: Run[] } | Run[]>(`/api/projects/${projectId}/runs`, {
    runs: [1400, 1300, 1200, 1100, 900].map((routedLengthMm, i) => ({
      endA: `TB1:${i + 1}`,
      endB: `X2:${i + 1}`,
      gauge: "22 AWG",
      colour: "VT",
      insulation: tag,
      routedLengthMm,
      endAStripMm: 6,
      endBStripMm: 8,
      endATermination: "ferrule",
    })),
  });
  expect(made.status).toBe(201);
  const list = await lead.get<{ items: Run[] }>(`/api/projects/${projectId}/runs?limit=100`);
  runs = list.body.items;
  expect(runs).toHaveLength(5);
  const plan = await lead.post<{ id: string }>(`/api/projects/${projectId}/plans`);
  expect(plan.status).toBe(201);
  planId = plan.body.id;
  expect((await lead.post(`/api/plans/${planId}/commit`)).status).toBe(200);
});

async function bench(): Promise<Bench> {
  const r = await builder.get<Bench>(`/api/plans/${planId}/bench`);
  expect(r.status).toBe(200);
  return r.body;
}

async function fresh(id: string): Promise<Run> {
  return (await builder.get<Run>(runUrl(id))).body;
}

describe("the bench", () => {
  it("shows the committed plan with the shelf spool and a new put-up to open", async () => {
    const b = await bench();
    expect(b.status).toBe("committed");
    const spools = b.wireTypes.find((w) => w.wireTypeId === wireTypeId)!.spools;
    expect(spools.find((s) => s.source.kind === "shelf")!.stock!.id).toBe(shelf.id);
    const putup = spools.find((s) => s.source.kind === "putup")!;
    expect(putup.stock).toBeNull();
    expect(putup.cuts[0]!.markerCount).toBeGreaterThanOrEqual(2);
  });

  it("records a cut with its spool: the length goes down, who and when are kept, the audit trail says so", async () => {
    const run = runs[0]!;
    const before = await spoolLength(shelf.id);
    const r = await builder.patch<Run>(runUrl(run.id), {
      version: run.version,
      state: "cut",
      spoolId: shelf.id,
      actionId: randomUUID(),
    });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ state: "cut", version: run.version + 1 });
    expect(await spoolLength(shelf.id)).toBe(before - run.cutLengthMm);

    const adj = await lead.get<{ items: { reason: string; userName: string; newLengthMm: number }[] }>(
      `/api/stock/spools/${shelf.id}/adjustments`,
    );
    expect(adj.body.items[0]!.reason).toMatch(
      new RegExp(`^cut ${run.wireId} \\(plan ${planId.slice(0, 8)}\\)$`),
    );
    expect(adj.body.items[0]!.newLengthMm).toBe(before - run.cutLengthMm);

    const trace = await technician.get<{
      cut: { lot: string; location: string; cutByName: string; cutAt: string; takenMm: number };
      history: { action: string; detail: { spool?: { id: string } } }[];
    }>(`/api/trace/${run.traceCode}`);
    expect(trace.status).toBe(200);
    expect(trace.body.cut).toMatchObject({
      lot: "LOT-A7",
      location: "Rack 2, shelf B",
      takenMm: run.cutLengthMm,
    });
    expect(trace.body.cut.cutByName).toBeTruthy();
    expect(Date.now() - Date.parse(trace.body.cut.cutAt)).toBeLessThan(60_000);
    const last = trace.body.history.at(-1)!;
    expect(last.action).toBe("run.state");
    expect(last.detail.spool?.id).toBe(shelf.id);
    expect((await bench()).runs[run.id]).toMatchObject({ state: "cut", cutFromSpoolId: shelf.id });
  });

  it("takes the run on to marked and terminated", async () => {
    let run = await fresh(runs[0]!.id);
    for (const state of ["marked", "terminated"]) {
      const r = await builder.patch<Run>(runUrl(run.id), { version: run.version, state });
      expect(r.status).toBe(200);
      expect(r.body.state).toBe(state);
      run = r.body;
    }
  });

  it("an exact replay of an action id is not applied twice", async () => {
    const run = runs[1]!;
    const before = await spoolLength(shelf.id);
    const body = { version: run.version, state: "cut", spoolId: shelf.id, actionId: randomUUID() };
    const first = await builder.patch<Run>(runUrl(run.id), body);
    expect(first.status).toBe(200);
    const again = await builder.patch<Run>(runUrl(run.id), body);
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ state: "cut", version: first.body.version });
    expect(await spoolLength(shelf.id)).toBe(before - run.cutLengthMm);
    // The same action id on another run is refused.
    const other = runs[2]!;
    expect((await builder.patch(runUrl(other.id), { ...body, version: other.version })).status).toBe(409);
  });

  it("undo (back to planned) restores the spool's length", async () => {
    const run = await fresh(runs[1]!.id);
    const before = await spoolLength(shelf.id);
    const r = await builder.patch<Run>(runUrl(run.id), { version: run.version, state: "planned" });
    expect(r.status).toBe(200);
    expect(await spoolLength(shelf.id)).toBe(before + run.cutLengthMm);
    expect((await bench()).runs[run.id]).toMatchObject({ state: "planned", cutFromSpoolId: null });
  });

  it("a builder sending other fields gets 403, a technician may not cut", async () => {
    const run = await fresh(runs[2]!.id);
    const r = await builder.patch(runUrl(run.id), { version: run.version, state: "cut", circuit: "changed" });
    expect(r.status).toBe(403);
    const t = await technician.patch(runUrl(run.id), {
      version: run.version,
      state: "cut",
      spoolId: shelf.id,
    });
    expect(t.status).toBe(403);
    expect((await fresh(run.id)).version).toBe(run.version);
  });

  it("a stale version gets 409 with the current run and changes nothing", async () => {
    const run = await fresh(runs[2]!.id);
    const before = await spoolLength(shelf.id);
    const ok = await lead.patch<Run>(runUrl(run.id), { version: run.version, notes: "moved the connector" });
    expect(ok.status).toBe(200);
    const r = await builder.patch<Err>(runUrl(run.id), {
      version: run.version,
      state: "cut",
      spoolId: shelf.id,
    });
    expect(r.status).toBe(409);
    expect(r.body.error.details!.current).toMatchObject({
      id: run.id,
      version: ok.body.version,
      state: "planned",
    });
    expect(await spoolLength(shelf.id)).toBe(before);
  });

  it("refuses a spool that is not the team's or not of the run's wire type", async () => {
    const run = await fresh(runs[2]!.id);
    const missing = await builder.patch(runUrl(run.id), {
      version: run.version,
      state: "cut",
      spoolId: randomUUID(),
    });
    expect(missing.status).toBe(404);
    const spools = await lead.get<{ items: (Spool & { wireTypeId: string })[] }>(
      "/api/stock/spools?limit=1000",
    );
    const wrong = spools.body.items.find((s) => s.wireTypeId !== wireTypeId && s.state !== "used_up")!;
    const r = await builder.patch(runUrl(run.id), { version: run.version, state: "cut", spoolId: wrong.id });
    expect(r.status).toBe(422);
    expect((await fresh(run.id)).state).toBe("planned");
  });

  it("opens a new put-up as a shelf spool at its nominal length and cuts from it", async () => {
    const b = await bench();
    const putup = b.wireTypes
      .find((w) => w.wireTypeId === wireTypeId)!
      .spools.find((s) => s.source.kind === "putup")!;
    const url = `/api/plans/${planId}/spools/${putup.index}/open`;
    expect((await technician.post(url, { wireTypeId, lot: "X" })).status).toBe(403);
    expect((await builder.post(url, { wireTypeId })).status).toBe(422);
    const opened = await builder.post<{ created: boolean; spool: Spool }>(url, {
      wireTypeId,
      lot: "LOT-NEW-1",
      location: "Bench 1",
    });
    expect(opened.status).toBe(201);
    expect(opened.body.spool).toMatchObject({
      lengthMm: 4000,
      lot: "LOT-NEW-1",
      location: "Bench 1",
      state: "open",
    });
    const again = await builder.post<{ created: boolean; spool: Spool }>(url, { wireTypeId, lot: "other" });
    expect(again.status).toBe(200);
    expect(again.body.spool.id).toBe(opened.body.spool.id);
    const after = await bench();
    const sp = after.wireTypes
      .find((w) => w.wireTypeId === wireTypeId)!
      .spools.find((s) => s.index === putup.index)!;
    expect(sp.stock!.id).toBe(opened.body.spool.id);

    const run = await fresh(sp.cuts[0]!.runId);
    const r = await builder.patch(runUrl(run.id), {
      version: run.version,
      state: "cut",
      spoolId: sp.stock!.id,
    });
    expect(r.status).toBe(200);
    expect(await spoolLength(sp.stock!.id)).toBe(4000 - run.cutLengthMm);
  });
});
