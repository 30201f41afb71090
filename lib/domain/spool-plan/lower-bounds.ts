// Lower bounds that hold for every plan: L1 and Martello–Toth L2 (one spool length), and the cover bound
// (cheapest set of spools whose fillable length covers the total cut length; any spool mix).

import { KnapsackTable } from "@/lib/domain/spool-plan/knapsack";

/** L1 = ⌈Σ w / C⌉: spools needed for the total length alone. */
export function l1Bound(lengthsMm: readonly number[], capacityMm: number): number {
  let total = 0;
  for (const w of lengthsMm) total += w;
  return total === 0 ? 0 : Math.ceil(total / capacityMm);
}

/**
 * Martello & Toth (1990), "Lower bounds and reduction procedures for the bin packing problem", Discrete
 * Applied Mathematics 28:59–70, bound L2: for 0 ≤ α ≤ C/2 let J1 = {w > C − α}, J2 = {C/2 < w ≤ C − α},
 * J3 = {α ≤ w ≤ C/2}; L(α) = |J1| + |J2| + max(0, ⌈(ΣJ3 − (|J2|·C − ΣJ2)) / C⌉); L2 = max over α.
 * L(α) only changes at item sizes, so α runs over 0 and the distinct sizes ≤ C/2. Every length must be ≤ C.
 */
export function martelloTothL2(lengthsMm: readonly number[], capacityMm: number): number {
  const c = capacityMm;
  if (lengthsMm.length === 0) return 0;
  const alphas = [0, ...new Set(lengthsMm.filter((w) => 2 * w <= c))];
  let best = l1Bound(lengthsMm, c);
  for (const a of alphas) {
    let n1 = 0;
    let n2 = 0;
    let s2 = 0;
    let s3 = 0;
    for (const w of lengthsMm) {
      if (w > c - a) n1++;
      else if (2 * w > c) {
        n2++;
        s2 += w;
      } else if (w >= a) s3 += w;
    }
    const rest = s3 - (n2 * c - s2);
    const l = n1 + n2 + Math.max(0, Math.ceil(rest / c));
    if (l > best) best = l;
  }
  return best;
}

export interface CoverStock {
  /** Most cut length one spool of this type can hold (in the caller's length unit). */
  fill: number;
  cost: number;
  available: number | null;
}

/**
 * Least total cost of a multiset of spools whose fills sum to at least `demand` (respecting availability):
 * a relaxation of the plan that lets cuts split across spools but keeps whole spools. Returns Infinity
 * when the stock cannot cover the demand. Large demands are coarsened (fills rounded up, demand down),
 * which keeps the result a valid lower bound.
 */
export function minCostCover(stock: readonly CoverStock[], demand: number, maxCells = 2_000_000): number {
  if (demand <= 0) return 0;
  const unit = Math.max(1, Math.ceil(demand / maxCells));
  const d = Math.floor(demand / unit);
  if (d === 0) return 0;
  const f = new Float64Array(d + 1).fill(Infinity);
  f[0] = 0;
  for (const s of stock) {
    const e = Math.ceil(s.fill / unit);
    if (e <= 0) continue;
    if (s.available === null) {
      for (let x = 1; x <= d; x++) {
        const prev = f[Math.max(0, x - e)]! + s.cost;
        if (prev < f[x]!) f[x] = prev;
      }
    } else {
      let left = Math.min(s.available, Math.ceil(d / e));
      for (let piece = 1; left > 0; piece *= 2) {
        const k = Math.min(piece, left);
        left -= k;
        const ek = e * k;
        const ck = s.cost * k;
        for (let x = d; x >= 1; x--) {
          const prev = f[Math.max(0, x - ek)]! + ck;
          if (prev < f[x]!) f[x] = prev;
        }
      }
    }
  }
  // f[x] is "cost to cover exactly x or more" only after a suffix minimum.
  let best = Infinity;
  for (let x = d; x >= 0; x--) {
    if (f[x]! < best) best = f[x]!;
    f[x] = best;
  }
  return f[d]!;
}

/** Most total length of the given cuts (bounded by their counts) that fits in each capacity. */
export function maxFills(
  lengths: readonly number[],
  counts: readonly number[],
  capacities: readonly number[],
): number[] {
  let total = 0;
  lengths.forEach((l, i) => (total += l * counts[i]!));
  const cap = Math.min(total, Math.max(0, ...capacities));
  const table = new KnapsackTable(
    lengths.map((l, i) => ({ item: i, weight: l, value: l, bound: counts[i]! })),
    cap,
  );
  return capacities.map((c) => (c >= total ? total : table.value(c)));
}
