// Allowed continuous current of a conductor: 33 CFR 183.425 Table 5 with bundle and engine-space derating.

import { awgAreaMm2, gaugeAreaMm2 } from "./conductors";
import { awgLabel, formatGauge, type Gauge } from "./gauge";
import { formatForText, type Judgement } from "./voltage-drop";

/** Insulation temperature ratings (°C) that head the columns of 33 CFR 183.425 Table 5. */
export const USCG_TEMP_COLUMNS_C = [60, 75, 80, 90, 105, 125, 200] as const;
export type UscgColumnC = (typeof USCG_TEMP_COLUMNS_C)[number];

interface AmpacityRow {
  awg: number;
  amps: readonly [number, number, number, number, number, number, number];
}

// 33 CFR 183.425 Table 5: insulated stranded copper, 30 °C ambient, single conductor; amperes per column above.
// AWG stored as in gauge.ts: 1/0 → 0, 4/0 → −3.
const USCG_TABLE_5: readonly AmpacityRow[] = [
  { awg: 18, amps: [10, 10, 15, 20, 20, 25, 25] },
  { awg: 16, amps: [15, 15, 20, 25, 25, 30, 35] },
  { awg: 14, amps: [20, 20, 25, 30, 35, 40, 45] },
  { awg: 12, amps: [25, 25, 35, 40, 45, 50, 55] },
  { awg: 10, amps: [40, 40, 50, 55, 60, 70, 70] },
  { awg: 8, amps: [55, 65, 70, 70, 80, 90, 100] },
  { awg: 6, amps: [80, 95, 100, 100, 120, 125, 135] },
  { awg: 4, amps: [105, 125, 130, 135, 160, 170, 180] },
  { awg: 2, amps: [140, 170, 175, 180, 210, 225, 240] },
  { awg: 0, amps: [195, 230, 245, 245, 285, 305, 325] },
  { awg: -3, amps: [300, 360, 385, 385, 445, 475, 510] },
];

// Rows with their nominal areas, thinnest first, for the by-area lookup.
const ROWS_BY_AREA = USCG_TABLE_5.map((r) => ({ ...r, areaMm2: awgAreaMm2(r.awg) })).sort(
  (a, b) => a.areaMm2 - b.areaMm2,
);

/** The published Table 5 value for an AWG size and column, or null if the size or column is not tabulated. */
export function uscgTable5A(awg: number, columnC: number): number | null {
  const row = USCG_TABLE_5.find((r) => r.awg === awg);
  const col = USCG_TEMP_COLUMNS_C.indexOf(columnC as UscgColumnC);
  if (!row || col < 0) return null;
  return row.amps[col] ?? null;
}

/** The column to use for an insulation rating: the highest one not above it (conservative); null below 60 °C. */
export function uscgColumnFor(insulationTempC: number): UscgColumnC | null {
  let chosen: UscgColumnC | null = null;
  for (const c of USCG_TEMP_COLUMNS_C) if (c <= insulationTempC) chosen = c;
  return chosen;
}

/**
 * Engine-space (50 °C ambient) factors by column. 105 °C × 0.85 is from one published chart (medium confidence);
 * the other columns are from memory (electrical.md §6a) and should be treated as guidance.
 */
export const ENGINE_SPACE_FACTORS: Record<UscgColumnC, number> = {
  60: 0.58,
  75: 0.75,
  80: 0.78,
  90: 0.82,
  105: 0.85,
  125: 0.89,
  200: 1.0,
};

/**
 * USCG bundle factors (Electrical System Compliance Guideline): 3 conductors × 0.70, 4–6 × 0.60, 7–24 × 0.50,
 * 25 and more × 0.40; one or two conductors are not derated.
 */
export function bundleFactor(bundleSize: number): number {
  return bundleBracket(bundleSize).factor;
}

const BUNDLE_BRACKETS = [
  { min: 25, label: "25 or more", factor: 0.4 },
  { min: 7, label: "7–24", factor: 0.5 },
  { min: 4, label: "4–6", factor: 0.6 },
  { min: 3, label: "3", factor: 0.7 },
] as const;

/**
 * The USCG bracket a bundle falls in; one or two conductors are not derated. The guideline says the bundle
 * limit does not apply below 50 V; we apply it at every voltage as conservative guidance, and say so.
 */
export function bundleBracket(bundleSize: number): { label: string; factor: number } {
  return BUNDLE_BRACKETS.find((b) => bundleSize >= b.min) ?? { label: "1–2", factor: 1 };
}

export type AmpacityMethod = "table" | "next-smaller-size" | "area-scaled" | "largest-size";

export interface BaseAmpacity {
  ampacityA: number;
  columnC: UscgColumnC;
  method: AmpacityMethod;
  /** The tabulated size the value comes from. */
  basisAwg: number;
}

// Relative tolerance for "this area is that tabulated size".
const AREA_EPS = 1e-6;

/**
 * Single-conductor ampacity for any size, from Table 5, decided conservatively for sizes it does not list:
 * - between two tabulated sizes (3, 5, 7 … AWG, 1 AWG, 2/0, 3/0, metric sizes): the next smaller tabulated size;
 * - thinner than 18 AWG: the 18 AWG value scaled by area. Ampacity grows slower than area (about A^0.75, since
 *   heat leaves through the surface), so linear scaling understates it for thinner wire;
 * - thicker than 4/0: the 4/0 value, no extrapolation.
 */
