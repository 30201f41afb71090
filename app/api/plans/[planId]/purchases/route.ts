import { z } from "zod";
import { readQuery, route } from "@/lib/http/handler";
import { purchaseCsv, purchaseXlsx, requirePlan } from "@/lib/services/plans";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

const querySchema = z.object({ format: z.enum(["json", "csv", "xlsx"]).default("json") });

/** The put-ups a plan needs to buy, per supplier, as JSON, CSV or XLSX. */
export const GET = route("GET /api/plans/[planId]/purchases", async ({ me, params, req }) => {
  const plan = await requirePlan(me.teamId, params.planId);
  const { format } = readQuery(req, querySchema);
  const name = `purchase-list-${plan.id.slice(0, 8)}`;
  if (format === "csv") {
    return new Response(purchaseCsv(plan.result), {
      headers: {
        "Content-Type": "text/csv; charset=utf-8",
        "Content-Disposition": `attachment; filename="${name}.csv"`,
      },
    });
  }
  if (format === "xlsx") {
    return new Response(new Uint8Array(await purchaseXlsx(plan.result)), {
      headers: {
        "Content-Type": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
        "Content-Disposition": `attachment; filename="${name}.xlsx"`,
      },
    });
  }
  const items = plan.result.purchases;
  return { items, total: items.length, limit: items.length, offset: 0 };
});
