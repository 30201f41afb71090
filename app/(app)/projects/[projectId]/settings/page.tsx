import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { getProject } from "@/lib/db/projects";
import { uuidSchema } from "@/lib/validation/common";
import { ProjectSettingsForm } from "@/components/projects/project-settings-form";

export const metadata: Metadata = { title: "Project settings" };

export default async function ProjectSettingsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const me = await requirePageRole(ALL_ROLES, `/projects/${projectId}/settings`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  const project = await getProject(me.teamId, projectId);
  if (!project) notFound();
  return <ProjectSettingsForm project={project} canEdit={me.role === "lead"} />;
}
