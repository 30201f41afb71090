import { json, readJson, route } from "@/lib/http/handler";
import { listProjects } from "@/lib/db/projects";
import { createProject } from "@/lib/services/projects";
import { projectCreateSchema } from "@/lib/validation/projects";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/projects", async ({ me, req }) => {
  const includeArchived = req.nextUrl.searchParams.get("archived") === "1";
  const items = await listProjects(me.teamId, { includeArchived });
  return { items, total: items.length, limit: items.length, offset: 0 };
});

export const POST = route("POST /api/projects", async ({ me, req }) => {
  const input = await readJson(req, projectCreateSchema);
  return json(await createProject(me, input), 201);
});
