import { route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { projectProgress } from "@/lib/services/progress";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** Runs per bench state, overall and per wire type (gauge + colour + insulation). */
export const GET = route("GET /api/projects/[projectId]/progress", async ({ me, params }) => {
  const project = await requireProject(me.teamId, params.projectId);
  return projectProgress(me.teamId, project);
});
