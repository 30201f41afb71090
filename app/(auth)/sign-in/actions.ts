"use server";

import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { signInSchema } from "@/lib/validation/auth";
import { signIn } from "@/lib/auth/service";
import { AppError, mapError } from "@/lib/http/errors";
import { clientAddress } from "@/lib/http/client-address";
import { retryMessage } from "@/lib/auth/limits";

export interface SignInState {
  email: string;
  error: string | null;
}

function safeNext(next: FormDataEntryValue | null): string {
  const s = typeof next === "string" ? next : "";
  return s.startsWith("/") && !s.startsWith("//") ? s : "/projects";
}

export async function signInAction(_prev: SignInState, form: FormData): Promise<SignInState> {
  // Public action: the guard here is the credential check itself.
  const email = String(form.get("email") ?? "");
  const parsed = signInSchema.safeParse({ email, password: form.get("password") });
  if (!parsed.success) return { email, error: parsed.error.issues[0]?.message ?? "Check the form." };
  try {
    const { cookie } = await signIn(parsed.data, clientAddress(await headers()));
    (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  } catch (e) {
    if (e instanceof AppError && e.status === 429)
      return { email, error: retryMessage(Number(e.headers?.["Retry-After"] ?? 60)) };
    return { email, error: e instanceof AppError ? e.message : mapError(e).body.error.message };
  }
  redirect(safeNext(form.get("next")));
}
