// Cut length of a run: routed length + service slack + per-end service loop and termination allowance, rounded up.

import { TERMINATIONS, type ProjectSettings, type RunData, type Termination } from "./types";

/**
 * Length added at one end for its termination kind, in mm. Our rule (common practice, no published source): it
 * covers the conductor inside the terminal plus a reserve to cut off and re-terminate the end, which FAA
 * AC 43.13-1B par. 11-118 asks for ("slack for two re-terminations"); heavy lugs need more, a butt splice inside
 * the bundle less. The terminal maker's drawing, when there is one, takes precedence.
 */
export const END_ALLOWANCE_MM: Readonly<Record<Termination, number>> = {
  ring: 25,
  fork: 25,
  spade: 25,
  lug: 40,
  ferrule: 20,
  pin: 20,
  socket: 20,
  solder: 20,
  bare: 15,
  "butt-splice": 10,
};

/** Allowance for an end whose termination is blank or not one of TERMINATIONS (common practice). */
export const UNSPECIFIED_END_ALLOWANCE_MM = 20;

/** Terminations that sit inside the bundle, where no service loop is left (common practice). */
const NO_SERVICE_LOOP: ReadonlySet<Termination> = new Set<Termination>(["butt-splice"]);

export interface EndAllowance {
  termination: Termination | null;
  /** The table allowance for the termination kind. */
  terminationAllowanceMm: number;
  /** The strip length given for this end, if any. */
  stripMm: number | null;
  /** What is added at this end for the termination: max(table allowance, strip length). */
  allowanceMm: number;
  serviceLoopMm: number;
}

export interface CutLengthBreakdown {
  routedLengthMm: number;
  /** max(slackPct % of routed, slackMinMm); may be fractional before rounding. */
  slackMm: number;
  slackRule: "percent" | "minimum";
  endA: EndAllowance;
  endB: EndAllowance;
  /** Service loops at both ends together. */
  serviceLoopMm: number;
  /** Termination allowances at both ends together. */
  endAllowanceMm: number;
  /** routed + slack + service loops + end allowances, before rounding. */
  unroundedMm: number;
  roundingMm: number;
  /** What rounding up to the roundingMm step added. */
  roundingAddedMm: number;
  /** Whole millimetres, a multiple of roundingMm, never shorter than routedLengthMm. */
  cutLengthMm: number;
}

function asTermination(kind: string | null): Termination | null {
  if (kind === null) return null;
  const k = kind.trim().toLowerCase();
  return (TERMINATIONS as readonly string[]).includes(k) ? (k as Termination) : null;
}

function nonNegative(name: string, v: number): number {
  if (!Number.isFinite(v) || v < 0) throw new RangeError(`${name} must be a finite number ≥ 0, got ${v}`);
  return v;
}

function endAllowance(kind: string | null, stripMm: number | null, serviceLoopMm: number): EndAllowance {
  const termination = asTermination(kind);
  const terminationAllowanceMm = termination ? END_ALLOWANCE_MM[termination] : UNSPECIFIED_END_ALLOWANCE_MM;
  const strip = stripMm === null ? null : nonNegative("strip length", stripMm);
  // The strip is part of the conductor inside the terminal, so it is not added on top of the allowance; but
  // the allowance is never less than the strip, so a long strip (a large lug) still cannot make the wire short.
  const allowanceMm = Math.max(terminationAllowanceMm, strip ?? 0);
  return {
    termination,
    terminationAllowanceMm,
    stripMm: strip,
    allowanceMm,
    serviceLoopMm: termination && NO_SERVICE_LOOP.has(termination) ? 0 : serviceLoopMm,
  };
}

/**
 * The project's cut-length rule with its breakdown. Rounds UP to the rounding step: the plus-only length
 * tolerance of IPC/WHMA-A-620 Table 11-1 means a cut may be long but never short.
 */
