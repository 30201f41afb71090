import { json, readJson, readQuery, route } from "@/lib/http/handler";
import { createWireType, listWireTypes } from "@/lib/db/wire-types";
import { wireTypeCreateSchema, wireTypeListQuerySchema } from "@/lib/validation/stock";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/stock/wire-types", async ({ me, req }) => {
  return listWireTypes(me.teamId, readQuery(req, wireTypeListQuerySchema));
});

export const POST = route("POST /api/stock/wire-types", async ({ me, req }) => {
  const input = await readJson(req, wireTypeCreateSchema);
  return json(await createWireType(me.teamId, me.user.id, input), 201);
});
