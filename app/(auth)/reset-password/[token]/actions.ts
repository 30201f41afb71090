"use server";

import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { resetPassword } from "@/lib/auth/password-reset";
import { passwordResetConfirmSchema } from "@/lib/validation/team";
import { AppError, mapError } from "@/lib/http/errors";

export interface ResetState {
  errors: Record<string, string>;
  error: string | null;
}

export async function resetPasswordAction(_prev: ResetState, form: FormData): Promise<ResetState> {
  // Public action: the single-use token in the link is the guard.
  const password = String(form.get("password") ?? "");
  if (password !== String(form.get("confirm") ?? ""))
    return { errors: { confirm: "The two passwords differ." }, error: null };
  const parsed = passwordResetConfirmSchema.safeParse({ token: form.get("token"), password });
  if (!parsed.success) {
    const errors: Record<string, string> = {};
    for (const i of parsed.error.issues) errors[String(i.path[0])] ??= i.message;
    return { errors, error: errors.token ?? null };
  }
  try {
    const { cookie } = await resetPassword(parsed.data.token, parsed.data.password);
    (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  } catch (e) {
    return { errors: {}, error: e instanceof AppError ? e.message : mapError(e).body.error.message };
  }
  redirect("/projects");
}