export function cutLengthBreakdown(
  routedLengthMm: number,
  endAStripMm: number | null,
  endBStripMm: number | null,
  endATermination: string | null,
  endBTermination: string | null,
  settings: Pick<ProjectSettings, "slackPct" | "slackMinMm" | "serviceLoopMm" | "roundingMm">,
): CutLengthBreakdown {
  if (!Number.isFinite(routedLengthMm) || routedLengthMm <= 0) {
    throw new RangeError(`routed length must be a finite number > 0 mm, got ${routedLengthMm}`);
  }
  const slackPct = nonNegative("slackPct", settings.slackPct);
  const slackMinMm = nonNegative("slackMinMm", settings.slackMinMm);
  const loopMm = nonNegative("serviceLoopMm", settings.serviceLoopMm);
  // A step below 1 mm would give fractional cut lengths; lengths are whole millimetres.
  const roundingMm = Math.max(1, Math.round(nonNegative("roundingMm", settings.roundingMm)));

  // routed × pct / 100, in that order, keeps whole-number inputs exact in binary floating point.
  const pctSlack = (routedLengthMm * slackPct) / 100;
  const slackRule = pctSlack >= slackMinMm ? "percent" : "minimum";
  const slackMm = Math.max(pctSlack, slackMinMm);
  const endA = endAllowance(endATermination, endAStripMm, loopMm);
  const endB = endAllowance(endBTermination, endBStripMm, loopMm);
  const serviceLoopMm = endA.serviceLoopMm + endB.serviceLoopMm;
  const endAllowanceMm = endA.allowanceMm + endB.allowanceMm;
  const unroundedMm = routedLengthMm + slackMm + serviceLoopMm + endAllowanceMm;
  // The tiny epsilon keeps 1340.0000000000002 (a floating-point artefact) from jumping a whole step.
  const steps = Math.ceil(unroundedMm / roundingMm - 1e-9);
  const cutLengthMm = Math.max(steps * roundingMm, Math.ceil(routedLengthMm / roundingMm) * roundingMm);
  return {
    routedLengthMm,
    slackMm,
    slackRule,
    endA,
    endB,
    serviceLoopMm,
    endAllowanceMm,
    unroundedMm,
    roundingMm,
    roundingAddedMm: cutLengthMm - unroundedMm,
    cutLengthMm,
  };
}

/** The cut length in whole millimetres (see cutLengthBreakdown for the parts). */
export function cutLengthMm(
  routedLengthMm: number,
  endAStripMm: number | null,
  endBStripMm: number | null,
  endATermination: string | null,
  endBTermination: string | null,
  settings: Pick<ProjectSettings, "slackPct" | "slackMinMm" | "serviceLoopMm" | "roundingMm">,
): number {
  return cutLengthBreakdown(
    routedLengthMm,
    endAStripMm,
    endBStripMm,
    endATermination,
    endBTermination,
    settings,
  ).cutLengthMm;
}

/** Cut length of a run under a project's settings. */
export function runCutLengthMm(
  run: Pick<
    RunData,
    "routedLengthMm" | "endAStripMm" | "endBStripMm" | "endATermination" | "endBTermination"
  >,
  settings: Pick<ProjectSettings, "slackPct" | "slackMinMm" | "serviceLoopMm" | "roundingMm">,
): number {
  return cutLengthMm(
    run.routedLengthMm,
    run.endAStripMm,
    run.endBStripMm,
    run.endATermination,
    run.endBTermination,
    settings,
  );
}

/**
 * Plus tolerance on a finished wire length, in mm, per IPC/WHMA-A-620 Table 11-1 (used unless the drawing says
 * otherwise; the minus tolerance is always 0): ≤ 0.3 m +25 mm; ≤ 1.5 m +50 mm; ≤ 3 m +100 mm; ≤ 7.5 m +150 mm;
 * beyond, +5 %.
 */
export function lengthTolerancePlusMm(lengthMm: number): number {
  if (!Number.isFinite(lengthMm) || lengthMm <= 0)
    throw new RangeError(`length must be > 0 mm, got ${lengthMm}`);
  if (lengthMm <= 300) return 25;
  if (lengthMm <= 1500) return 50;
  if (lengthMm <= 3000) return 100;
  if (lengthMm <= 7500) return 150;
  return (lengthMm * 5) / 100;
}
