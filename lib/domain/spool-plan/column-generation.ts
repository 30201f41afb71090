// Gilmore–Gomory column generation for one wire type: the master LP over cutting patterns in HiGHS, exact
// knapsack pricing per stock type, the Lagrangian lower bound, and the integer steps built on the columns
// (round down + first-fit repair, restricted-master MIP, diving with re-generation).

import loadHighs, { type Highs, type Model } from "highs";
import { greedyPack } from "@/lib/domain/spool-plan/ffd";
import { KnapsackTable, type KnapsackItem } from "@/lib/domain/spool-plan/knapsack";
import { ceilBound, type Objective } from "@/lib/domain/spool-plan/objective";
import { binUsedMm, type Bin, type WireProblem, type WireSolution } from "@/lib/domain/spool-plan/problem";

/** Near-best patterns per stock type and pricing round, found in the capacities just below the spool's. */
const HARVEST_SCAN = 48;
const HARVEST_EXTRA = 3;
let highsPromise: Promise<Highs> | undefined;

/** One HiGHS runtime per process: each load builds a new Wasm instance (~85 ms). */
export function getHighs(): Promise<Highs> {
  highsPromise ??= loadHighs();
  return highsPromise;
}

/** A master column: a cutting pattern on one stock type, or (type −1) "leave one cut of an item unplaced". */
interface Column {
  type: number;
  items: number[];
  counts: number[];
  weight: number;
}

interface LpSolution {
  value: number;
  /** Duals of the demand rows (≥ 0) and of the availability rows per stock type (≤ 0; 0 when unlimited). */
  y: Float64Array;
  mu: Float64Array;
  x: Float64Array;
}

export interface CgResult {
  lp: LpSolution | null;
  /** Best valid Lagrangian bound on the weight of any plan for the current residual (−Infinity if none). */
  lowerBound: number;
  /** The Lagrangian bound from the duals of `lp` itself (what reduced-cost enumeration needs). */
  lpBound: number;
  converged: boolean;
}

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

function patternKey(type: number, items: readonly number[], counts: readonly number[]): string {
  let k = String(type);
  for (let j = 0; j < items.length; j++) k += `|${items[j]}:${counts[j]}`;
  return k;
}

/** Bin → sorted (items, counts). */
function binPattern(bin: Bin): { items: number[]; counts: number[] } {
  const m = new Map<number, number>();
  for (const i of bin.items) m.set(i, (m.get(i) ?? 0) + 1);
  const items = [...m.keys()].sort((a, b) => a - b);
  return { items, counts: items.map((i) => m.get(i)!) };
}

export class Master {
  readonly p: WireProblem;
  readonly obj: Objective;
  readonly columns: Column[] = [];
  iterations = 0;
  private readonly highs: Highs;
  private readonly model: Model;
  private readonly keys = new Map<string, number>();
  private readonly lengthUnit: number;
  private readonly capUnits: number[];
  private readonly availRow: number[];
  private readonly hasArtificial: boolean;

  /** Residual demand and availability the LP currently covers. */
  private demand: number[];
  private avail: (number | null)[];

  constructor(highs: Highs, p: WireProblem, obj: Objective, withArtificial: boolean) {
    this.highs = highs;
    this.p = p;
    this.obj = obj;
    this.hasArtificial = withArtificial;
    this.lengthUnit = p.items.reduce((g, it) => gcd(g, it.lengthMm), 0) || 1;
    this.capUnits = p.types.map((t) => Math.floor(t.usableMm / this.lengthUnit));
    this.demand = p.items.map((it) => it.demand);
    this.avail = p.types.map((t) => t.available);
    this.model = highs.createModel();
    this.model.options.set({ output_flag: false, presolve: "off", solver: "simplex", simplex_strategy: 4 });
    for (const it of p.items) this.model.addRow(it.demand, highs.infinity, { indices: [], values: [] });
    let row = p.items.length;
    this.availRow = p.types.map((t) => {
      if (t.available === null) return -1;
      this.model.addRow(-highs.infinity, t.available, { indices: [], values: [] });
      return row++;
    });
    if (withArtificial) {
      p.items.forEach((it, i) => {
        this.pushColumn({ type: -1, items: [i], counts: [1], weight: obj.penaltyPerMm * it.lengthMm });
      });
    }
  }

