import { readJson, readQuery, route } from "@/lib/http/handler";
import { patchProject, requireProject } from "@/lib/services/projects";
import { projectPatchSchema } from "@/lib/validation/projects";
import { z } from "zod";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/projects/[projectId]", async ({ me, params }) => {
  return requireProject(me.teamId, params.projectId);
});

export const PATCH = route("PATCH /api/projects/[projectId]", async ({ me, params, req }) => {
  await requireProject(me.teamId, params.projectId);
  const input = await readJson(req, projectPatchSchema);
  return patchProject(me, params.projectId!, input);
});

/** Archives the project (nothing is deleted; PATCH {archived:false} restores it). */
export const DELETE = route("DELETE /api/projects/[projectId]", async ({ me, params, req }) => {
  await requireProject(me.teamId, params.projectId);
  const { version } = readQuery(req, z.object({ version: z.coerce.number().int().min(1) }));
  return patchProject(me, params.projectId!, { version, archived: true });
});
