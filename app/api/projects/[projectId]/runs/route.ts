import { json, readJson, readQuery, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { createRuns, withCutLength, withLastTests } from "@/lib/services/runs";
import { listRuns } from "@/lib/db/runs";
import { runCreateBodySchema, runListQuerySchema } from "@/lib/validation/runs";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/projects/[projectId]/runs", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const query = readQuery(req, runListQuerySchema);
  const page = await listRuns(me.teamId, project.id, query);
  return { ...page, items: await withLastTests(me.teamId, withCutLength(project, page.items)) };
});

/** One run, or `{ runs: [...] }` for many, in one transaction. */
export const POST = route("POST /api/projects/[projectId]/runs", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const { many, runs } = await readJson(req, runCreateBodySchema);
  const created = withCutLength(project, await createRuns(me, project, runs));
  return json(many ? { items: created, total: created.length } : created[0], 201);
});