  dispose(): void {
    this.model.dispose();
  }

  private pushColumn(col: Column): number {
    const key = patternKey(col.type, col.items, col.counts);
    const known = this.keys.get(key);
    if (known !== undefined) return -1;
    const indices = [...col.items];
    const values = col.counts.map((c) => c);
    if (col.type >= 0 && this.availRow[col.type]! >= 0) {
      indices.push(this.availRow[col.type]!);
      values.push(1);
    }
    this.model.addCol(col.weight, 0, this.highs.infinity, { indices, values });
    this.keys.set(key, this.columns.length);
    this.columns.push(col);
    return this.columns.length - 1;
  }

  addPattern(type: number, items: number[], counts: number[]): number {
    return this.pushColumn({ type, items, counts, weight: this.obj.weights[type]! });
  }

  /** Adds many patterns in one HiGHS call (one addCol each is slow); returns the new column indices. */
  addPatterns(patterns: readonly { type: number; items: number[]; counts: number[] }[]): number[] {
    const cost: number[] = [];
    const starts: number[] = [0];
    const indices: number[] = [];
    const values: number[] = [];
    const added: number[] = [];
    const all: number[] = [];
    for (const pat of patterns) {
      const key = patternKey(pat.type, pat.items, pat.counts);
      const known = this.keys.get(key);
      if (known !== undefined) {
        all.push(known);
        continue;
      }
      all.push(this.columns.length);
      const weight = this.obj.weights[pat.type]!;
      pat.items.forEach((i, t) => {
        indices.push(i);
        values.push(pat.counts[t]!);
      });
      if (this.availRow[pat.type]! >= 0) {
        indices.push(this.availRow[pat.type]!);
        values.push(1);
      }
      starts.push(indices.length);
      cost.push(weight);
      this.keys.set(key, this.columns.length);
      added.push(this.columns.length);
      this.columns.push({ type: pat.type, items: pat.items, counts: pat.counts, weight });
    }
    if (added.length === 0) return all;
    const n = added.length;
    this.model.addCols({
      cost: Float64Array.from(cost),
      lower: new Float64Array(n),
      upper: new Float64Array(n).fill(this.highs.infinity),
      matrix: {
        format: "csc",
        numRows: this.p.items.length + this.availRow.filter((r) => r >= 0).length,
        numCols: n,
        starts: Int32Array.from(starts),
        indices: Int32Array.from(indices),
        values: Float64Array.from(values),
      },
    });
    return all;
  }

  /** Indices of the "leave unplaced" columns whose reduced cost is at most `threshold`. */
  artificialWithin(lp: LpSolution, threshold: number): number[] {
    const out: number[] = [];
    this.columns.forEach((col, j) => {
      if (col.type < 0 && col.weight - lp.y[col.items[0]!]! <= threshold) out.push(j);
    });
    return out;
  }

