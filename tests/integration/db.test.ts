import { afterAll, describe, expect, it } from "vitest";
import { makeKnex } from "@/lib/db/knex";
import { migrateLatest, rollbackAll, seedDemo } from "@/lib/db/migrations";
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
    const before = {
      users: await count("app_user"),
      runs: await count("run"),
      projects: await count("project"),
    };
    expect(before.users).toBe(3);
    expect(before.projects).toBe(1);
    expect(before.runs).toBeGreaterThanOrEqual(55);
    expect(await seedDemo(k)).toBe(false);
    expect({
      users: await count("app_user"),
      runs: await count("run"),
      projects: await count("project"),
    }).toEqual(before);
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
