import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { uuidSchema } from "@/lib/validation/common";
import { PrintView } from "@/components/print/print-view";
import { teamPageSize } from "@/lib/db/team";

export const metadata: Metadata = { title: "Print" };

export default async function PrintPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string }>;
  searchParams: Promise<{ runs?: string }>;
}) {
  const { projectId } = await params;
  const me = await requirePageRole(ALL_ROLES, `/projects/${projectId}/print`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  const { runs } = await searchParams;
  const pageSize = await teamPageSize(me.teamId);
  return <PrintView projectId={projectId} initialRuns={runs ?? ""} role={me.role} pageSize={pageSize} />;
}
