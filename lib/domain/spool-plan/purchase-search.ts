// Exact search over what to buy, for wire types that need few spools: every purchase (multiset of put-ups)
// cheaper than the incumbent, cheapest first, is checked by an exact bin-completion search (then a small
// assignment MIP in HiGHS if that runs out of nodes). The first feasible purchase is the cheapest plan; the
// first undecided one bounds the cost from below.

import type { Highs } from "highs";
import { refine } from "@/lib/domain/spool-plan/ffd";
import type { Bin, WireProblem, WireSolution } from "@/lib/domain/spool-plan/problem";

export interface SearchLimits {
  /** Give up (no bound from the search) when more purchases than this are cheaper than the incumbent. */
  maxPurchases: number;
  /** Largest check tried: spools (shelf + bought), and integer variables of the MIP. */
  maxBins: number;
  maxVariables: number;
  /** Time for one feasibility MIP. */
  mipTimeMs: number;
  /** Nodes of the exact bin-completion search tried before the MIP. */
  dfsNodes: number;
}

export const DEFAULT_SEARCH_LIMITS: SearchLimits = {
  maxPurchases: 400,
  maxBins: 16,
  maxVariables: 2500,
  mipTimeMs: 400,
  dfsNodes: 50_000,
};

export interface SearchOutcome {
  /** The cheapest feasible plan found (null: none cheaper than the incumbent, or undecided). */
  solution: WireSolution | null;
  /** Proven lower bound on the purchase cost (cents). */
  boundCents: number;
  /** True when every purchase cheaper than the result was proven infeasible, and equal-cost purchases with
   *  fewer spools too: the result is optimal for cost, then spools. */
  complete: boolean;
  purchasesChecked: number;
}

interface Purchase {
  counts: number[];
  costCents: number;
  spools: number;
}

type Check =
  | { status: "feasible"; bins: Bin[]; spools: number; optimal: boolean }
  | { status: "infeasible" }
  | { status: "unknown" };

/**
 * Runs the search; returns null when it does not apply (too many candidate purchases). `fillsMm[k]` is the
 * most cut length a spool of type k can hold, used to skip purchases that cannot cover the total length.
 */
export function purchaseSearch(
  highs: Highs,
  p: WireProblem,
  fillsMm: readonly number[],
  incumbentCostCents: number,
  incumbentSpools: number,
  deadline: number,
  limits: SearchLimits = DEFAULT_SEARCH_LIMITS,
): SearchOutcome | null {
  let totalMm = 0;
  let cuts = 0;
  for (const it of p.items) {
    totalMm += it.lengthMm * it.demand;
    cuts += it.demand;
  }
  const putups: number[] = [];
  let shelfFillMm = 0;
  p.types.forEach((t, k) => {
    if (t.kind === "putup") putups.push(k);
    else shelfFillMm += fillsMm[k]! * (t.available ?? 1);
  });
  putups.sort((a, b) => p.types[b]!.costCents - p.types[a]!.costCents || a - b);

  // Enumerate purchases cheaper than the incumbent (or as cheap with fewer spools) that cover the length.
  const found: Purchase[] = [];
  const counts = p.types.map(() => 0);
  let overflow = false;
  let visits = 0;
  const walk = (j: number, cost: number, fill: number, spools: number): void => {
    if (overflow) return;
    if (++visits > 50 * limits.maxPurchases * (putups.length + 1)) {
      overflow = true;
      return;
    }
    if (j === putups.length) {
      if (fill + shelfFillMm >= totalMm && (cost < incumbentCostCents || spools < incumbentSpools)) {
        found.push({ counts: [...counts], costCents: cost, spools });
        if (found.length > limits.maxPurchases) overflow = true;
      }
      return;
    }
    const k = putups[j]!;
    const t = p.types[k]!;
    const most = Math.min(t.available ?? cuts, cuts - spools);
    for (let c = 0; c <= most; c++) {
      const costC = cost + c * t.costCents;
      if (costC > incumbentCostCents) break;
      counts[k] = c;
      walk(j + 1, costC, fill + c * fillsMm[k]!, spools + c);
      counts[k] = 0;
      if (overflow) return;
      if (t.costCents === 0 && c > 0 && fill + c * fillsMm[k]! + shelfFillMm >= totalMm) break;
    }
  };
  walk(0, 0, 0, 0);
  if (overflow) return null;
  found.sort((a, b) => a.costCents - b.costCents || a.spools - b.spools);

  let best: { bins: Bin[]; costCents: number; spools: number } | null = null;
  let checked = 0;
  let spoolsProven = true;
  for (const buy of found) {
    if (best && (buy.costCents > best.costCents || buy.spools >= best.spools)) continue;
    if (!best && buy.costCents >= incumbentCostCents && buy.spools >= incumbentSpools) continue;
    const check = performance.now() < deadline ? feasibility(highs, p, buy.counts, deadline, limits) : null;
    checked++;
    if (!check || check.status === "unknown") {
      // Undecided: every cheaper purchase is infeasible, so this one's cost bounds the optimum.
      const boundCents = best ? best.costCents : buy.costCents;
      return {
        solution: best ? toSolution(p, best.bins) : null,
        boundCents,
        complete: false,
        purchasesChecked: checked,
      };
    }
    if (check.status === "feasible") {
      const spools = check.spools;
      if (!check.optimal) spoolsProven = false;
      if (!best || buy.costCents < best.costCents || spools < best.spools)
        best = { bins: check.bins, costCents: buy.costCents, spools };
    }
  }
  if (best) {
    const solution = toSolution(p, best.bins);
    return { solution, boundCents: best.costCents, complete: spoolsProven, purchasesChecked: checked };
  }
  return { solution: null, boundCents: incumbentCostCents, complete: true, purchasesChecked: checked };
}

