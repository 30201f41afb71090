import { json, readJson, route } from "@/lib/http/handler";
import { invitationCreateSchema } from "@/lib/validation/team";
import { inviteMember } from "@/lib/services/team";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

// 201 once the invitation is saved, whether or not the mail went out (mailSent says; Resend retries).
export const POST = route("POST /api/team/invitations", async ({ me, req }) => {
  const input = await readJson(req, invitationCreateSchema);
  return json(await inviteMember(me, input), 201);
});
