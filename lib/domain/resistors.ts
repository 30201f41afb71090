// Series resistors for indicator LEDs: value rounded up to an IEC 60063 preferred number, power rating with margin.

import { formatForText, type Judgement } from "./voltage-drop";

/** IEC 60063 preferred numbers, one decade. */
export const E12 = [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82] as const;
export const E24 = [
  10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91,
] as const;

export type ESeries = "E12" | "E24";
const SERIES: Record<ESeries, readonly number[]> = { E12, E24 };

/** Standard resistor power ratings in watts (common practice). */
export const POWER_RATINGS_W = [0.125, 0.25, 0.5, 1, 2, 3, 5, 10] as const;
/** Common practice: rate a resistor at least twice what it dissipates. */
export const POWER_MARGIN = 2;

// Values this close to a preferred number count as that number (guards against 4.7 / 0.1 = 46.99999…).
const REL_EPS = 1e-9;

/** The smallest preferred value of the series that is at least `ohm`. */
export function preferredValueAtLeast(ohm: number, series: ESeries): number {
  if (!(ohm > 0) || !Number.isFinite(ohm)) throw new RangeError(`resistance must be positive, got ${ohm}`);
  const values = SERIES[series];
  let decade = Math.pow(10, Math.floor(Math.log10(ohm)) - 1);
  for (;;) {
    for (const v of values) {
      const candidate = v * decade;
      if (candidate >= ohm * (1 - REL_EPS)) return Number(candidate.toPrecision(12));
    }
    decade *= 10;
  }
}

/** The smallest standard power rating at or above `watts`, or null above the largest (10 W). */
export function powerRatingAtLeast(watts: number): number | null {
  for (const r of POWER_RATINGS_W) if (r >= watts * (1 - REL_EPS)) return r;
  return null;
}

export interface SeriesResistorInput {
  supplyV: number;
  ledForwardV: number;
  ledCurrentA: number;
  series: ESeries;
}

export type SeriesResistor =
  | {
      ok: true;
      /** (V − Vf) / I before rounding. */
      exactOhm: number;
      /** Rounded up to the series, so the current stays at or below the target. */
      ohm: number;
      currentA: number;
      dissipationW: number;
      /** Dissipation × margin, the least rating to choose. */
      requiredRatingW: number;
      /** Standard rating; null when even 10 W is not enough. */
      ratingW: number | null;
      findings: Judgement[];
    }
  | { ok: false; message: string };

export function seriesResistor(input: SeriesResistorInput): SeriesResistor {
  const { supplyV, ledForwardV, ledCurrentA, series } = input;
  if (!(ledCurrentA > 0)) return { ok: false, message: "LED current must be above 0 A" };
  const headroomV = supplyV - ledForwardV;
  if (!(headroomV > 0)) {
    return {
      ok: false,
      message: `LED forward voltage ${formatForText(ledForwardV)} V is not below the ${formatForText(supplyV)} V supply: no series resistor can set its current`,
    };
  }
  const exactOhm = headroomV / ledCurrentA;
  const ohm = preferredValueAtLeast(exactOhm, series);
  const currentA = headroomV / ohm;
  const dissipationW = currentA * currentA * ohm;
  const requiredRatingW = dissipationW * POWER_MARGIN;
  const ratingW = powerRatingAtLeast(requiredRatingW);
  const findings: Judgement[] = [];
  if (ratingW === null) {
    findings.push({
      verdict: "warn",
      text: `Series resistor dissipates ${formatForText(dissipationW)} W: more than a 10 W part with a 2× margin (common practice) can take; use a regulator or current source`,
    });
  } else {
    findings.push({
      verdict: "pass",
      text: `Series resistor ${formatForText(ohm)} Ω (${series}, IEC 60063, rounded up) dissipates ${formatForText(dissipationW)} W: use a ${formatForText(ratingW)} W part (2× margin, common practice)`,
    });
  }
  return { ok: true, exactOhm, ohm, currentA, dissipationW, requiredRatingW, ratingW, findings };
}
