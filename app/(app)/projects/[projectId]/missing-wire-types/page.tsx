import type { Metadata } from "next";
import { notFound } from "next/navigation";
import Link from "next/link";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { getProject } from "@/lib/db/projects";
import { uuidSchema } from "@/lib/validation/common";
import { UnmatchedWireTypes } from "@/components/stock/unmatched-wire-types";

export const metadata: Metadata = { title: "Missing wire types" };

export default async function MissingWireTypesPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const me = await requirePageRole(ALL_ROLES, `/projects/${projectId}/missing-wire-types`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  const project = await getProject(me.teamId, projectId);
  if (!project) notFound();
  return (
    <div className="flex flex-col gap-5">
      <div>
        <Link href={`/projects/${project.id}`} className="text-sm text-ink-soft hover:text-ink">
          ← {project.name}
        </Link>
        <h1 className="text-2xl font-bold">Wire types missing for project {project.name}</h1>
      </div>
      <UnmatchedWireTypes projectId={project.id} canEdit={me.role === "lead"} />
    </div>
  );
}
