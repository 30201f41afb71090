// Database helper: `tsx scripts/db.ts migrate|rollback|seed|reset` against DATABASE_URL.
import { makeKnex } from "@/lib/db/knex";
import { migrateLatest, rollbackAll, seedDemo } from "@/lib/db/migrations";

async function main(): Promise<void> {
  const cmd = process.argv[2];
  const url = process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:54329/loomwright";
  const knex = makeKnex(url, { camel: false, poolMax: 2 });
  try {
    if (cmd === "migrate") {
      const names = await migrateLatest(knex);
      console.log(names.length ? `migrated: ${names.join(", ")}` : "migrations: up to date");
    } else if (cmd === "rollback") {
      await rollbackAll(knex);
      console.log("rolled back all migrations");
    } else if (cmd === "seed") {
      console.log(
        (await seedDemo(knex)) ? "seeded the demo data" : "demo data: database not empty, left alone",
      );
    } else if (cmd === "reset") {
      await rollbackAll(knex);
      await migrateLatest(knex);
      await seedDemo(knex);
      console.log("reset: rolled back, migrated and seeded");
    } else {
      console.error("usage: tsx scripts/db.ts migrate|rollback|seed|reset");
      process.exitCode = 2;
    }
  } finally {
    await knex.destroy();
  }
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
