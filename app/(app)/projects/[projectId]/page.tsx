import type { Metadata } from "next";
import { notFound } from "next/navigation";
import Link from "next/link";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { getProject } from "@/lib/db/projects";
import { uuidSchema } from "@/lib/validation/common";
import { RunsTable } from "@/components/runs/runs-table";
import { MissingWireTypesLink } from "@/components/stock/missing-wire-types-link";

export const metadata: Metadata = { title: "Runs" };

export default async function ProjectRunsPage({ params }: { params: Promise<{ projectId: string }> }) {
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
          {project.runCount} runs · supply {project.supplyV} V · slack max({project.slackPct} %,{" "}
          {project.slackMinMm} mm) + {project.serviceLoopMm} mm per end
        </p>
        <MissingWireTypesLink projectId={project.id} />
      </div>
      <section aria-labelledby="runs-heading" className="flex flex-col gap-3">
        <h2 id="runs-heading" className="text-lg font-semibold">
          Runs
        </h2>
        <RunsTable projectId={project.id} />
      </section>
    </div>
  );
}