  /**
   * Every maximal pattern whose reduced cost under these duals is at most `threshold`, or null when there
   * are more than `maxCount`. A plan of weight W uses only columns of reduced cost ≤ W − L, with L the
   * Lagrangian bound of the same duals (Σ rc·x = W − dual objective, and the other columns' reduced costs
   * add up to at least L − dual objective); extending a pattern to a maximal one only lowers its reduced
   * cost. So with threshold = target − L these columns hold every plan of weight ≤ target.
   * `maxWasteMm` optionally drops patterns leaving more room unused (valid when every plan better than the
   * incumbent wastes at most that much in total, as with one stock length).
   */
  enumerate(
    lp: LpSolution,
    threshold: number,
    maxCount: number,
    maxWasteMm = Infinity,
  ): { type: number; items: number[]; counts: number[] }[] | null {
    const p = this.p;
    const m = p.items.length;
    const order = [...Array(m).keys()]
      .filter((i) => this.demand[i]! > 0)
      .sort((a, b) => lp.y[b]! / p.items[b]!.lengthMm - lp.y[a]! / p.items[a]!.lengthMm || a - b);
    const len = order.map((i) => p.items[i]!.lengthMm);
    const val = order.map((i) => lp.y[i]!);
    const dem = order.map((i) => this.demand[i]!);
    const out: { type: number; items: number[]; counts: number[] }[] = [];
    const a = new Array<number>(order.length).fill(0);
    for (let k = 0; k < p.types.length; k++) {
      const av = this.avail[k] ?? null;
      if (av === 0) continue;
      const need = this.obj.weights[k]! - lp.mu[k]! - threshold;
      const cap = p.types[k]!.usableMm;
      let overflow = false;
      // Fractional (Dantzig) bound on the value the items from j on can still add in `room`.
      const bound = (j: number, room: number): number => {
        let v = 0;
        for (let t = j; t < order.length && room > 0; t++) {
          const take = Math.min(dem[t]!, room / len[t]!);
          v += take * val[t]!;
          room -= take * len[t]!;
        }
        return v;
      };
      // Fill that the remaining items can still add, for the waste filter.
      const fillLeft = (j: number, room: number): number => {
        let f = 0;
        for (let t = j; t < order.length && f < room; t++) f += dem[t]! * len[t]!;
        return Math.min(f, room);
      };
      const rec = (j: number, room: number, value: number): void => {
        if (overflow) return;
        if (value + bound(j, room) < need - 1e-9 * Math.max(1, Math.abs(need))) return;
        if (room - fillLeft(j, room) > maxWasteMm) return;
        if (j === order.length) {
          if (value < need - 1e-9 * Math.max(1, Math.abs(need))) return;
          for (let t = 0; t < order.length; t++) if (a[t]! < dem[t]! && len[t]! <= room) return; // not maximal
          const items: number[] = [];
          const counts: number[] = [];
          order.forEach((i, t) => {
            if (a[t]! > 0) {
              items.push(i);
              counts.push(a[t]!);
            }
          });
          if (items.length === 0) return;
          const idx = items.map((_, q) => q).sort((x, y) => items[x]! - items[y]!);
          out.push({ type: k, items: idx.map((q) => items[q]!), counts: idx.map((q) => counts[q]!) });
          if (out.length > maxCount) overflow = true;
          return;
        }
        const most = Math.min(dem[j]!, Math.floor(room / len[j]!));
        for (let c = most; c >= 0; c--) {
          a[j] = c;
          rec(j + 1, room - c * len[j]!, value + c * val[j]!);
          if (overflow) break;
        }
        a[j] = 0;
      };
      rec(0, cap, 0);
      if (overflow) return null;
    }
    return out;
  }

  addBins(bins: readonly Bin[]): void {
    for (const b of bins) {
      const { items, counts } = binPattern(b);
      if (items.length) this.addPattern(b.type, items, counts);
    }
  }

  /** Column counts that reproduce a solution (its bins are added as columns first). */
  countsOf(s: WireSolution): Float64Array {
    this.addBins(s.bins);
    const x = new Float64Array(this.columns.length);
    for (const b of s.bins) {
      const { items, counts } = binPattern(b);
      const j = this.keys.get(patternKey(b.type, items, counts));
      if (j !== undefined) x[j]! += 1;
    }
    if (this.hasArtificial) {
      s.unplaced.forEach((n, i) => {
        const j = this.keys.get(patternKey(-1, [i], [1]));
        if (j !== undefined) x[j]! += n;
      });
    }
    return x;
  }

  /** Fixes these columns at 0 (or frees them again). */
  blockColumns(cols: readonly number[], block: boolean): void {
    if (cols.length === 0) return;
    const upper = new Float64Array(cols.length).fill(block ? 0 : this.highs.infinity);
    this.model.changeColsBounds({ kind: "set", indices: cols }, new Float64Array(cols.length), upper);
  }

  setResidual(demand: readonly number[], avail: readonly (number | null)[]): void {
    this.demand = [...demand];
    this.avail = [...avail];
    demand.forEach((d, i) => this.model.changeRowBounds(i, d, this.highs.infinity));
    this.p.types.forEach((_, k) => {
      const r = this.availRow[k]!;
      if (r >= 0) this.model.changeRowBounds(r, -this.highs.infinity, avail[k] ?? 0);
    });
  }

  private setTimeLimit(deadline: number): boolean {
    const secs = (deadline - performance.now()) / 1000;
    if (secs <= 0.001) return false;
    this.model.options.set("time_limit", secs);
    this.model.zeroAllClocks();
    return true;
  }

