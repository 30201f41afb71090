// Test results and the bench-state rules around them: who may record what, the run_test rows and audit events
// written in the same transaction, stale versions, sending a failed run back, and what the lists and trace show.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { makeKnex } from "@/lib/db/knex";
import { signedIn, type Client } from "../helpers/http";
import { testDatabaseUrl } from "../helpers/db";

const baseUrl = inject("baseUrl");

type Test = {
  kind: string;
  passed: boolean;
  value: number | null;
  note: string | null;
  testedByName: string;
};
type Run = {
  id: string;
  wireId: string;
  version: number;
  state: string;
  traceCode: string;
  lastTest: Test | null;
};
type ErrorBody = { error: { code: string; message: string; details?: { current?: Run } } };
type AuditRow = { action: string; detail: Record<string, unknown>; actor_user_id: string };

let lead: Client;
let builder: Client;
let technician: Client;
let projectId: string;
const k = makeKnex(testDatabaseUrl(), { camel: false, poolMax: 2 });

const base = { endA: "PSU1:+", endB: "TB4:1", gauge: "16 AWG", colour: "RD", routedLengthMm: 1200 };

async function newRun(state = "terminated"): Promise<Run> {
  const r = await lead.post<Run>(`/api/projects/${projectId}/runs`, base);
  expect(r.status).toBe(201);
  if (state === "planned") return r.body;
  const s = await lead.patch<Run>(`/api/projects/${projectId}/runs/${r.body.id}`, { version: 1, state });
  expect(s.status).toBe(200);
  return s.body;
}

const url = (run: Run) => `/api/projects/${projectId}/runs/${run.id}`;
const events = async (run: Run) =>
  (await k("audit_events")
    .where({ entity_id: run.id })
    .orderBy("id")
    .select("action", "detail", "actor_user_id")) as AuditRow[];
const testRows = async (run: Run) =>
  (await k("run_test").where({ run_id: run.id }).orderBy("id").select("*")) as {
    kind: string;
    passed: boolean;
    value: number | null;
    note: string | null;
    run_version: number;
  }[];

beforeAll(async () => {
  lead = await signedIn(baseUrl, "lead@example.test");
  builder = await signedIn(baseUrl, "builder@example.test");
  technician = await signedIn(baseUrl, "technician@example.test");
  const p = await lead.post<{ id: string }>("/api/projects", {
    name: `Tests ${Date.now()}`,
    wireIdPrefix: "TT-",
  });
  projectId = p.body.id;
});
afterAll(async () => {
  await k.destroy();
});

