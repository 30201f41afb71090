// Conductor geometry and DC resistance: AWG (ASTM B258), IEC 60228 metric sizes, IEC 60028 resistivity.

import { type Gauge } from "./gauge";

/** Millimetres per inch (exact). */
export const MM_PER_IN = 25.4;
/** Metres per foot (exact). */
export const M_PER_FT = 0.3048;
/** One circular mil in mm²: the area of a 0.001 in circle, (π/4) × 0.0254². */
export const MM2_PER_CMIL = (Math.PI / 4) * 0.0254 * 0.0254;

// ASTM B258: 36 AWG is 0.0050 in, 0000 (n = −3) is 0.4600 in, 39 geometric steps between.
const AWG36_DIAMETER_IN = 0.005;
const AWG_RATIO_BASE = 92;
const AWG_STEPS = 39;

/** Diameter of a solid round AWG wire in inches (ASTM B258 definition; m/0 as n = 1 − m). */
export function awgDiameterIn(awg: number): number {
  return AWG36_DIAMETER_IN * Math.pow(AWG_RATIO_BASE, (36 - awg) / AWG_STEPS);
}

export function awgDiameterMm(awg: number): number {
  return awgDiameterIn(awg) * MM_PER_IN;
}

/** Cross-section in circular mils: the diameter in mils, squared. */
export function awgAreaCmil(awg: number): number {
  const mils = awgDiameterIn(awg) * 1000;
  return mils * mils;
}

export function awgAreaMm2(awg: number): number {
  const d = awgDiameterMm(awg);
  return (Math.PI / 4) * d * d;
}

/** Nominal conductor cross-section of a gauge in mm². A stranded AWG conductor carries the solid wire's area. */
export function gaugeAreaMm2(g: Gauge): number {
  return g.system === "awg" ? awgAreaMm2(g.awg) : g.mm2;
}

export type ConductorMaterial = "copper" | "aluminium";

export interface MaterialResistivity {
  /** Resistivity at 20 °C in Ω·mm²/m. */
  rho20OhmMm2PerM: number;
  /** Temperature coefficient of resistance at 20 °C, per kelvin. */
  alpha20PerK: number;
}

export const RESISTIVITY: Record<ConductorMaterial, MaterialResistivity> = {
  // IEC 60028: annealed copper, 100 % IACS = 1/58 Ω·mm²/m, α20 = 0.00393 /K.
  copper: { rho20OhmMm2PerM: 0.017241, alpha20PerK: 0.00393 },
  // EC-grade aluminium at 61 % IACS, α20 = 0.00403 /K (IEC 60889, electrical.md §3).
  aluminium: { rho20OhmMm2PerM: 0.028264, alpha20PerK: 0.00403 },
};

/** Resistivity at a conductor temperature in Ω·mm²/m: ρ20 × (1 + α20 (T − 20)). */
export function resistivityAt(material: ConductorMaterial, tempC: number): number {
  const m = RESISTIVITY[material];
  return m.rho20OhmMm2PerM * (1 + m.alpha20PerK * (tempC - 20));
}

/**
 * Stranded conductors measure about 2 % above a solid wire of the same area (strand lay length).
 * From NEC Chapter 9 Table 8, whose stranded/solid ratios run 1.018–1.026 for 18–8 AWG; we take the upper
 * part of that range so that ρ/A × factor is never below a Table 8 stranded entry (conservative).
 */
export const STRANDING_FACTOR = 1.025;

/** IEC 60228 conductor classes as the resistance table groups them. */
export type IecClass = "1/2" | "5/6";

interface IecRow {
  mm2: number;
  class12: number;
  class56: number;
  class56Tinned: number;
}