  solveLp(deadline: number): LpSolution | null {
    if (!this.setTimeLimit(deadline)) return null;
    this.model.run();
    if (this.model.getModelStatus() !== this.highs.constants.modelStatus.optimal) return null;
    const sol = this.model.getSolution();
    const y = new Float64Array(this.p.items.length);
    for (let i = 0; i < y.length; i++) y[i] = Math.max(0, sol.rowDual[i]!);
    const mu = new Float64Array(this.p.types.length);
    this.availRow.forEach((r, k) => (mu[k] = r >= 0 ? Math.min(0, sol.rowDual[r]!) : 0));
    return { value: this.model.getObjectiveValue(), y, mu, x: sol.colValue };
  }

  /**
   * Exact pricing: one bounded-knapsack DP (lengths in units of the gcd of the cut lengths) serves every stock
   * type; reduced cost of the best pattern on type k = weight_k − μ_k − Σ y·a. Adds improving columns
   * (the best per type plus a few near-best ones) and returns the Lagrangian bound for these duals.
   */
  price(lp: LpSolution): { added: number; lowerBound: number } {
    const { y, mu } = lp;
    const p = this.p;
    const unit = this.lengthUnit;
    const kitems: KnapsackItem[] = [];
    let total = 0;
    let open = 0;
    p.items.forEach((it, i) => {
      const d = this.demand[i]!;
      open += d;
      if (d > 0 && y[i]! > 1e-12) {
        const w = it.lengthMm / unit;
        kitems.push({ item: i, weight: w, value: y[i]!, bound: d });
        total += w * d;
      }
    });
    let maxCap = 0;
    p.types.forEach((_, k) => {
      if (this.avail[k] === null || this.avail[k]! > 0) maxCap = Math.max(maxCap, this.capUnits[k]!);
    });
    const table = new KnapsackTable(kitems, Math.min(maxCap, total));
    let dualObj = 0;
    this.demand.forEach((d, i) => (dualObj += y[i]! * d));
    let added = 0;
    let lagr = 0;
    for (let k = 0; k < p.types.length; k++) {
      const a = this.avail[k] ?? null;
      if (a === 0) continue;
      if (a !== null) dualObj += mu[k]! * a;
      const cap = this.capUnits[k]!;
      const w = this.obj.weights[k]!;
      const rc = w - mu[k]! - table.value(cap);
      const uses = Math.min(a ?? open, open);
      if (rc < 0) lagr += rc * uses;
      const eps = 1e-9 * Math.max(1, w);
      if (rc >= -eps) continue;
      const best = table.pattern(cap);
      if (this.addPattern(k, best.items, best.counts) >= 0) added++;
      // Near-best patterns from slightly smaller capacities often enter the next bases too.
      let extra = 0;
      for (let s = 1, c = cap - 1; c > 0 && s <= HARVEST_SCAN && extra < HARVEST_EXTRA; s++, c--) {
        if (w - mu[k]! - table.value(c) >= -eps) break;
        const pat = table.pattern(c);
        if (this.addPattern(k, pat.items, pat.counts) >= 0) {
          extra++;
          added++;
        }
      }
    }
    if (this.hasArtificial) {
      p.items.forEach((it, i) => {
        const rc = this.obj.penaltyPerMm * it.lengthMm - y[i]!;
        if (rc < 0) lagr += rc * this.demand[i]!;
      });
    }
    return { added, lowerBound: dualObj + lagr };
  }

  /**
   * Column generation on the current residual until no improving column or the deadline; unless `exact`,
   * also until the bound is as tight as the LP can make it (in whole weight units) or reaches `stopAtWeight`.
   */
  generate(deadline: number, stopAtWeight: number, exact = false): CgResult {
    let lowerBound = -Infinity;
    let last: { lp: LpSolution; bound: number } | null = null;
    const result = (converged: boolean): CgResult => ({
      lp: last?.lp ?? null,
      lowerBound,
      lpBound: last?.bound ?? -Infinity,
      converged,
    });
    for (;;) {
      const lp = this.solveLp(deadline);
      if (!lp) return result(false);
      this.iterations++;
      // Columns added below do not change this LP's duals, so its bound stays paired with it.
      const priced = this.price(lp);
      last = { lp, bound: priced.lowerBound };
      lowerBound = Math.max(lowerBound, priced.lowerBound);
      if (priced.added === 0) return result(true);
      const lbInt = ceilBound(lowerBound);
      if (!exact && (lbInt >= ceilBound(lp.value) || lbInt >= stopAtWeight)) return result(false);
      if (performance.now() >= deadline) return result(false);
    }
  }

