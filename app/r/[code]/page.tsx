import type { Metadata } from "next";
import { notFound } from "next/navigation";
import Link from "next/link";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { traceRun, type TraceView } from "@/lib/services/trace";
import { AppError } from "@/lib/http/errors";
import { TraceRun } from "@/components/trace/trace-run";

export const metadata: Metadata = { title: "Wire" };

export default async function TracePage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const me = await requirePageRole(ALL_ROLES, `/r/${encodeURIComponent(code)}`);
  let view: TraceView;
  try {
    view = await traceRun(me.teamId, code);
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    throw e;
  }
  return (
    <div className="flex flex-col gap-4">
      <Link href={`/projects/${view.project.id}`} className="text-sm text-ink-soft hover:text-ink">
        ← {view.project.name}
      </Link>
      <TraceRun view={view} canTest={me.role === "technician" || me.role === "lead"} />
    </div>
  );
}