function toSolution(p: WireProblem, bins: Bin[]): WireSolution {
  return refine(p, { bins, unplaced: p.items.map(() => 0), method: "purchase-search" });
}

/** The spools a purchase gives: the purchase's put-ups (longest first), then every shelf spool (longest first). */
function purchaseBins(
  p: WireProblem,
  buy: readonly number[],
): { type: number; cap: number; shelf: boolean }[] {
  const bins: { type: number; cap: number; shelf: boolean }[] = [];
  p.types.forEach((t, k) => {
    const n = t.kind === "shelf" ? (t.available ?? 1) : buy[k]!;
    for (let c = 0; c < n; c++) bins.push({ type: k, cap: t.usableMm, shelf: t.kind === "shelf" });
  });
  return bins.sort((a, b) => Number(a.shelf) - Number(b.shelf) || b.cap - a.cap || a.type - b.type);
}

/**
 * Exact bin-completion search: fills the spools one at a time (in the given order) with a multiset of the
 * remaining cuts. Everything the plan does not cut is room left on some spool, so the total room left is
 * fixed (Σ capacities − Σ cuts): each spool's choice may leave at most what is still unspent, which prunes
 * hard when the purchase is tight. Fuller fillings are tried first; a spool may stay empty. Returns the cut
 * counts per spool, "infeasible" when proven, or null when the node budget runs out.
 */
export function packExactly(
  lengths: readonly number[],
  demand: readonly number[],
  caps: readonly number[],
  nodeLimit: number,
): number[][] | "infeasible" | null {
  const m = lengths.length;
  const B = caps.length;
  let total = 0;
  lengths.forEach((l, i) => (total += l * demand[i]!));
  let room = 0;
  for (const c of caps) room += c;
  if (room < total) return "infeasible";
  const r = [...demand];
  const out: number[][] = caps.map(() => lengths.map(() => 0));
  let nodes = 0;
  let aborted = false;

  const fillBin = (b: number, spare: number): boolean => {
    if (r.every((x) => x === 0)) return true;
    if (b === B) return false;
    const cap = caps[b]!;
    const a = out[b]!;
    // Length still to cut from items i.. (for the "can this still fill the spool" bound).
    const rest = new Array<number>(m + 1).fill(0);
    for (let i = m - 1; i >= 0; i--) rest[i] = rest[i + 1]! + lengths[i]! * r[i]!;
    const choose = (i: number, left: number): boolean => {
      if (++nodes > nodeLimit) {
        aborted = true;
        return false;
      }
      if (left - Math.min(rest[i]!, left) > spare) return false; // cannot get within the spare
      if (i === m) {
        for (let t = 0; t < m; t++) r[t]! -= a[t]!;
        const ok = fillBin(b + 1, spare - left);
        for (let t = 0; t < m; t++) r[t]! += a[t]!;
        return ok;
      }
      const most = Math.min(r[i]!, Math.floor(left / lengths[i]!));
      for (let c = most; c >= 0; c--) {
        a[i] = c;
        if (choose(i + 1, left - c * lengths[i]!)) return true;
        if (aborted) break;
      }
      a[i] = 0;
      return false;
    };
    return choose(0, cap);
  };
  if (fillBin(0, room - total)) return out;
  return aborted ? null : "infeasible";
}

/** Bin completion first; the assignment MIP when that runs out of nodes or may open too many spools. */
function feasibility(
  highs: Highs,
  p: WireProblem,
  buy: readonly number[],
  deadline: number,
  limits: SearchLimits,
): Check | null {
  const bins = purchaseBins(p, buy);
  if (bins.length > limits.maxBins) return null;
  let totalMm = 0;
  for (const it of p.items) totalMm += it.lengthMm * it.demand;
  const dfs = packExactly(
    p.items.map((it) => it.lengthMm),
    p.items.map((it) => it.demand),
    bins.map((b) => b.cap),
    limits.dfsNodes,
  );
  if (dfs === "infeasible") return { status: "infeasible" };
  if (dfs) {
    const out: Bin[] = bins.map((b, k) => {
      const items: number[] = [];
      dfs[k]!.forEach((n, i) => {
        for (let c = 0; c < n; c++) items.push(i);
      });
      return { type: b.type, items };
    });
    const used = out.filter((b) => b.items.length > 0);
    // Fewest spools this purchase allows: all bought ones plus enough of the longest shelf spools.
    let cap = 0;
    let least = 0;
    for (const b of bins) {
      if (cap >= totalMm && b.shelf) break;
      cap += b.cap;
      least++;
    }
    if (used.length <= least) return { status: "feasible", bins: used, spools: used.length, optimal: true };
    const mip = feasibilityMip(highs, p, bins, deadline, limits);
    if (mip?.status === "feasible" && mip.spools <= used.length) return mip;
    return { status: "feasible", bins: used, spools: used.length, optimal: false };
  }
  return feasibilityMip(highs, p, bins, deadline, limits);
}

