// What a scanned marker opens: the run behind a trace code, with its checks, tests, history and neighbours.
import type { AuditEventView } from "@/lib/db/audit";
import { findTraceRun, traceRest, type RelatedRun, type TraceRunRow } from "@/lib/db/trace";
import type { RunTestRecord } from "@/lib/db/run-tests";
import { normaliseTraceCode } from "@/lib/domain/trace-code";
import { runCutLengthMm } from "@/lib/domain/cut-length";
import { notFound } from "@/lib/http/errors";
import { checksOfRunWith, checksView, type RunChecksView } from "@/lib/services/checks";
import type { RunView } from "@/lib/services/runs";
import { traceCut, type TraceCutView } from "@/lib/services/bench";

export type { RelatedRun };

export interface TraceView {
  run: RunView;
  project: { id: string; name: string };
  checks: RunChecksView | null;
  /** Test results, newest first (run.lastTest is the first). */
  tests: RunTestRecord[];
  history: AuditEventView[];
  related: RelatedRun[];
  /** Which spool the run was cut from, by whom and when (null until cut). */
  cut: TraceCutView | null;
}

const device = (ref: string) => ref.split(":")[0]!.trim();

// Views already built, per team and code, with the project row version they were built from. Each scan reads the
// run and that version in one query; only when the project changed is the rest read again (in one more query).
const CACHE_MAX = 1000;
const cache = new Map<string, { stamp: string; view: TraceView }>();

export async function traceRun(teamId: string, rawCode: string): Promise<TraceView> {
  const code = normaliseTraceCode(rawCode);
  if (!code) throw notFound("A run with that code");
  const head = await findTraceRun(teamId, code);
  if (!head) throw notFound("A run of your team with that code");
  const key = `${teamId}:${code}`;
  const hit = cache.get(key);
  if (hit && hit.stamp === head.stamp) {
    cache.delete(key);
    cache.set(key, hit);
    return hit.view;
  }
  // Read after the stamp: a change in between only makes the next scan see a newer stamp and build again.
  const view = await buildTraceView(teamId, head);
  cache.delete(key);
  cache.set(key, { stamp: head.stamp, view });
  if (cache.size > CACHE_MAX) cache.delete(cache.keys().next().value!);
  return view;
}

async function buildTraceView(teamId: string, head: TraceRunRow): Promise<TraceView> {
  const { run, settings } = head;
  const devices = [...new Set([device(run.endA), device(run.endB)])];
  // The checks read only the runs this run's checks depend on: the same result as the whole project's checks.
  const [{ linked, related, tests, history }, cut] = await Promise.all([
    traceRest(teamId, run, devices),
    traceCut(teamId, run.id),
  ]);
  const runChecks = checksOfRunWith(run, linked, settings);
  return {
    run: { ...run, cutLengthMm: runCutLengthMm(run, settings), lastTest: tests[0] ?? null },
    project: { id: run.projectId, name: head.projectName },
    checks: runChecks ? checksView(runChecks) : null,
    tests,
    history,
    related,
    cut,
  };
}
