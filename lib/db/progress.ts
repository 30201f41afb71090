// Counts of a project's runs per wire type and bench state, for the Progress section.
import { db, type Db } from "@/lib/db/knex";
import type { ProgressRow } from "@/lib/domain/progress";

export async function countRunsByWireTypeAndState(
  teamId: string,
  projectId: string,
  q: Db = db(),
): Promise<ProgressRow[]> {
  const rows = (await q("run as r")
    .join("project as p", "p.id", "r.projectId")
    .where({ "p.teamId": teamId, "r.projectId": projectId })
    .groupBy("r.gauge", "r.colour", "r.insulation", "r.state")
    .select("r.gauge", "r.colour", "r.insulation", "r.state")
    .count({ count: "*" })) as ProgressRow[];
  return rows.map((r) => ({ ...r, count: Number(r.count) }));
}
