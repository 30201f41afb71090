// The access table: every API route and method with the roles allowed. The guards read it; the role-matrix test
// checks every route file against it.
import { ALL_ROLES, LEAD_ONLY, type Role } from "@/lib/auth/roles";

/** "public": no sign-in; "user": any signed-in person (no team role needed); otherwise the team roles allowed. */
export type Access = "public" | "user" | readonly Role[];

export const ROUTE_ACCESS = {
  "GET /api/health": "public",
  "POST /api/auth/sign-up": "public",
  "POST /api/auth/sign-in": "public",
  "POST /api/auth/sign-out": "user",
  "GET /api/me": "user",
  "GET /api/projects": ALL_ROLES,
  "POST /api/projects": LEAD_ONLY,
  "GET /api/projects/[projectId]": ALL_ROLES,
  "PATCH /api/projects/[projectId]": LEAD_ONLY,
  "DELETE /api/projects/[projectId]": LEAD_ONLY,
  "GET /api/projects/[projectId]/runs": ALL_ROLES,
  "POST /api/projects/[projectId]/runs": LEAD_ONLY,
  "POST /api/projects/[projectId]/runs/bulk": ALL_ROLES,
  "GET /api/projects/[projectId]/runs/export": ALL_ROLES,
  "GET /api/projects/[projectId]/checks": ALL_ROLES,
  "GET /api/projects/[projectId]/progress": ALL_ROLES,
  "GET /api/trace/[code]": ALL_ROLES,
  "GET /api/projects/[projectId]/markers.pdf": ALL_ROLES,
  "GET /api/print/templates": ALL_ROLES,
  "POST /api/print/templates": LEAD_ONLY,
  "PATCH /api/print/templates/[templateId]": LEAD_ONLY,
  "DELETE /api/print/templates/[templateId]": LEAD_ONLY,
  "PATCH /api/team/page-size": LEAD_ONLY,
  "GET /api/projects/[projectId]/plans": ALL_ROLES,
  "POST /api/projects/[projectId]/plans": LEAD_ONLY,
  "GET /api/plans/[planId]": ALL_ROLES,
  "POST /api/plans/[planId]/commit": LEAD_ONLY,
  "GET /api/plans/[planId]/purchases": ALL_ROLES,
  "POST /api/plans/[planId]/purchase-mail": LEAD_ONLY,
  "GET /api/plans/[planId]/cut-sheet.pdf": ALL_ROLES,
  // The bench: everyone reads a plan's bench view; builders and leads open a plan's new put-up as a shelf spool.
  "GET /api/plans/[planId]/bench": ALL_ROLES,
  "POST /api/plans/[planId]/spools/[index]/open": ["lead", "builder"],
  "GET /api/print/templates/[templateId]/calibration.pdf": ALL_ROLES,
  "POST /api/projects/[projectId]/imports": LEAD_ONLY,
  "GET /api/projects/[projectId]/imports/[importId]": LEAD_ONLY,
  "PATCH /api/projects/[projectId]/imports/[importId]": LEAD_ONLY,
  "POST /api/projects/[projectId]/imports/[importId]/commit": LEAD_ONLY,
  "GET /api/projects/[projectId]/runs/[runId]": ALL_ROLES,
  // Builders and technicians may change a run's state (technicians with a test result); the service checks which
  // fields each role sends and which state changes it may make.
  "PATCH /api/projects/[projectId]/runs/[runId]": ALL_ROLES,
  "DELETE /api/projects/[projectId]/runs/[runId]": LEAD_ONLY,
  "POST /api/auth/password-reset": "public",
  "POST /api/auth/password-reset/confirm": "public",
  "POST /api/invitations/accept": "public",
  "GET /api/team": ALL_ROLES,
  "POST /api/team/invitations": LEAD_ONLY,
  "POST /api/team/invitations/[invitationId]/resend": LEAD_ONLY,
  "DELETE /api/team/invitations/[invitationId]": LEAD_ONLY,
  "PATCH /api/team/members/[userId]": LEAD_ONLY,
  "DELETE /api/team/members/[userId]": LEAD_ONLY,
  "GET /api/audit": LEAD_ONLY,
  // Development only: answers 404 unless the mailbox is on (lib/env.ts mailboxEnabled).
  "GET /api/dev/mail": "public",
  // Stock: the lead edits; builders and technicians read.
  "GET /api/projects/[projectId]/unmatched-wire-types": ALL_ROLES,
  "GET /api/stock/wire-types": ALL_ROLES,
  "POST /api/stock/wire-types": LEAD_ONLY,
  "GET /api/stock/wire-types/[wireTypeId]": ALL_ROLES,
  "PATCH /api/stock/wire-types/[wireTypeId]": LEAD_ONLY,
  "DELETE /api/stock/wire-types/[wireTypeId]": LEAD_ONLY,
  "GET /api/stock/put-ups": ALL_ROLES,
  "POST /api/stock/put-ups": LEAD_ONLY,
  "PATCH /api/stock/put-ups/[putUpId]": LEAD_ONLY,
  "DELETE /api/stock/put-ups/[putUpId]": LEAD_ONLY,
  "GET /api/stock/spools": ALL_ROLES,
  "POST /api/stock/spools": LEAD_ONLY,
  "GET /api/stock/spools/[spoolId]": ALL_ROLES,
  "PATCH /api/stock/spools/[spoolId]": LEAD_ONLY,
  "GET /api/stock/spools/[spoolId]/adjustments": ALL_ROLES,
  "POST /api/stock/spools/[spoolId]/adjustments": LEAD_ONLY,
} as const satisfies Record<string, Access>;

export type RouteKey = keyof typeof ROUTE_ACCESS;

export function accessFor(key: RouteKey): Access {
  return ROUTE_ACCESS[key];
}
