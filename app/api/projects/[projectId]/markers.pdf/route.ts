import { readQuery, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { markerPdf, pdfResponse } from "@/lib/services/print";
import { markersQuerySchema } from "@/lib/validation/print";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** Heat-shrink marker strips for chosen runs: both ends of each run (and repeats), barcodes back to each run. */
export const GET = route("GET /api/projects/[projectId]/markers.pdf", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const q = readQuery(req, markersQuerySchema);
  const { pdf, markerCount, pageCount } = await markerPdf(me.teamId, project, q);
  return pdfResponse(pdf, `${project.name}-markers.pdf`, {
    "X-Marker-Count": String(markerCount),
    "X-Page-Count": String(pageCount),
  });
});
