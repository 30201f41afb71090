import { route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/projects/[projectId]", async ({ me, params }) => {
  return requireProject(me.teamId, params.projectId);
});
