// A team's members and invitations, always scoped by team (an invitation link is looked up by its token's hash).
import { db, type Db, type Tx } from "@/lib/db/knex";
import type { Role } from "@/lib/auth/roles";

export interface MemberRecord {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}

export type InvitationStatus = "pending" | "unsent" | "expired" | "accepted" | "revoked";

export interface InvitationRecord {
  id: string;
  teamId: string;
  email: string;
  role: Role;
  invitedBy: string | null;
  invitedByName: string | null;
  createdAt: string;
  expiresAt: string;
  sentAt: string | null;
  sendError: string | null;
  acceptedAt: string | null;
  revokedAt: string | null;
  status: InvitationStatus;
}

/** An invitation found by its link, with the team's name for the acceptance page. */
export interface InvitationByToken extends InvitationRecord {
  teamName: string;
}

const INVITATION_COLUMNS = [
  "i.id",
  "i.teamId",
  "i.email",
  "i.role",
  "i.invitedBy",
  "u.name as invitedByName",
  "i.createdAt",
  "i.expiresAt",
  "i.sentAt",
  "i.sendError",
  "i.acceptedAt",
  "i.revokedAt",
];

type InvitationRow = Omit<InvitationRecord, "status"> & {
  createdAt: Date | string;
  expiresAt: Date | string;
};

function withStatus<T extends InvitationRow>(r: T, now = Date.now()): T & { status: InvitationStatus } {
  const status: InvitationStatus = r.acceptedAt
    ? "accepted"
    : r.revokedAt
      ? "revoked"
      : new Date(r.expiresAt).getTime() <= now
        ? "expired"
        : r.sentAt
          ? "pending"
          : "unsent";
  return { ...r, status };
}

function invitations(q: Db) {
  return q("invitation as i").leftJoin("appUser as u", "u.id", "i.invitedBy").select(INVITATION_COLUMNS);
}

export async function listMembers(teamId: string, q: Db = db()): Promise<MemberRecord[]> {
  return (await q("membership as m")
    .join("appUser as u", "u.id", "m.userId")
    .where("m.teamId", teamId)
    .select("m.userId", "u.name", "u.email", "m.role", "m.createdAt as joinedAt")
    .orderByRaw(
      "case m.role when 'lead' then 0 when 'builder' then 1 else 2 end, lower(u.name)",
    )) as MemberRecord[];
}

export async function getMember(teamId: string, userId: string, q: Db = db()): Promise<MemberRecord | null> {
  const row = (await q("membership as m")
    .join("appUser as u", "u.id", "m.userId")
    .where({ "m.teamId": teamId, "m.userId": userId })
    .select("m.userId", "u.name", "u.email", "m.role", "m.createdAt as joinedAt")
    .first()) as MemberRecord | undefined;
  return row ?? null;
}

export async function findMemberByEmail(
  teamId: string,
  email: string,
  q: Db = db(),
): Promise<MemberRecord | null> {
  const row = (await q("membership as m")
    .join("appUser as u", "u.id", "m.userId")
    .where("m.teamId", teamId)
    .whereRaw("lower(u.email) = lower(?)", [email])
    .select("m.userId", "u.name", "u.email", "m.role", "m.createdAt as joinedAt")
    .first()) as MemberRecord | undefined;
  return row ?? null;
}

/** Serialises membership changes of one team (the last-lead rule depends on it). */
export async function lockTeam(trx: Tx, teamId: string): Promise<boolean> {
  const row = await trx("team").where({ id: teamId }).forUpdate().first("id");
  return Boolean(row);
}

export async function countLeads(teamId: string, q: Db = db()): Promise<number> {
  const [row] = (await q("membership").where({ teamId, role: "lead" }).count({ n: "*" })) as [{ n: number }];
  return Number(row.n);
}

export async function updateMemberRole(trx: Tx, teamId: string, userId: string, role: Role): Promise<void> {
  await trx("membership").where({ teamId, userId }).update({ role });
}

export async function insertMember(trx: Tx, teamId: string, userId: string, role: Role): Promise<void> {
  await trx("membership").insert({ teamId, userId, role });
}

