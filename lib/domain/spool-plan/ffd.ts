// First-fit and best-fit decreasing: the baseline plans, the incumbent the optimiser starts from, and the
// residual repair after rounding. Also the clean-up pass every plan goes through (drop empty, buy cheaper).

import {
  binUsedMm,
  buildProblems,
  evaluate,
  materialize,
  validateInput,
  type Bin,
  type WireProblem,
  type WireSolution,
} from "@/lib/domain/spool-plan/problem";
import {
  DEFAULT_PLAN_OPTIONS,
  type HeuristicPlan,
  type PlanCut,
  type PlanOptions,
  type PlanStock,
  type PlannedSpool,
  type UnplacedCut,
} from "@/lib/domain/spool-plan/types";

export type FitRule = "first" | "best";

/**
 * Picks the stock type for a new spool that must hold a cut of `lengthMm`: a shelf spool if one fits (the
 * shortest that fits, so long remnants stay for long cuts), else the put-up with the lowest price per mm of
 * the wire it will really use, min(usable, length still to place); ties go to the shorter put-up.
 */
function chooseNewType(p: WireProblem, uses: number[], lengthMm: number, remainingMm: number): number {
  let best = -1;
  let bestShelf = false;
  let bestScore = Infinity;
  for (let k = 0; k < p.types.length; k++) {
    const t = p.types[k]!;
    if (t.usableMm < lengthMm) continue;
    if (t.available !== null && uses[k]! >= t.available) continue;
    const shelf = t.kind === "shelf";
    const score = shelf ? t.usableMm : t.costCents / Math.min(t.usableMm, remainingMm);
    if (best < 0 || (shelf && !bestShelf)) {
      best = k;
      bestShelf = shelf;
      bestScore = score;
      continue;
    }
    if (shelf !== bestShelf) continue;
    const prev = p.types[best]!;
    if (score < bestScore - 1e-12 || (Math.abs(score - bestScore) <= 1e-12 && t.usableMm < prev.usableMm)) {
      best = k;
      bestScore = score;
    }
  }
  return best;
}

/**
 * Packs `demand[i]` cuts of each item, longest first, into the open bins (`start`, kept) or new spools.
 * Cuts that fit no spool left are counted as unplaced.
 */
export function greedyPack(
  p: WireProblem,
  rule: FitRule,
  demand: readonly number[] = p.items.map((it) => it.demand),
  start: readonly Bin[] = [],
  method = rule === "first" ? "ffd" : "bfd",
): WireSolution {
  const bins: Bin[] = start.map((b) => ({ type: b.type, items: [...b.items] }));
  const free: number[] = bins.map((b) => p.types[b.type]!.usableMm - binUsedMm(p, b));
  const uses = p.types.map(() => 0);
  for (const b of bins) uses[b.type]!++;
  const unplaced = p.items.map(() => 0);
  let remainingMm = 0;
  p.items.forEach((it, i) => (remainingMm += it.lengthMm * (demand[i] ?? 0)));
  for (let i = 0; i < p.items.length; i++) {
    const len = p.items[i]!.lengthMm;
    for (let c = 0; c < (demand[i] ?? 0); c++) {
      let target = -1;
      if (rule === "first") {
        for (let b = 0; b < bins.length; b++) {
          if (free[b]! >= len) {
            target = b;
            break;
          }
        }
      } else {
        let bestFree = Infinity;
        for (let b = 0; b < bins.length; b++) {
          const f = free[b]!;
          if (f >= len && f < bestFree) {
            bestFree = f;
            target = b;
          }
        }
      }
      if (target < 0) {
        const k = chooseNewType(p, uses, len, remainingMm);
        if (k >= 0) {
          uses[k]!++;
          bins.push({ type: k, items: [] });
          free.push(p.types[k]!.usableMm);
          target = bins.length - 1;
        }
      }
      remainingMm -= len;
      if (target < 0) {
        unplaced[i]!++;
        continue;
      }
      bins[target]!.items.push(i);
      free[target]! -= len;
    }
  }
  return refine(p, { bins, unplaced, method });
}

/**
 * Clean-up applied to every candidate plan: drops empty bins and moves each spool to the cheapest stock type
 * that still holds its cuts (most expensive spools first), e.g. a 100 ft put-up half used becomes a 50 ft one.
 */
export function refine(p: WireProblem, s: WireSolution): WireSolution {
  const bins = s.bins.filter((b) => b.items.length > 0).map((b) => ({ type: b.type, items: [...b.items] }));
  const uses = p.types.map(() => 0);
  for (const b of bins) uses[b.type]!++;
  const order = bins
    .map((b, j) => ({ j, cost: p.types[b.type]!.costCents, used: binUsedMm(p, b) }))
    .sort((a, b) => b.cost - a.cost || b.used - a.used || a.j - b.j);
  for (const { j, used } of order) {
    const bin = bins[j]!;
    const cur = p.types[bin.type]!;
    let best = -1;
    for (let k = 0; k < p.types.length; k++) {
      const t = p.types[k]!;
      if (k === bin.type || t.usableMm < used || t.costCents >= cur.costCents) continue;
      if (t.available !== null && uses[k]! >= t.available) continue;
      const bt = best < 0 ? null : p.types[best]!;
      if (!bt || t.costCents < bt.costCents || (t.costCents === bt.costCents && t.usableMm < bt.usableMm))
        best = k;
    }
    if (best >= 0) {
      uses[bin.type]!--;
      uses[best]!++;
      bin.type = best;
    }
  }
  return { bins, unplaced: [...s.unplaced], method: s.method };
}

function heuristicPlan(
  rule: FitRule,
  cuts: readonly PlanCut[],
  stock: readonly PlanStock[],
  options: Partial<PlanOptions>,
): HeuristicPlan {
  const opts = { ...DEFAULT_PLAN_OPTIONS, ...options };
  validateInput(cuts, stock, opts);
  const spools: PlannedSpool[] = [];
  const unplaced: UnplacedCut[] = [];
  let costCents = 0;
  let scrapMm = 0;
  for (const p of buildProblems(cuts, stock, opts)) {
    const sol = greedyPack(p, rule);
    const m = materialize(p, sol);
    const key = evaluate(p, sol);
    spools.push(...m.spools);
    unplaced.push(...p.rejected, ...m.unplaced);
    costCents += key.costCents;
    scrapMm += key.scrapMm;
  }
  return { spools, unplaced, costCents, spoolCount: spools.length, scrapMm };
}

/**
 * First-fit decreasing per wire type: cuts longest first, each into the first open spool it fits, else a new
 * spool (shelf first, then the put-up with the lowest price per mm used); then each spool is moved to the
 * cheapest stock that holds its cuts. With one stock length this is classic FFD (Johnson 1973).
 */
export function firstFitDecreasing(
  cuts: readonly PlanCut[],
  stock: readonly PlanStock[],
  options: Partial<PlanOptions> = {},
): HeuristicPlan {
  return heuristicPlan("first", cuts, stock, options);
}

/** Best-fit decreasing: as firstFitDecreasing, but each cut goes into the open spool it leaves the least room on. */
export function bestFitDecreasing(
  cuts: readonly PlanCut[],
  stock: readonly PlanStock[],
  options: Partial<PlanOptions> = {},
): HeuristicPlan {
  return heuristicPlan("best", cuts, stock, options);
}
