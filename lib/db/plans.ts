// Stored spool plans, reached only through a project of the caller's team.
import { db, type Db, type Tx } from "@/lib/db/knex";
import type { PlanView } from "@/lib/services/plan-view";

export interface PlanRecord {
  id: string;
  projectId: string;
  createdBy: string | null;
  status: "draft" | "committed";
  result: PlanView;
  runVersions: Record<string, number>;
  spoolVersions: Record<string, number>;
  costCents: number;
  lowerBoundCents: number;
  gapPct: number | null;
  createdAt: string;
  committedAt: string | null;
}

const COLUMNS = [
  "s.id",
  "s.projectId",
  "s.createdBy",
  "s.status",
  "s.runVersions",
  "s.spoolVersions",
  "s.costCents",
  "s.lowerBoundCents",
  "s.gapPct",
  "s.createdAt",
  "s.committedAt",
];

export async function insertPlan(
  q: Db,
  p: Omit<PlanRecord, "id" | "createdAt" | "committedAt" | "status">,
): Promise<string> {
  const [row] = (await q("spoolPlan")
    .insert({
      projectId: p.projectId,
      createdBy: p.createdBy,
      result: JSON.stringify(p.result),
      runVersions: JSON.stringify(p.runVersions),
      spoolVersions: JSON.stringify(p.spoolVersions),
      costCents: p.costCents,
      lowerBoundCents: p.lowerBoundCents,
      gapPct: p.gapPct,
    })
    .returning("id")) as [{ id: string }];
  return row.id;
}

/** A plan of the team (by plan id alone: the plan routes do not carry the project). */
export async function getPlan(
  teamId: string,
  planId: string,
  opts: { forUpdate?: Tx } = {},
): Promise<PlanRecord | null> {
  const q = opts.forUpdate ?? db();
  const row = (await q("spoolPlan as s")
    .join("project as p", "p.id", "s.projectId")
    .where({ "p.teamId": teamId, "s.id": planId })
    .select([...COLUMNS, "s.result"])
    .modify((b) => {
      if (opts.forUpdate) b.forUpdate("s");
    })
    .first()) as PlanRecord | undefined;
  return row ?? null;
}

export async function listPlans(teamId: string, projectId: string): Promise<Omit<PlanRecord, "result">[]> {
  return (await db()("spoolPlan as s")
    .join("project as p", "p.id", "s.projectId")
    .where({ "p.teamId": teamId, "s.projectId": projectId })
    .select(COLUMNS)
    .orderBy("s.createdAt", "desc")
    .limit(50)) as Omit<PlanRecord, "result">[];
}

export async function markPlanCommitted(tx: Tx, planId: string, userId: string): Promise<void> {
  await tx("spoolPlan")
    .where({ id: planId })
    .update({ status: "committed", committedAt: tx.fn.now(), committedBy: userId });
}
