// Test database access: a fresh schema with the demo seed, and knex instances for tests to read and write.
import { makeKnex } from "@/lib/db/knex";
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
