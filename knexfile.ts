// Knex CLI configuration; the app and tests use the same migration list through lib/db/migrations.ts.
import type { Knex } from "knex";

const config: Knex.Config = {
  client: "pg",
  connection: process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:54329/loomwright",
  migrations: { directory: "./db/migrations", extension: "ts", loadExtensions: [".ts"] },
  seeds: { directory: "./db/seeds", extension: "ts", loadExtensions: [".ts"] },
};

export default config;
