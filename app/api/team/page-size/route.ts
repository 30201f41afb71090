import { readJson, route } from "@/lib/http/handler";
import { changePageSize } from "@/lib/services/print";
import { pageSizeSchema } from "@/lib/validation/print";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** The paper the team prints cut sheets on: A4 or US Letter. */
export const PATCH = route("PATCH /api/team/page-size", async ({ me, req }) => {
  const { pageSize } = await readJson(req, pageSizeSchema);
  return changePageSize(me, pageSize);
});
