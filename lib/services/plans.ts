// Spool plans: run the planner over a project's cuts and the team's stock, store it, commit it to the shelf.
import Papa from "papaparse";
import ExcelJS from "exceljs";
import { db } from "@/lib/db/knex";
import { recordAudit } from "@/lib/db/audit";
import { getPlan, insertPlan, listPlans, markPlanCommitted, type PlanRecord } from "@/lib/db/plans";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { listAllRuns } from "@/lib/db/runs";
import { listAllWireTypes } from "@/lib/db/wire-types";
import { listActivePutUps } from "@/lib/db/put-ups";
import { createSpool, listOpenSpools, reserveSpools } from "@/lib/db/spools";
import { planSpools, type PlanCut, type PlanStock } from "@/lib/domain/spool-plan";
import { runCutLengthMm } from "@/lib/domain/cut-length";
import { wireTypeMatcher } from "@/lib/domain/wire-type-match";
import { colourName } from "@/lib/domain/colour";
import type { TeamMe } from "@/lib/auth/guards";
import { conflict, notFound } from "@/lib/http/errors";
import { uuidSchema } from "@/lib/validation/common";
import { sendMail } from "@/lib/mail/send";
import { env } from "@/lib/env";
import { buildCutSheetPdf } from "@/lib/pdf/cut-sheet";
import { repeatMarkerCount } from "@/lib/domain/markers";
import type { CutSheetSpoolInput } from "@/lib/domain/cut-sheet";
import { teamPageSize } from "@/lib/db/team";
import { requireProject } from "@/lib/services/projects";
import type {
  PlanCutView,
  PlanPurchaseView,
  PlanSpoolView,
  PlanUnplacedView,
  PlanView,
  PlanWireTypeView,
} from "@/lib/services/plan-view";

const PLAN_TIME_LIMIT_MS = 3000;

function wireTypeLabel(w: { gauge: string; colour: string; insulation: string | null }): string {
  return `${w.gauge} ${w.colour} (${colourName(w.colour)})${w.insulation ? ` ${w.insulation}` : ""}`;
}

