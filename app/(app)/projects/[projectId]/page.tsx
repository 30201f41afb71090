import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { uuidSchema } from "@/lib/validation/common";
import { RunsWorkspace } from "@/components/runs/runs-workspace";

export const metadata: Metadata = { title: "Runs" };

export default async function ProjectRunsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const me = await requirePageRole(ALL_ROLES, `/projects/${projectId}`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  return <RunsWorkspace projectId={projectId} role={me.role} />;
}
