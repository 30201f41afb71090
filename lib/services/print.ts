// Print jobs: marker strips for chosen runs of a project, sized from the wire types on the shelf.
import { buildMarkerStripPdf } from "@/lib/pdf/marker-strip";
import { renderCalibrationPage } from "@/lib/pdf/calibration";
import {
  DEFAULT_MARKER_TEMPLATES,
  findMarkerTemplate,
  validateTemplate,
  type MarkerTemplate,
} from "@/lib/domain/marker-templates";
import { db } from "@/lib/db/knex";
import { recordAudit } from "@/lib/db/audit";
import {
  deleteTeamTemplate,
  getTeamTemplate,
  insertTeamTemplate,
  listTeamTemplates,
  setTeamPageSize,
  updateTeamTemplateIfVersion,
  type TeamTemplateRow,
} from "@/lib/db/marker-templates";
import type { TeamMe } from "@/lib/auth/guards";
import { uuidSchema } from "@/lib/validation/common";
import type { MarkerRunInput } from "@/lib/domain/markers";
import { runCutLengthMm } from "@/lib/domain/cut-length";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { listAllRuns } from "@/lib/db/runs";
import { listAllWireTypes } from "@/lib/db/wire-types";
import { matchProjectRuns } from "@/lib/services/stock";
import { env } from "@/lib/env";
import { conflict, invalid, notFound } from "@/lib/http/errors";
import type { MarkerTemplateBodyInput, MarkersQuery } from "@/lib/validation/print";

export type TemplateView = MarkerTemplate & { builtIn: boolean; version: number | null };

function fromRow(r: TeamTemplateRow): TemplateView {
  return { ...r.body, id: r.id, name: r.name, builtIn: false, version: r.version };
}

/** The built-in templates, then the team's own. */
export async function listTemplates(teamId: string): Promise<TemplateView[]> {
  const own = await listTeamTemplates(teamId);
  return [
    ...DEFAULT_MARKER_TEMPLATES.map((t) => ({ ...t, builtIn: true, version: null })),
    ...own.map(fromRow),
  ];
}

export async function requireTemplate(teamId: string, id: string): Promise<TemplateView> {
  const builtIn = findMarkerTemplate(id);
  if (builtIn) return { ...builtIn, builtIn: true, version: null };
  const row = uuidSchema.safeParse(id).success ? await getTeamTemplate(teamId, id) : null;
  if (!row) throw notFound(`The marker template "${id}"`);
  return fromRow(row);
}

function checkLayout(input: MarkerTemplateBodyInput): Omit<MarkerTemplate, "id" | "name"> {
  const { name: _name, ...body } = input;
  const problems = validateTemplate({ ...body, id: "new", name: input.name });
  if (problems.length) throw invalid(`The template does not fit: ${problems.join("; ")}.`, { problems });
  return body;
}

export async function createTemplate(me: TeamMe, input: MarkerTemplateBodyInput): Promise<TemplateView> {
  const body = checkLayout(input);
  const id = await db().transaction(async (tx) => {
    const newId = await insertTeamTemplate(tx, me.teamId, input.name, body);
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "template.create",
      entityType: "marker_template",
      entityId: newId,
      detail: { name: input.name },
    });
    return newId;
  });
  return requireTemplate(me.teamId, id);
}

export async function updateTemplate(
  me: TeamMe,
  id: string,
  input: MarkerTemplateBodyInput & { version: number },
): Promise<TemplateView> {
  const current = await requireTemplate(me.teamId, id);
  if (current.builtIn) throw conflict("Built-in templates cannot be changed; save a copy under a new name.");
  const { version, ...rest } = input;
  const body = checkLayout(rest);
  await db().transaction(async (tx) => {
    if (!(await updateTeamTemplateIfVersion(tx, me.teamId, id, version, rest.name, body))) {
      throw conflict("Someone else changed this template since you opened it.", { current });
    }
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "template.update",
      entityType: "marker_template",
      entityId: id,
      detail: { name: rest.name },
    });
  });
  return requireTemplate(me.teamId, id);
}

export async function removeTemplate(me: TeamMe, id: string): Promise<void> {
  const current = await requireTemplate(me.teamId, id);
  if (current.builtIn) throw conflict("Built-in templates cannot be deleted.");
  await db().transaction(async (tx) => {
    await deleteTeamTemplate(tx, me.teamId, id);
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "template.delete",
      entityType: "marker_template",
      entityId: id,
      detail: { name: current.name },
    });
  });
}

export async function changePageSize(me: TeamMe, pageSize: "A4" | "Letter"): Promise<{ pageSize: string }> {
  await db().transaction(async (tx) => {
    await setTeamPageSize(tx, me.teamId, pageSize);
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "team.page-size",
      entityType: "team",
      entityId: me.teamId,
      detail: { pageSize },
    });
  });
  return { pageSize };
}

const MAX_RUNS_PER_JOB = 5000;

export async function markerPdf(
  teamId: string,
  project: ProjectRecord,
  q: MarkersQuery,
): Promise<{ pdf: Buffer; markerCount: number; pageCount: number }> {
  const template = await requireTemplate(teamId, q.template);
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

export async function calibrationPdf(teamId: string, templateId: string): Promise<Buffer> {
  return renderCalibrationPage(await requireTemplate(teamId, templateId));
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
