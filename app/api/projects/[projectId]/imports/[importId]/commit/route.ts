import { route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { commitImport, requireImport } from "@/lib/services/imports";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** All rows in one transaction, or 422 and nothing written while any error is left. */
export const POST = route(
  "POST /api/projects/[projectId]/imports/[importId]/commit",
  async ({ me, params }) => {
    const project = await requireProject(me.teamId, params.projectId);
    const r = await requireImport(me, project, params.importId);
    return commitImport(me, project, r.id);
  },
);
