import { after } from "next/server";
import { json, readJson, route } from "@/lib/http/handler";
import { passwordResetRequestSchema } from "@/lib/validation/team";
import { RESET_REQUESTED, requestPasswordReset } from "@/lib/auth/password-reset";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

// The same answer for every address, given before any look-up or mail happens (no account enumeration).
export const POST = route("POST /api/auth/password-reset", async ({ req }) => {
  const { email } = await readJson(req, passwordResetRequestSchema);
  after(() => requestPasswordReset(email).catch((e: unknown) => console.error("[password-reset]", e)));
  return json({ ok: true, message: RESET_REQUESTED }, 202);
});
