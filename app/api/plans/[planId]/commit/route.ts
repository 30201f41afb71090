import { route } from "@/lib/http/handler";
import { commitPlan } from "@/lib/services/plans";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** Reserves the shelf spools the plan uses and shelves the kept remnants, in one transaction (409 on a race). */
export const POST = route("POST /api/plans/[planId]/commit", async ({ me, params }) =>
  commitPlan(me, params.planId ?? ""),
);
