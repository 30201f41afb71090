// Small pieces the stock repositories share: joining a caller's transaction, field diffs for the audit trail.
import type { Knex } from "knex";
import type { Db, Tx } from "@/lib/db/knex";

/** Runs `fn` in the caller's transaction when given one (e.g. a plan commit), otherwise in a new one. */
export async function withTx<T>(q: Db, fn: (trx: Tx) => Promise<T>): Promise<T> {
  if ((q as Knex.Transaction).isTransaction) return fn(q as Tx);
  return (q as Knex).transaction(fn);
}

/** The fields a patch really changes, as { field: { from, to } } for the audit detail. */
export function changedFields(
  before: Record<string, unknown>,
  patch: Record<string, unknown>,
): Record<string, { from: unknown; to: unknown }> {
  const out: Record<string, { from: unknown; to: unknown }> = {};
  for (const [k, to] of Object.entries(patch)) {
    if (to === undefined) continue;
    const from = before[k] ?? null;
    if (from !== to) out[k] = { from, to };
  }
  return out;
}

/** Only the keys whose value is not undefined (so a patch never writes a column it did not name). */
export function definedOnly<T extends Record<string, unknown>>(o: T): Partial<T> {
  const out: Partial<T> = {};
  for (const [k, v] of Object.entries(o)) if (v !== undefined) (out as Record<string, unknown>)[k] = v;
  return out;
}

type PgError = { code?: unknown; constraint?: unknown };

export function isUniqueViolation(e: unknown, constraint: string): boolean {
  const pg = e as PgError;
  return !!pg && pg.code === "23505" && pg.constraint === constraint;
}

export function likePattern(q: string): string {
  return `%${q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
}
