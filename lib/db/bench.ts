// Bench records: the spool a run was cut from, replay-proof bench actions, and spools opened for a plan's put-ups.
import { db, type Db, type Tx } from "@/lib/db/knex";

export interface RunCutRecord {
  runId: string;
  cutFromSpoolId: string | null;
  cutBy: string | null;
  cutByName: string | null;
  cutAt: string | null;
  cutTakenMm: number | null;
  spoolLot: string | null;
  spoolLocation: string | null;
}

/** The cut record of a run of the team (null when the run is not the team's). */
export async function getRunCut(teamId: string, runId: string, q: Db = db()): Promise<RunCutRecord | null> {
  const row = (await q("run as r")
    .join("project as p", "p.id", "r.projectId")
    .leftJoin("spool as s", "s.id", "r.cutFromSpoolId")
    .leftJoin("appUser as u", "u.id", "r.cutBy")
    .where({ "p.teamId": teamId, "r.id": runId })
    .select(
      "r.id as runId",
      "r.cutFromSpoolId",
      "r.cutBy",
      "u.name as cutByName",
      "r.cutAt",
      "r.cutTakenMm",
      "s.lot as spoolLot",
      "s.location as spoolLocation",
    )
    .first()) as RunCutRecord | undefined;
  return row ?? null;
}

/** The cut records of a project's runs, by run id. */
export async function listRunCuts(
  teamId: string,
  projectId: string,
  q: Db = db(),
): Promise<Map<string, { cutFromSpoolId: string | null; cutBy: string | null }>> {
  const rows = (await q("run as r")
    .join("project as p", "p.id", "r.projectId")
    .where({ "p.teamId": teamId, "r.projectId": projectId })
    .select("r.id", "r.cutFromSpoolId", "r.cutBy")) as {
    id: string;
    cutFromSpoolId: string | null;
    cutBy: string | null;
  }[];
  return new Map(rows.map((r) => [r.id, { cutFromSpoolId: r.cutFromSpoolId, cutBy: r.cutBy }]));
}

export async function setRunCut(
  tx: Tx,
  runId: string,
  cut: { spoolId: string | null; userId: string | null; takenMm: number | null } | null,
): Promise<void> {
  await tx("run")
    .where({ id: runId })
    .update(
      cut
        ? { cutFromSpoolId: cut.spoolId, cutBy: cut.userId, cutAt: tx.fn.now(), cutTakenMm: cut.takenMm }
        : { cutFromSpoolId: null, cutBy: null, cutAt: null, cutTakenMm: null },
    );
}

export interface BenchActionRecord {
  actionId: string;
  runId: string;
  toState: string;
  resultVersion: number;
}

export async function findBenchAction(
  q: Db,
  teamId: string,
  actionId: string,
): Promise<BenchActionRecord | null> {
  const row = (await q("benchAction")
    .where({ teamId, actionId })
    .select("actionId", "runId", "toState", "resultVersion")
    .first()) as BenchActionRecord | undefined;
  return row ?? null;
}

export async function insertBenchAction(
  tx: Tx,
  teamId: string,
  actorUserId: string,
  a: BenchActionRecord,
): Promise<void> {
  await tx("benchAction").insert({ teamId, actorUserId, ...a });
}

export interface PlanSpoolOpenRecord {
  planId: string;
  wireTypeId: string;
  spoolIndex: number;
  spoolId: string;
}

export async function listPlanSpoolOpens(planId: string, q: Db = db()): Promise<PlanSpoolOpenRecord[]> {
  return (await q("planSpoolOpen")
    .where({ planId })
    .select("planId", "wireTypeId", "spoolIndex", "spoolId")) as PlanSpoolOpenRecord[];
}

export async function insertPlanSpoolOpen(tx: Tx, rec: PlanSpoolOpenRecord, openedBy: string): Promise<void> {
  await tx("planSpoolOpen").insert({ ...rec, openedBy });
}

/** The newest committed plan of a project that cuts from this spool (a reserved shelf spool or an opened one). */
export async function planOfSpool(q: Db, projectId: string, spoolId: string): Promise<{ id: string } | null> {
  const row = (await q("spoolPlan as s")
    .where({ "s.projectId": projectId, "s.status": "committed" })
    .where((w) =>
      w
        .whereRaw("jsonb_exists(s.spool_versions::jsonb, ?)", [spoolId])
        .orWhereExists((e) =>
          e
            .select(q.raw("1"))
            .from("planSpoolOpen as o")
            .whereRaw("o.plan_id = s.id")
            .where("o.spoolId", spoolId),
        ),
    )
    .orderBy("s.createdAt", "desc")
    .select("s.id")
    .first()) as { id: string } | undefined;
  return row ?? null;
}

export interface BenchSpoolStock {
  id: string;
  wireTypeId: string;
  lengthMm: number;
  initialLengthMm: number;
  lot: string | null;
  location: string | null;
  state: string;
  version: number;
}

/** Spools of the team by id (shelf spools a plan cuts from and the ones opened for it). */
export async function spoolsByIds(teamId: string, ids: string[], q: Db = db()): Promise<BenchSpoolStock[]> {
  if (ids.length === 0) return [];
  return (await q("spool")
    .where({ teamId })
    .whereIn("id", ids)
    .select(
      "id",
      "wireTypeId",
      "lengthMm",
      "initialLengthMm",
      "lot",
      "location",
      "state",
      "version",
    )) as BenchSpoolStock[];
}

/** Locks a spool of the team for the rest of the transaction, so two cuts from it cannot both read one length. */
export async function lockSpoolRow(tx: Tx, teamId: string, spoolId: string): Promise<boolean> {
  const row = await tx("spool").where({ teamId, id: spoolId }).forUpdate().select("id").first();
  return Boolean(row);
}
