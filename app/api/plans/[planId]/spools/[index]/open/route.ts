import { json, readJson, route } from "@/lib/http/handler";
import { notFound } from "@/lib/http/errors";
import { openPlanSpool } from "@/lib/services/bench";
import { requirePlan } from "@/lib/services/plans";
import { planSpoolOpenSchema } from "@/lib/validation/bench";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** Opens a plan's new put-up as a shelf spool (201), or answers the one already opened for it (200). */
export const POST = route("POST /api/plans/[planId]/spools/[index]/open", async ({ me, params, req }) => {
  const plan = await requirePlan(me.teamId, params.planId);
  if (!/^\d{1,6}$/.test(params.index ?? "")) throw notFound("That spool of the plan");
  const input = await readJson(req, planSpoolOpenSchema);
  const out = await openPlanSpool(me, plan.id, Number(params.index), input);
  return json(out, out.created ? 201 : 200);
});
