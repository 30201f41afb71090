// Stock API against the running app: wire types, put-ups, shelf spools, length adjustments, roles, team isolation,
// and the project's unmatched wire types.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { makeKnex } from "@/lib/db/knex";
import { Client, signedIn } from "../helpers/http";
import { deleteRuns, insertRun, testDatabaseUrl } from "../helpers/db";

const baseUrl = inject("baseUrl");

type Err = { error: { code: string; message: string; details?: unknown } };
type PageOf<T> = { items: T[]; total: number; limit: number; offset: number };
type WireType = {
  id: string;
  gauge: string;
  colour: string;
  insulation: string | null;
  conductorMaterial: string;
  tinned: boolean;
  outerDiameterMm: number | null;
  insulationTempC: number | null;
  notes: string | null;
  shelfSpoolCount: number;
  shelfLengthMm: number;
  openLengthMm: number;
  putUpCount: number;
  activePutUpLengthsMm: number[];
};
type PutUp = {
  id: string;
  wireTypeId: string;
  nominalLengthMm: number;
  priceCents: number;
  currency: string;
  supplierName: string;
  supplierPartNo: string | null;
  active: boolean;
  pricePerMetreCents: number;
  gauge: string;
};
type Spool = {
  id: string;
  wireTypeId: string;
  lengthMm: number;
  initialLengthMm: number;
  lot: string | null;
  location: string | null;
  state: string;
  version: number;
  originNote: string | null;
  sourcePutUpId: string | null;
};
type Adjustment = {
  id: number;
  userId: string;
  userName: string;
  oldLengthMm: number;
  newLengthMm: number;
  reason: string;
};
type Unmatched = {
  gauge: string;
  colour: string;
  insulation: string | null;
  reason: string;
  runCount: number;
  routedLengthMm: number;
  wireIds: string[];
};

let lead: Client;
let builder: Client;
let technician: Client;
let projectId: string;
const k = makeKnex(testDatabaseUrl(), { camel: true, poolMax: 2 });

async function demoWireType(gauge: string, colour: string, insulation: string): Promise<WireType> {
  const r = await lead.get<PageOf<WireType>>(
    `/api/stock/wire-types?gauge=${encodeURIComponent(gauge)}&colour=${colour}&limit=50`,
  );
  const w = r.body.items.find((i) => i.insulation === insulation);
  if (!w) throw new Error(`demo wire type ${gauge} ${colour} ${insulation} missing`);
  return w;
}

async function auditFor(entityId: string, action: string) {
  return (await k("auditEvents").where({ entityId, action }).orderBy("id", "desc")) as {
    actorUserId: string | null;
    detail: Record<string, unknown>;
  }[];
}

beforeAll(async () => {
  [lead, builder, technician] = await Promise.all([
    signedIn(baseUrl, "lead@example.test"),
    signedIn(baseUrl, "builder@example.test"),
    signedIn(baseUrl, "technician@example.test"),
  ]);
  const projects = await lead.get<{ items: { id: string; name: string }[] }>("/api/projects");
  projectId = projects.body.items.find((p) => p.name === "Harrow-3")!.id;
});

afterAll(async () => {
  await k.destroy();
});

