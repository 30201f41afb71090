import { route } from "@/lib/http/handler";
import { resendInvitation } from "@/lib/services/team";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const POST = route("POST /api/team/invitations/[invitationId]/resend", async ({ me, params }) =>
  resendInvitation(me, params.invitationId),
);
