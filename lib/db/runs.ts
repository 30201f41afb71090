// Runs of a project, always reached through a project of the caller's team.
import { db, type Db, type Tx } from "@/lib/db/knex";
import type { BenchState, RunData } from "@/lib/domain/types";
import type { RunListQuery } from "@/lib/validation/runs";
import type { Page } from "@/lib/validation/common";

export interface RunRecord extends RunData {
  id: string;
  projectId: string;
  state: BenchState;
  version: number;
  traceCode: string;
  createdAt: string;
  updatedAt: string;
}

const RUN_COLUMNS = [
  "id",
  "projectId",
  "wireId",
  "endA",
  "endB",
  "endATermination",
  "endBTermination",
  "endAStripMm",
  "endBStripMm",
  "circuit",
  "gauge",
  "colour",
  "insulation",
  "insulationTempC",
  "bundleSize",
  "hotSpace",
  "routedLengthMm",
  "currentA",
  "peakCurrentA",
  "supplyV",
  "dropClass",
  "dropLimitPct",
  "fuseA",
  "returnKind",
  "returnRunWireId",
  "returnResistanceOhm",
  "ledForwardV",
  "ledCurrentA",
  "state",
  "notes",
  "traceCode",
  "version",
  "createdAt",
  "updatedAt",
] as const;

export const RUN_SELECT = RUN_COLUMNS.map((c) => `r.${c}`);

function scoped(q: Db, teamId: string, projectId: string) {
  return q("run as r")
    .join("project as p", "p.id", "r.projectId")
    .where({ "p.teamId": teamId, "r.projectId": projectId });
}

