// Team roles and what each may do (PRODUCT.md §2).
export const ROLES = ["lead", "builder", "technician"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  lead: "Lead",
  builder: "Builder",
  technician: "Technician",
};

export const ALL_ROLES: readonly Role[] = ROLES;
export const LEAD_ONLY: readonly Role[] = ["lead"];
