import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { uuidSchema } from "@/lib/validation/common";
import { ProgressView } from "@/components/progress/progress-view";

export const metadata: Metadata = { title: "Progress" };

export default async function ProgressPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  await requirePageRole(ALL_ROLES, `/projects/${projectId}/progress`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  return <ProgressView projectId={projectId} />;
}
