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
  "POST /api/projects/[projectId]/imports": LEAD_ONLY,
  "GET /api/projects/[projectId]/imports/[importId]": LEAD_ONLY,
  "PATCH /api/projects/[projectId]/imports/[importId]": LEAD_ONLY,
  "POST /api/projects/[projectId]/imports/[importId]/commit": LEAD_ONLY,
  "GET /api/projects/[projectId]/runs/[runId]": ALL_ROLES,
  // Builders and technicians may change a run's state (technicians with a test result); the service checks which
  // fields each role sends and which state changes it may make.
  "PATCH /api/projects/[projectId]/runs/[runId]": ALL_ROLES,
  "DELETE /api/projects/[projectId]/runs/[runId]": LEAD_ONLY,
} as const satisfies Record<string, Access>;

export type RouteKey = keyof typeof ROUTE_ACCESS;

export function accessFor(key: RouteKey): Access {
  return ROUTE_ACCESS[key];
}