export async function listRuns(
  teamId: string,
  projectId: string,
  query: RunListQuery,
  q: Db = db(),
): Promise<Page<RunRecord>> {
  const base = scoped(q, teamId, projectId).modify((b) => {
    if (query.gauge) b.where("r.gauge", query.gauge);
    if (query.colour) b.where("r.colour", query.colour.toUpperCase());
    if (query.state) b.where("r.state", query.state);
    if (query.q) {
      const like = `%${query.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
      b.where((w) =>
        w
          .whereILike("r.wireId", like)
          .orWhereILike("r.endA", like)
          .orWhereILike("r.endB", like)
          .orWhereILike("r.circuit", like),
      );
    }
  });
  const [countRow] = (await base.clone().count({ total: "*" })) as [{ total: number }];
  const items = (await base
    .clone()
    .select(RUN_SELECT)
    .orderBy(`r.${query.sort}`, query.dir)
    .orderBy("r.wireId", "asc")
    .limit(query.limit)
    .offset(query.offset)) as RunRecord[];
  return { items, total: Number(countRow.total), limit: query.limit, offset: query.offset };
}

export async function listAllRuns(teamId: string, projectId: string, q: Db = db()): Promise<RunRecord[]> {
  return (await scoped(q, teamId, projectId).select(RUN_SELECT).orderBy("r.wireId", "asc")) as RunRecord[];
}

export async function getRun(teamId: string, projectId: string, runId: string, q: Db = db()) {
  const row = (await scoped(q, teamId, projectId).where("r.id", runId).select(RUN_SELECT).first()) as
    RunRecord | undefined;
  return row ?? null;
}

export async function getRunForUpdate(tx: Tx, teamId: string, projectId: string, runId: string) {
  const row = (await scoped(tx, teamId, projectId)
    .where("r.id", runId)
    .select(RUN_SELECT)
    .forUpdate("r")
    .first()) as RunRecord | undefined;
  return row ?? null;
}

export async function wireIdsWithPrefix(tx: Db, projectId: string, prefix: string): Promise<string[]> {
  const like = `${prefix.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
  const rows = (await tx("run").where("projectId", projectId).whereLike("wireId", like).select("wireId")) as {
    wireId: string;
  }[];
  return rows.map((r) => r.wireId);
}

export async function existingWireIds(tx: Db, projectId: string, wireIds: string[]): Promise<string[]> {
  if (wireIds.length === 0) return [];
  const rows = (await tx("run")
    .where("projectId", projectId)
    .whereIn("wireId", wireIds)
    .select("wireId")) as {
    wireId: string;
  }[];
  return rows.map((r) => r.wireId);
}

export type RunInsert = RunData & { traceCode: string };

export async function insertRuns(tx: Tx, projectId: string, runs: RunInsert[]): Promise<RunRecord[]> {
  const out: RunRecord[] = [];
  // 1,000 rows of 30 columns stay under PostgreSQL's 65,535 bind parameters per statement.
  for (let i = 0; i < runs.length; i += 1000) {
    const chunk = runs.slice(i, i + 1000).map((r) => ({ ...r, projectId }));
    out.push(
      ...((await tx("run")
        .insert(chunk)
        .returning(RUN_COLUMNS as unknown as string[])) as RunRecord[]),
    );
  }
  return out;
}

/** Writes the changed fields and bumps the version, only if the stored version is still `version`. */
export async function updateRunIfVersion(
  tx: Tx,
  runId: string,
  version: number,
  changes: Partial<RunData> & { state?: string },
): Promise<RunRecord | null> {
  const rows = (await tx("run")
    .where({ id: runId, version })
    .update({ ...changes, version: version + 1, updatedAt: tx.fn.now() })
    .returning(RUN_COLUMNS as unknown as string[])) as RunRecord[];
  return rows[0] ?? null;
}

export async function deleteRunRow(tx: Tx, runId: string): Promise<void> {
  await tx("run").where({ id: runId }).delete();
}

export async function touchProject(tx: Tx, projectId: string): Promise<void> {
  await tx("project").where({ id: projectId }).update({ updatedAt: tx.fn.now() });
}

/** Locks the given runs of a project (in id order, so two bulk edits cannot deadlock). */
export async function lockRuns(
  tx: Tx,
  teamId: string,
  projectId: string,
  ids: string[],
): Promise<RunRecord[]> {
  return (await scoped(tx, teamId, projectId)
    .whereIn("r.id", ids)
    .select(RUN_SELECT)
    .orderBy("r.id")
    .forUpdate("r")) as RunRecord[];
}

export async function updateRunsBulk(
  tx: Tx,
  ids: string[],
  changes: Partial<RunData> & { state?: string },
): Promise<RunRecord[]> {
  return (await tx("run")
    .whereIn("id", ids)
    .update({ ...changes, version: tx.raw("version + 1"), updatedAt: tx.fn.now() })
    .returning(RUN_COLUMNS as unknown as string[])) as RunRecord[];
}

/** Updates many runs, each with its own changes, bumping every version (inside the caller's transaction). */
export async function updateRunsEach(
  tx: Tx,
  updates: { id: string; changes: Partial<RunData> }[],
): Promise<RunRecord[]> {
  const out: RunRecord[] = [];
  for (const u of updates) {
    const rows = (await tx("run")
      .where({ id: u.id })
      .update({ ...u.changes, version: tx.raw("version + 1"), updatedAt: tx.fn.now() })
      .returning(RUN_COLUMNS as unknown as string[])) as RunRecord[];
    if (rows[0]) out.push(rows[0]);
  }
  return out;
}

/** What changes whenever a run of the project is added, edited or removed: count, sum of versions, last update. */
export async function runsRevision(
  teamId: string,
  projectId: string,
  q: Db = db(),
): Promise<{ count: number; versionSum: number; lastUpdatedAt: string | null }> {
  const [row] = (await scoped(q, teamId, projectId).select(
    q.raw("count(*)::int as count"),
    q.raw("coalesce(sum(r.version), 0)::bigint as version_sum"),
    q.raw("max(r.updated_at)::text as last_updated_at"),
  )) as [{ count: number; versionSum: number; lastUpdatedAt: string | null }];
  return row;
}
