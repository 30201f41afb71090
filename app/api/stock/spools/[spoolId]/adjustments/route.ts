import { json, readJson, readQuery, route } from "@/lib/http/handler";
import { adjustSpoolLength, getSpool, listAdjustments } from "@/lib/db/spools";
import { found, idParam } from "@/lib/services/stock";
import { adjustmentListQuerySchema, spoolAdjustmentSchema } from "@/lib/validation/stock";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

const WHAT = "That spool";

export const GET = route("GET /api/stock/spools/[spoolId]/adjustments", async ({ me, params, req }) => {
  const id = idParam(params.spoolId, WHAT);
  return listAdjustments(me.teamId, id, readQuery(req, adjustmentListQuerySchema));
});

/** A measured length with the reason, recorded with who made it, in one transaction with the change. */
export const POST = route("POST /api/stock/spools/[spoolId]/adjustments", async ({ me, params, req }) => {
  const id = idParam(params.spoolId, WHAT);
  // Another team's record is not found before its body is judged.
  found(await getSpool(me.teamId, id), WHAT);
  const input = await readJson(req, spoolAdjustmentSchema);
  return json(await adjustSpoolLength(me.teamId, me.user.id, id, input), 201);
});
