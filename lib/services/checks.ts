// Electrical checks of a project's runs, computed from the current runs and settings; a result is reused only
// while nothing it was computed from has changed (same runs, same versions, same project settings).
import { computeChecks, type ChecksResult } from "@/lib/domain/checks";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { listAllRuns, runsRevision } from "@/lib/db/runs";

const cache = new Map<string, { key: string; result: ChecksResult }>();
const MAX_CACHED_PROJECTS = 50;

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
