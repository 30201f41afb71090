// The bench: cutting runs from a recorded spool (its length goes down, an undo puts it back), replay-proof bench
// actions, opening a plan's new put-up as a shelf spool, and the bench view of a committed plan.
import { db, type Tx } from "@/lib/db/knex";
import {
  findBenchAction,
  getRunCut,
  insertBenchAction,
  insertPlanSpoolOpen,
  listPlanSpoolOpens,
  listRunCuts,
  lockSpoolRow,
  planOfSpool,
  setRunCut,
  spoolsByIds,
  type BenchSpoolStock,
} from "@/lib/db/bench";
import { adjustSpoolLength, createSpool, getSpool, type SpoolListItem } from "@/lib/db/spools";
import { getPlan, type PlanRecord } from "@/lib/db/plans";
import { listAllRuns, type RunRecord } from "@/lib/db/runs";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { runCutLengthMm } from "@/lib/domain/cut-length";
import { repeatMarkerCount } from "@/lib/domain/markers";
import type { BenchState } from "@/lib/domain/types";
import type { TeamMe } from "@/lib/auth/guards";
import { conflict, forbidden, invalid, notFound } from "@/lib/http/errors";
import { requireProject } from "@/lib/services/projects";
import { requirePlan } from "@/lib/services/plans";
import type { PlanCutView, PlanSpoolSource } from "@/lib/services/plan-view";
import type { PlanSpoolOpenInput } from "@/lib/validation/bench";

/** Fields of a run PATCH that are bench records, not run fields: builders may send them with the state. */
export const BENCH_PATCH_FIELDS: readonly string[] = ["spoolId", "actionId"];

interface BenchPatchInput {
  state?: BenchState;
  spoolId?: string;
  actionId?: string;
}

/**
 * An exact replay of a bench action (same client-made action id): answers with the run as it is now, changing
 * nothing. Called with the run locked, before the version check.
 */
export async function benchReplay(
  tx: Tx,
  me: TeamMe,
  current: RunRecord,
  input: BenchPatchInput,
): Promise<RunRecord | null> {
  if (!input.actionId) return null;
  const done = await findBenchAction(tx, me.teamId, input.actionId);
  if (!done) return null;
  if (done.runId !== current.id) throw conflict("That action id was already used for another run.");
  return current;
}

/**
 * What a state change does at the bench, inside the run PATCH's transaction: planned → cut records the spool (its
 * measured length goes down by the cut length, never below 0), who and when; back to planned undoes that (only
 * the builder who cut it, or a lead). Returns extra detail for the run's audit event.
 */
export async function applyBenchEffects(
  tx: Tx,
  me: TeamMe,
  project: ProjectRecord,
  before: RunRecord,
  after: RunRecord,
  input: BenchPatchInput,
): Promise<Record<string, unknown>> {
  const detail: Record<string, unknown> = {};
  const cutNow = before.state === "planned" && after.state === "cut";
  if (input.spoolId && !cutNow) {
    throw invalid("spoolId: a spool is recorded only when a planned run is cut.");
  }
  if (cutNow) {
    let taken: number | null = null;
    if (input.spoolId) {
      if (!(await lockSpoolRow(tx, me.teamId, input.spoolId))) throw notFound("That spool");
      const spool = (await getSpool(me.teamId, input.spoolId, tx))!;
      if (spool.state === "used_up") throw conflict("That spool is used up; pick another.");
      if (spool.gauge !== before.gauge || spool.colour !== before.colour) {
        throw invalid(
          `spoolId: that spool holds ${spool.gauge} ${spool.colour}, but ${before.wireId} is ${before.gauge} ${before.colour}.`,
        );
      }
      const cutMm = runCutLengthMm(before, settingsOf(project));
      taken = Math.min(cutMm, spool.lengthMm);
      const plan = await planOfSpool(tx, project.id, spool.id);
      await adjustSpoolLength(
        me.teamId,
        me.user.id,
        spool.id,
        {
          lengthMm: spool.lengthMm - taken,
          reason: `cut ${before.wireId}${plan ? ` (plan ${plan.id.slice(0, 8)})` : ""}`,
        },
        tx,
      );
      detail.spool = { id: spool.id, lot: spool.lot, location: spool.location, takenMm: taken };
    }
    await setRunCut(tx, before.id, { spoolId: input.spoolId ?? null, userId: me.user.id, takenMm: taken });
  } else if (after.state === "planned" && before.state !== "planned") {
    const cut = await getRunCut(me.teamId, before.id, tx);
    if (cut?.cutBy && cut.cutBy !== me.user.id && me.role !== "lead") {
      throw forbidden("Only the builder who cut this run, or a lead, may undo the cut.");
    }
    if (cut?.cutFromSpoolId && cut.cutTakenMm && (await lockSpoolRow(tx, me.teamId, cut.cutFromSpoolId))) {
      const spool = await getSpool(me.teamId, cut.cutFromSpoolId, tx);
      if (spool) {
        await adjustSpoolLength(
          me.teamId,
          me.user.id,
          spool.id,
          { lengthMm: spool.lengthMm + cut.cutTakenMm, reason: `undo cut ${before.wireId}` },
          tx,
        );
        detail.restoredSpool = { id: spool.id, lot: spool.lot, restoredMm: cut.cutTakenMm };
      }
    }
    await setRunCut(tx, before.id, null);
  }
  if (input.actionId) {
    await insertBenchAction(tx, me.teamId, me.user.id, {
      actionId: input.actionId,
      runId: after.id,
      toState: after.state,
      resultVersion: after.version,
    });
  }
  return detail;
}

