import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { uuidSchema } from "@/lib/validation/common";
import { PlanView } from "@/components/plan/plan-view";

export const metadata: Metadata = { title: "Spool plan" };

export default async function PlanPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const me = await requirePageRole(ALL_ROLES, `/projects/${projectId}/plan`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  return <PlanView projectId={projectId} role={me.role} />;
}
