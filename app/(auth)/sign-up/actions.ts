"use server";

import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { signUpSchema } from "@/lib/validation/auth";
import { signUp } from "@/lib/auth/service";
import { AppError, mapError } from "@/lib/http/errors";

export interface SignUpState {
  values: { email: string; name: string; teamName: string };
  errors: Record<string, string>;
  error: string | null;
}

export async function signUpAction(_prev: SignUpState, form: FormData): Promise<SignUpState> {
  // Public action: anyone may create an account and the team it leads.
  const values = {
    email: String(form.get("email") ?? ""),
    name: String(form.get("name") ?? ""),
    teamName: String(form.get("teamName") ?? ""),
  };
  const parsed = signUpSchema.safeParse({ ...values, password: form.get("password") });
  if (!parsed.success) {
    const errors: Record<string, string> = {};
    for (const i of parsed.error.issues) errors[String(i.path[0])] ??= i.message;
    return { values, errors, error: null };
  }
  try {
    const { cookie } = await signUp(parsed.data);
    (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  } catch (e) {
    return { values, errors: {}, error: e instanceof AppError ? e.message : mapError(e).body.error.message };
  }
  redirect("/projects");
}
