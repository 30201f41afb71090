import { readJson, route } from "@/lib/http/handler";
import { deletePutUp, getPutUp, updatePutUp } from "@/lib/db/put-ups";
import { found, idParam } from "@/lib/services/stock";
import { putUpPatchSchema } from "@/lib/validation/stock";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

const WHAT = "That put-up";

export const PATCH = route("PATCH /api/stock/put-ups/[putUpId]", async ({ me, params, req }) => {
  const id = idParam(params.putUpId, WHAT);
  // Another team's record is not found before its body is judged.
  found(await getPutUp(me.teamId, id), WHAT);
  const patch = await readJson(req, putUpPatchSchema);
  return updatePutUp(me.teamId, me.user.id, id, patch);
});

export const DELETE = route("DELETE /api/stock/put-ups/[putUpId]", async ({ me, params }) => {
  await deletePutUp(me.teamId, me.user.id, idParam(params.putUpId, WHAT));
  return { ok: true };
});
