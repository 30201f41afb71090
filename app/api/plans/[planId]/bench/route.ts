import { route } from "@/lib/http/handler";
import { benchView } from "@/lib/services/bench";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** A plan as the bench works it: spools with their shelf records now, cuts in order, each run's state and version. */
export const GET = route("GET /api/plans/[planId]/bench", async ({ me, params }) =>
  benchView(me, params.planId ?? ""),
);