export interface TraceCutView {
  spoolId: string | null;
  lot: string | null;
  location: string | null;
  cutByName: string | null;
  cutAt: string | null;
  takenMm: number | null;
}

/** "Cut from spool lot X, location Y by Z at T" for the trace page; null when the run has not been cut. */
export async function traceCut(teamId: string, runId: string): Promise<TraceCutView | null> {
  const c = await getRunCut(teamId, runId);
  if (!c || !c.cutAt) return null;
  return {
    spoolId: c.cutFromSpoolId,
    lot: c.spoolLot,
    location: c.spoolLocation,
    cutByName: c.cutByName,
    cutAt: c.cutAt,
    takenMm: c.cutTakenMm,
  };
}

function planSpool(plan: PlanRecord, wireTypeId: string, index: number) {
  const wt = plan.result.wireTypes.find((w) => w.wireTypeId === wireTypeId);
  const sp = wt?.spools.find((s) => s.index === index);
  if (!wt || !sp) throw notFound("That spool of the plan");
  return { wt, sp };
}

/**
 * Opens a new put-up of a committed plan at the bench: creates its shelf spool (open, at the nominal length, with
 * the lot and location the builder reads off it) and remembers it for that plan spool. Opening it again answers
 * the spool already opened.
 */
export async function openPlanSpool(
  me: TeamMe,
  planId: string,
  index: number,
  input: PlanSpoolOpenInput,
): Promise<{ created: boolean; spool: SpoolListItem }> {
  const plan = await requirePlan(me.teamId, planId);
  await requireProject(me.teamId, plan.projectId);
  const { wt, sp } = planSpool(plan, input.wireTypeId, index);
  if (plan.status !== "committed") throw conflict("Commit this plan before opening its new spools.");
  if (sp.source.kind !== "putup") throw invalid("That spool is already on the shelf; it needs no opening.");
  const source = sp.source;
  return db().transaction(async (tx) => {
    await getPlan(me.teamId, planId, { forUpdate: tx });
    const existing = (await listPlanSpoolOpens(planId, tx)).find(
      (o) => o.wireTypeId === wt.wireTypeId && o.spoolIndex === index,
    );
    if (existing) return { created: false, spool: (await getSpool(me.teamId, existing.spoolId, tx))! };
    const spool = await createSpool(
      me.teamId,
      me.user.id,
      {
        wireTypeId: wt.wireTypeId,
        lengthMm: source.nominalMm,
        initialLengthMm: source.nominalMm,
        lot: input.lot,
        location: input.location,
        state: "open",
        sourcePutUpId: source.putUpId,
        originNote: `Opened at the bench for plan ${planId.slice(0, 8)} (${plan.result.projectName}), spool ${index} of ${wt.label}`,
      },
      tx,
    );
    await insertPlanSpoolOpen(
      tx,
      { planId, wireTypeId: wt.wireTypeId, spoolIndex: index, spoolId: spool.id },
      me.user.id,
    );
    return { created: true, spool };
  });
}