export async function createPlan(me: TeamMe, project: ProjectRecord): Promise<string> {
  const settings = settingsOf(project);
  const [runs, wireTypes] = await Promise.all([
    listAllRuns(me.teamId, project.id),
    listAllWireTypes(me.teamId),
  ]);
  const matcher = wireTypeMatcher(wireTypes);
  const wtById = new Map(wireTypes.map((w) => [w.id, w]));
  const unplaced: PlanUnplacedView[] = [];
  const cuts: PlanCut[] = [];
  const cutInfo = new Map<string, PlanCutView>();
  for (const r of runs) {
    const lengthMm = runCutLengthMm(r, settings);
    const m = matcher.match(r);
    if (m.kind !== "matched") {
      unplaced.push({
        runId: r.id,
        wireId: r.wireId,
        cutLengthMm: lengthMm,
        reason:
          m.kind === "missing"
            ? `No wire type in Stock for ${r.gauge} ${r.colour}${r.insulation ? ` ${r.insulation}` : ""}: add it first.`
            : `Several wire types fit ${r.gauge} ${r.colour}; give the run its insulation spec.`,
      });
      continue;
    }
    cuts.push({ id: r.id, wireType: m.wireTypeId, lengthMm });
    cutInfo.set(r.id, {
      runId: r.id,
      wireId: r.wireId,
      traceCode: r.traceCode,
      cutLengthMm: lengthMm,
      routedLengthMm: r.routedLengthMm,
      endA: r.endA,
      endB: r.endB,
      endATermination: r.endATermination,
      endBTermination: r.endBTermination,
      endAStripMm: r.endAStripMm,
      endBStripMm: r.endBStripMm,
    });
  }
  const wtIds = [...new Set(cuts.map((c) => c.wireType))];
  const [spools, putUps] = await Promise.all([
    listOpenSpools(me.teamId, wtIds),
    listActivePutUps(me.teamId, wtIds),
  ]);
  const stock: PlanStock[] = [
    ...spools.map((s) => ({
      id: `spool:${s.id}`,
      wireType: s.wireTypeId,
      lengthMm: s.lengthMm,
      costCents: 0,
      available: 1,
      kind: "shelf" as const,
    })),
    ...putUps.map((p) => ({
      id: `putup:${p.id}`,
      wireType: p.wireTypeId,
      lengthMm: p.nominalLengthMm,
      costCents: p.priceCents,
      available: null,
      kind: "putup" as const,
    })),
  ];
  const result = await planSpools(cuts, stock, {
    endDiscardMm: settings.endDiscardMm,
    keepRemnantMm: settings.keepRemnantMm,
    timeLimitMs: PLAN_TIME_LIMIT_MS,
  });

  const spoolById = new Map(spools.map((s) => [s.id, s]));
  const putUpById = new Map(putUps.map((p) => [p.id, p]));
  const byType = new Map<string, PlanSpoolView[]>();
  for (const ps of result.spools) {
    const [kind, id] = ps.stockId.split(":") as ["spool" | "putup", string];
    const list = byType.get(ps.wireType) ?? [];
    const source: PlanSpoolView["source"] =
      kind === "spool"
        ? {
            kind: "shelf",
            spoolId: id,
            lot: spoolById.get(id)?.lot ?? null,
            location: spoolById.get(id)?.location ?? null,
            lengthMm: spoolById.get(id)?.lengthMm ?? ps.usableMm,
          }
        : {
            kind: "putup",
            putUpId: id,
            nominalMm: putUpById.get(id)?.nominalLengthMm ?? ps.usableMm + ps.endDiscardMm,
            supplier: putUpById.get(id)?.supplierName ?? null,
            partNumber: putUpById.get(id)?.supplierPartNo ?? null,
            priceCents: putUpById.get(id)?.priceCents ?? ps.costCents,
            currency: putUpById.get(id)?.currency ?? "USD",
          };
    list.push({
      index: list.length + 1,
      source,
      usableMm: ps.usableMm,
      endDiscardMm: ps.endDiscardMm,
      usedMm: ps.usedMm,
      leftoverMm: ps.leftoverMm,
      keep: ps.keep,
      costCents: ps.costCents,
      cuts: ps.cutIds.map((cid) => cutInfo.get(cid)!),
    });
    byType.set(ps.wireType, list);
  }
  for (const u of result.unplaced) {
    const c = cutInfo.get(u.id);
    unplaced.push({ runId: u.id, wireId: c?.wireId ?? u.id, cutLengthMm: u.lengthMm, reason: u.reason });
  }
  const wireTypesView: PlanWireTypeView[] = result.perWireType.map((s) => {
    const w = wtById.get(s.wireType)!;
    return {
      wireTypeId: s.wireType,
      label: wireTypeLabel(w),
      gauge: w.gauge,
      colour: w.colour,
      insulation: w.insulation,
      // Shelf spools first, then new ones: the order the bench takes them.
      spools: (byType.get(s.wireType) ?? [])
        .sort((a, b) => Number(a.source.kind === "putup") - Number(b.source.kind === "putup"))
        .map((sp, i) => ({ ...sp, index: i + 1 })),
      costCents: s.costCents,
      lowerBoundCents: s.lowerBoundCents,
      gapPct: s.gapPct,
      scrapMm: s.scrapMm,
      method: s.method,
      provenOptimal: s.provenOptimal,
      ffd: { costCents: s.ffd.costCents, spoolCount: s.ffd.spoolCount, scrapMm: s.ffd.scrapMm },
    };
  });
  const purchases: PlanPurchaseView[] = result.purchases.map((p) => {
    const pu = putUpById.get(p.stockId.replace(/^putup:/, ""))!;
    return {
      putUpId: pu.id,
      wireTypeLabel: wireTypeLabel(wtById.get(pu.wireTypeId)!),
      supplier: pu.supplierName,
      partNumber: pu.supplierPartNo,
      nominalMm: pu.nominalLengthMm,
      count: p.count,
      unitPriceCents: pu.priceCents,
      totalCents: p.costCents,
      currency: pu.currency,
    };
  });
  const view: PlanView = {
    projectId: project.id,
    projectName: project.name,
    createdAt: new Date().toISOString(),
    wireTypes: wireTypesView,
    purchases,
    unplaced,
    costCents: result.costCents,
    lowerBoundCents: result.lowerBoundCents,
    gapPct: result.gapPct,
    spoolCount: result.spoolCount,
    cutCount: cuts.length,
    scrapMm: result.scrapMm,
    keptRemnantMm: result.keptRemnantMm,
    method: result.method,
    elapsedMs: result.elapsedMs,
    settings: { endDiscardMm: settings.endDiscardMm, keepRemnantMm: settings.keepRemnantMm },
  };
  const usedShelf = new Set(
    result.spools.filter((s) => s.stockId.startsWith("spool:")).map((s) => s.stockId.slice(6)),
  );
  return db().transaction(async (tx) => {
    const id = await insertPlan(tx, {
      projectId: project.id,
      createdBy: me.user.id,
      result: view,
      runVersions: Object.fromEntries(runs.map((r) => [r.id, r.version])),
      spoolVersions: Object.fromEntries(
        spools.filter((s) => usedShelf.has(s.id)).map((s) => [s.id, s.version]),
      ),
      costCents: result.costCents,
      lowerBoundCents: result.lowerBoundCents,
      gapPct: result.gapPct,
    });
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "plan.create",
      entityType: "spool_plan",
      entityId: id,
      detail: { projectId: project.id, costCents: result.costCents, spools: result.spoolCount },
    });
    return id;
  });
}

