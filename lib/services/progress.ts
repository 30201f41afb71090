// A project's bench progress, counted from the runs' current states.
import { countRunsByWireTypeAndState } from "@/lib/db/progress";
import type { ProjectRecord } from "@/lib/db/projects";
import { summariseProgress, type ProjectProgress } from "@/lib/domain/progress";

export type ProgressView = ProjectProgress & { projectId: string; projectName: string };

export async function projectProgress(teamId: string, project: ProjectRecord): Promise<ProgressView> {
  const rows = await countRunsByWireTypeAndState(teamId, project.id);
  return { projectId: project.id, projectName: project.name, ...summariseProgress(rows) };
}