/** Removes the membership and ends the sessions that could still act in this team. */
export async function deleteMember(trx: Tx, teamId: string, userId: string): Promise<void> {
  await trx("membership").where({ teamId, userId }).del();
  const [left] = (await trx("membership").where({ userId }).count({ n: "*" })) as [{ n: number }];
  await trx("userSession")
    .where({ userId })
    .modify((b) => {
      // With other teams left, only the sessions working in this team end; with none, every session does.
      if (Number(left.n) > 0) b.where("teamId", teamId);
    })
    .del();
}

export async function listOpenInvitations(teamId: string, q: Db = db()): Promise<InvitationRecord[]> {
  const rows = (await invitations(q)
    .where("i.teamId", teamId)
    .whereNull("i.acceptedAt")
    .whereNull("i.revokedAt")
    .orderBy("i.createdAt", "desc")) as InvitationRow[];
  return rows.map((r) => withStatus(r));
}

export async function getInvitation(
  teamId: string,
  id: string,
  q: Db = db(),
): Promise<InvitationRecord | null> {
  const row = (await invitations(q).where({ "i.teamId": teamId, "i.id": id }).first()) as
    InvitationRow | undefined;
  return row ? withStatus(row) : null;
}

export async function findOpenInvitationByEmail(
  teamId: string,
  email: string,
  q: Db = db(),
): Promise<InvitationRecord | null> {
  const row = (await invitations(q)
    .where("i.teamId", teamId)
    .whereRaw("lower(i.email) = lower(?)", [email])
    .whereNull("i.acceptedAt")
    .whereNull("i.revokedAt")
    .first()) as InvitationRow | undefined;
  return row ? withStatus(row) : null;
}

export async function insertInvitation(
  trx: Tx,
  input: { teamId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date },
): Promise<string> {
  const [row] = (await trx("invitation").insert(input).returning("id")) as [{ id: string }];
  return row.id;
}

/** A new link for an open invitation (the old one stops working); false when it is no longer open. */
export async function renewInvitationToken(
  trx: Tx,
  teamId: string,
  id: string,
  tokenHash: string,
  expiresAt: Date,
): Promise<boolean> {
  const n = await trx("invitation")
    .where({ teamId, id })
    .whereNull("acceptedAt")
    .whereNull("revokedAt")
    .update({ tokenHash, expiresAt, sentAt: null, sendError: null });
  return n > 0;
}

export async function markInvitationSent(
  teamId: string,
  id: string,
  result: { ok: true } | { ok: false; error: string },
  q: Db = db(),
): Promise<void> {
  await q("invitation")
    .where({ teamId, id })
    .update(
      result.ok
        ? { sentAt: q.fn.now(), sendError: null }
        : { sentAt: null, sendError: result.error.slice(0, 300) },
    );
}

export async function revokeInvitation(trx: Tx, teamId: string, id: string): Promise<boolean> {
  const n = await trx("invitation")
    .where({ teamId, id })
    .whereNull("acceptedAt")
    .whereNull("revokedAt")
    .update({ revokedAt: trx.fn.now() });
  return n > 0;
}

export async function findInvitationByTokenHash(
  tokenHash: string,
  q: Db = db(),
): Promise<InvitationByToken | null> {
  const row = (await invitations(q)
    .join("team as t", "t.id", "i.teamId")
    .select("t.name as teamName")
    .where("i.tokenHash", tokenHash)
    .first()) as (InvitationRow & { teamName: string }) | undefined;
  return row ? withStatus(row) : null;
}

/** Marks the invitation used only if it is still open and unexpired: of two accepters at once, exactly one wins. */
export async function claimInvitation(trx: Tx, id: string, tokenHash: string): Promise<boolean> {
  const rows = await trx("invitation")
    .where({ id, tokenHash })
    .whereNull("acceptedAt")
    .whereNull("revokedAt")
    .where("expiresAt", ">", trx.fn.now())
    .update({ acceptedAt: trx.fn.now() })
    .returning("id");
  return rows.length === 1;
}

export async function setInvitationAcceptedBy(trx: Tx, id: string, userId: string): Promise<void> {
  await trx("invitation").where({ id }).update({ acceptedBy: userId });
}

/** The paper size the team prints cut sheets on (A4 or US Letter). */
export async function teamPageSize(teamId: string, q: Db = db()): Promise<"A4" | "Letter"> {
  const row = (await q("team").where({ id: teamId }).first("pageSize")) as
    { pageSize: "A4" | "Letter" } | undefined;
  return row?.pageSize ?? "A4";
}
