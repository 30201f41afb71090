import { route } from "@/lib/http/handler";
import { traceRun } from "@/lib/services/trace";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** The run behind a scanned marker; a code of another team is simply not found. */
export const GET = route("GET /api/trace/[code]", async ({ me, params }) =>
  traceRun(me.teamId, params.code ?? ""),
);