describe("recording test results", () => {
  it("a technician's pass stores the result, the state and one run.test event in one change", async () => {
    const run = await newRun();
    const r = await technician.patch<Run>(url(run), {
      version: run.version,
      state: "tested",
      testKind: "continuity",
      testValue: 0.031,
      note: "both ends pulled",
    });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ state: "tested", version: run.version + 1 });
    expect(r.body.lastTest).toMatchObject({
      kind: "continuity",
      passed: true,
      value: 0.031,
      note: "both ends pulled",
      testedByName: expect.any(String),
    });
    const rows = await testRows(run);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      kind: "continuity",
      passed: true,
      value: 0.031,
      run_version: run.version + 1,
    });
    const ev = (await events(run)).at(-1)!;
    expect(ev.action).toBe("run.test");
    expect(ev.detail).toMatchObject({
      changed: { state: { from: "terminated", to: "tested" } },
      test: { kind: "continuity", passed: true, value: 0.031, unit: "Ω", note: "both ends pulled" },
    });
  });

  it("a fail sets failed; a value is optional; a second test on the same state is kept too", async () => {
    const run = await newRun();
    const f = await technician.patch<Run>(url(run), {
      version: run.version,
      state: "failed",
      testKind: "insulation",
      testValue: 0.4,
    });
    expect(f.status).toBe(200);
    expect(f.body.state).toBe("failed");
    const again = await technician.patch<Run>(url(run), {
      version: f.body.version,
      state: "failed",
      testKind: "continuity",
      testValue: null,
    });
    expect(again.status).toBe(200);
    expect(again.body.lastTest).toMatchObject({ kind: "continuity", passed: false, value: null });
    expect((await testRows(run)).map((t) => [t.kind, t.passed, t.value])).toEqual([
      ["insulation", false, 0.4],
      ["continuity", false, null],
    ]);
    const last = (await events(run)).at(-1)!;
    expect(last.action).toBe("run.test");
    expect(last.detail.changed).toEqual({});
    expect(last.detail.test).toMatchObject({ unit: "Ω" });
  });

  it("refuses a stale version with 409 and the current run, and writes no result", async () => {
    const run = await newRun();
    const first = await technician.patch<Run>(url(run), {
      version: run.version,
      state: "tested",
      testKind: "continuity",
      testValue: 0.02,
    });
    expect(first.status).toBe(200);
    const before = (await events(run)).length;
    const stale = await lead.patch<ErrorBody>(url(run), {
      version: run.version,
      state: "failed",
      testKind: "insulation",
      testValue: 0.1,
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.details?.current).toMatchObject({ state: "tested", version: run.version + 1 });
    expect(await testRows(run)).toHaveLength(1);
    expect(await events(run)).toHaveLength(before);
  });

  it("limits what each role may send with a state", async () => {
    const run = await newRun();
    const v = run.version;
    // Technicians: a test kind, value or note only with tested/failed; no other field.
    expect((await technician.patch(url(run), { version: v, testValue: 1 })).status).toBe(403);
    expect((await technician.patch(url(run), { version: v, state: "terminated", note: "x" })).status).toBe(
      403,
    );
    expect(
      (await technician.patch(url(run), { version: v, state: "terminated", testKind: "continuity" })).status,
    ).toBe(403);
    expect((await technician.patch(url(run), { version: v, state: "tested", gauge: "10 AWG" })).status).toBe(
      403,
    );
    // Anyone: a test state needs its kind; a kind or value needs a test state.
    expect((await technician.patch<ErrorBody>(url(run), { version: v, state: "tested" })).status).toBe(422);
    expect((await lead.patch(url(run), { version: v, state: "failed" })).status).toBe(422);
    expect((await lead.patch(url(run), { version: v, state: "cut", testKind: "continuity" })).status).toBe(
      422,
    );
    expect((await lead.patch(url(run), { version: v, state: "tested", testKind: "resistance" })).status).toBe(
      422,
    );
    expect(
      (await lead.patch(url(run), { version: v, state: "tested", testKind: "continuity", testValue: -1 }))
        .status,
    ).toBe(422);
    // Builders: a note with a bench state, nothing of a test.
    expect((await builder.patch(url(run), { version: v, note: "alone" })).status).toBe(403);
    expect(
      (await builder.patch(url(run), { version: v, state: "terminated", testKind: "continuity" })).status,
    ).toBe(403);
    expect(
      (await builder.patch(url(run), { version: v, state: "tested", testKind: "continuity" })).status,
    ).toBe(403);
    // Nothing refused changed anything.
    expect((await lead.get<Run>(url(run))).body.version).toBe(v);
    expect(await testRows(run)).toHaveLength(0);

    const noted = await builder.patch<Run>(url(run), {
      version: v,
      state: "marked",
      note: "sleeve re-shrunk",
    });
    expect(noted.status).toBe(200);
    const ev = (await events(run)).at(-1)!;
    expect(ev.action).toBe("run.state");
    expect(ev.detail).toMatchObject({
      changed: { state: { from: "terminated", to: "marked" } },
      note: "sleeve re-shrunk",
    });
  });
});

