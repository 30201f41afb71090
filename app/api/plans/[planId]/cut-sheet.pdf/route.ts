import { route } from "@/lib/http/handler";
import { cutSheetPdf } from "@/lib/services/plans";
import { pdfResponse } from "@/lib/services/print";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** The bench document of a spool plan: one section per spool in cutting order, with tick boxes and barcodes. */
export const GET = route("GET /api/plans/[planId]/cut-sheet.pdf", async ({ me, params }) => {
  const { pdf, name } = await cutSheetPdf(me, params.planId ?? "");
  return pdfResponse(pdf, name);
});
