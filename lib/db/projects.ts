// Projects, always scoped by team.
import { db, type Db, type Tx } from "@/lib/db/knex";
import type { GaugeSystem, ProjectSettings } from "@/lib/domain/types";

export interface ProjectRecord extends ProjectSettings {
  id: string;
  teamId: string;
  name: string;
  wireIdPrefix: string;
  defaultDropClass: string;
  version: number;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
  runCount: number;
}

const COLUMNS = [
  "p.id",
  "p.teamId",
  "p.name",
  "p.wireIdPrefix",
  "p.supplyV",
  "p.conductorTempC",
  "p.gaugeSystem",
  "p.slackPct",
  "p.slackMinMm",
  "p.serviceLoopMm",
  "p.roundingMm",
  "p.endDiscardMm",
  "p.keepRemnantMm",
  "p.markerRepeatMm",
  "p.defaultDropClass",
  "p.version",
  "p.archivedAt",
  "p.createdAt",
  "p.updatedAt",
];

function withRunCount(q: Db) {
  return q("project as p")
    .select(...COLUMNS)
    .select(q.raw("(select count(*) from run r where r.project_id = p.id)::int as run_count"));
}

export async function listProjects(teamId: string, opts: { includeArchived?: boolean } = {}, q: Db = db()) {
  const rows = (await withRunCount(q)
    .where("p.teamId", teamId)
    .modify((b) => {
      if (!opts.includeArchived) b.whereNull("p.archivedAt");
    })
    .orderBy("p.name", "asc")) as ProjectRecord[];
  return rows.map(normalise);
}

export async function getProject(
  teamId: string,
  projectId: string,
  q: Db = db(),
): Promise<ProjectRecord | null> {
  const row = (await withRunCount(q).where({ "p.teamId": teamId, "p.id": projectId }).first()) as
    ProjectRecord | undefined;
  return row ? normalise(row) : null;
}

function normalise(r: ProjectRecord): ProjectRecord {
  return { ...r, gaugeSystem: r.gaugeSystem as GaugeSystem };
}

export function settingsOf(p: ProjectRecord): ProjectSettings {
  return {
    supplyV: p.supplyV,
    conductorTempC: p.conductorTempC,
    gaugeSystem: p.gaugeSystem,
    slackPct: p.slackPct,
    slackMinMm: p.slackMinMm,
    serviceLoopMm: p.serviceLoopMm,
    roundingMm: p.roundingMm,
    endDiscardMm: p.endDiscardMm,
    keepRemnantMm: p.keepRemnantMm,
    markerRepeatMm: p.markerRepeatMm,
  };
}

export interface ProjectWrite {
  name?: string;
  wireIdPrefix?: string;
  supplyV?: number;
  conductorTempC?: number;
  gaugeSystem?: GaugeSystem;
  slackPct?: number;
  slackMinMm?: number;
  serviceLoopMm?: number;
  roundingMm?: number;
  endDiscardMm?: number;
  keepRemnantMm?: number;
  markerRepeatMm?: number | null;
  defaultDropClass?: string;
  archivedAt?: Date | null;
}

export async function insertProject(
  tx: Tx,
  teamId: string,
  data: ProjectWrite & { name: string },
): Promise<string> {
  const [row] = (await tx("project")
    .insert({ ...data, teamId })
    .returning("id")) as [{ id: string }];
  return row.id;
}

/** Updates only if the stored version is still `version`; returns false on a stale version. */
export async function updateProjectIfVersion(
  tx: Tx,
  teamId: string,
  projectId: string,
  version: number,
  data: ProjectWrite,
): Promise<boolean> {
  const n = await tx("project")
    .where({ id: projectId, teamId, version })
    .update({ ...data, version: version + 1, updatedAt: tx.fn.now() });
  return Number(n) === 1;
}

export async function projectNameTaken(
  q: Db,
  teamId: string,
  name: string,
  exceptId?: string,
): Promise<boolean> {
  const row = await q("project")
    .where({ teamId })
    .whereRaw("lower(name) = lower(?)", [name])
    .modify((b) => {
      if (exceptId) b.whereNot("id", exceptId);
    })
    .first("id");
  return Boolean(row);
}
