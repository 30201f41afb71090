// Test database access: a fresh schema with the demo seed, and knex instances for tests to read and write.
import { randomBytes } from "node:crypto";
import { makeKnex } from "@/lib/db/knex";
import { traceCodeFromBytes } from "@/lib/domain/trace-code";
import { migrateLatest, rollbackAll, seedDemo } from "@/lib/db/migrations";

export function testDatabaseUrl(kind: "integration" | "e2e" = "integration"): string {
  const url = kind === "e2e" ? process.env.E2E_DATABASE_URL : process.env.TEST_DATABASE_URL;
  if (!url)
    throw new Error(
      `${kind === "e2e" ? "E2E" : "TEST"}_DATABASE_URL is not set; run the tests with npm test`,
    );
  return url;
}

/** Drops every table the migrations made, migrates again and seeds the demo. */
export async function resetDatabase(url: string): Promise<void> {
  const k = makeKnex(url, { camel: false, poolMax: 2 });
  try {
    await rollbackAll(k);
    await migrateLatest(k);
    await seedDemo(k);
  } finally {
    await k.destroy();
  }
}

/** Creates (or recreates) an empty scratch database next to the test database and returns its URL. */
export async function scratchDatabase(name: string): Promise<string> {
  const base = new URL(testDatabaseUrl());
  const admin = new URL(base);
  admin.pathname = "/postgres";
  const k = makeKnex(admin.toString(), { camel: false, poolMax: 1 });
  try {
    await k.raw(`drop database if exists ?? with (force)`, [name]);
    await k.raw(`create database ??`, [name]);
  } finally {
    await k.destroy();
  }
  base.pathname = `/${name}`;
  return base.toString();
}

/** Inserts a run straight into a project of the test database (for cases the API cannot make yet). */
export async function insertRun(
  projectId: string,
  run: { wireId: string; gauge: string; colour: string; insulation: string | null; routedLengthMm: number },
  url: string = testDatabaseUrl(),
): Promise<string> {
  const k = makeKnex(url, { camel: false, poolMax: 1 });
  try {
    const [row] = (await k("run")
      .insert({
        project_id: projectId,
        wire_id: run.wireId,
        end_a: "TEST:1",
        end_b: "TEST:2",
        gauge: run.gauge,
        colour: run.colour,
        insulation: run.insulation,
        routed_length_mm: run.routedLengthMm,
        trace_code: traceCodeFromBytes(randomBytes(5)),
      })
      .returning("id")) as [{ id: string }];
    return row.id;
  } finally {
    await k.destroy();
  }
}

export async function deleteRuns(ids: string[], url: string = testDatabaseUrl()): Promise<void> {
  const k = makeKnex(url, { camel: false, poolMax: 1 });
  try {
    await k("run").whereIn("id", ids).delete();
  } finally {
    await k.destroy();
  }
}
