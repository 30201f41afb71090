// Print jobs: marker strips for chosen runs of a project, sized from the wire types on the shelf.
import { buildMarkerStripPdf } from "@/lib/pdf/marker-strip";
import { renderCalibrationPage } from "@/lib/pdf/calibration";
import {
  DEFAULT_MARKER_TEMPLATES,
  findMarkerTemplate,
  type MarkerTemplate,
} from "@/lib/domain/marker-templates";
import type { MarkerRunInput } from "@/lib/domain/markers";
import { runCutLengthMm } from "@/lib/domain/cut-length";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { listAllRuns } from "@/lib/db/runs";
import { listAllWireTypes } from "@/lib/db/wire-types";
import { matchProjectRuns } from "@/lib/services/stock";
import { env } from "@/lib/env";
import { invalid, notFound } from "@/lib/http/errors";
import type { MarkersQuery } from "@/lib/validation/print";

export function listTemplates(): readonly MarkerTemplate[] {
  return DEFAULT_MARKER_TEMPLATES;
}

export function requireTemplate(id: string): MarkerTemplate {
  const t = findMarkerTemplate(id);
  if (!t) throw notFound(`The marker template "${id}"`);
  return t;
}

const MAX_RUNS_PER_JOB = 5000;

export async function markerPdf(
  teamId: string,
  project: ProjectRecord,
  q: MarkersQuery,
): Promise<{ pdf: Buffer; markerCount: number; pageCount: number }> {
  const template = requireTemplate(q.template);
  const settings = settingsOf(project);
  const [runs, matches, wireTypes] = await Promise.all([
    listAllRuns(teamId, project.id),
    matchProjectRuns(teamId, project.id),
    listAllWireTypes(teamId),
  ]);
  const wanted = q.runs
    ? new Set(
        q.runs
          .split(",")
          .map((s) => s.trim())
          .filter(Boolean),
      )
    : null;
  const chosen = runs.filter(
    (r) =>
      (!wanted || wanted.has(r.id) || wanted.has(r.wireId)) &&
      (!q.state || r.state === q.state) &&
      (!q.gauge || r.gauge === q.gauge) &&
      (!q.colour || r.colour === q.colour.toUpperCase()),
  );
  if (chosen.length === 0) throw invalid("No run matches that choice; nothing to print.");
  if (chosen.length > MAX_RUNS_PER_JOB) throw invalid(`Print at most ${MAX_RUNS_PER_JOB} runs at a time.`);
  const odById = new Map(wireTypes.map((w) => [w.id, w.outerDiameterMm]));
  const inputs: MarkerRunInput[] = chosen.map((r) => {
    const m = matches.get(r.id);
    return {
      wireId: r.wireId,
      endA: r.endA,
      endB: r.endB,
      gauge: r.gauge,
      colour: r.colour,
      insulation: r.insulation,
      routedLengthMm: r.routedLengthMm,
      cutLengthMm: runCutLengthMm(r, settings),
      traceCode: r.traceCode,
      outerDiameterMm: m?.kind === "matched" ? (odById.get(m.wireTypeId) ?? null) : null,
    };
  });
  const { pdf, viewModel } = await buildMarkerStripPdf({
    runs: inputs,
    settings,
    template,
    publicBaseUrl: env().PUBLIC_BASE_URL,
    title: `${project.name} — markers`,
    outlines: q.outlines === "1",
  });
  const markerCount = viewModel.pages.reduce((s, p) => s + p.markers.length, 0);
  return { pdf, markerCount, pageCount: viewModel.pages.length };
}

export async function calibrationPdf(templateId: string): Promise<Buffer> {
  return renderCalibrationPage(requireTemplate(templateId));
}

export function pdfResponse(pdf: Buffer, filename: string, extra: Record<string, string> = {}): Response {
  return new Response(new Uint8Array(pdf), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `inline; filename="${filename.replace(/[^A-Za-z0-9._-]+/g, "-")}"`,
      "Cache-Control": "no-store",
      ...extra,
    },
  });
}
