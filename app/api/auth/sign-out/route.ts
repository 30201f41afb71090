import { json, route } from "@/lib/http/handler";
import { signOut } from "@/lib/auth/service";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const POST = route("POST /api/auth/sign-out", async ({ me }) => {
  const cookie = await signOut(me.session.id);
  const res = json({ ok: true });
  res.cookies.set(cookie.name, cookie.value, cookie.attributes);
  return res;
});
