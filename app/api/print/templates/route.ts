import { json, readJson, route } from "@/lib/http/handler";
import { createTemplate, listTemplates } from "@/lib/services/print";
import { markerTemplateBodySchema } from "@/lib/validation/print";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** The built-in marker templates and the team's own. */
export const GET = route("GET /api/print/templates", async ({ me }) => {
  const items = await listTemplates(me.teamId);
  return { items, total: items.length, limit: items.length, offset: 0 };
});

/** A new team template; the layout must fit its page (422 naming what does not). */
export const POST = route("POST /api/print/templates", async ({ me, req }) =>
  json(await createTemplate(me, await readJson(req, markerTemplateBodySchema)), 201),
);
