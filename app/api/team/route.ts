import { route } from "@/lib/http/handler";
import { teamView } from "@/lib/services/team";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/team", async ({ me }) => teamView(me));
