import { readQuery, route } from "@/lib/http/handler";
import { auditQuerySchema } from "@/lib/validation/team";
import { auditFacets, listAuditEvents } from "@/lib/db/audit";
import { db } from "@/lib/db/knex";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/audit", async ({ me, req }) => {
  const query = readQuery(req, auditQuerySchema);
  const [page, facets] = await Promise.all([
    listAuditEvents(me.teamId, query, db()),
    auditFacets(me.teamId, db()),
  ]);
  return { ...page, facets };
});