// IEC 60228 maximum DC resistance at 20 °C, copper, Ω/km (electrical.md §2, three reproductions agree).
// 70, 95 and 120 mm² are from memory (not in the reference file); they are higher than ρ/A, so conservative.
const IEC_60228_ROWS: readonly IecRow[] = [
  { mm2: 0.5, class12: 36.0, class56: 39.0, class56Tinned: 40.1 },
  { mm2: 0.75, class12: 24.5, class56: 26.0, class56Tinned: 26.7 },
  { mm2: 1, class12: 18.1, class56: 19.5, class56Tinned: 20.0 },
  { mm2: 1.5, class12: 12.1, class56: 13.3, class56Tinned: 13.7 },
  { mm2: 2.5, class12: 7.41, class56: 7.98, class56Tinned: 8.21 },
  { mm2: 4, class12: 4.61, class56: 4.95, class56Tinned: 5.09 },
  { mm2: 6, class12: 3.08, class56: 3.3, class56Tinned: 3.39 },
  { mm2: 10, class12: 1.83, class56: 1.91, class56Tinned: 1.95 },
  { mm2: 16, class12: 1.15, class56: 1.21, class56Tinned: 1.24 },
  { mm2: 25, class12: 0.727, class56: 0.78, class56Tinned: 0.795 },
  { mm2: 35, class12: 0.524, class56: 0.554, class56Tinned: 0.565 },
  { mm2: 50, class12: 0.387, class56: 0.386, class56Tinned: 0.393 },
  { mm2: 70, class12: 0.268, class56: 0.272, class56Tinned: 0.277 },
  { mm2: 95, class12: 0.193, class56: 0.206, class56Tinned: 0.21 },
  { mm2: 120, class12: 0.153, class56: 0.161, class56Tinned: 0.164 },
];

/**
 * IEC 60228 maximum resistance at 20 °C in Ω/km for a copper size, or null where the size is not tabulated
 * (or for tinned class 1/2, which this table does not carry).
 */
export function iec60228MaxOhmPerKm(mm2: number, iecClass: IecClass, tinned: boolean): number | null {
  const row = IEC_60228_ROWS.find((r) => Math.abs(r.mm2 - mm2) < 1e-9);
  if (!row) return null;
  if (iecClass === "1/2") return tinned ? null : row.class12;
  return tinned ? row.class56Tinned : row.class56;
}

/**
 * IEC 60228 temperature correction factor kt: multiply a resistance measured at t °C to get its 20 °C value.
 * The tabulated factors fit 250 / (230 + t), an effective α20 of 0.004 /K.
 */
export function iec60228CorrectionFactor(tempC: number): number {
  return 250 / (230 + tempC);
}

export interface ConductorOptions {
  material: ConductorMaterial;
  /** Stranded conductor (the usual harness wire); solid otherwise. */
  stranded: boolean;
  /** IEC 60228 class assumed for metric sizes. */
  iecClass: IecClass;
  /** Tinned (coated) strands; only the IEC 60228 class 5/6 table distinguishes it. */
  tinned: boolean;
}

/** Flexible plain copper: what a harness is usually built from. */
export const DEFAULT_CONDUCTOR: ConductorOptions = {
  material: "copper",
  stranded: true,
  iecClass: "5/6",
  tinned: false,
};

export type ResistanceBasis = "iec-60228-max" | "resistivity";

export interface ConductorResistance {
  ohmPerM: number;
  ohmPerKm: number;
  basis: ResistanceBasis;
}

/**
 * DC resistance per length at a conductor temperature.
 * Tabulated IEC 60228 copper sizes use the standard's maximum (conservative), moved to temperature with its own
 * correction factor; everything else is ρ(T)/A, times the stranding factor for stranded conductors.
 */
export function conductorResistance(
  g: Gauge,
  tempC: number,
  opts: ConductorOptions = DEFAULT_CONDUCTOR,
): ConductorResistance {
  if (g.system === "metric" && opts.material === "copper") {
    const max20 = iec60228MaxOhmPerKm(g.mm2, opts.iecClass, opts.tinned);
    if (max20 !== null) {
      const ohmPerKm = max20 / iec60228CorrectionFactor(tempC);
      return { ohmPerKm, ohmPerM: ohmPerKm / 1000, basis: "iec-60228-max" };
    }
  }
  const strand = opts.stranded ? STRANDING_FACTOR : 1;
  const ohmPerM = (resistivityAt(opts.material, tempC) / gaugeAreaMm2(g)) * strand;
  return { ohmPerM, ohmPerKm: ohmPerM * 1000, basis: "resistivity" };
}

export function ohmPerM(g: Gauge, tempC: number, opts: ConductorOptions = DEFAULT_CONDUCTOR): number {
  return conductorResistance(g, tempC, opts).ohmPerM;
}

export function ohmPerKm(g: Gauge, tempC: number, opts: ConductorOptions = DEFAULT_CONDUCTOR): number {
  return conductorResistance(g, tempC, opts).ohmPerKm;
}
