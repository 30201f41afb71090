import { readJson, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { remapImport, requireImport } from "@/lib/services/imports";
import { importMappingSchema } from "@/lib/validation/imports";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/projects/[projectId]/imports/[importId]", async ({ me, params }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const r = await requireImport(me, project, params.importId);
  return { id: r.id, filename: r.filename, status: r.status, createdAt: r.createdAt, preview: r.preview };
});

/** The user's column mapping: every row is checked again with it. */
export const PATCH = route(
  "PATCH /api/projects/[projectId]/imports/[importId]",
  async ({ me, params, req }) => {
    const project = await requireProject(me.teamId, params.projectId);
    const r = await requireImport(me, project, params.importId);
    return remapImport(me, project, r.id, await readJson(req, importMappingSchema));
  },
);
