// Runs of a project, always reached through a project of the caller's team.
import { db, type Db } from "@/lib/db/knex";
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
    .select(RUN_COLUMNS.map((c) => `r.${c}`))
    .orderBy(`r.${query.sort}`, query.dir)
    .orderBy("r.wireId", "asc")
    .limit(query.limit)
    .offset(query.offset)) as RunRecord[];
  return { items, total: Number(countRow.total), limit: query.limit, offset: query.offset };
}

export async function listAllRuns(teamId: string, projectId: string, q: Db = db()): Promise<RunRecord[]> {
  return (await scoped(q, teamId, projectId)
    .select(RUN_COLUMNS.map((c) => `r.${c}`))
    .orderBy("r.wireId", "asc")) as RunRecord[];
}
