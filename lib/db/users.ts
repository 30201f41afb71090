// Users, teams and memberships.
import { db, type Db, type Tx } from "@/lib/db/knex";
import type { Role } from "@/lib/auth/roles";
import { recordAudit } from "@/lib/db/audit";

export interface UserRow {
  id: string;
  email: string;
  name: string;
  passwordHash: string;
}

export interface MembershipRow {
  teamId: string;
  teamName: string;
  role: Role;
}

export async function findUserByEmail(email: string, q: Db = db()): Promise<UserRow | null> {
  const row = (await q("appUser")
    .select("id", "email", "name", "passwordHash")
    .whereRaw("lower(email) = lower(?)", [email])
    .first()) as UserRow | undefined;
  return row ?? null;
}

export async function listMemberships(userId: string, q: Db = db()): Promise<MembershipRow[]> {
  return (await q("membership as m")
    .join("team as t", "t.id", "m.teamId")
    .where("m.userId", userId)
    .orderBy("m.createdAt", "asc")
    .select("m.teamId", "t.name as teamName", "m.role")) as MembershipRow[];
}

export async function createUserWithTeam(input: {
  id: string;
  email: string;
  name: string;
  passwordHash: string;
  teamName: string;
}): Promise<{ userId: string; teamId: string }> {
  return db().transaction(async (trx) => {
    await trx("appUser").insert({
      id: input.id,
      email: input.email,
      name: input.name,
      passwordHash: input.passwordHash,
    });
    const [team] = (await trx("team").insert({ name: input.teamName }).returning("id")) as [{ id: string }];
    await trx("membership").insert({ teamId: team.id, userId: input.id, role: "lead" });
    await recordAudit(trx, {
      teamId: team.id,
      actorUserId: input.id,
      action: "team.create",
      entityType: "team",
      entityId: team.id,
      detail: { teamName: input.teamName, email: input.email },
    });
    return { userId: input.id, teamId: team.id };
  });
}

export async function insertUser(
  trx: Tx,
  input: { id: string; email: string; name: string; passwordHash: string },
): Promise<void> {
  await trx("appUser").insert(input);
}

export async function setPasswordHash(trx: Tx, userId: string, passwordHash: string): Promise<void> {
  await trx("appUser").where({ id: userId }).update({ passwordHash });
}

/** Ends every session of a user (after a password reset, before the new one is made). */
export async function deleteUserSessions(trx: Tx, userId: string): Promise<void> {
  await trx("userSession").where({ userId }).del();
}

export async function setSessionTeam(sessionId: string, teamId: string): Promise<void> {
  await db()("userSession").where({ id: sessionId }).update({ teamId });
}

export async function ping(): Promise<void> {
  await db().raw("select 1");
}
