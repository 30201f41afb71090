import { json, readJson, route } from "@/lib/http/handler";
import { signUpSchema } from "@/lib/validation/auth";
import { signUp } from "@/lib/auth/service";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const POST = route("POST /api/auth/sign-up", async ({ req }) => {
  const input = await readJson(req, signUpSchema);
  const { userId, teamId, cookie } = await signUp(input);
  const res = json({ user: { id: userId, email: input.email, name: input.name }, teamId }, 201);
  res.cookies.set(cookie.name, cookie.value, cookie.attributes);
  return res;
});