  /**
   * Restricted-master MIP over the columns so far (or only `allowed` ones), started from `start`. Returns the
   * best solution found (null if none) and whether HiGHS proved it optimal, or proved no solution exists.
   */
  solveMip(
    deadline: number,
    start: Float64Array | null,
    nodeLimit: number,
    allowed: ReadonlySet<number> | null = null,
  ): { x: Float64Array | null; proven: boolean } {
    const n = this.columns.length;
    if (!this.setTimeLimit(deadline)) return { x: null, proven: false };
    const blocked = allowed ? [...Array(n).keys()].filter((j) => !allowed.has(j)) : [];
    this.blockColumns(blocked, true);
    this.model.changeColsIntegrality(
      { kind: "range", from: 0, to: n - 1 },
      new Int32Array(n).fill(this.highs.constants.variableType.integer),
    );
    // Weights are integers, so a gap below 1 proves optimality over these columns.
    // Presolve off and more heuristic effort found packings far sooner on the benchmark families.
    this.model.options.set({
      solver: "choose",
      presolve: "off",
      mip_heuristic_effort: 0.3,
      mip_rel_gap: 0,
      mip_abs_gap: 0.99,
      mip_max_nodes: nodeLimit,
    });
    try {
      if (start && start.length === n) this.model.setSolution({ colValue: start });
      this.model.run();
      const status = this.model.getModelStatus();
      const ms = this.highs.constants.modelStatus;
      const feasible = Number(this.model.info.get("primal_solution_status")) === 2;
      return {
        x: feasible ? this.model.getSolution().colValue : null,
        proven: status === ms.optimal || status === ms.infeasible,
      };
    } finally {
      this.blockColumns(blocked, false);
      this.model.clearIntegrality();
      this.model.options.set({ solver: "simplex", presolve: "off", simplex_strategy: 4 });
    }
  }

  /**
   * Turns column counts into bins: copies of each pattern, surplus cuts removed (from the emptiest spools
   * first), and whatever is still uncovered packed first-fit decreasing into the spools' room and new spools.
   */
  toSolution(
    x: Float64Array,
    round: "down" | "nearest",
    method: string,
    fixed: readonly Bin[] = [],
  ): WireSolution {
    const p = this.p;
    const bins: Bin[] = fixed.map((b) => ({ type: b.type, items: [...b.items] }));
    this.columns.forEach((col, j) => {
      if (col.type < 0) return;
      const v = x[j] ?? 0;
      const copies = round === "down" ? Math.floor(v + 1e-6) : Math.round(v);
      for (let c = 0; c < copies; c++) {
        const items: number[] = [];
        col.items.forEach((i, t) => {
          for (let r = 0; r < col.counts[t]!; r++) items.push(i);
        });
        bins.push({ type: col.type, items });
      }
    });
    return completeBins(p, bins, method);
  }
}

/** Removes surplus cuts and packs the missing ones first-fit decreasing. */
export function completeBins(p: WireProblem, bins: Bin[], method: string): WireSolution {
  const covered = p.items.map(() => 0);
  for (const b of bins) for (const i of b.items) covered[i]!++;
  const surplus = p.items.map((it, i) => Math.max(0, covered[i]! - it.demand));
  if (surplus.some((s) => s > 0)) {
    const order = bins
      .map((b, j) => ({ j, used: binUsedMm(p, b) }))
      .sort((a, b) => a.used - b.used || a.j - b.j);
    for (const { j } of order) {
      const b = bins[j]!;
      b.items = b.items.filter((i) => {
        if (surplus[i]! > 0) {
          surplus[i]!--;
          return false;
        }
        return true;
      });
    }
  }
  const left = p.items.map((it, i) => Math.max(0, it.demand - Math.min(covered[i]!, it.demand)));
  return greedyPack(
    p,
    "first",
    left,
    bins.filter((b) => b.items.length > 0),
    method,
  );
}