export interface BenchCutView extends PlanCutView {
  markerCount: number;
}

export interface BenchSpoolView {
  index: number;
  source: PlanSpoolSource;
  usableMm: number;
  leftoverMm: number;
  keep: boolean;
  cuts: BenchCutView[];
  /** The shelf record cut from: the plan's shelf spool, or the one opened for a new put-up (null until then). */
  stock: BenchSpoolStock | null;
}

export interface BenchWireTypeView {
  wireTypeId: string;
  label: string;
  gauge: string;
  colour: string;
  insulation: string | null;
  spools: BenchSpoolView[];
}

export interface BenchRunState {
  id: string;
  wireId: string;
  traceCode: string;
  state: BenchState;
  version: number;
  cutLengthMm: number;
  cutFromSpoolId: string | null;
  cutBy: string | null;
}

export interface BenchView {
  planId: string;
  status: PlanRecord["status"];
  createdAt: string;
  committedAt: string | null;
  projectId: string;
  projectName: string;
  wireTypes: BenchWireTypeView[];
  /** The plan's runs as they are now (state, version), by run id; runs deleted since the plan are absent. */
  runs: Record<string, BenchRunState>;
}

export async function benchView(me: TeamMe, planId: string): Promise<BenchView> {
  const plan = await requirePlan(me.teamId, planId);
  const project = await requireProject(me.teamId, plan.projectId);
  const settings = settingsOf(project);
  const [opens, runs, cuts] = await Promise.all([
    listPlanSpoolOpens(planId),
    listAllRuns(me.teamId, project.id),
    listRunCuts(me.teamId, project.id),
  ]);
  const opened = new Map(opens.map((o) => [`${o.wireTypeId}:${o.spoolIndex}`, o.spoolId]));
  const shelfIds = plan.result.wireTypes.flatMap((w) =>
    w.spools.flatMap((s) => (s.source.kind === "shelf" ? [s.source.spoolId] : [])),
  );
  const stock = new Map(
    (await spoolsByIds(me.teamId, [...shelfIds, ...opens.map((o) => o.spoolId)])).map((s) => [s.id, s]),
  );
  const byId = new Map(runs.map((r) => [r.id, r]));
  const inPlan = new Set<string>();
  const wireTypes: BenchWireTypeView[] = plan.result.wireTypes.map((w) => ({
    wireTypeId: w.wireTypeId,
    label: w.label,
    gauge: w.gauge,
    colour: w.colour,
    insulation: w.insulation,
    spools: w.spools.map((s) => {
      const stockId =
        s.source.kind === "shelf" ? s.source.spoolId : (opened.get(`${w.wireTypeId}:${s.index}`) ?? null);
      return {
        index: s.index,
        source: s.source,
        usableMm: s.usableMm,
        leftoverMm: s.leftoverMm,
        keep: s.keep,
        stock: stockId ? (stock.get(stockId) ?? null) : null,
        cuts: s.cuts.map((c) => {
          inPlan.add(c.runId);
          return { ...c, markerCount: 2 + repeatMarkerCount(c.routedLengthMm, project.markerRepeatMm) };
        }),
      };
    }),
  }));
  const runStates: Record<string, BenchRunState> = {};
  for (const id of inPlan) {
    const r = byId.get(id);
    if (!r) continue;
    const c = cuts.get(id);
    runStates[id] = {
      id,
      wireId: r.wireId,
      traceCode: r.traceCode,
      state: r.state,
      version: r.version,
      cutLengthMm: runCutLengthMm(r, settings),
      cutFromSpoolId: c?.cutFromSpoolId ?? null,
      cutBy: c?.cutBy ?? null,
    };
  }
  return {
    planId: plan.id,
    status: plan.status,
    createdAt: plan.createdAt,
    committedAt: plan.committedAt,
    projectId: project.id,
    projectName: project.name,
    wireTypes,
    runs: runStates,
  };
}