describe("wire types", () => {
  it("lists the demo wire types in pages, with shelf totals and put-up lengths", async () => {
    const page = await builder.get<PageOf<WireType>>("/api/stock/wire-types?limit=10&offset=5");
    expect(page.status).toBe(200);
    expect(page.body).toMatchObject({ limit: 10, offset: 5 });
    expect(page.body.items).toHaveLength(10);
    expect(page.body.total).toBeGreaterThanOrEqual(30);

    const bk22 = await demoWireType("22 AWG", "BK", "UL 1007");
    expect(bk22).toMatchObject({
      conductorMaterial: "copper",
      tinned: false,
      outerDiameterMm: 1.6, // electrical.md §8 default for UL 1007 22 AWG
      insulationTempC: 80,
      shelfSpoolCount: 1,
      shelfLengthMm: 18420,
      openLengthMm: 18420,
      // 25, 50, 100, 500, 1000 ft at 304.8 mm per foot
      activePutUpLengthsMm: [7620, 15240, 30480, 152400, 304800],
    });
    // Thickest first: the 4 AWG battery cable leads the list.
    const first = await lead.get<PageOf<WireType>>("/api/stock/wire-types?limit=1");
    expect(first.body.items[0]!.gauge).toBe("4 AWG");
    expect((await lead.get("/api/stock/wire-types?limit=501")).status).toBe(422);
  });

  let created: WireType;

  it("creates a wire type with the gauge and colour normalised, and audits it", async () => {
    const r = await lead.post<WireType>("/api/stock/wire-types", {
      gauge: "14",
      colour: "green/yellow",
      insulation: "  ul   1015 ",
      outerDiameterMm: "3.5",
      insulationTempC: 105,
      tinned: true,
    });
    expect(r.status).toBe(201);
    created = r.body;
    expect(created).toMatchObject({
      gauge: "14 AWG",
      colour: "GNYE",
      insulation: "ul 1015",
      outerDiameterMm: 3.5,
      insulationTempC: 105,
      tinned: true,
      shelfSpoolCount: 0,
      putUpCount: 0,
    });
    const audit = await auditFor(created.id, "wire_type.create");
    expect(audit).toHaveLength(1);
    expect(audit[0]!.actorUserId).toBe("demo-lead-0001");
  });

  it("refuses a duplicate wire type (insulation compared without case) with 409", async () => {
    const r = await lead.post<Err>("/api/stock/wire-types", {
      gauge: "14 AWG",
      colour: "GNYE",
      insulation: "UL 1015",
    });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/already exists/);
    expect(r.body.error.details).toEqual({ existingId: created.id });
    // The same gauge and colour in another spec is another stock.
    const other = await lead.post<WireType>("/api/stock/wire-types", {
      gauge: "14 AWG",
      colour: "GNYE",
      insulation: "SAE J1128 TXL",
    });
    expect(other.status).toBe(201);
    // Renaming it onto the first one's spec is a duplicate too.
    const clash = await lead.patch<Err>(`/api/stock/wire-types/${other.body.id}`, { insulation: "UL 1015" });
    expect(clash.status).toBe(409);
    expect((await lead.delete(`/api/stock/wire-types/${other.body.id}`)).status).toBe(200);
  });

  it.each([
    [{ gauge: "37 AWG", colour: "RD" }, "gauge", /outside the supported AWG range/],
    [{ gauge: "0.8 mm²", colour: "RD" }, "gauge", /not a standard metric size/],
    [{ gauge: "", colour: "RD" }, "gauge", /empty/],
    [{ gauge: "18 AWG", colour: "mauve" }, "colour", /IEC 60757/],
    [{ gauge: "18 AWG", colour: "RDRD" }, "colour", /same colour twice/],
    [{ gauge: "18 AWG", colour: "RD", outerDiameterMm: -1 }, "outerDiameterMm", /more than 0 mm/],
    [{ gauge: "18 AWG", colour: "RD", outerDiameterMm: "thick" }, "outerDiameterMm", /outer diameter/],
    [
      { gauge: "18 AWG", colour: "RD", conductorMaterial: "gold" },
      "conductorMaterial",
      /copper or aluminium/,
    ],
  ])("answers 422 with a message for a bad wire type (%#)", async (body, path, message) => {
    const r = await lead.post<Err & { error: { details: { path: string; message: string }[] } }>(
      "/api/stock/wire-types",
      body,
    );
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe("invalid");
    const issue = r.body.error.details.find((d) => d.path === path);
    expect(issue?.message).toMatch(message);
    expect(r.body.error.message).toMatch(message);
  });

  it("reads, edits and deletes one wire type; deleting one with spools is refused", async () => {
    const one = await technician.get<WireType>(`/api/stock/wire-types/${created.id}`);
    expect(one.status).toBe(200);
    expect(one.body.gauge).toBe("14 AWG");

    const edited = await lead.patch<WireType>(`/api/stock/wire-types/${created.id}`, {
      notes: "For the charge-port bond",
      outerDiameterMm: null,
    });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({
      notes: "For the charge-port bond",
      outerDiameterMm: null,
      gauge: "14 AWG",
    });
    const audit = await auditFor(created.id, "wire_type.update");
    expect(audit[0]!.detail).toMatchObject({
      changes: {
        notes: { from: null, to: "For the charge-port bond" },
        outerDiameterMm: { from: 3.5, to: null },
      },
    });
    expect((await lead.patch(`/api/stock/wire-types/${created.id}`, {})).status).toBe(422);
    expect((await lead.patch(`/api/stock/wire-types/${created.id}`, { gauge: "banana" })).status).toBe(422);
    expect((await lead.get("/api/stock/wire-types/00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await lead.get("/api/stock/wire-types/not-a-uuid")).status).toBe(404);

    const withSpools = await demoWireType("22 AWG", "BK", "UL 1007");
    const refused = await lead.delete<Err>(`/api/stock/wire-types/${withSpools.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/spool/);

    expect((await lead.delete(`/api/stock/wire-types/${created.id}`)).status).toBe(200);
    expect((await lead.get(`/api/stock/wire-types/${created.id}`)).status).toBe(404);
    expect(await auditFor(created.id, "wire_type.delete")).toHaveLength(1);
  });
});

describe("put-ups", () => {
  it("lists a wire type's put-ups, price per metre falling with spool size", async () => {
    const bk22 = await demoWireType("22 AWG", "BK", "UL 1007");
    const r = await technician.get<PageOf<PutUp>>(`/api/stock/put-ups?wireTypeId=${bk22.id}`);
    expect(r.status).toBe(200);
    expect(r.body.total).toBe(5);
    const lengths = r.body.items.map((p) => p.nominalLengthMm);
    expect(lengths).toEqual([7620, 15240, 30480, 152400, 304800]);
    for (const p of r.body.items) {
      expect(p.currency).toBe("USD");
      expect(p.supplierName).toBe("Northgate Wire Supply");
      expect(p.pricePerMetreCents).toBeCloseTo((p.priceCents * 1000) / p.nominalLengthMm, 9);
    }
    const perMetre = r.body.items.map((p) => p.pricePerMetreCents);
    for (let i = 1; i < perMetre.length; i++) expect(perMetre[i]!).toBeLessThan(perMetre[i - 1]!);

    const all = await lead.get<PageOf<PutUp>>("/api/stock/put-ups?limit=7&offset=14");
    expect(all.body.items).toHaveLength(7);
    expect(all.body.total).toBeGreaterThan(150);
    expect((await lead.get("/api/stock/put-ups?wireTypeId=nope")).status).toBe(422);
  });

  it("creates, edits and deletes a put-up with audit events", async () => {
    const wt = await demoWireType("18 AWG", "RD", "UL 1007");
    const r = await lead.post<PutUp>("/api/stock/put-ups", {
      wireTypeId: wt.id,
      nominalLengthMm: 250 * 304.8,
      priceCents: 2999,
      supplierName: " Larkfield Electrical ",
      supplierPartNo: "LF-18RD-250",
    });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({
      nominalLengthMm: 76200,
      priceCents: 2999,
      currency: "USD", // the default when none is given
      supplierName: "Larkfield Electrical",
      active: true,
      gauge: "18 AWG",
    });
    expect(r.body.pricePerMetreCents).toBeCloseTo(39.357, 3);
    expect(await auditFor(r.body.id, "put_up.create")).toHaveLength(1);

    const p = await lead.patch<PutUp>(`/api/stock/put-ups/${r.body.id}`, {
      priceCents: 3199,
      currency: "eur",
    });
    expect(p.status).toBe(200);
    expect(p.body).toMatchObject({ priceCents: 3199, currency: "EUR" });
    expect((await auditFor(r.body.id, "put_up.update"))[0]!.detail).toMatchObject({
      changes: { priceCents: { from: 2999, to: 3199 }, currency: { from: "USD", to: "EUR" } },
    });
    expect((await lead.patch(`/api/stock/put-ups/${r.body.id}`, {})).status).toBe(422);

    expect((await lead.delete(`/api/stock/put-ups/${r.body.id}`)).status).toBe(200);
    expect((await lead.patch(`/api/stock/put-ups/${r.body.id}`, { priceCents: 1 })).status).toBe(404);
    expect(await auditFor(r.body.id, "put_up.delete")).toHaveLength(1);
  });

  it.each([
    [{ nominalLengthMm: 0 }, "nominalLengthMm", /at least 1 mm/],
    [{ nominalLengthMm: 30480.5 }, "nominalLengthMm", /whole number/],
    [{ nominalLengthMm: "" }, "nominalLengthMm", /millimetres/],
    [{ nominalLengthMm: 6_000_000 }, "nominalLengthMm", /at most 5 km/],
    [{ priceCents: -1 }, "priceCents", /negative/],
    [{ priceCents: 12.5 }, "priceCents", /whole number of cents/],
    [{ priceCents: null }, "priceCents", /price/],
    [{ currency: "dollars" }, "currency", /ISO 4217/],
    [{ supplierName: "  " }, "supplierName", /Name the supplier/],
  ])("answers 422 with a message for a bad put-up (%#)", async (bad, path, message) => {
    const wt = await demoWireType("18 AWG", "RD", "UL 1007");
    const body = {
      wireTypeId: wt.id,
      nominalLengthMm: 30480,
      priceCents: 1500,
      supplierName: "Test",
      ...bad,
    };
    const r = await lead.post<Err & { error: { details: { path: string; message: string }[] } }>(
      "/api/stock/put-ups",
      body,
    );
    expect(r.status).toBe(422);
    expect(r.body.error.details.find((d) => d.path === path)?.message).toMatch(message);
  });

  it("refuses a put-up for a wire type that does not exist", async () => {
    const r = await lead.post<Err>("/api/stock/put-ups", {
      wireTypeId: "00000000-0000-4000-8000-000000000000",
      nominalLengthMm: 30480,
      priceCents: 100,
      supplierName: "Test",
    });
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/wireTypeId/);
  });
});

describe("shelf spools", () => {
  let spool: Spool;

  it("lists the shelf with filters and pages", async () => {
    const all = await builder.get<PageOf<Spool>>("/api/stock/spools");
    expect(all.status).toBe(200);
    expect(all.body.total).toBeGreaterThanOrEqual(12);
    const usedUp = await builder.get<PageOf<Spool>>("/api/stock/spools?state=used_up");
    expect(usedUp.body.items.length).toBeGreaterThanOrEqual(1);
    expect(usedUp.body.items.every((s) => s.state === "used_up" && s.lengthMm === 0)).toBe(true);
    const sgx = await demoWireType("4 AWG", "RD", "SAE J1127 SGX");
    const one = await builder.get<PageOf<Spool>>(`/api/stock/spools?wireTypeId=${sgx.id}&state=open`);
    expect(one.body.items).toHaveLength(1);
    expect(one.body.items[0]).toMatchObject({
      lengthMm: 1900,
      location: "Cable rack C1",
      lot: "BC-26-11870",
    });
    const paged = await builder.get<PageOf<Spool>>("/api/stock/spools?limit=5&offset=5");
    expect(paged.body.items).toHaveLength(5);
    expect((await builder.get("/api/stock/spools?state=lost")).status).toBe(422);
  });

  it("creates a spool bought as a put-up, and refuses bad lengths and foreign put-ups", async () => {
    const wt = await demoWireType("16 AWG", "OG", "SAE J1128 GXL");
    const putUps = await lead.get<PageOf<PutUp>>(`/api/stock/put-ups?wireTypeId=${wt.id}`);
    const hundred = putUps.body.items.find((p) => p.nominalLengthMm === 30480)!;
    const r = await lead.post<Spool>("/api/stock/spools", {
      wireTypeId: wt.id,
      lengthMm: 30480,
      lot: "NG-2611-0001",
      location: "Rack B4",
      sourcePutUpId: hundred.id,
    });
    expect(r.status).toBe(201);
    spool = r.body;
    expect(spool).toMatchObject({
      state: "open",
      version: 1,
      initialLengthMm: 30480,
      sourcePutUpId: hundred.id,
    });
    expect(await auditFor(spool.id, "spool.create")).toHaveLength(1);

    const other = await demoWireType("22 AWG", "BK", "UL 1007");
    const foreignPutUp = await lead.post<Err>("/api/stock/spools", {
      wireTypeId: other.id,
      lengthMm: 100,
      sourcePutUpId: hundred.id,
    });
    expect(foreignPutUp.status).toBe(422);
    expect(foreignPutUp.body.error.message).toMatch(/sourcePutUpId/);
    for (const lengthMm of [-5, 1.5, "abc", null]) {
      const bad = await lead.post<Err>("/api/stock/spools", { wireTypeId: wt.id, lengthMm });
      expect(bad.status).toBe(422);
      expect(bad.body.error.message).toMatch(/lengthMm/);
    }
  });

  it("edits location and state with the version; a stale version answers 409 with the current record", async () => {
    const moved = await lead.patch<Spool>(`/api/stock/spools/${spool.id}`, {
      version: 1,
      location: "Bench cart",
    });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({ location: "Bench cart", version: 2 });

    const stale = await lead.patch<Err & { error: { details: { current: Spool } } }>(
      `/api/stock/spools/${spool.id}`,
      { version: 1, location: "Rack B9" },
    );
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.current).toMatchObject({
      id: spool.id,
      version: 2,
      location: "Bench cart",
    });

    const reserved = await lead.patch<Spool>(`/api/stock/spools/${spool.id}`, {
      version: 2,
      state: "reserved",
    });
    expect(reserved.body).toMatchObject({ state: "reserved", version: 3 });
    expect((await lead.patch(`/api/stock/spools/${spool.id}`, { version: 3, state: "lost" })).status).toBe(
      422,
    );
    expect((await lead.patch(`/api/stock/spools/${spool.id}`, { version: 3 })).status).toBe(422);
    expect((await lead.patch(`/api/stock/spools/${spool.id}`, { location: "x" })).status).toBe(422);
    const audit = await auditFor(spool.id, "spool.update");
    expect(audit).toHaveLength(2);
    expect(audit[1]!.detail).toMatchObject({ changes: { location: { from: "Rack B4", to: "Bench cart" } } });
    expect((await technician.get<Spool>(`/api/stock/spools/${spool.id}`)).body.state).toBe("reserved");
  });

  it("records a length adjustment with who and why, in step with the spool and the audit trail", async () => {
    const r = await lead.post<{ spool: Spool; adjustment: Adjustment }>(
      `/api/stock/spools/${spool.id}/adjustments`,
      { lengthMm: 29870, reason: "Measured after a test cut" },
    );
    expect(r.status).toBe(201);
    expect(r.body.spool).toMatchObject({ lengthMm: 29870, version: 4, state: "reserved" });
    expect(r.body.adjustment).toMatchObject({
      userId: "demo-lead-0001",
      userName: "Mara Quill",
      oldLengthMm: 30480,
      newLengthMm: 29870,
      reason: "Measured after a test cut",
    });
    const rows = (await k("spoolAdjustment").where({ spoolId: spool.id })) as {
      userId: string;
      reason: string;
    }[];
    expect(rows).toEqual([
      expect.objectContaining({ userId: "demo-lead-0001", reason: "Measured after a test cut" }),
    ]);
    const audit = await auditFor(spool.id, "spool.adjust");
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({
      actorUserId: "demo-lead-0001",
      detail: {
        oldLengthMm: 30480,
        newLengthMm: 29870,
        reason: "Measured after a test cut",
        adjustmentId: r.body.adjustment.id,
      },
    });

    const history = await builder.get<PageOf<Adjustment>>(`/api/stock/spools/${spool.id}/adjustments`);
    expect(history.status).toBe(200);
    expect(history.body.total).toBe(1);
    expect(history.body.items[0]).toMatchObject({
      reason: "Measured after a test cut",
      userName: "Mara Quill",
    });
  });

  it("requires a reason and a whole length, and changes nothing when refused", async () => {
    for (const body of [
      { lengthMm: 1000 },
      { lengthMm: 1000, reason: "   " },
      { lengthMm: 1000, reason: "ok" },
      { lengthMm: -1, reason: "Measured" },
      { lengthMm: 10.5, reason: "Measured" },
    ]) {
      const r = await lead.post<Err>(`/api/stock/spools/${spool.id}/adjustments`, body);
      expect(r.status).toBe(422);
      expect(r.body.error.message.length).toBeGreaterThan(10);
    }
    const missing = await lead.post<Err>(`/api/stock/spools/${spool.id}/adjustments`, { lengthMm: 1000 });
    expect(missing.body.error.message).toMatch(/reason: Say why the length changed/);
    const s = await lead.get<Spool>(`/api/stock/spools/${spool.id}`);
    expect(s.body).toMatchObject({ lengthMm: 29870, version: 4 });
    expect(await k("spoolAdjustment").where({ spoolId: spool.id })).toHaveLength(1);
  });

  it("a stale version on an adjustment answers 409; measuring 0 mm uses the spool up", async () => {
    const stale = await lead.post<Err>(`/api/stock/spools/${spool.id}/adjustments`, {
      lengthMm: 100,
      reason: "Old screen",
      version: 2,
    });
    expect(stale.status).toBe(409);
    const empty = await lead.post<{ spool: Spool }>(`/api/stock/spools/${spool.id}/adjustments`, {
      lengthMm: 0,
      reason: "Cut the last of it for the work light",
      version: 4,
    });
    expect(empty.status).toBe(201);
    expect(empty.body.spool).toMatchObject({ lengthMm: 0, state: "used_up", version: 5 });
    const back = await lead.post<{ spool: Spool }>(`/api/stock/spools/${spool.id}/adjustments`, {
      lengthMm: 400,
      reason: "Found a tail still on the core",
    });
    expect(back.body.spool).toMatchObject({ lengthMm: 400, state: "open", version: 6 });
    expect(
      (await lead.post(`/api/stock/spools/not-a-uuid/adjustments`, { lengthMm: 1, reason: "abc" })).status,
    ).toBe(404);
  });
});

describe("roles", () => {
  it("builders and technicians read stock but every write answers 403 and changes nothing", async () => {
    const wt = await demoWireType("22 AWG", "BK", "UL 1007");
    const putUp = (await lead.get<PageOf<PutUp>>(`/api/stock/put-ups?wireTypeId=${wt.id}`)).body.items[0]!;
    const spool = (await lead.get<PageOf<Spool>>(`/api/stock/spools?wireTypeId=${wt.id}`)).body.items[0]!;
    const writes: [string, string, unknown][] = [
      ["POST", "/api/stock/wire-types", { gauge: "24 AWG", colour: "PK", insulation: "UL 1007" }],
      ["PATCH", `/api/stock/wire-types/${wt.id}`, { notes: "mine now" }],
      ["DELETE", `/api/stock/wire-types/${wt.id}`, undefined],
      [
        "POST",
        "/api/stock/put-ups",
        { wireTypeId: wt.id, nominalLengthMm: 1000, priceCents: 1, supplierName: "X" },
      ],
      ["PATCH", `/api/stock/put-ups/${putUp.id}`, { priceCents: 1 }],
      ["DELETE", `/api/stock/put-ups/${putUp.id}`, undefined],
      ["POST", "/api/stock/spools", { wireTypeId: wt.id, lengthMm: 1000 }],
      ["PATCH", `/api/stock/spools/${spool.id}`, { version: spool.version, location: "Home" }],
      ["POST", `/api/stock/spools/${spool.id}/adjustments`, { lengthMm: 1, reason: "Took it home" }],
    ];
    for (const who of [builder, technician]) {
      for (const path of [
        "/api/stock/wire-types",
        `/api/stock/wire-types/${wt.id}`,
        "/api/stock/put-ups",
        "/api/stock/spools",
        `/api/stock/spools/${spool.id}`,
        `/api/stock/spools/${spool.id}/adjustments`,
        `/api/projects/${projectId}/unmatched-wire-types`,
      ]) {
        expect((await who.get(path)).status, path).toBe(200);
      }
      for (const [method, path, body] of writes) {
        const r = await who.request<Err>(method, path, body);
        expect(r.status, `${method} ${path}`).toBe(403);
        expect(r.body.error.code).toBe("forbidden");
      }
    }
    expect((await lead.get<Spool>(`/api/stock/spools/${spool.id}`)).body).toMatchObject({
      version: spool.version,
      lengthMm: spool.lengthMm,
      location: spool.location,
    });
    expect((await lead.get<WireType>(`/api/stock/wire-types/${wt.id}`)).body.notes).toBeNull();
    const anon = new Client(baseUrl);
    expect((await anon.get("/api/stock/wire-types")).status).toBe(401);
    expect((await anon.post("/api/stock/spools", { wireTypeId: wt.id, lengthMm: 1 })).status).toBe(401);
  });
});

describe("team isolation", () => {
  it("another team never sees or edits the demo team's stock", async () => {
    const outsider = new Client(baseUrl);
    const signUp = await outsider.post("/api/auth/sign-up", {
      email: `stock-outsider-${Date.now()}@example.test`,
      password: "another-long-pw",
      name: "Wren Hollis",
      teamName: "Hollis Marine Electrics",
    });
    expect(signUp.status).toBe(201);

    for (const path of ["/api/stock/wire-types", "/api/stock/put-ups", "/api/stock/spools"]) {
      const r = await outsider.get<PageOf<unknown>>(path);
      expect(r.status).toBe(200);
      expect(r.body).toMatchObject({ items: [], total: 0 });
    }
    const wt = await demoWireType("22 AWG", "BK", "UL 1007");
    const putUp = (await lead.get<PageOf<PutUp>>(`/api/stock/put-ups?wireTypeId=${wt.id}`)).body.items[0]!;
    const spool = (await lead.get<PageOf<Spool>>(`/api/stock/spools?wireTypeId=${wt.id}`)).body.items[0]!;
    expect((await outsider.get<PageOf<PutUp>>(`/api/stock/put-ups?wireTypeId=${wt.id}`)).body.total).toBe(0);
    expect((await outsider.get<PageOf<Spool>>(`/api/stock/spools?wireTypeId=${wt.id}`)).body.total).toBe(0);

    const attempts: [string, string, unknown, number[]][] = [
      ["GET", `/api/stock/wire-types/${wt.id}`, undefined, [404]],
      ["PATCH", `/api/stock/wire-types/${wt.id}`, { notes: "ours" }, [404]],
      ["DELETE", `/api/stock/wire-types/${wt.id}`, undefined, [404]],
      ["PATCH", `/api/stock/put-ups/${putUp.id}`, { priceCents: 1 }, [404]],
      ["DELETE", `/api/stock/put-ups/${putUp.id}`, undefined, [404]],
      ["GET", `/api/stock/spools/${spool.id}`, undefined, [404]],
      ["PATCH", `/api/stock/spools/${spool.id}`, { version: spool.version, location: "Ours" }, [404]],
      ["GET", `/api/stock/spools/${spool.id}/adjustments`, undefined, [404]],
      ["POST", `/api/stock/spools/${spool.id}/adjustments`, { lengthMm: 1, reason: "Ours now" }, [404]],
      [
        "POST",
        "/api/stock/put-ups",
        { wireTypeId: wt.id, nominalLengthMm: 1, priceCents: 1, supplierName: "X" },
        [422],
      ],
      ["POST", "/api/stock/spools", { wireTypeId: wt.id, lengthMm: 1 }, [422]],
      ["GET", `/api/projects/${projectId}/unmatched-wire-types`, undefined, [403, 404]],
    ];
    for (const [method, path, body, statuses] of attempts) {
      const r = await outsider.request(method, path, body);
      expect(statuses, `${method} ${path}`).toContain(r.status);
      expect(JSON.stringify(r.body)).not.toMatch(/Rack|Northgate|UL 1007|Harrow/);
    }
    // The other team keeps its own stock, and the same spec is no conflict across teams.
    const own = await outsider.post<WireType>("/api/stock/wire-types", {
      gauge: "22 AWG",
      colour: "BK",
      insulation: "UL 1007",
    });
    expect(own.status).toBe(201);
    expect((await lead.get(`/api/stock/wire-types/${own.body.id}`)).status).toBe(404);
    expect((await lead.get<WireType>(`/api/stock/wire-types/${wt.id}`)).body.notes).toBeNull();
    expect((await lead.get<Spool>(`/api/stock/spools/${spool.id}`)).body.version).toBe(spool.version);
  });
});

describe("unmatched wire types of a project", () => {
  it("is empty for the seeded demo project: every Harrow-3 run has its wire type", async () => {
    const r = await technician.get<PageOf<Unmatched>>(`/api/projects/${projectId}/unmatched-wire-types`);
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ items: [], total: 0, offset: 0 });
    expect((await lead.get("/api/projects/not-a-uuid/unmatched-wire-types")).status).toBe(404);
  });

  it("lists a new combination with run counts and routed length, and an ambiguous run without insulation", async () => {
    const added = [
      await insertRun(projectId, {
        wireId: "HR3-T01",
        gauge: "14 AWG",
        colour: "PK",
        insulation: "SAE J1128 TXL",
        routedLengthMm: 1500,
      }),
      await insertRun(projectId, {
        wireId: "HR3-T02",
        gauge: "14 AWG",
        colour: "PK",
        insulation: "sae  j1128 txl",
        routedLengthMm: 500,
      }),
      // No insulation, and only one 22 AWG BK wire type exists: it matches that one.
      await insertRun(projectId, {
        wireId: "HR3-T03",
        gauge: "22 AWG",
        colour: "BK",
        insulation: null,
        routedLengthMm: 300,
      }),
    ];
    const extra: string[] = [];
    try {
      const r = await lead.get<PageOf<Unmatched>>(`/api/projects/${projectId}/unmatched-wire-types`);
      expect(r.body.total).toBe(1);
      expect(r.body.items[0]).toEqual({
        gauge: "14 AWG",
        colour: "PK",
        insulation: "SAE J1128 TXL",
        insulationTempC: null,
        reason: "missing",
        candidateCount: 0,
        runCount: 2,
        routedLengthMm: 2000,
        wireIds: ["HR3-T01", "HR3-T02"],
      });

      // A second 22 AWG BK spec makes the run without insulation ambiguous.
      const txl = await lead.post<WireType>("/api/stock/wire-types", {
        gauge: "22 AWG",
        colour: "BK",
        insulation: "SAE J1128 TXL",
      });
      extra.push(txl.body.id);
      const r2 = await lead.get<PageOf<Unmatched>>(`/api/projects/${projectId}/unmatched-wire-types`);
      expect(r2.body.total).toBe(2);
      expect(r2.body.items.find((u) => u.wireIds[0] === "HR3-T03")).toMatchObject({
        gauge: "22 AWG",
        colour: "BK",
        insulation: null,
        reason: "ambiguous",
        runCount: 1,
        routedLengthMm: 300,
      });
      expect(
        (
          await lead.get<PageOf<Unmatched>>(
            `/api/projects/${projectId}/unmatched-wire-types?limit=1&offset=1`,
          )
        ).body.items,
      ).toHaveLength(1);

      // Adding the missing wire type (with the insulation in another case) clears its row.
      const pk = await lead.post<WireType>("/api/stock/wire-types", {
        gauge: "14",
        colour: "pink",
        insulation: "sae j1128 TXL",
      });
      extra.push(pk.body.id);
      const r3 = await lead.get<PageOf<Unmatched>>(`/api/projects/${projectId}/unmatched-wire-types`);
      expect(r3.body.items.map((u) => u.reason)).toEqual(["ambiguous"]);
    } finally {
      await deleteRuns(added);
      for (const id of extra) await lead.delete(`/api/stock/wire-types/${id}`);
    }
    expect(
      (await lead.get<PageOf<Unmatched>>(`/api/projects/${projectId}/unmatched-wire-types`)).body.total,
    ).toBe(0);
  });
});