/**
 * Diving with limited backtracking: at each node solve the LP (re-generating columns for the residual), then
 * fix a column — every column at ⌊x⌋ when some x ≥ 1, else the largest x at 1 (ties: less waste) — reduce the
 * demands and go deeper. A node whose fixed weight plus residual bound exceeds `aimWeight` (at most the
 * incumbent's weight − 1; aiming at the lower bound keeps the dive on paths that could still be optimal) fails,
 * and the parent tries its next candidate, within `nodeLimit` nodes and the deadline (when those run out,
 * the current path is finished first-fit decreasing and returned).
 */
export function dive(
  m: Master,
  deadline: number,
  aimWeight: number,
  nodeLimit = 400,
  branching = 3,
  only: ReadonlySet<number> | null = null,
): WireSolution | null {
  const p = m.p;
  let nodes = 0;
  const fill = (col: Column): number =>
    col.items.reduce((s, i, t) => s + p.items[i]!.lengthMm * col.counts[t]!, 0);

  const apply = (
    picks: { j: number; copies: number }[],
    demand: number[],
    avail: (number | null)[],
    fixed: Bin[],
  ): number => {
    let weight = 0;
    for (const { j, copies } of picks) {
      const col = m.columns[j]!;
      for (let c = 0; c < copies; c++) {
        const a = avail[col.type];
        if (a !== null && a !== undefined && a <= 0) break;
        const items: number[] = [];
        col.items.forEach((i, t) => {
          const take = Math.min(col.counts[t]!, demand[i]!);
          demand[i]! -= take;
          for (let r = 0; r < take; r++) items.push(i);
        });
        if (items.length === 0) break;
        if (a !== null && a !== undefined) avail[col.type] = a - 1;
        fixed.push({ type: col.type, items });
        weight += m.obj.weights[col.type]!;
      }
    }
    return weight;
  };

  const visit = (
    demand: number[],
    avail: (number | null)[],
    fixed: Bin[],
    fixedWeight: number,
  ): WireSolution | null => {
    if (!demand.some((d) => d > 0)) {
      const s = greedyPack(p, "first", demand, fixed, "cg-dive");
      return fixedWeight <= aimWeight ? s : null;
    }
    // Out of nodes or time: finish this path first-fit decreasing rather than lose it.
    const giveUp = (): WireSolution => greedyPack(p, "first", demand, fixed, "cg-dive");
    if (++nodes > nodeLimit || performance.now() >= deadline) return giveUp();
    m.setResidual(demand, avail);
    let x: Float64Array;
    if (only) {
      // Restricted to the columns that can hold a better plan: the LP alone, no new columns.
      const lp = m.solveLp(deadline);
      if (!lp) return performance.now() >= deadline ? giveUp() : null; // infeasible
      if (fixedWeight + ceilBound(lp.value) > aimWeight) return null;
      x = lp.x;
    } else {
      const cg = m.generate(deadline, Infinity);
      if (!cg.lp) return giveUp();
      if (fixedWeight + ceilBound(cg.lowerBound) > aimWeight) return null;
      x = cg.lp.x;
    }
    const options: { j: number; copies: number }[][] = [];
    const whole: { j: number; copies: number }[] = [];
    const frac: number[] = [];
    m.columns.forEach((col, j) => {
      if (col.type < 0 || x[j]! <= 1e-6) return;
      if (x[j]! >= 1 - 1e-6) whole.push({ j, copies: Math.floor(x[j]! + 1e-6) });
      frac.push(j);
    });
    if (whole.length) options.push(whole);
    frac.sort((a, b) => x[b]! - x[a]! || fill(m.columns[b]!) - fill(m.columns[a]!) || a - b);
    for (const j of frac.slice(0, branching)) options.push([{ j, copies: 1 }]);
    for (const pick of options) {
      const d = [...demand];
      const a = [...avail];
      const f = [...fixed];
      const w = apply(pick, d, a, f);
      if (w === 0) continue;
      const found = visit(d, a, f, fixedWeight + w);
      if (found) return found;
      if (nodes > nodeLimit || performance.now() >= deadline) return giveUp();
    }
    return null;
  };

  const blocked = only ? m.columns.map((_, j) => j).filter((j) => !only.has(j)) : [];
  m.blockColumns(blocked, true);
  try {
    return visit(
      p.items.map((it) => it.demand),
      p.types.map((t) => t.available),
      [],
      0,
    );
  } finally {
    m.blockColumns(blocked, false);
    m.setResidual(
      p.items.map((it) => it.demand),
      p.types.map((t) => t.available),
    );
  }
}
