// The stored shape of a spool plan: what the plan screen, the cut sheet, the purchase list and the commit read.

export interface PlanCutView {
  runId: string;
  wireId: string;
  traceCode: string;
  cutLengthMm: number;
  routedLengthMm: number;
  endA: string;
  endB: string;
  endATermination: string | null;
  endBTermination: string | null;
  endAStripMm: number | null;
  endBStripMm: number | null;
}

export type PlanSpoolSource =
  | { kind: "shelf"; spoolId: string; lot: string | null; location: string | null; lengthMm: number }
  | {
      kind: "putup";
      putUpId: string;
      nominalMm: number;
      supplier: string | null;
      partNumber: string | null;
      priceCents: number;
      currency: string;
    };

export interface PlanSpoolView {
  /** Position in the wire type's cutting order (1-based). */
  index: number;
  source: PlanSpoolSource;
  usableMm: number;
  endDiscardMm: number;
  usedMm: number;
  leftoverMm: number;
  /** The leftover goes back to the shelf as a remnant when the plan is committed. */
  keep: boolean;
  costCents: number;
  /** Longest first: the order the bench cuts them. */
  cuts: PlanCutView[];
}

export interface PlanWireTypeView {
  wireTypeId: string;
  label: string;
  gauge: string;
  colour: string;
  insulation: string | null;
  spools: PlanSpoolView[];
  costCents: number;
  lowerBoundCents: number;
  gapPct: number | null;
  scrapMm: number;
  method: string;
  provenOptimal: boolean;
  ffd: { costCents: number; spoolCount: number; scrapMm: number };
}

export interface PlanPurchaseView {
  putUpId: string;
  wireTypeLabel: string;
  supplier: string | null;
  partNumber: string | null;
  nominalMm: number;
  count: number;
  unitPriceCents: number;
  totalCents: number;
  currency: string;
}

export interface PlanUnplacedView {
  runId: string;
  wireId: string;
  cutLengthMm: number;
  reason: string;
}

export interface PlanView {
  projectId: string;
  projectName: string;
  createdAt: string;
  wireTypes: PlanWireTypeView[];
  purchases: PlanPurchaseView[];
  unplaced: PlanUnplacedView[];
  costCents: number;
  lowerBoundCents: number;
  gapPct: number | null;
  spoolCount: number;
  cutCount: number;
  scrapMm: number;
  keptRemnantMm: number;
  method: string;
  elapsedMs: number;
  settings: { endDiscardMm: number; keepRemnantMm: number };
}