export function baseAmpacity(areaMm2: number, insulationTempC: number): BaseAmpacity | null {
  const columnC = uscgColumnFor(insulationTempC);
  if (columnC === null || !(areaMm2 > 0)) return null;
  const col = USCG_TEMP_COLUMNS_C.indexOf(columnC);
  const first = ROWS_BY_AREA[0]!;
  if (areaMm2 < first.areaMm2 * (1 - AREA_EPS)) {
    return {
      ampacityA: first.amps[col]! * (areaMm2 / first.areaMm2),
      columnC,
      method: "area-scaled",
      basisAwg: first.awg,
    };
  }
  let row = first;
  for (const r of ROWS_BY_AREA) if (r.areaMm2 <= areaMm2 * (1 + AREA_EPS)) row = r;
  const exact = Math.abs(row.areaMm2 - areaMm2) <= row.areaMm2 * AREA_EPS;
  const last = ROWS_BY_AREA[ROWS_BY_AREA.length - 1]!;
  const method: AmpacityMethod = exact ? "table" : row === last ? "largest-size" : "next-smaller-size";
  return { ampacityA: row.amps[col]!, columnC, method, basisAwg: row.awg };
}

/** Insulation rating assumed when a run does not give one: the lowest column, so the least current. */
export const DEFAULT_INSULATION_TEMP_C = 60;

export interface AmpacityInput {
  gauge: Gauge;
  insulationTempC: number | null;
  bundleSize: number | null;
  hotSpace: boolean;
}

export type AmpacityResult =
  | {
      ok: true;
      /** Derated allowed continuous current. */
      ampacityA: number;
      baseA: number;
      bundleFactor: number;
      hotSpaceFactor: number;
      columnC: UscgColumnC;
      method: AmpacityMethod;
      basisAwg: number;
      /** Plain-language notes on assumptions, each naming its rule. */
      notes: string[];
    }
  | { ok: false; message: string };

export function deratedAmpacity(input: AmpacityInput): AmpacityResult {
  const notes: string[] = [];
  const tempC = input.insulationTempC ?? DEFAULT_INSULATION_TEMP_C;
  if (input.insulationTempC === null) {
    notes.push("Insulation rating not given: 60 °C assumed, the most conservative column of 33 CFR 183.425");
  }
  const base = baseAmpacity(gaugeAreaMm2(input.gauge), tempC);
  if (!base) {
    return {
      ok: false,
      message: `Insulation rated ${formatForText(tempC)} °C is below the 60 °C column of 33 CFR 183.425 Table 5: no ampacity can be given; use the maker's rating`,
    };
  }
  const size = formatGauge(input.gauge);
  const basis = `${awgLabel(base.basisAwg)} AWG`;
  if (base.method === "next-smaller-size") {
    notes.push(`${size} is not in 33 CFR 183.425 Table 5: rated as the next smaller listed size, ${basis}`);
  } else if (base.method === "area-scaled") {
    notes.push(
      `${size} is thinner than 33 CFR 183.425 Table 5 lists: ${basis} value scaled by area (our rule)`,
    );
  } else if (base.method === "largest-size") {
    notes.push(`${size} is larger than 33 CFR 183.425 Table 5 lists: rated as ${basis}`);
  }
  const bundle = bundleBracket(input.bundleSize ?? 1);
  const bf = bundle.factor;
  if (bf < 1) {
    notes.push(
      `Bundle of ${bundle.label} conductors: ×${bf} (USCG bundle factors; the guideline exempts systems below 50 V, applied anyway as conservative guidance)`,
    );
  }
  const hf = input.hotSpace ? ENGINE_SPACE_FACTORS[base.columnC] : 1;
  if (input.hotSpace)
    notes.push(`Hot space: ×${hf} for ${base.columnC} °C insulation (engine-space factor, 50 °C)`);
  return {
    ok: true,
    ampacityA: base.ampacityA * bf * hf,
    baseA: base.ampacityA,
    bundleFactor: bf,
    hotSpaceFactor: hf,
    columnC: base.columnC,
    method: base.method,
    basisAwg: base.basisAwg,
    notes,
  };
}

/** Our own rule, like the drop check: a current above this fraction of ampacity warns. */
export const AMPACITY_WARN_FRACTION = 0.8;

/** Margin in percent of the ampacity left at this current (negative when over). */
export function ampacityMarginPct(currentA: number, ampacityA: number): number {
  return ((ampacityA - currentA) / ampacityA) * 100;
}

export function judgeAmpacity(currentA: number, ampacityA: number): Judgement {
  const i = formatForText(currentA);
  const a = formatForText(ampacityA);
  const rule = "33 CFR 183.425";
  if (currentA > ampacityA) {
    return {
      verdict: "fail",
      text: `Current ${i} A exceeds the ${a} A ampacity of the wire after derating (${rule})`,
    };
  }
  if (currentA > AMPACITY_WARN_FRACTION * ampacityA) {
    return {
      verdict: "warn",
      text: `Current ${i} A is above ${AMPACITY_WARN_FRACTION * 100} % of the ${a} A ampacity after derating (${rule}); warn band is our own rule`,
    };
  }
  return { verdict: "pass", text: `Current ${i} A is within the ${a} A ampacity after derating (${rule})` };
}
