// The reads behind a trace page: the run a code names with its project's settings, and the runs around it.
import { db, type Db } from "@/lib/db/knex";
import { RUN_SELECT, type RunRecord } from "@/lib/db/runs";
import type { RunTestRecord } from "@/lib/db/run-tests";
import type { AuditEventView } from "@/lib/db/audit";
import { camelRow, toSnake } from "@/lib/db/case";
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

export type RelatedRun = Pick<RunRecord, "id" | "wireId" | "endA" | "endB" | "circuit" | "traceCode">;

export interface TraceRest {
  /** The runs the run's checks read besides itself: its return run, and the runs that use it as their return. */
  linked: RunRecord[];
  /** Other runs ending on one of the given devices (the part of a reference before ':'), by wire ID, at most 100. */
  related: RelatedRun[];
  /** Its test results, newest first (at most 100). */
  tests: RunTestRecord[];
  /** Its audit history, oldest first (at most 500). */
  history: AuditEventView[];
}

const RUN_SQL_COLUMNS = RUN_SELECT.map((c) => `r.${toSnake(c.slice(2))}`).join(", ");
const asRows = <T>(json: unknown, dates: readonly string[]): T[] =>
  (json as Record<string, unknown>[]).map((raw) => {
    const row = camelRow(raw) as Record<string, unknown>;
    for (const d of dates) if (typeof row[d] === "string") row[d] = new Date(row[d] as string);
    return row as T;
  });

/**
 * Everything else a trace page shows, in one read (one round trip instead of four): the linked and related runs,
 * the tests and the history. The run is already known to belong to the team's project.
 */
export async function traceRest(
  teamId: string,
  run: Pick<RunRecord, "id" | "projectId" | "wireId" | "returnKind" | "returnRunWireId">,
  devices: readonly string[],
  q: Db = db(),
): Promise<TraceRest> {
  const linkedArgs: unknown[] = [run.projectId, run.id, run.wireId];
  let linkedReturn = "";
  if (run.returnKind === "run" && run.returnRunWireId) {
    linkedReturn = " or r.wire_id = ?";
    linkedArgs.push(run.returnRunWireId);
  }
  const deviceSql = devices.length
    ? devices.map(() => "split_part(r.end_a, ':', 1) = ? or split_part(r.end_b, ':', 1) = ?").join(" or ")
    : "false";
  const sql = `select
    (select coalesce(json_agg(l order by l.wire_id), cast('[]' as json)) from (
      select ${RUN_SQL_COLUMNS} from run r
      where r.project_id = ? and r.id <> ? and ((r.return_kind = 'run' and r.return_run_wire_id = ?)${linkedReturn})
      limit 1000) l) as linked,
    (select coalesce(json_agg(d order by d.wire_id), cast('[]' as json)) from (
      select r.id, r.wire_id, r.end_a, r.end_b, r.circuit, r.trace_code from run r
      where r.project_id = ? and r.id <> ? and (${deviceSql})
      order by r.wire_id limit 100) d) as related,
    (select coalesce(json_agg(t order by t.id desc), cast('[]' as json)) from (
      select t.id, t.run_id, t.kind, t.passed, t.value, t.note, t.tested_by, u.name as tested_by_name, t.tested_at,
        t.run_version
      from run_test t left join app_user u on u.id = t.tested_by
      where t.run_id = ? order by t.id desc limit 100) t) as tests,
    (select coalesce(json_agg(h order by h.id), cast('[]' as json)) from (
      select e.id, e.action, u.name as actor_name, e.detail, e.created_at
      from audit_events e left join app_user u on u.id = e.actor_user_id
      where e.team_id = ? and e.entity_type = 'run' and e.entity_id = ? order by e.id limit 500) h) as history`;
  const args = [
    ...linkedArgs,
    run.projectId,
    run.id,
    ...devices.flatMap((d) => [d, d]),
    run.id,
    teamId,
    run.id,
  ];
  const res = (await q.raw(sql, args as string[])) as {
    rows: { linked: unknown; related: unknown; tests: unknown; history: unknown }[];
  };
  const row = res.rows[0]!;
  return {
    linked: asRows<RunRecord>(row.linked, ["createdAt", "updatedAt"]),
    related: asRows<RelatedRun>(row.related, []),
    tests: asRows<RunTestRecord>(row.tests, ["testedAt"]),
    history: asRows<AuditEventView>(row.history, ["createdAt"]),
  };
}
