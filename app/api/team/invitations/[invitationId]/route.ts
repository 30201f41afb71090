import { route } from "@/lib/http/handler";
import { revokeInvitationById } from "@/lib/services/team";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const DELETE = route("DELETE /api/team/invitations/[invitationId]", async ({ me, params }) => {
  await revokeInvitationById(me, params.invitationId);
  return { ok: true };
});
