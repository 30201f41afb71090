// The audit trail: one row per change that matters, always inside the transaction that makes the change.
import type { Db } from "@/lib/db/knex";

export interface AuditInput {
  teamId: string;
  actorUserId: string | null;
  /** e.g. "project.create", "run.update", "member.role", "invitation.create" */
  action: string;
  entityType: string;
  entityId: string | null;
  detail?: Record<string, unknown>;
}

export async function recordAudit(q: Db, e: AuditInput): Promise<void> {
  await q("auditEvents").insert({
    teamId: e.teamId,
    actorUserId: e.actorUserId,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    detail: JSON.stringify(e.detail ?? {}),
  });
}

export async function recordAudits(q: Db, events: AuditInput[]): Promise<void> {
  if (events.length === 0) return;
  const rows = events.map((e) => ({
    teamId: e.teamId,
    actorUserId: e.actorUserId,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    detail: JSON.stringify(e.detail ?? {}),
  }));
  for (let i = 0; i < rows.length; i += 1000) await q("auditEvents").insert(rows.slice(i, i + 1000));
}

export interface AuditEventView {
  id: number;
  action: string;
  actorName: string | null;
  detail: Record<string, unknown>;
  createdAt: string;
}

export interface AuditEventRecord {
  id: number;
  action: string;
  entityType: string;
  entityId: string | null;
  detail: Record<string, unknown>;
  createdAt: string;
  actorUserId: string | null;
  actorName: string | null;
  actorEmail: string | null;
}

export interface AuditQuery {
  action?: string;
  actorUserId?: string;
  /** Inclusive dates (YYYY-MM-DD), read as UTC days. */
  from?: string;
  to?: string;
  limit: number;
  offset: number;
}

export async function listAuditEvents(
  teamId: string,
  query: AuditQuery,
  q: Db,
): Promise<{ items: AuditEventRecord[]; total: number; limit: number; offset: number }> {
  const base = q("auditEvents as a")
    .leftJoin("appUser as u", "u.id", "a.actorUserId")
    .where("a.teamId", teamId)
    .modify((b) => {
      if (query.action) b.where("a.action", query.action);
      if (query.actorUserId) b.where("a.actorUserId", query.actorUserId);
      if (query.from)
        b.where("a.createdAt", ">=", q.raw("(?::date)::timestamp at time zone 'UTC'", [query.from]));
      if (query.to)
        b.where("a.createdAt", "<", q.raw("((?::date) + 1)::timestamp at time zone 'UTC'", [query.to]));
    });
  const [countRow] = (await base.clone().count({ total: "*" })) as [{ total: number }];
  const items = (await base
    .clone()
    .select(
      "a.id",
      "a.action",
      "a.entityType",
      "a.entityId",
      "a.detail",
      "a.createdAt",
      "a.actorUserId",
      "u.name as actorName",
      "u.email as actorEmail",
    )
    .orderBy("a.createdAt", "desc")
    .orderBy("a.id", "desc")
    .limit(query.limit)
    .offset(query.offset)) as AuditEventRecord[];
  return { items, total: Number(countRow.total), limit: query.limit, offset: query.offset };
}

/** The actions and people that occur in a team's trail, for the filters. */
export async function auditFacets(
  teamId: string,
  q: Db,
): Promise<{ actions: string[]; actors: { id: string; name: string; email: string }[] }> {
  const actions = (await q("auditEvents").where({ teamId }).distinct("action").orderBy("action")) as {
    action: string;
  }[];
  const actors = (await q("auditEvents as a")
    .join("appUser as u", "u.id", "a.actorUserId")
    .where("a.teamId", teamId)
    .distinct("u.id", "u.name", "u.email")
    .orderBy("u.name")) as { id: string; name: string; email: string }[];
  return { actions: actions.map((a) => a.action), actors };
}
