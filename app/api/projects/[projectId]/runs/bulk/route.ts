import { readJson, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { bulkPatchRuns, withCutLength, withLastTests } from "@/lib/services/runs";
import { runBulkPatchSchema } from "@/lib/validation/runs";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** The same change to many runs in one transaction (role limits as for a single edit). */
export const POST = route("POST /api/projects/[projectId]/runs/bulk", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const updated = await bulkPatchRuns(me, project, await readJson(req, runBulkPatchSchema));
  return { items: await withLastTests(me.teamId, withCutLength(project, updated)), total: updated.length };
});
