// The spool planner: per wire type, first-fit/best-fit decreasing as the incumbent, an exact purchase search
// for small jobs, then column generation with rounding, diving, reduced-cost enumeration and restricted-master
// MIPs; returns the best plan found with the lower bound it proved.

import { Master, dive, getHighs } from "@/lib/domain/spool-plan/column-generation";
import { greedyPack } from "@/lib/domain/spool-plan/ffd";
import { maxFills, martelloTothL2, minCostCover } from "@/lib/domain/spool-plan/lower-bounds";
import { purchaseSearch } from "@/lib/domain/spool-plan/purchase-search";
import {
  ceilBound,
  costBoundCents,
  makeObjective,
  weightOf,
  type Objective,
} from "@/lib/domain/spool-plan/objective";
import {
  buildProblems,
  compareKeys,
  evaluate,
  materialize,
  validateInput,
  type SolutionKey,
  type WireProblem,
  type WireSolution,
} from "@/lib/domain/spool-plan/problem";
import {
  DEFAULT_PLAN_OPTIONS,
  type PlanCut,
  type PlanOptions,
  type PlanResult,
  type PlanStock,
  type PlannedSpool,
  type Purchase,
  type UnplacedCut,
  type WireTypeSummary,
} from "@/lib/domain/spool-plan/types";

export * from "@/lib/domain/spool-plan/types";
export { bestFitDecreasing, firstFitDecreasing } from "@/lib/domain/spool-plan/ffd";
export { l1Bound, martelloTothL2, minCostCover } from "@/lib/domain/spool-plan/lower-bounds";

/** MIP node budget per restricted-master solve (the time limit still applies). */
const MIP_NODE_LIMIT = 20_000;
/** Most columns the reduced-cost enumeration may produce before it is skipped. */
const ENUMERATION_LIMIT = 20_000;

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

interface PreBounds {
  /** Most cut length one spool of each type can hold (mm). */
  fillsMm: number[];
  coverCents: number;
  l2Cents: number | null;
  /** Fewest spools of any plan. */
  spools: number;
  /** Bound on the weight of any plan (see objective.ts). */
  weight: number;
}

/** Weight bound implied by a cost bound and the fewest-spools bound. */
function weightFromCost(obj: Objective, costCents: number, spools: number): number {
  if (obj.uniform) return obj.uniformCost > 0 ? Math.max(costCents / obj.uniformCost, spools) : spools;
  return obj.costScale * (costCents / obj.costUnit) + spools;
}

/** Bounds that need no LP: the cover bound (cost and spool count) and, with one stock length, L2. */
function preBounds(p: WireProblem, obj: Objective): PreBounds {
  const unit = p.items.reduce((g, it) => gcd(g, it.lengthMm), 0) || 1;
  const lengths = p.items.map((it) => it.lengthMm / unit);
  const demands = p.items.map((it) => it.demand);
  const fills = maxFills(
    lengths,
    demands,
    p.types.map((t) => Math.floor(t.usableMm / unit)),
  );
  const fillsMm = fills.map((f) => f * unit);
  let totalMm = 0;
  p.items.forEach((it) => (totalMm += it.lengthMm * it.demand));
  const cover = coverCents(p, fillsMm, totalMm);
  const spools = minCostCover(
    p.types.map((t, k) => ({ fill: fillsMm[k]!, cost: 1, available: t.available })),
    totalMm,
  );
  let l2: number | null = null;
  const only = p.types[0];
  if (p.types.length === 1 && only && only.available === null) {
    const all: number[] = [];
    p.items.forEach((it) => {
      for (let c = 0; c < it.demand; c++) all.push(it.lengthMm);
    });
    l2 = martelloTothL2(all, only.usableMm);
  }
  const spoolLb = Math.max(Number.isFinite(spools) ? spools : 0, l2 ?? 0);
  const coverC = Number.isFinite(cover) ? cover : 0;
  return {
    fillsMm,
    coverCents: coverC,
    l2Cents: l2 === null || !only ? null : l2 * only.costCents,
    spools: spoolLb,
    weight: weightFromCost(obj, coverC, spoolLb),
  };
}

