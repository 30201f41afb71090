// Runs ↔ wire types: which wire type each run of a project is cut from, and the combinations no wire type covers.
import { db, type Db } from "@/lib/db/knex";
import { listAllRuns } from "@/lib/db/runs";
import { listAllWireTypes } from "@/lib/db/wire-types";
import {
  wireTypeMatcher,
  unmatchedCombinations,
  type UnmatchedCombination,
  type WireTypeMatch,
} from "@/lib/domain/wire-type-match";
import { notFound } from "@/lib/http/errors";
import { uuidSchema, type Page } from "@/lib/validation/common";
import type { UnmatchedListQuery } from "@/lib/validation/stock";

/** Each run of the project (by run id) with its wire type match; see lib/domain/wire-type-match.ts for the rule. */
export async function matchProjectRuns(
  teamId: string,
  projectId: string,
  q: Db = db(),
): Promise<Map<string, WireTypeMatch>> {
  const [runs, wireTypes] = await Promise.all([
    listAllRuns(teamId, projectId, q),
    listAllWireTypes(teamId, q),
  ]);
  const matcher = wireTypeMatcher(wireTypes);
  return new Map(runs.map((r) => [r.id, matcher.match(r)]));
}

export async function listUnmatchedWireTypes(
  teamId: string,
  projectId: string,
  query: UnmatchedListQuery,
  q: Db = db(),
): Promise<Page<UnmatchedCombination>> {
  const [runs, wireTypes] = await Promise.all([
    listAllRuns(teamId, projectId, q),
    listAllWireTypes(teamId, q),
  ]);
  const all = unmatchedCombinations(runs, wireTypes);
  return {
    items: all.slice(query.offset, query.offset + query.limit),
    total: all.length,
    limit: query.limit,
    offset: query.offset,
  };
}

/** A route's id parameter: anything but a UUID is simply not found (never a database type error). */
export function idParam(value: string | undefined, what: string): string {
  if (!value || !uuidSchema.safeParse(value).success) throw notFound(what);
  return value;
}

/** 404 unless the record exists in the caller's team. */
export function found<T>(record: T | null, what: string): T {
  if (!record) throw notFound(what);
  return record;
}
