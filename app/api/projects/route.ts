import { route } from "@/lib/http/handler";
import { listProjects } from "@/lib/db/projects";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/projects", async ({ me }) => {
  const items = await listProjects(me.teamId);
  return { items, total: items.length, limit: items.length, offset: 0 };
});
