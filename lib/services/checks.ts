// Electrical checks of a project's runs, computed on request from the current runs and settings (never stale).
import { computeChecks, type ChecksResult, type RunChecks } from "@/lib/domain/checks";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { listAllRuns } from "@/lib/db/runs";
import type { ProjectSettings, RunData } from "@/lib/domain/types";

export async function projectChecks(teamId: string, project: ProjectRecord): Promise<ChecksResult> {
  const runs = await listAllRuns(teamId, project.id);
  return computeChecks(runs, settingsOf(project));
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
