import { afterAll, describe, expect, it } from "vitest";
import { makeKnex } from "@/lib/db/knex";
import { migrateLatest, rollbackAll, seedDemo } from "@/lib/db/migrations";
import { seedStockIfEmpty } from "@/db/seeds/02_stock";
import { matchWireType } from "@/lib/domain/wire-type-match";
import { scratchDatabase, testDatabaseUrl } from "../helpers/db";

// Named after this run's test database, so engineers testing side by side on one cluster never share it.
const SCRATCH = `${new URL(testDatabaseUrl()).pathname.slice(1)}_scratch_migrate`;

const tables = async (k: ReturnType<typeof makeKnex>) =>
  (
    (await k.raw(
      `select table_name from information_schema.tables where table_schema = 'public' and table_name not like 'knex_%' order by 1`,
    )) as { rows: { table_name: string }[] }
  ).rows.map((r) => r.table_name);

describe("migrations and seed", () => {
  let k: ReturnType<typeof makeKnex>;
  afterAll(async () => {
    await k?.destroy();
  });

  it("migrate up, down and up again", async () => {
    k = makeKnex(await scratchDatabase(SCRATCH), { camel: false, poolMax: 2 });
    await migrateLatest(k);
    const first = await tables(k);
    expect(first).toEqual(
      expect.arrayContaining([
        "team",
        "app_user",
        "membership",
        "user_session",
        "project",
        "run",
        "wire_type",
        "put_up",
        "spool",
        "spool_adjustment",
        "run_test",
      ]),
    );
    await rollbackAll(k);
    expect(await tables(k)).toEqual([]);
    await migrateLatest(k);
    expect(await tables(k)).toEqual(first);
  });

  it("seeds the demo once and leaves a non-empty database alone", async () => {
    expect(await seedDemo(k)).toBe(true);
    const count = async (t: string) => Number(((await k(t).count({ n: "*" })) as [{ n: string }])[0].n);
    const counts = async () => ({
      users: await count("app_user"),
      runs: await count("run"),
      projects: await count("project"),
      wireTypes: await count("wire_type"),
      putUps: await count("put_up"),
      spools: await count("spool"),
      adjustments: await count("spool_adjustment"),
    });
    const before = await counts();
    expect(before.users).toBe(3);
    expect(before.projects).toBe(1);
    expect(before.runs).toBeGreaterThanOrEqual(55);
    expect(before.wireTypes).toBeGreaterThanOrEqual(12);
    expect(before.putUps).toBeGreaterThan(before.wireTypes);
    expect(before.spools).toBeGreaterThanOrEqual(12);
    expect(before.adjustments).toBeGreaterThanOrEqual(1);
    expect(await seedDemo(k)).toBe(false);
    expect(await seedStockIfEmpty(k)).toBe(false);
    expect(await counts()).toEqual(before);
  });

  it("the demo stock covers every run, prices fall per metre with spool size, and the shelf is partly used", async () => {
    const runs = (await k("run").select("gauge", "colour", "insulation")) as {
      gauge: string;
      colour: string;
      insulation: string | null;
    }[];
    const wireTypes = (await k("wire_type").select(
      "id",
      "gauge",
      "colour",
      "insulation",
      "outer_diameter_mm",
    )) as {
      id: string;
      gauge: string;
      colour: string;
      insulation: string | null;
      outer_diameter_mm: number | null;
    }[];
    for (const r of runs)
      expect(matchWireType(r, wireTypes).kind, `${r.gauge} ${r.colour} ${r.insulation}`).toBe("matched");
    for (const w of wireTypes) expect(w.outer_diameter_mm).toBeGreaterThan(0);

    const putUps = (await k("put_up")
      .select("wire_type_id", "supplier_name", "nominal_length_mm", "price_cents", "currency")
      .orderBy(["wire_type_id", "supplier_name", "nominal_length_mm"])) as {
      wire_type_id: string;
      supplier_name: string;
      nominal_length_mm: number;
      price_cents: number;
      currency: string;
    }[];
    const lengths = new Set(putUps.map((p) => p.nominal_length_mm));
    // 10, 25, 50, 100, 500 and 1000 ft, at exactly 304.8 mm per foot.
    expect([...lengths].sort((a, b) => a - b)).toEqual([3048, 7620, 15240, 30480, 152400, 304800]);
    let prev: (typeof putUps)[number] | null = null;
    for (const p of putUps) {
      expect(p.price_cents).toBeGreaterThan(0);
      if (prev && prev.wire_type_id === p.wire_type_id && prev.supplier_name === p.supplier_name) {
        expect(p.price_cents / p.nominal_length_mm).toBeLessThan(prev.price_cents / prev.nominal_length_mm);
      }
      prev = p;
    }
    const suppliers = new Set(putUps.map((p) => p.supplier_name));
    expect([...suppliers].sort()).toEqual(["Bramble Cable Co.", "Northgate Wire Supply"]);

    const spools = (await k("spool").select(
      "length_mm",
      "initial_length_mm",
      "lot",
      "location",
      "state",
    )) as {
      length_mm: number;
      initial_length_mm: number;
      lot: string | null;
      location: string | null;
      state: string;
    }[];
    const shelf = spools.filter((s) => s.state === "open");
    expect(shelf.length).toBeGreaterThanOrEqual(12);
    for (const s of shelf) {
      expect(s.length_mm).toBeGreaterThan(0);
      expect(s.length_mm).toBeLessThanOrEqual(s.initial_length_mm);
      expect(s.lot).toBeTruthy();
      expect(s.location).toBeTruthy();
    }
    expect(shelf.some((s) => s.length_mm < s.initial_length_mm)).toBe(true);
  });

  it("the demo has one account per role and realistic runs", async () => {
    const roles = (await k("membership").select("role").orderBy("role")) as { role: string }[];
    expect(roles.map((r) => r.role)).toEqual(["builder", "lead", "technician"]);
    const runs = (await k("run").select(
      "wire_id",
      "gauge",
      "colour",
      "routed_length_mm",
      "return_run_wire_id",
    )) as {
      wire_id: string;
      gauge: string;
      colour: string;
      routed_length_mm: number;
      return_run_wire_id: string | null;
    }[];
    const wireIds = new Set(runs.map((r) => r.wire_id));
    expect(wireIds.size).toBe(runs.length);
    const types = new Set(runs.map((r) => `${r.gauge} ${r.colour}`));
    expect(types.size).toBeGreaterThanOrEqual(12);
    for (const r of runs) {
      expect(r.routed_length_mm).toBeGreaterThan(0);
      if (r.return_run_wire_id) expect(wireIds.has(r.return_run_wire_id)).toBe(true);
    }
  });
});
