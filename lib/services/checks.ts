// Electrical checks of a project's runs, computed on request from the current runs and settings (never stale).
import { computeChecks, type ChecksResult } from "@/lib/domain/checks";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { listAllRuns } from "@/lib/db/runs";

export async function projectChecks(teamId: string, project: ProjectRecord): Promise<ChecksResult> {
  const runs = await listAllRuns(teamId, project.id);
  return computeChecks(runs, settingsOf(project));
}
