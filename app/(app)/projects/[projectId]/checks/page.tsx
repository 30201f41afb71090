import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { uuidSchema } from "@/lib/validation/common";
import { ChecksView } from "@/components/checks/checks-view";

export const metadata: Metadata = { title: "Checks" };

export default async function ChecksPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  await requirePageRole(ALL_ROLES, `/projects/${projectId}/checks`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  return <ChecksView projectId={projectId} />;
}
