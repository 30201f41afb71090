// Schemas for the team, invitation, password-reset, audit and development-mailbox endpoints.
import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";
import { emailSchema, passwordSchema } from "@/lib/validation/auth";
import { pagingSchema } from "@/lib/validation/common";

export const roleSchema = z.enum(ROLES, { message: "Choose a role: lead, builder or technician." });

export const invitationCreateSchema = z.object({ email: emailSchema, role: roleSchema });
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>;

export const memberRoleSchema = z.object({ role: roleSchema });
export type MemberRoleInput = z.infer<typeof memberRoleSchema>;

const tokenSchema = z.string().trim().min(1, { message: "The link is missing its token." }).max(200);

/** A new person gives a name and a password; someone with an account gives that account's password. */
export const invitationAcceptSchema = z.object({
  token: tokenSchema,
  name: z.string().trim().min(1, { message: "Enter your name." }).max(100).optional(),
  password: z.string().min(1, { message: "Enter a password." }).max(200),
});
export type InvitationAcceptInput = z.infer<typeof invitationAcceptSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetConfirmSchema = z.object({ token: tokenSchema, password: passwordSchema });
export type PasswordResetConfirmInput = z.infer<typeof passwordResetConfirmSchema>;

// An empty query value (a cleared filter) means no filter.
const blankIsUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);
const optionalFilter = z.preprocess(blankIsUndefined, z.string().trim().max(60).optional());
const optionalDate = z.preprocess(
  blankIsUndefined,
  z.iso.date({ message: "Use a date as YYYY-MM-DD." }).optional(),
);

export const auditQuerySchema = pagingSchema(200, 50).extend({
  action: optionalFilter,
  actorUserId: optionalFilter,
  from: optionalDate,
  to: optionalDate,
});
export type AuditListQuery = z.infer<typeof auditQuerySchema>;

export const devMailQuerySchema = pagingSchema(200, 50).extend({
  to: z.string().trim().max(320).optional(),
});
