// The one migration and seed runner: a static list, so the CLI script, the app and vitest all load the same files.
import type { Knex } from "knex";
import * as core from "@/db/migrations/20261201000001_core";
import * as audit from "@/db/migrations/20261201000002_audit";
import * as imports from "@/db/migrations/20261201000003_imports";
import * as teamMail from "@/db/migrations/20261201000100_team_mail";
import * as stock from "@/db/migrations/20261201000200_stock";
import * as plans from "@/db/migrations/20261201000400_plans";
import * as print from "@/db/migrations/20261201000410_print";
import * as bench from "@/db/migrations/20261201000500_bench";
import * as runTests from "@/db/migrations/20261201000300_run_tests";
import * as demo from "@/db/seeds/01_demo";
import { seedStockIfEmpty } from "@/db/seeds/02_stock";

type Migration = { up: (k: Knex) => Promise<void>; down: (k: Knex) => Promise<void> };

// Names keep the .ts suffix so the knex_migrations rows match what the knex CLI writes.
const MIGRATIONS: Record<string, Migration> = {
  "20261201000001_core.ts": core,
  "20261201000002_audit.ts": audit,
  "20261201000003_imports.ts": imports,
  "20261201000100_team_mail.ts": teamMail,
  "20261201000200_stock.ts": stock,
  "20261201000400_plans.ts": plans,
  "20261201000410_print.ts": print,
  "20261201000500_bench.ts": bench,
  "20261201000300_run_tests.ts": runTests,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(MIGRATIONS),
  getMigrationName: (name) => name,
  getMigration: async (name) => {
    const m = MIGRATIONS[name];
    if (!m) throw new Error(`unknown migration ${name}`);
    return m;
  },
};

export async function migrateLatest(knex: Knex): Promise<string[]> {
  const [, names] = (await knex.migrate.latest({ migrationSource })) as [number, string[]];
  return names;
}

export async function rollbackAll(knex: Knex): Promise<void> {
  await knex.migrate.rollback({ migrationSource }, true);
}

/** Seeds the demo scenario when the database holds no users, then the demo team's stock when it has none;
 * returns whether it seeded anything. */
export async function seedDemo(knex: Knex): Promise<boolean> {
  const seeded = await demo.seedIfEmpty(knex);
  const stockSeeded = await seedStockIfEmpty(knex);
  return seeded || stockSeeded;
}
