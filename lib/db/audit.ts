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

/** The history of one record, oldest first. */
export async function listEntityEvents(
  q: Db,
  teamId: string,
  entityType: string,
  entityId: string,
): Promise<AuditEventView[]> {
  return (await q("auditEvents as e")
    .leftJoin("appUser as u", "u.id", "e.actorUserId")
    .where({ "e.teamId": teamId, "e.entityType": entityType, "e.entityId": entityId })
    .orderBy("e.id", "asc")
    .limit(500)
    .select("e.id", "e.action", "u.name as actorName", "e.detail", "e.createdAt")) as AuditEventView[];
}
