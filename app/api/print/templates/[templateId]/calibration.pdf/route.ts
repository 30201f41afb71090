import { route } from "@/lib/http/handler";
import { calibrationPdf, pdfResponse } from "@/lib/services/print";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** A ruler and crop marks in the template's grid, to measure the printer's offset. */
export const GET = route("GET /api/print/templates/[templateId]/calibration.pdf", async ({ me, params }) =>
  pdfResponse(
    await calibrationPdf(me.teamId, params.templateId ?? ""),
    `calibration-${params.templateId}.pdf`,
  ),
);
