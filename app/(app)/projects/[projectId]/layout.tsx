import { notFound } from "next/navigation";
import Link from "next/link";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { getProject } from "@/lib/db/projects";
import { uuidSchema } from "@/lib/validation/common";
import { ProjectNav } from "@/components/projects/project-nav";
import { MissingWireTypesLink } from "@/components/stock/missing-wire-types-link";

export default async function ProjectLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ projectId: string }>;
}) {
  const { projectId } = await params;
  const me = await requirePageRole(ALL_ROLES, `/projects/${projectId}`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  const project = await getProject(me.teamId, projectId);
  if (!project) notFound();
  return (
    <div className="flex flex-col gap-5">
      <div>
        <Link href="/projects" className="text-sm text-ink-soft hover:text-ink">
          ← Projects
        </Link>
        <h1 className="text-2xl font-bold">{project.name}</h1>
        <p className="text-sm text-ink-soft">
          {project.runCount} runs · supply {project.supplyV} V · conductors at {project.conductorTempC} °C ·
          slack max({project.slackPct} %, {project.slackMinMm} mm) + {project.serviceLoopMm} mm per end,
          rounded up to {project.roundingMm} mm
        </p>
      </div>
      <MissingWireTypesLink projectId={project.id} />
      <ProjectNav projectId={project.id} />
      {children}
    </div>
  );
}
