// Sign-up, sign-in and sign-out, used by both the forms' server actions and the JSON route handlers.
import { generateIdFromEntropySize, type Cookie } from "lucia";
import { lucia } from "@/lib/auth/lucia";
import { burnPasswordCheck, hashPassword, verifyPassword } from "@/lib/auth/password";
import { assertSignInAllowed, noteSignInFailure, noteSignInSuccess } from "@/lib/auth/limits";
import { createUserWithTeam, findUserByEmail, listMemberships } from "@/lib/db/users";
import { conflict, unauthorized } from "@/lib/http/errors";
import type { SignInInput, SignUpInput } from "@/lib/validation/auth";

export const BAD_CREDENTIALS = "That e-mail address and password do not match an account.";

export async function signUp(
  input: SignUpInput,
): Promise<{ userId: string; teamId: string; cookie: Cookie }> {
  if (await findUserByEmail(input.email))
    throw conflict("An account with that e-mail address already exists.");
  const passwordHash = await hashPassword(input.password);
  const { userId, teamId } = await createUserWithTeam({
    id: generateIdFromEntropySize(10),
    email: input.email,
    name: input.name,
    passwordHash,
    teamName: input.teamName,
  });
  const session = await lucia().createSession(userId, { team_id: teamId });
  return { userId, teamId, cookie: lucia().createSessionCookie(session.id) };
}

/** Checks the sign-in limits first (429 even for the right password once they are used up), then the password. */
export async function signIn(
  input: SignInInput,
  clientIp: string,
): Promise<{ userId: string; cookie: Cookie }> {
  await assertSignInAllowed(input.email, clientIp);
  const user = await findUserByEmail(input.email);
  let ok = false;
  if (user) ok = await verifyPassword(user.passwordHash, input.password);
  else await burnPasswordCheck(input.password);
  if (!user || !ok) {
    await noteSignInFailure(input.email, clientIp);
    throw unauthorized(BAD_CREDENTIALS);
  }
  await noteSignInSuccess(input.email);
  return { userId: user.id, cookie: await startSession(user.id) };
}

/** A new session in the given team, or the user's first team. */
export async function startSession(userId: string, teamId?: string): Promise<Cookie> {
  const team = teamId ?? (await listMemberships(userId))[0]?.teamId ?? null;
  const session = await lucia().createSession(userId, { team_id: team });
  return lucia().createSessionCookie(session.id);
}

export async function signOut(sessionId: string): Promise<Cookie> {
  await lucia().invalidateSession(sessionId);
  return lucia().createBlankSessionCookie();
}

export async function signOutEverywhere(userId: string): Promise<void> {
  await lucia().invalidateUserSessions(userId);
}
