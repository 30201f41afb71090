// Password reset by mailed link: single use, one hour; asking never tells whether an address has an account, and a
// reset ends every session of the user before the new one starts.
import type { Cookie } from "lucia";
import { hashPassword } from "@/lib/auth/password";
import { startSession } from "@/lib/auth/service";
import { hashToken, looksLikeToken, newToken } from "@/lib/auth/tokens";
import { db } from "@/lib/db/knex";
import {
  claimPasswordReset,
  findPasswordResetByTokenHash,
  insertPasswordReset,
  useAllPasswordResets,
} from "@/lib/db/password-resets";
import { clearFailures } from "@/lib/db/sign-in-failures";
import { deleteUserSessions, findUserByEmail, setPasswordHash } from "@/lib/db/users";
import { env } from "@/lib/env";
import { conflict, notFound } from "@/lib/http/errors";
import { sendMail } from "@/lib/mail/send";
import { passwordResetMail } from "@/lib/mail/templates";

export const RESET_MINUTES = 60;

/** The one answer to every request, whether or not the address has an account. */
export const RESET_REQUESTED =
  "If an account uses that address, a link to set a new password is on its way. It works once, for one hour.";

export const RESET_MESSAGES = {
  invalid: "This password-reset link is not valid. Ask for a new one.",
  used: "This password-reset link has already been used. Ask for a new one if you need it.",
  expired: "This password-reset link has expired (links work for one hour). Ask for a new one.",
} as const;

/** Makes and mails a link when the address has an account; does nothing otherwise. Run it after answering. */
export async function requestPasswordReset(email: string): Promise<void> {
  const user = await findUserByEmail(email);
  if (!user) return;
  const token = newToken();
  await insertPasswordReset(user.id, hashToken(token), new Date(Date.now() + RESET_MINUTES * 60 * 1000));
  const link = `${env().PUBLIC_BASE_URL.replace(/\/$/, "")}/reset-password/${token}`;
  const result = await sendMail({ to: user.email, ...passwordResetMail({ name: user.name, link }) });
  if (!result.ok) console.error(`[password-reset] mail to a user was not sent: ${result.error}`);
}

export type ResetView = { state: "open"; email: string } | { state: "invalid" | "used" | "expired" };

export async function viewPasswordReset(token: string): Promise<ResetView> {
  if (!looksLikeToken(token)) return { state: "invalid" };
  const r = await findPasswordResetByTokenHash(hashToken(token));
  if (!r) return { state: "invalid" };
  if (r.usedAt) return { state: "used" };
  if (new Date(r.expiresAt).getTime() <= Date.now()) return { state: "expired" };
  return { state: "open", email: r.email };
}

/** Sets the new password, ends all the user's sessions and starts a new one. */
export async function resetPassword(
  token: string,
  password: string,
): Promise<{ userId: string; cookie: Cookie }> {
  const view = await viewPasswordReset(token);
  if (view.state === "invalid") throw notFound("That password-reset link");
  if (view.state !== "open") throw conflict(RESET_MESSAGES[view.state], { reason: view.state });
  const passwordHash = await hashPassword(password);
  const userId = await db().transaction(async (trx) => {
    const id = await claimPasswordReset(trx, hashToken(token));
    if (!id) throw conflict(RESET_MESSAGES.used, { reason: "used" });
    await setPasswordHash(trx, id, passwordHash);
    await useAllPasswordResets(trx, id);
    await deleteUserSessions(trx, id);
    await clearFailures(view.email, trx);
    return id;
  });
  return { userId, cookie: await startSession(userId) };
}
