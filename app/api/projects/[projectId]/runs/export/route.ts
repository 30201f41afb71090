import { z } from "zod";
import { readQuery, route } from "@/lib/http/handler";
import { requireProject } from "@/lib/services/projects";
import { listAllRuns } from "@/lib/db/runs";
import { settingsOf } from "@/lib/db/projects";
import { runsToCsv, runsToXlsx } from "@/lib/export/runs";
import { runCutLengthMm } from "@/lib/domain/cut-length";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

const querySchema = z.object({ format: z.enum(["csv", "xlsx"]).default("csv") });

/** The run list as CSV or XLSX with units in the headers; it imports back unchanged. */
export const GET = route("GET /api/projects/[projectId]/runs/export", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const { format } = readQuery(req, querySchema);
  const settings = settingsOf(project);
  const runs = (await listAllRuns(me.teamId, project.id)).map((r) => ({
    ...r,
    cutLengthMm: runCutLengthMm(r, settings),
  }));
  const base = `${project.name.replace(/[^A-Za-z0-9._-]+/g, "-")}-runs`;
  if (format === "xlsx") {
    const buf = await runsToXlsx(runs, settings);
    return new Response(new Uint8Array(buf), {
      headers: {
        "Content-Type": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
        "Content-Disposition": `attachment; filename="${base}.xlsx"`,
      },
    });
  }
  return new Response(runsToCsv(runs, settings), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${base}.csv"`,
    },
  });
});
