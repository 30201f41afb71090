// Projects, always scoped by team.
import { db, type Db } from "@/lib/db/knex";
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
