import { readJson, route } from "@/lib/http/handler";
import { deleteWireType, getWireType, updateWireType } from "@/lib/db/wire-types";
import { found, idParam } from "@/lib/services/stock";
import { wireTypePatchSchema } from "@/lib/validation/stock";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

const WHAT = "That wire type";

export const GET = route("GET /api/stock/wire-types/[wireTypeId]", async ({ me, params }) => {
  return found(await getWireType(me.teamId, idParam(params.wireTypeId, WHAT)), WHAT);
});

export const PATCH = route("PATCH /api/stock/wire-types/[wireTypeId]", async ({ me, params, req }) => {
  const id = idParam(params.wireTypeId, WHAT);
  // Another team's record is not found before its body is judged.
  found(await getWireType(me.teamId, id), WHAT);
  const patch = await readJson(req, wireTypePatchSchema);
  return updateWireType(me.teamId, me.user.id, id, patch);
});

export const DELETE = route("DELETE /api/stock/wire-types/[wireTypeId]", async ({ me, params }) => {
  await deleteWireType(me.teamId, me.user.id, idParam(params.wireTypeId, WHAT));
  return { ok: true };
});
