import { json, readJson, route } from "@/lib/http/handler";
import { signInSchema } from "@/lib/validation/auth";
import { signIn } from "@/lib/auth/service";
import { clientAddress } from "@/lib/http/client-address";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const POST = route("POST /api/auth/sign-in", async ({ req }) => {
  const input = await readJson(req, signInSchema);
  const { userId, cookie } = await signIn(input, clientAddress(req.headers));
  const res = json({ user: { id: userId, email: input.email } });
  res.cookies.set(cookie.name, cookie.value, cookie.attributes);
  return res;
});
