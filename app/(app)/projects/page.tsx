import type { Metadata } from "next";
import Link from "next/link";
import { requirePageUser } from "@/lib/auth/guards";
import { listProjects } from "@/lib/db/projects";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { NewProjectForm } from "@/components/projects/new-project-form";

export const metadata: Metadata = { title: "Projects" };

export default async function ProjectsPage({ searchParams }: { searchParams: Promise<{ denied?: string }> }) {
  const me = await requirePageUser("/projects");
  const { denied } = await searchParams;
  if (!me.teamId) {
    return (
      <EmptyState title="You are not in a team yet">
        Ask your team&apos;s lead to invite you, or sign up to start a team of your own.
      </EmptyState>
    );
  }
  const projects = await listProjects(me.teamId);
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="text-sm font-semibold uppercase tracking-wide text-copper-dark">{me.teamName}</p>
          <h1 className="text-2xl font-bold">Projects</h1>
        </div>
        {me.role === "lead" ? <NewProjectForm /> : null}
      </div>
      {denied ? <Notice tone="info">That screen is not open to your role in this team.</Notice> : null}
      {projects.length === 0 ? (
        <EmptyState title="No projects yet">
          A project holds one harness build: its run list, checks, spool plan and printed markers.
        </EmptyState>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {projects.map((p) => (
            <li key={p.id}>
              <Link
                href={`/projects/${p.id}`}
                className="flex h-full flex-col gap-2 rounded-lg border border-line bg-white p-5 shadow-sm transition hover:border-copper hover:shadow"
              >
                <span className="text-lg font-bold">{p.name}</span>
                <span className="text-sm text-ink-soft">
                  {p.runCount} runs · {p.supplyV} V · {p.gaugeSystem === "awg" ? "AWG" : "mm²"} sizes
                </span>
                <span className="mt-auto text-xs text-ink-faint">
                  Wire IDs {p.wireIdPrefix}… · updated {new Date(p.updatedAt).toLocaleDateString("en-GB")}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
