import { readJson, route } from "@/lib/http/handler";
import { memberRoleSchema } from "@/lib/validation/team";
import { changeMemberRole, removeMember } from "@/lib/services/team";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const PATCH = route("PATCH /api/team/members/[userId]", async ({ me, params, req }) => {
  const { role } = await readJson(req, memberRoleSchema);
  return { member: await changeMemberRole(me, params.userId, role) };
});

// Their sessions in this team end in the same transaction.
export const DELETE = route("DELETE /api/team/members/[userId]", async ({ me, params }) => {
  await removeMember(me, params.userId);
  return { ok: true };
});
