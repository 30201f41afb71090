// Heat-shrink marker sleeves: the standard size series, the fit window on a wire's outer diameter, lay-flat width, and wire OD estimates.

import { awgDiameterMm, gaugeAreaMm2 } from "./conductors";
import { parseGauge, type Gauge } from "./gauge";

/** One heat-shrink sleeve size: the inside diameter as supplied (expanded) and after full recovery. */
export interface SleeveSize {
  id: string;
  label: string;
  expandedMm: number;
  recoveredMm: number;
  /** Shrink ratio N in N:1 (expanded = N × recovered). */
  ratio: number;
}

function sleeve(
  series: string,
  label: string,
  expandedMm: number,
  recoveredMm: number,
  ratio: number,
): SleeveSize {
  return { id: `${series}-${expandedMm}`, label, expandedMm, recoveredMm, ratio };
}

/** The usual 2:1 inch series, expanded / recovered ID in mm (electrical.md §8, common practice). */
export const SLEEVES_2_TO_1: readonly SleeveSize[] = [
  sleeve("2to1", '1/16" (1.6 mm) 2:1', 1.6, 0.8, 2),
  sleeve("2to1", '3/32" (2.4 mm) 2:1', 2.4, 1.2, 2),
  sleeve("2to1", '1/8" (3.2 mm) 2:1', 3.2, 1.6, 2),
  sleeve("2to1", '3/16" (4.8 mm) 2:1', 4.8, 2.4, 2),
  sleeve("2to1", '1/4" (6.4 mm) 2:1', 6.4, 3.2, 2),
  sleeve("2to1", '3/8" (9.5 mm) 2:1', 9.5, 4.8, 2),
  sleeve("2to1", '1/2" (12.7 mm) 2:1', 12.7, 6.4, 2),
  sleeve("2to1", '3/4" (19.1 mm) 2:1', 19.1, 9.5, 2),
  sleeve("2to1", '1" (25.4 mm) 2:1', 25.4, 12.7, 2),
];

/** A common 3:1 metric series (electrical.md §8, from memory). */
export const SLEEVES_3_TO_1: readonly SleeveSize[] = [
  sleeve("3to1", "1.5 mm 3:1", 1.5, 0.5, 3),
  sleeve("3to1", "3 mm 3:1", 3, 1, 3),
  sleeve("3to1", "4.5 mm 3:1", 4.5, 1.5, 3),
  sleeve("3to1", "6 mm 3:1", 6, 2, 3),
  sleeve("3to1", "9 mm 3:1", 9, 3, 3),
  sleeve("3to1", "12 mm 3:1", 12, 4, 3),
  sleeve("3to1", "18 mm 3:1", 18, 6, 3),
  sleeve("3to1", "24 mm 3:1", 24, 8, 3),
];

/**
 * Fit rules (electrical.md §8, common practice): the expanded ID must clear the wire by a slide-on margin,
 * the recovered ID must be below the wire OD, and for a marker that must not slide or turn the wire OD
 * should sit no higher than recovered + 25 % of the shrink (i.e. the sleeve still has 75 % of its shrink left).
 */
export const SLEEVE_FIT_RULES = { slideOnMarginPct: 20, gripShareOfShrink: 0.25 } as const;

/** `grip`: meets the strict grip rule; `slide-only`: slides on and recovers onto the wire, but grips less. */
export type SleeveFitGrade = "grip" | "slide-only" | "too-tight" | "too-loose";

export function sleeveFitGrade(s: SleeveSize, wireOdMm: number): SleeveFitGrade {
  if (s.expandedMm < wireOdMm * (1 + SLEEVE_FIT_RULES.slideOnMarginPct / 100) - 1e-9) return "too-tight";
  if (s.recoveredMm >= wireOdMm) return "too-loose";
  const gripMaxOdMm = s.recoveredMm + SLEEVE_FIT_RULES.gripShareOfShrink * (s.expandedMm - s.recoveredMm);
  return wireOdMm <= gripMaxOdMm + 1e-9 ? "grip" : "slide-only";
}

/** Width of a flattened tube: half its circumference, π·D/2. */
export function layFlatWidthMm(diameterMm: number): number {
  return (Math.PI * diameterMm) / 2;
}

export interface SleeveChoice {
  sleeve: SleeveSize;
  grade: "grip" | "slide-only";
  wireOdMm: number;
  /** Flat width of the expanded sleeve: the printable face before margins. */
  layFlatMm: number;
  /** Installed diameter over expanded diameter: how much print is squeezed around the wire after shrinking. */
  circumferentialScale: number;
}

export type SleeveChoiceResult = { ok: true; choice: SleeveChoice } | { ok: false; message: string };

