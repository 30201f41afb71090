import { route } from "@/lib/http/handler";
import { listTemplates } from "@/lib/services/print";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/print/templates", async () => {
  const items = listTemplates();
  return { items, total: items.length, limit: items.length, offset: 0 };
});