describe("sending a failed run back to the bench", () => {
  it("technician and lead send a failed run to planned or cut; builders leave tested and failed runs alone", async () => {
    const run = await newRun();
    const failed = (
      await technician.patch<Run>(url(run), { version: run.version, state: "failed", testKind: "continuity" })
    ).body;
    expect((await builder.patch(url(run), { version: failed.version, state: "cut" })).status).toBe(403);
    const back = await technician.patch<Run>(url(run), { version: failed.version, state: "planned" });
    expect(back.status).toBe(200);
    expect(back.body.state).toBe("planned");
    const ev = (await events(run)).at(-1)!;
    expect(ev).toMatchObject({
      action: "run.state",
      detail: { changed: { state: { from: "failed", to: "planned" } } },
    });
    // The failed result stays on record.
    expect(back.body.lastTest).toMatchObject({ passed: false });

    // A technician sends back only a failed run.
    const cut = await builder.patch<Run>(url(run), { version: back.body.version, state: "cut" });
    expect(cut.status).toBe(200);
    expect((await technician.patch(url(run), { version: cut.body.version, state: "planned" })).status).toBe(
      403,
    );

    // The lead may send a failed run to cut; a builder may not move a tested run.
    const run2 = await newRun();
    const f2 = (
      await lead.patch<Run>(url(run2), { version: run2.version, state: "failed", testKind: "insulation" })
    ).body;
    const c2 = await lead.patch<Run>(url(run2), { version: f2.version, state: "cut" });
    expect(c2.status).toBe(200);
    const run3 = await newRun();
    const t3 = (
      await technician.patch<Run>(url(run3), {
        version: run3.version,
        state: "tested",
        testKind: "continuity",
      })
    ).body;
    expect((await builder.patch(url(run3), { version: t3.version, state: "terminated" })).status).toBe(403);
    expect((await technician.patch(url(run3), { version: t3.version, state: "terminated" })).status).toBe(
      200,
    );
  });

  it("bulk edits never record a test and keep the same state rules", async () => {
    const a = await newRun();
    const b = await newRun();
    const bulk = `/api/projects/${projectId}/runs/bulk`;
    const items = [a, b].map((r) => ({ id: r.id, version: r.version }));
    expect((await lead.post(bulk, { items, changes: { state: "tested" } })).status).toBe(422);
    expect((await technician.post(bulk, { items, changes: { state: "failed" } })).status).toBe(422);
    const t = (
      await technician.patch<Run>(url(a), { version: a.version, state: "tested", testKind: "continuity" })
    ).body;
    const refused = await builder.post<ErrorBody>(bulk, {
      items: [
        { id: a.id, version: t.version },
        { id: b.id, version: b.version },
      ],
      changes: { state: "cut" },
    });
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toContain(a.wireId);
    expect((await lead.get<Run>(url(b))).body.state).toBe("terminated");
  });
});

describe("where results show", () => {
  it("the runs list and a single run carry the newest result; the trace shows the history newest first", async () => {
    const run = await newRun();
    const p = (
      await technician.patch<Run>(url(run), {
        version: run.version,
        state: "failed",
        testKind: "continuity",
        testValue: 12,
      })
    ).body;
    await technician.patch(url(run), {
      version: p.version,
      state: "tested",
      testKind: "continuity",
      testValue: 0.03,
    });
    const list = await lead.get<{ items: Run[] }>(`/api/projects/${projectId}/runs?limit=1000`);
    const row = list.body.items.find((r) => r.id === run.id)!;
    expect(row.lastTest).toMatchObject({ passed: true, value: 0.03 });
    expect(list.body.items.find((r) => r.lastTest === null)).toBeTruthy();
    expect((await builder.get<Run>(url(run))).body.lastTest).toMatchObject({ passed: true });

    const trace = await builder.get<{ run: Run; tests: Test[]; history: { action: string }[] }>(
      `/api/trace/${run.traceCode}`,
    );
    expect(trace.status).toBe(200);
    expect(trace.body.run).toMatchObject({ state: "tested", lastTest: { passed: true } });
    expect(trace.body.tests.map((t) => [t.passed, t.value])).toEqual([
      [true, 0.03],
      [false, 12],
    ]);
    expect(trace.body.history.filter((h) => h.action === "run.test")).toHaveLength(2);
  });
});
