// What a scanned marker opens: the run behind a trace code, with its checks, history and neighbours.
import { db } from "@/lib/db/knex";
import { listEntityEvents, type AuditEventView } from "@/lib/db/audit";
import { findRunByTraceCode, runsOnDevices, type RunRecord } from "@/lib/db/runs";
import { normaliseTraceCode } from "@/lib/domain/trace-code";
import type { RunChecks } from "@/lib/domain/checks";
import { notFound } from "@/lib/http/errors";
import { requireProject } from "@/lib/services/projects";
import { projectChecks } from "@/lib/services/checks";
import { withCutLength, type RunView } from "@/lib/services/runs";
import { traceCut, type TraceCutView } from "@/lib/services/bench";

export interface TraceView {
  run: RunView;
  project: { id: string; name: string };
  checks: RunChecks | null;
  history: AuditEventView[];
  related: Pick<RunRecord, "id" | "wireId" | "endA" | "endB" | "circuit" | "traceCode">[];
  /** Which spool the run was cut from, by whom and when (null until cut). */
  cut: TraceCutView | null;
}

const device = (ref: string) => ref.split(":")[0]!.trim();

export async function traceRun(teamId: string, rawCode: string): Promise<TraceView> {
  const code = normaliseTraceCode(rawCode);
  if (!code) throw notFound("A run with that code");
  const found = await findRunByTraceCode(teamId, code);
  if (!found) throw notFound("A run of your team with that code");
  const { projectName, ...run } = found;
  const project = await requireProject(teamId, run.projectId);
  const [checks, history, related, cut] = await Promise.all([
    projectChecks(teamId, project),
    listEntityEvents(db(), teamId, "run", run.id),
    runsOnDevices(teamId, run.projectId, [...new Set([device(run.endA), device(run.endB)])], run.id),
    traceCut(teamId, run.id),
  ]);
  return {
    run: withCutLength(project, [run])[0]!,
    project: { id: run.projectId, name: projectName },
    checks: checks.runs[run.wireId] ?? null,
    history,
    related,
    cut,
  };
}
