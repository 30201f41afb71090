// The Team screen's changes: invitations (saved first, mailed after, resendable), roles and removals, each written
// with its audit event in one transaction; the last lead of a team can be neither removed nor demoted.
import type { TeamMe } from "@/lib/auth/guards";
import type { Role } from "@/lib/auth/roles";
import { newToken, hashToken } from "@/lib/auth/tokens";
import { recordAudit } from "@/lib/db/audit";
import { db } from "@/lib/db/knex";
import {
  countLeads,
  deleteMember,
  findMemberByEmail,
  findOpenInvitationByEmail,
  getInvitation,
  getMember,
  insertInvitation,
  listMembers,
  listOpenInvitations,
  lockTeam,
  markInvitationSent,
  renewInvitationToken,
  revokeInvitation,
  updateMemberRole,
  type InvitationRecord,
  type MemberRecord,
} from "@/lib/db/team";
import { env } from "@/lib/env";
import { conflict, notFound } from "@/lib/http/errors";
import { sendMail } from "@/lib/mail/send";
import { invitationMail } from "@/lib/mail/templates";
import { uuidSchema } from "@/lib/validation/common";
import type { InvitationCreateInput } from "@/lib/validation/team";

export const INVITATION_DAYS = 7;

export interface TeamView {
  team: { id: string; name: string };
  me: { userId: string; role: Role };
  members: MemberRecord[];
  invitations: InvitationRecord[];
}

export interface InvitationOutcome {
  invitation: InvitationRecord;
  mailSent: boolean;
  /** Why the mail did not go out, when it did not. */
  mailError: string | null;
}

export async function teamView(me: TeamMe): Promise<TeamView> {
  const [members, invitations] = await Promise.all([listMembers(me.teamId), listOpenInvitations(me.teamId)]);
  return {
    team: { id: me.teamId, name: me.teamName },
    me: { userId: me.user.id, role: me.role },
    members,
    invitations,
  };
}

export function invitationLink(token: string): string {
  return `${env().PUBLIC_BASE_URL.replace(/\/$/, "")}/invitations/${token}`;
}

function requireInvitationId(id: string | undefined): string {
  if (!id || !uuidSchema.safeParse(id).success) throw notFound("That invitation");
  return id;
}

function requireUserId(id: string | undefined): string {
  if (!id || !/^[A-Za-z0-9_-]{1,64}$/.test(id)) throw notFound("That member");
  return id;
}

/** Mails the link and records whether it went; the invitation stays saved either way. */
async function deliver(
  me: TeamMe,
  invitationId: string,
  token: string,
  role: Role,
  email: string,
  expiresAt: Date,
) {
  const mail = invitationMail({
    teamName: me.teamName,
    inviterName: me.user.name,
    role,
    link: invitationLink(token),
    expiresAt,
  });
  const result = await sendMail({ to: email, ...mail });
  await markInvitationSent(me.teamId, invitationId, result);
  const invitation = await getInvitation(me.teamId, invitationId);
  if (!invitation) throw notFound("That invitation");
  return { invitation, mailSent: result.ok, mailError: result.ok ? null : result.error };
}

export async function inviteMember(me: TeamMe, input: InvitationCreateInput): Promise<InvitationOutcome> {
  const token = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000);
  const id = await db().transaction(async (trx) => {
    await lockTeam(trx, me.teamId);
    if (await findMemberByEmail(me.teamId, input.email, trx))
      throw conflict(`${input.email} is already a member of this team.`);
    if (await findOpenInvitationByEmail(me.teamId, input.email, trx))
      throw conflict(`${input.email} already has an open invitation. Resend it or revoke it first.`);
    const invitationId = await insertInvitation(trx, {
      teamId: me.teamId,
      email: input.email,
      role: input.role,
      tokenHash: hashToken(token),
      invitedBy: me.user.id,
      expiresAt,
    });
    await recordAudit(trx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "invitation.create",
      entityType: "invitation",
      entityId: invitationId,
      detail: { email: input.email, role: input.role },
    });
    return invitationId;
  });
  return deliver(me, id, token, input.role, input.email, expiresAt);
}

/** A fresh link with a fresh 7 days (the old link stops working), mailed again. */
export async function resendInvitation(me: TeamMe, rawId: string | undefined): Promise<InvitationOutcome> {
  const id = requireInvitationId(rawId);
  const token = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000);
  const inv = await db().transaction(async (trx) => {
    const found = await getInvitation(me.teamId, id, trx);
    if (!found) throw notFound("That invitation");
    if (found.status === "accepted") throw conflict("That invitation has already been accepted.");
    if (found.status === "revoked") throw conflict("That invitation was revoked; send a new one.");
    if (!(await renewInvitationToken(trx, me.teamId, id, hashToken(token), expiresAt)))
      throw conflict("That invitation is no longer open.");
    await recordAudit(trx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "invitation.resend",
      entityType: "invitation",
      entityId: id,
      detail: { email: found.email, role: found.role },
    });
    return found;
  });
  return deliver(me, id, token, inv.role, inv.email, expiresAt);
}

export async function revokeInvitationById(me: TeamMe, rawId: string | undefined): Promise<void> {
  const id = requireInvitationId(rawId);
  await db().transaction(async (trx) => {
    const found = await getInvitation(me.teamId, id, trx);
    if (!found) throw notFound("That invitation");
    if (found.status === "accepted") throw conflict("That invitation has already been accepted.");
    if (!(await revokeInvitation(trx, me.teamId, id))) throw conflict("That invitation was already revoked.");
    await recordAudit(trx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "invitation.revoke",
      entityType: "invitation",
      entityId: id,
      detail: { email: found.email, role: found.role },
    });
  });
}

const LAST_LEAD = "A team needs at least one lead. Make another member a lead first.";

export async function changeMemberRole(
  me: TeamMe,
  rawUserId: string | undefined,
  role: Role,
): Promise<MemberRecord> {
  const userId = requireUserId(rawUserId);
  return db().transaction(async (trx) => {
    await lockTeam(trx, me.teamId);
    const member = await getMember(me.teamId, userId, trx);
    if (!member) throw notFound("That member");
    if (member.role === role) return member;
    if (member.role === "lead" && (await countLeads(me.teamId, trx)) <= 1) throw conflict(LAST_LEAD);
    await updateMemberRole(trx, me.teamId, userId, role);
    await recordAudit(trx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "member.role",
      entityType: "member",
      entityId: userId,
      detail: { email: member.email, name: member.name, from: member.role, to: role },
    });
    return { ...member, role };
  });
}

/** Removes the member; their sessions in this team end in the same transaction. */
export async function removeMember(me: TeamMe, rawUserId: string | undefined): Promise<void> {
  const userId = requireUserId(rawUserId);
  await db().transaction(async (trx) => {
    await lockTeam(trx, me.teamId);
    const member = await getMember(me.teamId, userId, trx);
    if (!member) throw notFound("That member");
    if (member.role === "lead" && (await countLeads(me.teamId, trx)) <= 1)
      throw conflict("The team's last lead cannot be removed. Make another member a lead first.");
    await deleteMember(trx, me.teamId, userId);
    await recordAudit(trx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "member.remove",
      entityType: "member",
      entityId: userId,
      detail: { email: member.email, name: member.name, role: member.role },
    });
  });
}
