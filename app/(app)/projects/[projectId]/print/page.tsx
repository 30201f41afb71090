import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { uuidSchema } from "@/lib/validation/common";
import { PrintView } from "@/components/print/print-view";

export const metadata: Metadata = { title: "Print" };

export default async function PrintPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string }>;
  searchParams: Promise<{ runs?: string }>;
}) {
  const { projectId } = await params;
  await requirePageRole(ALL_ROLES, `/projects/${projectId}/print`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  const { runs } = await searchParams;
  return <PrintView projectId={projectId} initialRuns={runs ?? ""} />;
}
