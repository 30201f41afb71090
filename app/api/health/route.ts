import { json, route } from "@/lib/http/handler";
import { ping } from "@/lib/db/users";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/health", async () => {
  try {
    await ping();
    return json({ ok: true, db: "up" });
  } catch {
    return json({ ok: false, db: "down" }, 503);
  }
});
