import { readQuery, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { checksView, projectChecks } from "@/lib/services/checks";
import { checksQuerySchema } from "@/lib/validation/checks";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** Per-run electrical checks (paged, filterable by verdict), the project summary and the cautions. */
export const GET = route("GET /api/projects/[projectId]/checks", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const q = readQuery(req, checksQuerySchema);
  const result = await projectChecks(me.teamId, project);
  const filtered = q.verdict ? result.list.filter((r) => r.verdict === q.verdict) : result.list;
  return {
    summary: result.summary,
    cautions: result.cautions,
    items: filtered.slice(q.offset, q.offset + q.limit).map(checksView),
    total: filtered.length,
    limit: q.limit,
    offset: q.offset,
  };
});
