// Public shapes of the spool planner: cuts, stock, options and the plan it returns (lengths in mm, money in cents).

import { DEFAULT_PROJECT_SETTINGS } from "@/lib/domain/types";

/** One cut to make: a final cut length (allowances already included) of one wire type. */
export interface PlanCut {
  id: string;
  /** Packing group: gauge + colour + insulation spec; cuts of different wire types never share a spool. */
  wireType: string;
  /** Final cut length in whole millimetres. */
  lengthMm: number;
}

/**
 * A spool the plan may use.
 * - `shelf`: a remnant or part-used spool on hand; `lengthMm` is its measured remaining length and is all
 *   usable (its end was cut clean when it was last used, so no end discard).
 * - `putup`: a spool to buy; `lengthMm` is the nominal put-up length and each new spool loses
 *   `endDiscardMm` at its start, so its usable length is `lengthMm − endDiscardMm`.
 * When `kind` is omitted, a stock with `costCents` 0 and a numeric `available` is a shelf spool, anything
 * else a put-up.
 */
export interface PlanStock {
  id: string;
  wireType: string;
  lengthMm: number;
  costCents: number;
  /** How many times this stock may be used: null = unlimited (a put-up you can keep buying). */
  available: number | null;
  kind?: StockKind;
}

export type StockKind = "shelf" | "putup";

export interface PlanOptions {
  /** Discarded from the start of every newly opened put-up (taped, kinked or crushed end). */
  endDiscardMm: number;
  /** A leftover at least this long goes back to the shelf as a remnant; shorter leftovers are scrap. */
  keepRemnantMm: number;
  /** Wall-clock budget for the whole plan; the best plan found so far is returned when it runs out. */
  timeLimitMs: number;
}

/** End discard and keep-remnant threshold follow the project defaults (100 mm and 1000 mm, common practice). */
export const DEFAULT_PLAN_OPTIONS: PlanOptions = {
  endDiscardMm: DEFAULT_PROJECT_SETTINGS.endDiscardMm,
  keepRemnantMm: DEFAULT_PROJECT_SETTINGS.keepRemnantMm,
  timeLimitMs: 2000,
};

/** One spool of the plan with its cuts in cutting order (longest first). */
export interface PlannedSpool {
  stockId: string;
  wireType: string;
  kind: StockKind;
  /** Cut ids in cutting order: longest first. */
  cutIds: string[];
  /** Usable length: measured length for shelf spools, nominal − end discard for put-ups. */
  usableMm: number;
  /** The end discard taken off this spool (0 for shelf spools). */
  endDiscardMm: number;
  usedMm: number;
  leftoverMm: number;
  /** True when the leftover is at least keepRemnantMm and goes back to the shelf when the plan is committed. */
  keep: boolean;
  /** Purchase cost of this spool (0 for shelf spools). */
  costCents: number;
}

export interface UnplacedCut {
  id: string;
  wireType: string;
  lengthMm: number;
  reason: string;
}

/** What the planner did for one wire type, with the first-fit decreasing baseline beside it. */
export interface WireTypeSummary {
  wireType: string;
  cutCount: number;
  placedCount: number;
  spoolCount: number;
  costCents: number;
  /** Proven lower bound on the purchase cost of any plan for this wire type (see PlanResult). */
  lowerBoundCents: number;
  gapPct: number | null;
  scrapMm: number;
  keptRemnantMm: number;
  unplacedMm: number;
  /**
   * The bounds that were computed (cents); lowerBoundCents is their maximum. lp: column generation's
   * Lagrangian bound; cover: cheapest spools whose fill covers the total length; l2: Martello–Toth L2 (one
   * stock length); search: every cheaper purchase proven infeasible.
   */
  bounds: { lpCents: number | null; coverCents: number; l2Cents: number | null; searchCents: number | null };
  /** First-fit decreasing on the same input, for comparison. */
  ffd: { costCents: number; spoolCount: number; scrapMm: number; unplacedMm: number };
  /** Which step produced the returned plan: "ffd", "bfd", "purchase-search", "cg-round", "cg-mip", "cg-dive". */
  method: string;
  /** True when the plan is proven optimal for cost then number of spools. */
  provenOptimal: boolean;
  columns: number;
  cgIterations: number;
  elapsedMs: number;
}

/** A put-up to buy, summed over the plan. */
export interface Purchase {
  stockId: string;
  wireType: string;
  count: number;
  costCents: number;
}

/** A plan built without the optimiser (first-fit or best-fit decreasing). */
export interface HeuristicPlan {
  spools: PlannedSpool[];
  unplaced: UnplacedCut[];
  costCents: number;
  spoolCount: number;
  scrapMm: number;
}

export interface PlanResult extends HeuristicPlan {
  /**
   * Proven lower bound on the purchase cost, summed over wire types. When cuts are unplaced because the
   * stock ran out, it bounds the cost of plans that leave the same length unplaced.
   */
  lowerBoundCents: number;
  /** (cost − bound) / bound × 100; 0 when cost equals the bound; null when the bound is 0 but the cost is not. */
  gapPct: number | null;
  keptRemnantMm: number;
  purchases: Purchase[];
  perWireType: WireTypeSummary[];
  /** The methods behind the wire types' plans, e.g. "cg-mip" or "cg-mip+ffd". */
  method: string;
  elapsedMs: number;
}
