import { readJson, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { deleteRun, patchRun, withCutLength, withLastTests } from "@/lib/services/runs";
import { getRun } from "@/lib/db/runs";
import { notFound } from "@/lib/http/errors";
import { uuidSchema } from "@/lib/validation/common";
import { runPatchSchema } from "@/lib/validation/runs";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

function runIdOf(params: Record<string, string>): string {
  if (!uuidSchema.safeParse(params.runId).success) throw notFound("That run");
  return params.runId!;
}

export const GET = route("GET /api/projects/[projectId]/runs/[runId]", async ({ me, params }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const run = await getRun(me.teamId, project.id, runIdOf(params));
  if (!run) throw notFound("That run");
  return (await withLastTests(me.teamId, withCutLength(project, [run])))[0];
});

export const PATCH = route("PATCH /api/projects/[projectId]/runs/[runId]", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const runId = runIdOf(params);
  const updated = await patchRun(me, project, runId, await readJson(req, runPatchSchema));
  return (await withLastTests(me.teamId, withCutLength(project, [updated])))[0];
});

export const DELETE = route("DELETE /api/projects/[projectId]/runs/[runId]", async ({ me, params }) => {
  const project = await requireProject(me.teamId, params.projectId);
  await deleteRun(me, project, runIdOf(params));
  return { ok: true };
});
