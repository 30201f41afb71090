import { readJson, route } from "@/lib/http/handler";
import { removeTemplate, requireTemplate, updateTemplate } from "@/lib/services/print";
import { markerTemplatePatchSchema } from "@/lib/validation/print";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const PATCH = route("PATCH /api/print/templates/[templateId]", async ({ me, params, req }) => {
  const id = (await requireTemplate(me.teamId, params.templateId ?? "")).id;
  return updateTemplate(me, id, await readJson(req, markerTemplatePatchSchema));
});

export const DELETE = route("DELETE /api/print/templates/[templateId]", async ({ me, params }) => {
  const id = (await requireTemplate(me.teamId, params.templateId ?? "")).id;
  await removeTemplate(me, id);
  return { ok: true };
});
