import { route } from "@/lib/http/handler";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route("GET /api/me", async ({ me }) => ({
  user: { id: me.user.id, email: me.user.email, name: me.user.name },
  teams: me.teams.map((t) => ({ id: t.teamId, name: t.teamName, role: t.role })),
  team: me.teamId ? { id: me.teamId, name: me.teamName } : null,
  role: me.role,
}));