export interface PlanResponse {
  id: string;
  status: PlanRecord["status"];
  createdAt: string;
  committedAt: string | null;
  /** Runs changed, added or removed since the plan was made. */
  stale: { changed: string[]; added: string[]; removed: string[] };
  plan: PlanView;
}

export async function requirePlan(teamId: string, planId: string | undefined): Promise<PlanRecord> {
  if (!planId || !uuidSchema.safeParse(planId).success) throw notFound("That plan");
  const p = await getPlan(teamId, planId);
  if (!p) throw notFound("That plan");
  return p;
}

async function staleness(teamId: string, p: PlanRecord): Promise<PlanResponse["stale"]> {
  const runs = await listAllRuns(teamId, p.projectId);
  const now = new Map(runs.map((r) => [r.id, r]));
  const changed: string[] = [];
  const removed: string[] = [];
  for (const [id, v] of Object.entries(p.runVersions)) {
    const r = now.get(id);
    if (!r) removed.push(id);
    else if (r.version !== v) changed.push(r.wireId);
  }
  const added = runs.filter((r) => !(r.id in p.runVersions)).map((r) => r.wireId);
  return { changed, added, removed };
}

export async function planResponse(teamId: string, p: PlanRecord): Promise<PlanResponse> {
  return {
    id: p.id,
    status: p.status,
    createdAt: p.createdAt,
    committedAt: p.committedAt,
    stale: await staleness(teamId, p),
    plan: p.result,
  };
}

export async function projectPlans(teamId: string, projectId: string) {
  const items = await listPlans(teamId, projectId);
  return { items, total: items.length, limit: 50, offset: 0 };
}

/**
 * Commits a plan: reserves the shelf spools it uses and puts the kept leftovers of new spools on the shelf, in
 * one transaction. Two commits racing for one shelf spool: the second finds it reserved and gets 409.
 */
export async function commitPlan(me: TeamMe, planId: string): Promise<PlanResponse> {
  const plan = await requirePlan(me.teamId, planId);
  await requireProject(me.teamId, plan.projectId);
  const stale = await staleness(me.teamId, plan);
  if (stale.changed.length || stale.removed.length) {
    throw conflict("Runs changed since this plan was made; make a new plan before committing.", { stale });
  }
  await db().transaction(async (tx) => {
    const locked = await getPlan(me.teamId, planId, { forUpdate: tx });
    if (!locked || locked.status !== "draft") throw conflict("This plan was already committed.");
    const shelf = Object.entries(locked.spoolVersions).map(([id, version]) => ({ id, version }));
    await reserveSpools(tx, me.teamId, me.user.id, shelf, { planId });
    for (const wt of locked.result.wireTypes) {
      for (const sp of wt.spools) {
        if (sp.source.kind !== "putup" || !sp.keep) continue;
        await createSpool(
          me.teamId,
          me.user.id,
          {
            wireTypeId: wt.wireTypeId,
            lengthMm: sp.leftoverMm,
            initialLengthMm: sp.leftoverMm,
            lot: null,
            location: null,
            state: "reserved",
            sourcePutUpId: sp.source.putUpId,
            originNote: `Remnant of plan ${planId.slice(0, 8)} (${locked.result.projectName}), spool ${sp.index} of ${wt.label}; on the shelf once cut`,
          },
          tx,
        );
      }
    }
    await markPlanCommitted(tx, planId, me.user.id);
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "plan.commit",
      entityType: "spool_plan",
      entityId: planId,
      detail: { projectId: locked.projectId, reservedSpools: shelf.length },
    });
  });
  return planResponse(me.teamId, (await getPlan(me.teamId, planId))!);
}

const money = (cents: number) => (cents / 100).toFixed(2);

function purchaseRows(plan: PlanView) {
  return plan.purchases.map((p) => ({
    supplier: p.supplier ?? "",
    partNumber: p.partNumber ?? "",
    wireType: p.wireTypeLabel,
    putUpLengthM: (p.nominalMm / 1000).toFixed(2),
    putUpLengthFt: (p.nominalMm / 304.8).toFixed(0),
    quantity: p.count,
    unitPrice: money(p.unitPriceCents),
    total: money(p.totalCents),
    currency: p.currency,
  }));
}

