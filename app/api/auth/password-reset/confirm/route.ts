import { json, readJson, route } from "@/lib/http/handler";
import { passwordResetConfirmSchema } from "@/lib/validation/team";
import { resetPassword } from "@/lib/auth/password-reset";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const POST = route("POST /api/auth/password-reset/confirm", async ({ req }) => {
  const input = await readJson(req, passwordResetConfirmSchema);
  const { userId, cookie } = await resetPassword(input.token, input.password);
  const res = json({ ok: true, user: { id: userId } });
  res.cookies.set(cookie.name, cookie.value, cookie.attributes);
  return res;
});
