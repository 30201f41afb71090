"use server";

import { after } from "next/server";
import { passwordResetRequestSchema } from "@/lib/validation/team";
import { RESET_REQUESTED, requestPasswordReset } from "@/lib/auth/password-reset";

export interface ForgotState {
  email: string;
  error: string | null;
  sent: string | null;
}

export async function forgotPasswordAction(_prev: ForgotState, form: FormData): Promise<ForgotState> {
  // Public action: it answers the same for every address and does its work after answering.
  const email = String(form.get("email") ?? "");
  const parsed = passwordResetRequestSchema.safeParse({ email });
  if (!parsed.success)
    return { email, error: parsed.error.issues[0]?.message ?? "Check the address.", sent: null };
  after(() =>
    requestPasswordReset(parsed.data.email).catch((e: unknown) => console.error("[password-reset]", e)),
  );
  return { email, error: null, sent: RESET_REQUESTED };
}
