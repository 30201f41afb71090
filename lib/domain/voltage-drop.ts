// Voltage drop of a run: loop resistance (run + return path), drop in volts and percent, and its limit by class.

import { conductorResistance, DEFAULT_CONDUCTOR, type ConductorOptions } from "./conductors";
import { type Gauge } from "./gauge";
import { type DropClass } from "./types";

export type Verdict = "pass" | "warn" | "fail";

const VERDICT_RANK: Record<Verdict, number> = { pass: 0, warn: 1, fail: 2 };

export function worstVerdict(verdicts: Iterable<Verdict>): Verdict {
  let worst: Verdict = "pass";
  for (const v of verdicts) if (VERDICT_RANK[v] > VERDICT_RANK[worst]) worst = v;
  return worst;
}

/** Three significant figures for reason text: 4.12, 0.0361, 250; large values as whole numbers. */
export function formatForText(x: number): string {
  if (!Number.isFinite(x)) return "—";
  // Plain rounding where it gives three figures: toPrecision is slow when run for thousands of reasons.
  const a = Math.abs(x);
  if (a >= 100) return String(Math.round(x));
  if (a >= 10) return String(Math.round(x * 10) / 10);
  if (a >= 1) return String(Math.round(x * 100) / 100);
  return String(Number(x.toPrecision(3)));
}

/** ABYC E-11 K for copper in Ω·cmil/ft, used in CM = K × I × L / E (L = round-trip length in feet). */
export const ABYC_K_COPPER = 10.75;

/** Minimum conductor area in circular mils for an allowed drop, the ABYC E-11 way: CM = K·I·L/E. */
export function abycCircularMils(
  currentA: number,
  loopLengthFt: number,
  allowedDropV: number,
  k: number = ABYC_K_COPPER,
): number {
  return (k * currentA * loopLengthFt) / allowedDropV;
}

/** SI form of the same rule: A_min = ρ × L_loop × I / V_allowed (ρ in Ω·mm²/m, L in m → mm²). */
export function minAreaMm2ForDrop(
  currentA: number,
  loopLengthM: number,
  allowedDropV: number,
  rhoOhmMm2PerM: number,
): number {
  return (rhoOhmMm2PerM * loopLengthM * currentA) / allowedDropV;
}

export interface DropLimit {
  limitPct: number;
  /** What the limit applies to, for reason text: "critical circuits". */
  appliesTo: string;
  /** The rule the limit comes from: "ABYC E-11", "common practice", "project setting". */
  rule: string;
}

/** Drop limits by class: 3 % and 10 % from ABYC E-11, 5 % for motor power as common practice. */
export const DROP_LIMITS: Record<Exclude<DropClass, "custom">, DropLimit> = {
  critical: { limitPct: 3, appliesTo: "critical circuits", rule: "ABYC E-11" },
  standard: { limitPct: 10, appliesTo: "standard circuits", rule: "ABYC E-11" },
  motor: { limitPct: 5, appliesTo: "motor circuits", rule: "common practice" },
};

export type DropLimitResult =
  { ok: true; limit: DropLimit } | { ok: false; limit: DropLimit; message: string };

/** The limit for a run's class; a custom class without a usable percent falls back to the strictest (3 %). */
export function dropLimitFor(dropClass: DropClass, customPct: number | null): DropLimitResult {
  if (dropClass !== "custom") return { ok: true, limit: DROP_LIMITS[dropClass] };
  if (customPct !== null && Number.isFinite(customPct) && customPct > 0) {
    return { ok: true, limit: { limitPct: customPct, appliesTo: "this run", rule: "custom limit" } };
  }
  return {
    ok: false,
    limit: DROP_LIMITS.critical,
    message: "Custom drop class without a drop limit: the 3 % critical-circuit limit (ABYC E-11) is used",
  };
}

/** Our own rule: a drop above this fraction of its limit warns, so a run close to the limit gets a look. */
export const DROP_WARN_FRACTION = 0.8;

export interface DropResult {
  dropV: number;
  dropPct: number;
}

export function voltageDrop(currentA: number, loopResistanceOhm: number, supplyV: number): DropResult {
  const dropV = currentA * loopResistanceOhm;
  return { dropV, dropPct: (dropV / supplyV) * 100 };
}

export interface Judgement {
  verdict: Verdict;
  text: string;
}

/** Pass, warn (above 80 % of the limit, our rule) or fail (above the limit). */
export function judgeDrop(dropPct: number, limit: DropLimit, what = "Drop"): Judgement {
  const pct = formatForText(dropPct);
  const lim = `${formatForText(limit.limitPct)} % limit for ${limit.appliesTo} (${limit.rule})`;
  if (dropPct > limit.limitPct) return { verdict: "fail", text: `${what} ${pct} % exceeds the ${lim}` };
  if (dropPct > DROP_WARN_FRACTION * limit.limitPct) {
    return {
      verdict: "warn",
      text: `${what} ${pct} % is above ${DROP_WARN_FRACTION * 100} % of the ${lim}; warn band is our own rule`,
    };
  }
  return { verdict: "pass", text: `${what} ${pct} % is within the ${lim}` };
}

/** One conductor of a loop: its size and length. */
export interface ConductorLeg {
  gauge: Gauge;
  lengthMm: number;
}

/** Where the current comes back: a conductor (same size, or a named return run) or a fixed resistance. */
export type ReturnPath = { kind: "conductor"; leg: ConductorLeg } | { kind: "fixed"; ohm: number };

export interface LoopResistance {
  supplyOhm: number;
  returnOhm: number;
  loopResistanceOhm: number;
  /** True when the return is a conductor whose I²R loss belongs to this loop. */
  returnIsConductor: boolean;
}

export function legResistanceOhm(
  leg: ConductorLeg,
  tempC: number,
  opts: ConductorOptions = DEFAULT_CONDUCTOR,
): number {
  return conductorResistance(leg.gauge, tempC, opts).ohmPerM * (leg.lengthMm / 1000);
}

/** Loop resistance = the run's conductor plus its return path, at the conductor temperature. */
export function loopResistance(
  supply: ConductorLeg,
  ret: ReturnPath,
  tempC: number,
  opts: ConductorOptions = DEFAULT_CONDUCTOR,
): LoopResistance {
  const supplyOhm = legResistanceOhm(supply, tempC, opts);
  const returnOhm = ret.kind === "conductor" ? legResistanceOhm(ret.leg, tempC, opts) : ret.ohm;
  return {
    supplyOhm,
    returnOhm,
    loopResistanceOhm: supplyOhm + returnOhm,
    returnIsConductor: ret.kind === "conductor",
  };
}
