import { route } from "@/lib/http/handler";
import { planResponse, requirePlan } from "@/lib/services/plans";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/plans/[planId]", async ({ me, params }) =>
  planResponse(me.teamId, await requirePlan(me.teamId, params.planId)),
);
