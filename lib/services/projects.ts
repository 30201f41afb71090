// Project look-ups shared by handlers and pages: a project of another team is simply not found.
import { getProject, type ProjectRecord } from "@/lib/db/projects";
import { notFound } from "@/lib/http/errors";
import { uuidSchema } from "@/lib/validation/common";

export async function requireProject(teamId: string, projectId: string | undefined): Promise<ProjectRecord> {
  if (!projectId || !uuidSchema.safeParse(projectId).success) throw notFound("That project");
  const p = await getProject(teamId, projectId);
  if (!p) throw notFound("That project");
  return p;
}
