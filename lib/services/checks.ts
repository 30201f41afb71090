// Electrical checks of a project's runs, computed from the current runs and settings; a result is reused only
// while nothing it was computed from has changed (same runs, same versions, same project settings).
import { computeChecks, type ChecksResult } from "@/lib/domain/checks";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { listAllRuns, runsRevision } from "@/lib/db/runs";

const cache = new Map<string, { key: string; result: ChecksResult }>();
const MAX_CACHED_PROJECTS = 50;
import type { RunChecks } from "@/lib/domain/checks";
import type { ProjectSettings, RunData } from "@/lib/domain/types";

export async function projectChecks(teamId: string, project: ProjectRecord): Promise<ChecksResult> {
  const rev = await runsRevision(teamId, project.id);
  const key = `${project.version}|${project.updatedAt}|${rev.count}|${rev.versionSum}|${rev.lastUpdatedAt}`;
  const hit = cache.get(project.id);
  if (hit && hit.key === key) return hit.result;
  const result = computeChecks(await listAllRuns(teamId, project.id), settingsOf(project));
  if (cache.size >= MAX_CACHED_PROJECTS) cache.delete(cache.keys().next().value!);
  cache.set(project.id, { key, result });
  return result;
}

/**
 * One run's checks from the run and the only other runs they read (`linked`: its return run and the runs that
 * use it as their return): the same result the whole project's checks give for it, without reading every run.
 */
export function checksOfRunWith(
  run: RunData,
  linked: readonly RunData[],
  settings: ProjectSettings,
): RunChecks | null {
  return computeChecks([run, ...linked], settings).runs[run.wireId] ?? null;
}

/** A run's checks as the API answers them: `findings` repeats `reasons` with a topic each and is left out. */
export type RunChecksView = Omit<RunChecks, "findings">;

export function checksView(c: RunChecks): RunChecksView {
  const { findings: _findings, ...rest } = c;
  return rest;
}
