import { json, readJson, readQuery, route } from "@/lib/http/handler";
import { createSpool, listSpools } from "@/lib/db/spools";
import { spoolCreateSchema, spoolListQuerySchema } from "@/lib/validation/stock";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/stock/spools", async ({ me, req }) => {
  return listSpools(me.teamId, readQuery(req, spoolListQuerySchema));
});

export const POST = route("POST /api/stock/spools", async ({ me, req }) => {
  const input = await readJson(req, spoolCreateSchema);
  return json(await createSpool(me.teamId, me.user.id, input), 201);
});
