import { json, readJson, readQuery, route } from "@/lib/http/handler";
import { createPutUp, listPutUps } from "@/lib/db/put-ups";
import { putUpCreateSchema, putUpListQuerySchema } from "@/lib/validation/stock";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/stock/put-ups", async ({ me, req }) => {
  return listPutUps(me.teamId, readQuery(req, putUpListQuerySchema));
});

export const POST = route("POST /api/stock/put-ups", async ({ me, req }) => {
  const input = await readJson(req, putUpCreateSchema);
  return json(await createPutUp(me.teamId, me.user.id, input), 201);
});