/** The smallest sleeve that grips the wire; failing that, the smallest that slides on and recovers onto it. */
export function chooseSleeve(
  wireOdMm: number,
  series: readonly SleeveSize[] = SLEEVES_2_TO_1,
): SleeveChoiceResult {
  if (!(wireOdMm > 0)) return { ok: false, message: "wire outer diameter must be above 0 mm" };
  const sorted = [...series].sort((a, b) => a.expandedMm - b.expandedMm);
  const pick =
    sorted.find((s) => sleeveFitGrade(s, wireOdMm) === "grip") ??
    sorted.find((s) => sleeveFitGrade(s, wireOdMm) === "slide-only");
  if (!pick) {
    const first = sorted[0];
    const last = sorted[sorted.length - 1];
    if (first && wireOdMm <= first.recoveredMm) {
      return {
        ok: false,
        message: `a ${fmt(wireOdMm)} mm wire is thinner than the smallest sleeve recovers to (${fmt(first.recoveredMm)} mm)`,
      };
    }
    if (last && last.expandedMm < wireOdMm * (1 + SLEEVE_FIT_RULES.slideOnMarginPct / 100)) {
      return {
        ok: false,
        message: `no sleeve in the series slides over a ${fmt(wireOdMm)} mm wire with margin`,
      };
    }
    return { ok: false, message: `no sleeve in the series fits a ${fmt(wireOdMm)} mm wire` };
  }
  const grade = sleeveFitGrade(pick, wireOdMm) === "grip" ? "grip" : "slide-only";
  return {
    ok: true,
    choice: {
      sleeve: pick,
      grade,
      wireOdMm,
      layFlatMm: layFlatWidthMm(pick.expandedMm),
      circumferentialScale: Math.max(wireOdMm, pick.recoveredMm) / pick.expandedMm,
    },
  };
}

function fmt(mm: number): string {
  return String(Number(mm.toFixed(2)));
}

/** NEC Chapter 9 Table 8 overall diameters of stranded copper (7 strands), in mm (electrical.md §1). */
export const NEC_TABLE_8_STRANDED_OD_MM: Readonly<Record<number, number>> = {
  18: 1.17,
  16: 1.47,
  14: 1.85,
  12: 2.34,
  10: 2.95,
  8: 3.71,
  6: 4.67,
  4: 5.89,
  2: 7.42,
};

/**
 * Overall diameter of a concentric-lay stranded conductor with the same copper area as a solid wire of
 * diameter d: 7 strands span 3 strand diameters, 19 strands span 5 (strand d = d/√n).
 */
export function concentricLayOdMm(solidDiameterMm: number, strands: 7 | 19): number {
  const across = strands === 7 ? 3 : 5;
  return (across * solidDiameterMm) / Math.sqrt(strands);
}

export interface ConductorOdEstimate {
  odMm: number;
  source: "nec-table-8" | "concentric-lay";
}

/** Stranded conductor OD: NEC Table 8 where it lists the size, else concentric-lay geometry (19 strands from 1 AWG up, as Table 8 does). */
export function strandedConductorOdMm(g: Gauge): ConductorOdEstimate {
  if (g.system === "awg") {
    const listed = NEC_TABLE_8_STRANDED_OD_MM[g.awg];
    if (listed !== undefined) return { odMm: listed, source: "nec-table-8" };
    return {
      odMm: concentricLayOdMm(awgDiameterMm(g.awg), g.awg <= 1 ? 19 : 7),
      source: "concentric-lay",
    };
  }
  const solidMm = Math.sqrt((4 * g.mm2) / Math.PI);
  return { odMm: concentricLayOdMm(solidMm, g.mm2 > 35 ? 19 : 7), source: "concentric-lay" };
}

/**
 * Insulation wall in mm for an OD estimate. Known specs use the typical walls of electrical.md §8 (one maker's
 * data, defaults only); anything else gets a wall by conductor size (common practice).
 */
export function insulationWallMm(insulation: string | null, g: Gauge): number {
  const spec = (insulation ?? "").toUpperCase().replace(/[\s-]/g, "");
  const awg = g.system === "awg" ? g.awg : null;
  if (spec.includes("TXL")) return awg === 12 ? 0.46 : awg === 10 ? 0.5 : awg === 8 ? 0.55 : 0.4;
  if (spec.includes("GXL")) return awg === 12 ? 0.66 : awg === 10 ? 0.79 : awg === 8 ? 0.94 : 0.58;
  if (spec.includes("UL1007")) return 0.41;
  if (spec.includes("UL1015")) return awg === 8 ? 1.14 : 0.79;
  const areaMm2 = gaugeAreaMm2(g);
  if (areaMm2 <= 1.4) return 0.4;
  if (areaMm2 <= 5.5) return 0.6;
  if (areaMm2 <= 22) return 0.9;
  return 1.3;
}

export interface WireOd {
  odMm: number;
  /** True when the OD was estimated from gauge and insulation rather than given by the wire type. */
  estimated: boolean;
  note: string;
}

/** The wire's outer diameter: the wire type's own figure when known, else stranded conductor OD + 2 × wall. */
export function wireOuterDiameter(input: {
  outerDiameterMm?: number | null;
  gauge: string;
  insulation?: string | null;
}): WireOd | null {
  if (input.outerDiameterMm != null && input.outerDiameterMm > 0) {
    return { odMm: input.outerDiameterMm, estimated: false, note: "outer diameter from the wire type" };
  }
  const parsed = parseGauge(input.gauge);
  if (!parsed.ok) return null;
  const conductor = strandedConductorOdMm(parsed.gauge);
  const wallMm = insulationWallMm(input.insulation ?? null, parsed.gauge);
  const odMm = conductor.odMm + 2 * wallMm;
  const basis = conductor.source === "nec-table-8" ? "NEC Ch. 9 Table 8 stranded OD" : "concentric-lay OD";
  return { odMm, estimated: true, note: `estimated: ${basis} + 2 × ${wallMm} mm wall` };
}
