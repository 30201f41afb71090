// Accepting an invitation from its mailed link: a new person makes an account, someone with an account proves it
// with their password (or their session); the link works once, however many people use it at the same moment.
import { generateIdFromEntropySize } from "lucia";
import type { Role } from "@/lib/auth/roles";
import { assertSignInAllowed, noteSignInFailure, noteSignInSuccess } from "@/lib/auth/limits";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { hashToken, looksLikeToken } from "@/lib/auth/tokens";
import { recordAudit } from "@/lib/db/audit";
import { db } from "@/lib/db/knex";
import {
  claimInvitation,
  findInvitationByTokenHash,
  findMemberByEmail,
  insertMember,
  setInvitationAcceptedBy,
  type InvitationByToken,
} from "@/lib/db/team";
import { findUserByEmail, insertUser } from "@/lib/db/users";
import { conflict, invalid, notFound, unauthorized } from "@/lib/http/errors";
import { passwordSchema } from "@/lib/validation/auth";

export type InvitationView =
  | {
      state: "open";
      teamName: string;
      role: Role;
      email: string;
      inviterName: string | null;
      expiresAt: string;
      hasAccount: boolean;
    }
  | { state: "invalid" }
  | { state: "expired" | "revoked" | "accepted"; teamName: string };

async function lookup(token: string): Promise<InvitationByToken | null> {
  if (!looksLikeToken(token)) return null;
  return findInvitationByTokenHash(hashToken(token));
}

/** What the acceptance page shows for a link; never throws for a bad link. */
export async function viewInvitation(token: string): Promise<InvitationView> {
  const inv = await lookup(token);
  if (!inv) return { state: "invalid" };
  if (inv.status === "accepted" || inv.status === "revoked" || inv.status === "expired")
    return { state: inv.status, teamName: inv.teamName };
  return {
    state: "open",
    teamName: inv.teamName,
    role: inv.role,
    email: inv.email,
    inviterName: inv.invitedByName,
    expiresAt: new Date(inv.expiresAt).toISOString(),
    hasAccount: Boolean(await findUserByEmail(inv.email)),
  };
}

export const INVITATION_MESSAGES = {
  invalid: "This invitation link is not valid. Check that the whole address from the mail was opened.",
  accepted: "This invitation has already been used. Sign in with the account that accepted it.",
  revoked: "This invitation was withdrawn by the team's lead. Ask them for a new one if you still need it.",
  expired: "This invitation has expired. Ask the team's lead to resend it.",
} as const;

export interface AcceptInput {
  token: string;
  name?: string;
  password?: string;
  /** The signed-in user, who may join without typing a password when the invitation is for their address. */
  signedInUserId?: string | null;
  clientIp: string;
}

export async function acceptInvitation(
  input: AcceptInput,
): Promise<{ userId: string; teamId: string; newAccount: boolean }> {
  const inv = await lookup(input.token);
  if (!inv) throw notFound("That invitation");
  if (inv.status === "accepted" || inv.status === "revoked" || inv.status === "expired")
    throw conflict(INVITATION_MESSAGES[inv.status], { reason: inv.status });

  const existing = await findUserByEmail(inv.email);
  let userId: string;
  let passwordHash: string | null = null;
  if (existing) {
    userId = existing.id;
    if (input.signedInUserId !== existing.id) {
      // The password of an existing account is checked under the same limits as signing in.
      await assertSignInAllowed(inv.email, input.clientIp);
      if (!input.password || !(await verifyPassword(existing.passwordHash, input.password))) {
        await noteSignInFailure(inv.email, input.clientIp);
        throw unauthorized(`That password does not match the account for ${inv.email}.`);
      }
      await noteSignInSuccess(inv.email);
    }
  } else {
    if (!input.name) throw invalid("Enter your name.", [{ path: "name", message: "Enter your name." }]);
    const pw = passwordSchema.safeParse(input.password ?? "");
    if (!pw.success) {
      const message = pw.error.issues[0]?.message ?? "Choose a password.";
      throw invalid(message, [{ path: "password", message }]);
    }
    userId = generateIdFromEntropySize(10);
    passwordHash = await hashPassword(pw.data);
  }

  await db().transaction(async (trx) => {
    if (!(await claimInvitation(trx, inv.id, hashToken(input.token))))
      throw conflict(INVITATION_MESSAGES.accepted, { reason: "accepted" });
    if (passwordHash) {
      await insertUser(trx, { id: userId, email: inv.email, name: input.name ?? "", passwordHash });
    } else if (await findMemberByEmail(inv.teamId, inv.email, trx)) {
      throw conflict("You are already a member of this team.");
    }
    await setInvitationAcceptedBy(trx, inv.id, userId);
    await insertMember(trx, inv.teamId, userId, inv.role);
    await recordAudit(trx, {
      teamId: inv.teamId,
      actorUserId: userId,
      action: "invitation.accept",
      entityType: "invitation",
      entityId: inv.id,
      detail: { email: inv.email, role: inv.role, newAccount: Boolean(passwordHash) },
    });
  });
  return { userId, teamId: inv.teamId, newAccount: Boolean(passwordHash) };
}
