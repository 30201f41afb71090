"use server";

import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { optionalUser } from "@/lib/auth/guards";
import { signOut, startSession } from "@/lib/auth/service";
import { acceptInvitation } from "@/lib/services/invitations";
import { setSessionTeam } from "@/lib/db/users";
import { AppError, mapError } from "@/lib/http/errors";
import { clientAddress } from "@/lib/http/client-address";
import { retryMessage } from "@/lib/auth/limits";

export interface AcceptState {
  name: string;
  errors: Record<string, string>;
  error: string | null;
}

export async function acceptInvitationAction(_prev: AcceptState, form: FormData): Promise<AcceptState> {
  // Public action: the token in the link, and the password of an existing account, are the guard.
  const token = String(form.get("token") ?? "");
  const name = String(form.get("name") ?? "").trim();
  const me = await optionalUser();
  let result: { userId: string; teamId: string };
  try {
    result = await acceptInvitation({
      token,
      name: name || undefined,
      password: String(form.get("password") ?? "") || undefined,
      signedInUserId: me?.user.id ?? null,
      clientIp: clientAddress(await headers()),
    });
  } catch (e) {
    if (e instanceof AppError && e.status === 429)
      return { name, errors: {}, error: retryMessage(Number(e.headers?.["Retry-After"] ?? 60)) };
    if (e instanceof AppError && e.status === 422 && Array.isArray(e.details)) {
      const errors: Record<string, string> = {};
      for (const d of e.details as { path: string; message: string }[]) errors[d.path] ??= d.message;
      return { name, errors, error: null };
    }
    return { name, errors: {}, error: e instanceof AppError ? e.message : mapError(e).body.error.message };
  }
  if (me && me.user.id === result.userId) {
    await setSessionTeam(me.session.id, result.teamId);
  } else {
    const cookie = await startSession(result.userId, result.teamId);
    (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  }
  redirect("/projects");
}

/** Signs out whoever is signed in and comes back to the same invitation. */
export async function signOutForInvitationAction(form: FormData): Promise<void> {
  const me = await optionalUser();
  const token = String(form.get("token") ?? "");
  if (me) {
    const cookie = await signOut(me.session.id);
    (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  }
  redirect(`/invitations/${encodeURIComponent(token)}`);
}
