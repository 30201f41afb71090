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
  "GET /api/projects/[projectId]/runs": ALL_ROLES,
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
