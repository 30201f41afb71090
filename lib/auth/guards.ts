// The guards every page, route handler and server action calls: who is signed in, in which team, with which role.
import { cache } from "react";
import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import type { Session, User } from "lucia";
import { lucia } from "@/lib/auth/lucia";
import { accessFor, type Access, type RouteKey } from "@/lib/auth/access";
import type { Role } from "@/lib/auth/roles";
import { listMemberships, type MembershipRow } from "@/lib/db/users";
import { forbidden, unauthorized } from "@/lib/http/errors";

export interface Me {
  user: User;
  session: Session;
  teams: MembershipRow[];
  /** The team being worked in; null only for a user who belongs to no team. */
  teamId: string | null;
  teamName: string | null;
  role: Role | null;
}

export interface TeamMe extends Me {
  teamId: string;
  teamName: string;
  role: Role;
}

/** Reads and validates the session cookie once per request. */
export const validateRequest = cache(async (): Promise<{ user: User; session: Session } | null> => {
  const jar = await cookies();
  const id = jar.get(lucia().sessionCookieName)?.value ?? null;
  if (!id) return null;
  const { user, session } = await lucia().validateSession(id);
  try {
    if (session?.fresh) {
      const c = lucia().createSessionCookie(session.id);
      jar.set(c.name, c.value, c.attributes);
    }
    if (!session) {
      const c = lucia().createBlankSessionCookie();
      jar.set(c.name, c.value, c.attributes);
    }
  } catch {
    // Server components may not set cookies; route handlers and actions will.
  }
  return user && session ? { user, session } : null;
});

const loadMe = cache(async (): Promise<Me | null> => {
  const v = await validateRequest();
  if (!v) return null;
  const teams = await listMemberships(v.user.id);
  const active = teams.find((t) => t.teamId === v.session.teamId) ?? teams[0] ?? null;
  return {
    ...v,
    teams,
    teamId: active?.teamId ?? null,
    teamName: active?.teamName ?? null,
    role: active?.role ?? null,
  };
});

/** Any signed-in user; throws 401 otherwise. */
export async function requireUser(): Promise<Me> {
  const me = await loadMe();
  if (!me) throw unauthorized();
  return me;
}

/** A signed-in member of a team whose role is one of `roles`; 401 or 403 otherwise. */
export async function requireRole(roles: readonly Role[]): Promise<TeamMe> {
  const me = await requireUser();
  if (!me.teamId || !me.role || !me.teamName) throw forbidden("You are not a member of any team.");
  if (!roles.includes(me.role)) throw forbidden();
  return me as TeamMe;
}

/** The guard for a route key of the access table. */
export async function requireAccess(key: RouteKey): Promise<Me | null> {
  const access: Access = accessFor(key);
  if (access === "public") return null;
  if (access === "user") return requireUser();
  return requireRole(access);
}

/** For pages: a member with one of `roles`, or a redirect to sign-in (401) or the projects list (403). */
export async function requirePageRole(roles: readonly Role[], returnTo?: string): Promise<TeamMe> {
  const me = await loadMe();
  if (!me) redirect(returnTo ? `/sign-in?next=${encodeURIComponent(returnTo)}` : "/sign-in");
  if (!me.teamId || !me.role || !roles.includes(me.role)) redirect("/projects?denied=1");
  return me as TeamMe;
}

/** For pages open to anyone signed in (with or without a team). */
export async function requirePageUser(returnTo?: string): Promise<Me> {
  const me = await loadMe();
  if (!me) redirect(returnTo ? `/sign-in?next=${encodeURIComponent(returnTo)}` : "/sign-in");
  return me;
}

/** For the sign-in and sign-up pages: the current user if any (to send them on), without failing. */
export async function optionalUser(): Promise<Me | null> {
  return loadMe();
}
