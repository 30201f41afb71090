// The reads behind a trace page: the run a code names with its project's settings, and the runs around it.
import { db, type Db } from "@/lib/db/knex";
import { RUN_SELECT, type RunRecord } from "@/lib/db/runs";
import type { GaugeSystem, ProjectSettings } from "@/lib/domain/types";

const SETTING_KEYS = [
  "supplyV",
  "conductorTempC",
  "gaugeSystem",
  "slackPct",
  "slackMinMm",
  "serviceLoopMm",
  "roundingMm",
  "endDiscardMm",
  "keepRemnantMm",
  "markerRepeatMm",
] as const satisfies readonly (keyof ProjectSettings)[];

const alias = (k: string) => `setting${k[0]!.toUpperCase()}${k.slice(1)}`;

export interface TraceRunRow {
  run: RunRecord;
  projectName: string;
  settings: ProjectSettings;
  /**
   * The project row's version (PostgreSQL xmin). Every write to a project's runs touches the project row
   * (touchProject), so an unchanged stamp means nothing a trace page shows has changed.
   */
  stamp: string;
}

/** The run a trace code names, if it belongs to a project of this team, with its project's settings, in one read. */
export async function findTraceRun(teamId: string, code: string, q: Db = db()): Promise<TraceRunRow | null> {
  const row = (await q("run as r")
    .join("project as p", "p.id", "r.projectId")
    .where({ "p.teamId": teamId, "r.traceCode": code })
    .select([
      ...RUN_SELECT,
      "p.name as projectName",
      ...SETTING_KEYS.map((k) => `p.${k} as ${alias(k)}`),
      q.raw("p.xmin::text as stamp"),
    ])
    .first()) as Record<string, unknown> | undefined;
  if (!row) return null;
  const run: Record<string, unknown> = {};
  const settings: Record<string, unknown> = {};
  for (const k of SETTING_KEYS) settings[k] = row[alias(k)];
  for (const [k, v] of Object.entries(row)) {
    if (k !== "projectName" && k !== "stamp" && !k.startsWith("setting")) run[k] = v;
  }
  return {
    run: run as unknown as RunRecord,
    projectName: row.projectName as string,
    settings: {
      ...(settings as unknown as ProjectSettings),
      gaugeSystem: settings.gaugeSystem as GaugeSystem,
    },
    stamp: row.stamp as string,
  };
}

/** The runs a run's checks read besides itself: its return run, and the runs that use it as their return. */
export async function runsLinkedByReturn(
  teamId: string,
  projectId: string,
  run: Pick<RunRecord, "id" | "wireId" | "returnKind" | "returnRunWireId">,
  q: Db = db(),
): Promise<RunRecord[]> {
  return (await q("run as r")
    .join("project as p", "p.id", "r.projectId")
    .where({ "p.teamId": teamId, "r.projectId": projectId })
    .whereNot("r.id", run.id)
    .where((w) => {
      w.where({ "r.returnKind": "run", "r.returnRunWireId": run.wireId });
      if (run.returnKind === "run" && run.returnRunWireId) w.orWhere("r.wireId", run.returnRunWireId);
    })
    .select(RUN_SELECT)
    .orderBy("r.wireId", "asc")
    .limit(1000)) as RunRecord[];
}
