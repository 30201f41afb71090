import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { uuidSchema } from "@/lib/validation/common";
import { BenchScreen } from "@/components/bench/bench-screen";
import { EmptyState } from "@/components/ui/empty-state";

export const metadata: Metadata = { title: "Bench" };

export default async function BenchPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const me = await requirePageRole(ALL_ROLES, `/projects/${projectId}/bench`);
  if (!uuidSchema.safeParse(projectId).success) notFound();
  if (me.role === "technician") {
    return (
      <EmptyState
        title="The bench is not for your role"
        action={
          <Link href={`/projects/${projectId}`} className="font-semibold text-copper-dark underline">
            Back to the runs
          </Link>
        }
      >
        Builders and leads record cuts here. As a technician you scan a marker to open its trace page and
        record test results there.
      </EmptyState>
    );
  }
  return <BenchScreen projectId={projectId} />;
}
