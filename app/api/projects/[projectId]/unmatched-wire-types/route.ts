import { readQuery, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { listUnmatchedWireTypes } from "@/lib/services/stock";
import { unmatchedListQuerySchema } from "@/lib/validation/stock";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** The (gauge, colour, insulation) combinations of the project's runs that no wire type of the team covers. */
export const GET = route(
  "GET /api/projects/[projectId]/unmatched-wire-types",
  async ({ me, params, req }) => {
    const project = await requireProject(me.teamId, params.projectId);
    return listUnmatchedWireTypes(me.teamId, project.id, readQuery(req, unmatchedListQuerySchema));
  },
);