function coverCents(p: WireProblem, fillsMm: number[], lengthMm: number): number {
  return minCostCover(
    p.types.map((t, k) => ({ fill: fillsMm[k]!, cost: t.costCents, available: t.available })),
    lengthMm,
  );
}

/**
 * With one stock length C, a plan of S spools wastes S·C − Σ lengths in total, so a plan of weight ≤ target
 * has no pattern wasting more than that. Infinity otherwise.
 */
function wasteBudgetMm(p: WireProblem, obj: Objective, targetWeight: number): number {
  const only = p.types[0];
  if (p.types.length !== 1 || !only || !obj.uniform) return Infinity;
  let totalMm = 0;
  for (const it of p.items) totalMm += it.lengthMm * it.demand;
  return Math.max(0, targetWeight * only.usableMm - totalMm);
}

interface WireOutcome {
  problem: WireProblem;
  solution: WireSolution;
  key: SolutionKey;
  ffdKey: SolutionKey;
  lowerBoundCents: number;
  bounds: WireTypeSummary["bounds"];
  provenOptimal: boolean;
  columns: number;
  cgIterations: number;
  elapsedMs: number;
}

async function planWireType(p: WireProblem, deadline: number): Promise<WireOutcome> {
  const start = performance.now();
  const obj = makeObjective(p);
  const ffd = greedyPack(p, "first");
  const bfd = greedyPack(p, "best");
  const ffdKey = evaluate(p, ffd);
  let best = ffd;
  let bestKey = ffdKey;
  const consider = (s: WireSolution | null): void => {
    if (!s) return;
    const k = evaluate(p, s);
    if (compareKeys(k, bestKey) < 0) {
      best = s;
      bestKey = k;
    }
  };
  consider(bfd);
  const pre = preBounds(p, obj);
  let weightLb = pre.weight;
  let cgWeightLb: number | null = null;
  let exactProven = false;
  let columns = 0;
  let cgIterations = 0;
  let searchCents: number | null = null;
  let searchComplete = false;
  const gapOpen = (): boolean =>
    !searchComplete && !exactProven && weightOf(obj, bestKey) > ceilBound(weightLb);

  if (p.items.length > 0 && bestKey.unplacedMm === 0 && gapOpen() && performance.now() < deadline) {
    const highs = await getHighs();
    const t = performance.now();
    const found = purchaseSearch(
      highs,
      p,
      pre.fillsMm,
      bestKey.costCents,
      bestKey.spoolCount,
      t + 0.85 * (deadline - t),
    );
    if (found) {
      consider(found.solution);
      searchCents = found.boundCents;
      searchComplete = found.complete;
      weightLb = Math.max(weightLb, weightFromCost(obj, found.boundCents, pre.spools));
    }
  }

  if (p.items.length > 0 && gapOpen() && performance.now() < deadline) {
    const highs = await getHighs();
    const master = new Master(highs, p, obj, bestKey.unplacedMm > 0);
    try {
      master.addBins(ffd.bins);
      master.addBins(bfd.bins);
      const t0 = performance.now();
      const root = master.generate(t0 + 0.5 * (deadline - t0), weightOf(obj, bestKey), false);
      if (root.lp) {
        cgWeightLb = root.lowerBound;
        weightLb = Math.max(weightLb, root.lowerBound);
        consider(master.toSolution(root.lp.x, "down", "cg-round"));
      }
      // Diving grows the column pool; "exact" enumerates every column a better plan could use; the MIP
      // works over the pool. Each step gets a share of the time left.
      const phases = ["dive", "exact", "mip", "dive", "exact", "mip"] as const;
      const shares = [0.3, 0.6, 0.5, 0.4, 0.7, 1];
      let exactTriedAt = Infinity;
      for (let i = 0; i < phases.length && gapOpen() && performance.now() < deadline; i++) {
        const now = performance.now();
        const until = now + (deadline - now) * shares[i]!;
        const phase = phases[i]!;
        // The enumeration only changes when the incumbent (and so the target) does.
        if (phase === "exact" && weightOf(obj, bestKey) >= exactTriedAt) continue;
        if (phase === "dive") {
          consider(dive(master, until, weightOf(obj, bestKey) - 1));
        } else if (phase === "mip") {
          const r = master.solveMip(until, master.countsOf(best), MIP_NODE_LIMIT);
          if (r.x) consider(master.toSolution(r.x, "nearest", "cg-mip"));
        } else {
          const cg = master.generate(now + (until - now) * 0.5, Infinity, true);
          if (!cg.lp) continue;
          cgWeightLb = Math.max(cgWeightLb ?? -Infinity, cg.lowerBound);
          weightLb = Math.max(weightLb, cg.lowerBound);
          if (!gapOpen()) break;
          // A plan of weight ≤ target uses only columns of reduced cost ≤ target − (these duals' bound).
          exactTriedAt = weightOf(obj, bestKey);
          const target = exactTriedAt - 1;
          const threshold = target - cg.lpBound + 1e-7 * Math.max(1, Math.abs(cg.lpBound));
          if (!Number.isFinite(threshold) || threshold < 0) continue;
          const budget = wasteBudgetMm(p, obj, target);
          const pats = master.enumerate(cg.lp, threshold, ENUMERATION_LIMIT, budget);
          if (!pats) continue;
          // The incumbent's columns join them so the MIP starts from it (a superset keeps the proof valid).
          const start = master.countsOf(best);
          const allowed = new Set([
            ...master.addPatterns(pats),
            ...master.artificialWithin(cg.lp, threshold),
            ...[...start.keys()].filter((j) => start[j]! > 0),
          ]);
          // A dive over these columns alone (LP only) often finds the plan fast; the MIP then proves.
          const t = performance.now();
          consider(dive(master, t + (until - t) * 0.4, target, 2000, 3, allowed));
          if (!gapOpen()) break;
          const r = master.solveMip(until, master.countsOf(best), MIP_NODE_LIMIT, allowed);
          if (r.x) consider(master.toSolution(r.x, "nearest", "cg-exact"));
          if (r.proven) {
            // Every better plan was inside the enumerated columns, and the MIP proved there is none left.
            exactProven = true;
            cgWeightLb = Math.max(cgWeightLb, weightOf(obj, bestKey));
          }
        }
      }
      columns = master.columns.length;
      cgIterations = master.iterations;
    } finally {
      master.dispose();
    }
  }

  // Bounds for plans that leave as much unplaced as this one (all of them when nothing is unplaced).
  let totalMm = 0;
  p.items.forEach((it) => (totalMm += it.lengthMm * it.demand));
  const placedOnly = bestKey.unplacedMm > 0;
  const cover = placedOnly ? coverCents(p, pre.fillsMm, totalMm - bestKey.unplacedMm) : pre.coverCents;
  const bounds: WireTypeSummary["bounds"] = {
    lpCents: cgWeightLb === null ? null : costBoundCents(obj, cgWeightLb, bestKey.unplacedMm),
    coverCents: Number.isFinite(cover) ? cover : 0,
    l2Cents: placedOnly ? null : pre.l2Cents,
    searchCents: placedOnly ? null : searchCents,
  };
  const lowerBoundCents = Math.max(
    bounds.lpCents ?? 0,
    bounds.coverCents,
    bounds.l2Cents ?? 0,
    bounds.searchCents ?? 0,
  );
  return {
    problem: p,
    solution: best,
    key: bestKey,
    ffdKey,
    lowerBoundCents,
    bounds,
    provenOptimal: !gapOpen(),
    columns,
    cgIterations,
    elapsedMs: performance.now() - start,
  };
}

