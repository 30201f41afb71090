import type { Metadata } from "next";
import { requirePageRole } from "@/lib/auth/guards";
import { LEAD_ONLY } from "@/lib/auth/roles";
import { AuditScreen } from "@/components/audit/audit-screen";

export const metadata: Metadata = { title: "Audit" };

export default async function AuditPage() {
  await requirePageRole(LEAD_ONLY, "/audit");
  return <AuditScreen />;
}