export function purchaseCsv(plan: PlanView): string {
  return Papa.unparse(purchaseRows(plan), { newline: "\r\n" });
}

export async function purchaseXlsx(plan: PlanView): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("Purchase list");
  const rows = purchaseRows(plan);
  ws.columns = Object.keys(
    rows[0] ?? {
      supplier: 0,
      partNumber: 0,
      wireType: 0,
      putUpLengthM: 0,
      putUpLengthFt: 0,
      quantity: 0,
      unitPrice: 0,
      total: 0,
      currency: 0,
    },
  ).map((k) => ({ header: k, key: k, width: k === "wireType" ? 40 : 16 }));
  ws.addRows(rows);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

export async function mailPurchaseList(me: TeamMe, planId: string, to: string) {
  const plan = await requirePlan(me.teamId, planId);
  const view = plan.result;
  const bySupplier = new Map<string, PlanPurchaseView[]>();
  for (const p of view.purchases)
    bySupplier.set(p.supplier ?? "(no supplier)", [
      ...(bySupplier.get(p.supplier ?? "(no supplier)") ?? []),
      p,
    ]);
  const lines = [...bySupplier].flatMap(([s, items]) => [
    `${s}:`,
    ...items.map(
      (p) =>
        `  ${p.count} × ${p.partNumber ?? "(no part no.)"} — ${p.wireTypeLabel}, ${(p.nominalMm / 1000).toFixed(1)} m — ${money(p.totalCents)} ${p.currency}`,
    ),
  ]);
  const total = view.purchases.reduce((s, p) => s + p.totalCents, 0);
  const text = [
    `Purchase list for ${view.projectName}, from the spool plan of ${new Date(view.createdAt).toUTCString()}.`,
    "",
    ...(lines.length ? lines : ["Nothing to buy: the shelf covers every cut."]),
    "",
    `Total: ${money(total)} ${view.purchases[0]?.currency ?? ""}`.trim(),
    "",
    "The list is attached as CSV. Sent from Loomwright.",
  ].join("\n");
  const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
  const html = `<pre style="font-family:monospace">${esc(text)}</pre>`;
  const sent = await sendMail({
    to,
    subject: `Purchase list — ${view.projectName}`,
    text,
    html,
    attachments: [
      {
        filename: `purchase-list-${planId.slice(0, 8)}.csv`,
        content: purchaseCsv(view),
        contentType: "text/csv",
      },
    ],
  });
  await db().transaction(async (tx) => {
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: sent.ok ? "purchase-list.mail" : "purchase-list.mail-failed",
      entityType: "spool_plan",
      entityId: planId,
      detail: {
        to,
        items: view.purchases.length,
        totalCents: total,
        ...(sent.ok ? {} : { error: sent.error }),
      },
    });
  });
  return sent;
}

export async function cutSheetPdf(me: TeamMe, planId: string): Promise<{ pdf: Buffer; name: string }> {
  const plan = await requirePlan(me.teamId, planId);
  const project = await requireProject(me.teamId, plan.projectId);
  const pageSize = await teamPageSize(me.teamId);
  const view = plan.result;
  const spools: CutSheetSpoolInput[] = view.wireTypes.flatMap((wt) =>
    wt.spools.map((sp) => ({
      wireTypeLabel: wt.label,
      gauge: wt.gauge,
      colour: wt.colour,
      insulation: wt.insulation,
      source:
        sp.source.kind === "shelf"
          ? {
              kind: "shelf" as const,
              lot: sp.source.lot,
              location: sp.source.location,
              lengthMm: sp.source.lengthMm,
            }
          : {
              kind: "putup" as const,
              nominalMm: sp.source.nominalMm,
              supplier: sp.source.supplier,
              partNumber: sp.source.partNumber,
              price: sp.source.priceCents / 100,
            },
      cuts: sp.cuts.map((c) => ({
        ...c,
        markerCount: 2 + repeatMarkerCount(c.routedLengthMm, project.markerRepeatMm),
      })),
      leftoverMm: sp.leftoverMm,
      keep: sp.keep,
    })),
  );
  const { pdf } = await buildCutSheetPdf({
    projectName: view.projectName,
    planCreatedAt: plan.createdAt,
    pageSize,
    publicBaseUrl: env().PUBLIC_BASE_URL,
    currency: view.purchases[0]?.currency ?? "USD",
    spools,
  });
  return { pdf, name: `${view.projectName}-cut-sheet-${planId.slice(0, 8)}.pdf` };
}
