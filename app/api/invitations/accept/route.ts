import { json, readJson, route } from "@/lib/http/handler";
import { invitationAcceptSchema } from "@/lib/validation/team";
import { acceptInvitation } from "@/lib/services/invitations";
import { startSession } from "@/lib/auth/service";
import { clientAddress } from "@/lib/http/client-address";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const POST = route("POST /api/invitations/accept", async ({ req }) => {
  const input = await readJson(req, invitationAcceptSchema);
  const { userId, teamId, newAccount } = await acceptInvitation({
    ...input,
    clientIp: clientAddress(req.headers),
  });
  const cookie = await startSession(userId, teamId);
  const res = json({ ok: true, user: { id: userId }, teamId, newAccount }, 201);
  res.cookies.set(cookie.name, cookie.value, cookie.attributes);
  return res;
});
