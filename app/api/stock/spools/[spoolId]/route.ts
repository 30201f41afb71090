import { readJson, route } from "@/lib/http/handler";
import { getSpool, updateSpool } from "@/lib/db/spools";
import { found, idParam } from "@/lib/services/stock";
import { spoolPatchSchema } from "@/lib/validation/stock";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

const WHAT = "That spool";

export const GET = route("GET /api/stock/spools/[spoolId]", async ({ me, params }) => {
  return found(await getSpool(me.teamId, idParam(params.spoolId, WHAT)), WHAT);
});

/** Lot, location, state or origin note, with the spool's version; 409 with the current record when stale. */
export const PATCH = route("PATCH /api/stock/spools/[spoolId]", async ({ me, params, req }) => {
  const id = idParam(params.spoolId, WHAT);
  // Another team's record is not found before its body is judged.
  found(await getSpool(me.teamId, id), WHAT);
  const patch = await readJson(req, spoolPatchSchema);
  return updateSpool(me.teamId, me.user.id, id, patch);
});