function gapPct(cost: number, bound: number): number | null {
  if (cost === bound) return 0;
  if (bound <= 0) return null;
  return Math.round(((cost - bound) / bound) * 100 * 1000) / 1000;
}

/**
 * Plans every cut onto spools, each wire type on its own: shelf spools (cost 0, measured length all usable)
 * and put-ups (nominal − endDiscardMm usable, bought at costCents). Minimises, in order: length left
 * unplaced (only when limited stock runs out), purchase cost, spools opened, scrap. Never returns a plan
 * worse than first-fit decreasing. Deterministic for the same input unless the time limit cuts a step short.
 */
export async function planSpools(
  cuts: readonly PlanCut[],
  stock: readonly PlanStock[],
  options: Partial<PlanOptions> = {},
): Promise<PlanResult> {
  const t0 = performance.now();
  const opts: PlanOptions = { ...DEFAULT_PLAN_OPTIONS, ...options };
  validateInput(cuts, stock, opts);
  const problems = buildProblems(cuts, stock, opts);
  const deadline = t0 + opts.timeLimitMs;
  // Start compiling the solver now; it finishes in the background while the greedy plans are built.
  void getHighs();
  let cutsLeft = problems.reduce((s, p) => s + p.cutCount - p.rejected.length, 0);
  const outcomes: WireOutcome[] = [];
  for (const p of problems) {
    const n = p.cutCount - p.rejected.length;
    // Time is shared by cut count; a wire type that finishes early leaves its time to the rest.
    const now = performance.now();
    const share = cutsLeft > 0 ? ((deadline - now) * n) / cutsLeft : 0;
    outcomes.push(await planWireType(p, now + Math.max(0, share)));
    cutsLeft -= n;
  }

  const spools: PlannedSpool[] = [];
  const unplaced: UnplacedCut[] = [];
  const perWireType: WireTypeSummary[] = [];
  const methods: string[] = [];
  let costCents = 0;
  let lowerBoundCents = 0;
  for (const o of outcomes) {
    const m = materialize(o.problem, o.solution);
    spools.push(...m.spools);
    unplaced.push(...o.problem.rejected, ...m.unplaced);
    costCents += o.key.costCents;
    lowerBoundCents += o.lowerBoundCents;
    if (!methods.includes(o.solution.method)) methods.push(o.solution.method);
    perWireType.push({
      wireType: o.problem.wireType,
      cutCount: o.problem.cutCount,
      placedCount: m.spools.reduce((s, sp) => s + sp.cutIds.length, 0),
      spoolCount: o.key.spoolCount,
      costCents: o.key.costCents,
      lowerBoundCents: o.lowerBoundCents,
      gapPct: gapPct(o.key.costCents, o.lowerBoundCents),
      scrapMm: o.key.scrapMm,
      keptRemnantMm: m.spools.reduce((s, sp) => s + (sp.keep ? sp.leftoverMm : 0), 0),
      unplacedMm: o.key.unplacedMm,
      bounds: o.bounds,
      ffd: {
        costCents: o.ffdKey.costCents,
        spoolCount: o.ffdKey.spoolCount,
        scrapMm: o.ffdKey.scrapMm,
        unplacedMm: o.ffdKey.unplacedMm,
      },
      method: o.solution.method,
      provenOptimal: o.provenOptimal,
      columns: o.columns,
      cgIterations: o.cgIterations,
      elapsedMs: Math.round(o.elapsedMs),
    });
  }
  const purchases = new Map<string, Purchase>();
  for (const s of spools) {
    if (s.kind !== "putup") continue;
    const p = purchases.get(s.stockId);
    if (p) {
      p.count++;
      p.costCents += s.costCents;
    } else
      purchases.set(s.stockId, {
        stockId: s.stockId,
        wireType: s.wireType,
        count: 1,
        costCents: s.costCents,
      });
  }
  return {
    spools,
    unplaced,
    costCents,
    spoolCount: spools.length,
    scrapMm: spools.reduce((s, sp) => s + (sp.keep ? 0 : sp.leftoverMm), 0),
    keptRemnantMm: spools.reduce((s, sp) => s + (sp.keep ? sp.leftoverMm : 0), 0),
    lowerBoundCents,
    gapPct: gapPct(costCents, lowerBoundCents),
    purchases: [...purchases.values()],
    perWireType,
    method: methods.join("+") || "none",
    elapsedMs: Math.round(performance.now() - t0),
  };
}