/**
 * Can all cuts be cut from the shelf spools plus this purchase? Integer x[i][b] = cuts of item i from spool b;
 * each item's cuts all placed; each spool's cuts within its usable length; shelf spools opened only when used
 * (binary y[b], minimised); identical spools ordered by fill to break symmetry.
 */
function feasibilityMip(
  highs: Highs,
  p: WireProblem,
  bins: readonly { type: number; cap: number; shelf: boolean }[],
  deadline: number,
  limits: SearchLimits,
): Check | null {
  const m = p.items.length;
  const B = bins.length;
  const xs: { i: number; b: number; ub: number }[] = [];
  for (let b = 0; b < B; b++) {
    for (let i = 0; i < m; i++) {
      const it = p.items[i]!;
      const ub = Math.min(it.demand, Math.floor(bins[b]!.cap / it.lengthMm));
      if (ub > 0) xs.push({ i, b, ub });
    }
  }
  if (xs.length > limits.maxVariables) return null;
  // Rows: m demand (=), B capacity (≤), then symmetry rows (≥ 0) between consecutive identical spools.
  const sym: number[] = [];
  for (let b = 0; b + 1 < B; b++) if (bins[b]!.type === bins[b + 1]!.type) sym.push(b);
  const rowOfSym = new Map<number, number>();
  sym.forEach((b, s) => rowOfSym.set(b, m + B + s));
  const numRows = m + B + sym.length;
  const shelfBins = bins.map((bin, b) => (bin.shelf ? b : -1)).filter((b) => b >= 0);
  const numCols = xs.length + shelfBins.length;
  const starts: number[] = [0];
  const index: number[] = [];
  const value: number[] = [];
  const colCost: number[] = [];
  const colLower: number[] = [];
  const colUpper: number[] = [];
  for (const x of xs) {
    const len = p.items[x.i]!.lengthMm;
    const entries: [number, number][] = [
      [x.i, 1],
      [m + x.b, len],
    ];
    const down = rowOfSym.get(x.b);
    if (down !== undefined) entries.push([down, len]);
    const up = rowOfSym.get(x.b - 1);
    if (up !== undefined) entries.push([up, -len]);
    entries.sort((a, b) => a[0] - b[0]);
    for (const [r, v] of entries) {
      index.push(r);
      value.push(v);
    }
    starts.push(index.length);
    colCost.push(0);
    colLower.push(0);
    colUpper.push(x.ub);
  }
  for (const b of shelfBins) {
    index.push(m + b);
    value.push(-bins[b]!.cap);
    starts.push(index.length);
    colCost.push(1);
    colLower.push(0);
    colUpper.push(1);
  }
  const rowLower: number[] = [];
  const rowUpper: number[] = [];
  p.items.forEach((it) => {
    rowLower.push(it.demand);
    rowUpper.push(it.demand);
  });
  bins.forEach((bin) => {
    rowLower.push(-highs.infinity);
    rowUpper.push(bin.shelf ? 0 : bin.cap);
  });
  sym.forEach(() => {
    rowLower.push(0);
    rowUpper.push(highs.infinity);
  });
  const secs = Math.min(limits.mipTimeMs, deadline - performance.now()) / 1000;
  if (secs <= 0.001) return null;
  const model = highs.createModel({
    numCols,
    numRows,
    colCost,
    colLower,
    colUpper,
    rowLower,
    rowUpper,
    matrix: {
      format: "csc",
      numRows,
      numCols,
      starts: Int32Array.from(starts),
      indices: Int32Array.from(index),
      values: Float64Array.from(value),
    },
    integrality: new Int32Array(numCols).fill(highs.constants.variableType.integer),
  });
  try {
    model.options.set({ output_flag: false, time_limit: secs, mip_rel_gap: 0, mip_abs_gap: 0.99 });
    model.run();
    const status = model.getModelStatus();
    if (status === highs.constants.modelStatus.infeasible) return { status: "infeasible" };
    if (Number(model.info.get("primal_solution_status")) !== 2) return { status: "unknown" };
    const x = model.getSolution().colValue;
    const out: Bin[] = bins.map((bin) => ({ type: bin.type, items: [] }));
    xs.forEach((v, j) => {
      const n = Math.round(x[j]!);
      for (let c = 0; c < n; c++) out[v.b]!.items.push(v.i);
    });
    const used = out.filter((b) => b.items.length > 0);
    return {
      status: "feasible",
      bins: used,
      spools: used.length,
      optimal: status === highs.constants.modelStatus.optimal,
    };
  } finally {
    model.dispose();
  }
}
