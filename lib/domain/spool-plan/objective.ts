// The lexicographic objective (unplaced length, cost, spools) as one integer weight per spool, so the LP and
// the MIP optimise it directly, and the conversion of a bound on that weight back to cents.

import type { SolutionKey, WireProblem } from "@/lib/domain/spool-plan/problem";

export interface Objective {
  /** All stock types cost the same: weight 1 per spool, cost = uniformCost × spools. */
  uniform: boolean;
  uniformCost: number;
  /** gcd of the stock costs: costs are counted in this unit in the weights. */
  costUnit: number;
  /** Multiplier on cost so that any saving of one cost unit outweighs every spool count difference. */
  costScale: number;
  /** Integer weight of one spool of each stock type. */
  weights: number[];
  /** Weight of one unplaced millimetre: more than any plan's cost and spools together. */
  penaltyPerMm: number;
  /** Cuts to place (an upper bound on the spools of any sensible plan). */
  cutCount: number;
}

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

export function makeObjective(p: WireProblem): Objective {
  let n = 0;
  for (const it of p.items) n += it.demand;
  const costs = p.types.map((t) => t.costCents);
  const uniform = costs.every((c) => c === costs[0]);
  if (uniform) {
    return {
      uniform,
      uniformCost: costs[0] ?? 0,
      costUnit: 1,
      costScale: 0,
      weights: costs.map(() => 1),
      penaltyPerMm: n + 1,
      cutCount: n,
    };
  }
  const unit = costs.reduce((g, c) => gcd(g, c), 0) || 1;
  const scale = n + 1;
  let maxCost = 0;
  for (const t of p.types) maxCost += (t.costCents / unit) * Math.min(t.available ?? n, n);
  return {
    uniform,
    uniformCost: 0,
    costUnit: unit,
    costScale: scale,
    weights: costs.map((c) => scale * (c / unit) + 1),
    penaltyPerMm: scale * maxCost + n + 1,
    cutCount: n,
  };
}

export function weightOf(o: Objective, key: SolutionKey): number {
  const spools = key.spoolCount;
  const pen = o.penaltyPerMm * key.unplacedMm;
  if (o.uniform) return spools + pen;
  return o.costScale * (key.costCents / o.costUnit) + spools + pen;
}

/** Smallest integer weight ≥ a real lower bound, allowing for floating-point noise. */
export function ceilBound(lb: number): number {
  return Math.ceil(lb - 1e-7 * Math.max(1, Math.abs(lb)));
}

/**
 * Cost bound in cents for plans leaving `unplacedMm` unplaced, from a lower bound on their weight.
 * Weight = scale·cost + spools + penalty, spools ≤ cutCount, so cost ≥ (W − cutCount − penalty) / scale.
 */
export function costBoundCents(o: Objective, weightLb: number, unplacedMm: number): number {
  const w = ceilBound(weightLb) - o.penaltyPerMm * unplacedMm;
  if (o.uniform) return Math.max(0, w) * o.uniformCost;
  return Math.max(0, Math.ceil((w - o.cutCount) / o.costScale)) * o.costUnit;
}
