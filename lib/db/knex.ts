// The application's Knex instance (one pool per process, kept across dev reloads), camelCase in and out.
import knexFactory, { type Knex } from "knex";
import pg from "pg";
import { env } from "@/lib/env";
import { camelResponse, toSnake } from "@/lib/db/case";

// NUMERIC and BIGINT come back as strings from pg; counts and sums in this app fit in a double.
pg.types.setTypeParser(1700, (v) => Number.parseFloat(v));
pg.types.setTypeParser(20, (v) => Number.parseInt(v, 10));

const globalForDb = globalThis as unknown as { loomwrightDb?: Knex };

export function makeKnex(connection: string, opts: { camel: boolean; poolMax?: number }): Knex {
  return knexFactory({
    client: "pg",
    connection: { connectionString: connection, connectionTimeoutMillis: 3000 },
    pool: { min: 0, max: opts.poolMax ?? 10, acquireTimeoutMillis: 5000 },
    acquireConnectionTimeout: 5000,
    ...(opts.camel
      ? {
          wrapIdentifier: (value: string, origImpl: (v: string) => string) =>
            origImpl(value === "*" ? value : toSnake(value)),
          postProcessResponse: (result: unknown) => camelResponse(result),
        }
      : {}),
  });
}

export function db(): Knex {
  globalForDb.loomwrightDb ??= makeKnex(env().DATABASE_URL, { camel: true });
  return globalForDb.loomwrightDb;
}

export type Tx = Knex.Transaction;
export type Db = Knex | Knex.Transaction;
