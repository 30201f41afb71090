import { readQuery, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { listRuns } from "@/lib/db/runs";
import { runListQuerySchema } from "@/lib/validation/runs";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/projects/[projectId]/runs", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const query = readQuery(req, runListQuerySchema);
  return listRuns(me.teamId, project.id, query);
});
