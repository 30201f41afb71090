import { json, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { createPlan, planResponse, projectPlans, requirePlan } from "@/lib/services/plans";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/projects/[projectId]/plans", async ({ me, params }) => {
  const project = await requireProject(me.teamId, params.projectId);
  return projectPlans(me.teamId, project.id);
});

/** Plans every run's cut onto shelf spools and put-ups to buy (column generation with HiGHS, FFD as fallback). */
export const POST = route("POST /api/projects/[projectId]/plans", async ({ me, params }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const id = await createPlan(me, project);
  return json(await planResponse(me.teamId, await requirePlan(me.teamId, id)), 201);
});
