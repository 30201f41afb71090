// Stock arithmetic: put-up lengths in metres and feet, price per metre, and typical insulation outer diameters.
import { parseGauge } from "@/lib/domain/gauge";

/** One international foot is exactly 0.3048 m. */
export const MM_PER_FOOT = 304.8;

export const SPOOL_STATES = ["open", "reserved", "used_up"] as const;
export type SpoolState = (typeof SPOOL_STATES)[number];

export const CONDUCTOR_MATERIALS = ["copper", "aluminium"] as const;
export type ConductorMaterial = (typeof CONDUCTOR_MATERIALS)[number];

/** The currency a put-up gets when none is given: the demo and most AWG price lists are in US dollars. */
export const DEFAULT_CURRENCY = "USD";

export function mmToMetres(mm: number): number {
  return mm / 1000;
}

export function mmToFeet(mm: number): number {
  return mm / MM_PER_FOOT;
}

/** Whole millimetres from feet (rounded to the nearest mm; 100 ft = 30 480 mm exactly). */
export function feetToMm(ft: number): number {
  return Math.round(ft * MM_PER_FOOT);
}

export function metresToMm(m: number): number {
  return Math.round(m * 1000);
}

/** Price per metre in (fractional) cents of the put-up's currency. */
export function pricePerMetreCents(priceCents: number, nominalLengthMm: number): number {
  if (nominalLengthMm <= 0) throw new Error("a put-up length must be positive");
  return (priceCents * 1000) / nominalLengthMm;
}

type Spec = "UL1007" | "UL1015" | "TXL" | "GXL";

/**
 * Typical finished outer diameter in mm by spec and AWG: one maker's published nominal values as condensed in
 * the project's electrical reference §8. Defaults for a new wire type only; real products vary by 0.1–0.2 mm,
 * so the lead measures or takes the maker's sheet when it matters.
 */
const TYPICAL_OD_MM: Record<Spec, Partial<Record<number, number>>> = {
  UL1007: { 24: 1.45, 22: 1.6, 20: 1.85, 18: 2.1, 16: 2.4 },
  UL1015: { 24: 2.2, 22: 2.4, 20: 2.5, 18: 2.75, 16: 3.1, 14: 3.5, 12: 4.0, 10: 5.1, 8: 6.5 },
  TXL: { 24: 1.4, 22: 1.6, 20: 1.8, 18: 2.0, 16: 2.3, 14: 2.6, 12: 3.2, 10: 3.9, 8: 4.8 },
  GXL: { 20: 2.15, 18: 2.4, 16: 2.7, 14: 3.0, 12: 3.6, 10: 4.5, 8: 5.6 },
};

function specOf(insulation: string): Spec | null {
  const s = insulation.toUpperCase().replace(/\s+/g, "");
  if (/UL-?1007/.test(s)) return "UL1007";
  if (/UL-?1015/.test(s)) return "UL1015";
  if (/(^|[^A-Z])TXL/.test(s)) return "TXL";
  if (/(^|[^A-Z])GXL/.test(s)) return "GXL";
  return null;
}

/** A default outer diameter for a gauge and insulation spec, or null when the table has none. */
export function typicalOuterDiameterMm(gauge: string, insulation: string | null): number | null {
  if (!insulation) return null;
  const spec = specOf(insulation);
  const g = parseGauge(gauge);
  if (!spec || !g.ok || g.gauge.system !== "awg") return null;
  return TYPICAL_OD_MM[spec][g.gauge.awg] ?? null;
}
