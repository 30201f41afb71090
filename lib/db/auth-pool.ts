// The pg pool Lucia's PostgreSQL adapter uses for session rows (the adapter speaks pg, not Knex).
import pg from "pg";
import { env } from "@/lib/env";

const g = globalThis as unknown as { loomwrightAuthPool?: pg.Pool };

export function authPool(): pg.Pool {
  if (!g.loomwrightAuthPool) {
    g.loomwrightAuthPool = new pg.Pool({
      connectionString: env().DATABASE_URL,
      max: 5,
      connectionTimeoutMillis: 3000,
    });
    // An idle client that loses its server must not crash the process; the next query reconnects.
    g.loomwrightAuthPool.on("error", () => undefined);
  }
  return g.loomwrightAuthPool;
}
