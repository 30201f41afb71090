// Sign-up, sign-in and sign-out, used by both the forms' server actions and the JSON route handlers.
import { generateIdFromEntropySize, type Cookie } from "lucia";
import { lucia } from "@/lib/auth/lucia";
import { burnPasswordCheck, hashPassword, verifyPassword } from "@/lib/auth/password";
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

export async function signIn(input: SignInInput): Promise<{ userId: string; cookie: Cookie }> {
  const user = await findUserByEmail(input.email);
  if (!user) {
    await burnPasswordCheck(input.password);
    throw unauthorized(BAD_CREDENTIALS);
  }
  if (!(await verifyPassword(user.passwordHash, input.password))) throw unauthorized(BAD_CREDENTIALS);
  const teams = await listMemberships(user.id);
  const session = await lucia().createSession(user.id, { team_id: teams[0]?.teamId ?? null });
  return { userId: user.id, cookie: lucia().createSessionCookie(session.id) };
}

export async function signOut(sessionId: string): Promise<Cookie> {
  await lucia().invalidateSession(sessionId);
  return lucia().createBlankSessionCookie();
}

export async function signOutEverywhere(userId: string): Promise<void> {
  await lucia().invalidateUserSessions(userId);
}
