// Overcurrent protection of a run: does its fuse protect the wire, and is a battery-sourced run protected at all.

import { type Gauge } from "./gauge";
import { formatForText, type Judgement } from "./voltage-drop";

/**
 * How a run's fuse relates to its wire:
 * - ok: not above the derated ampacity (and at least 125 % of the load when a current is given);
 * - next-size: above the ampacity but within the ABYC E-11 150 % next-size allowance (non-motor loads only);
 * - oversized: above what the wire may be protected by: the wire can overheat before the fuse opens;
 * - undersized: below 125 % of the load current, so it may open in normal use;
 * - none: no fuse listed on this run;
 * - not-checked: no ampacity to compare with, or the rating is not a positive number.
 */
export const FUSE_VERDICTS = ["ok", "next-size", "oversized", "undersized", "none", "not-checked"] as const;
export type FuseVerdict = (typeof FUSE_VERDICTS)[number];

/** ABYC E-11: the next standard rating above the ampacity is allowed up to this multiple, non-motor loads only. */
export const NEXT_SIZE_MAX_FACTOR = 1.5;
/** Common practice: a fuse at least 125 % of the continuous load, so it does not open in normal use. */
export const FUSE_MIN_LOAD_FACTOR = 1.25;
/** ABYC E-11: protection within 7 in (177.8 mm) of the source connection. */
export const SOURCE_PROTECTION_MAX_MM = 178;

/** NEC 240.4(D) small-conductor caps for copper, after derating (advisory for building wire). */
const NEC_240_4_D_CAP_A: ReadonlyMap<number, number> = new Map([
  [18, 7],
  [16, 10],
  [14, 15],
  [12, 20],
  [10, 30],
]);

export function nec2404dCapA(g: Gauge): number | null {
  return g.system === "awg" ? (NEC_240_4_D_CAP_A.get(g.awg) ?? null) : null;
}

// IEEE 315 class letter BT (BT, BT1, BT-2) or a BAT… designator (BAT, BAT1, BATT, BATTERY); a trailing +/−
// terminal mark is allowed. "BTN1" (a button) is deliberately not a battery.
const BATTERY_DEVICE = /^(?:BT|BAT\w*?)[-_]?\d*[+-]?$/i;
const BATTERY_CIRCUIT = /\bbatt(?:ery|eries)?\b/i;

/** The device part of a `device:pin` reference. */
export function deviceOf(reference: string): string {
  const i = reference.indexOf(":");
  return (i < 0 ? reference : reference.slice(0, i)).trim();
}

/**
 * Our heuristic for "this run is fed straight from a battery": either end's device is a battery designator
 * (IEEE 315 class letter BT, or a name starting with BAT), or the circuit name mentions a battery.
 */
export function isBatterySourced(run: { endA: string; endB: string; circuit: string | null }): boolean {
  if (BATTERY_DEVICE.test(deviceOf(run.endA)) || BATTERY_DEVICE.test(deviceOf(run.endB))) return true;
  return run.circuit !== null && BATTERY_CIRCUIT.test(run.circuit);
}

export interface FuseInput {
  fuseA: number | null;
  /** Derated ampacity of the wire; null when it could not be found. */
  ampacityA: number | null;
  currentA: number | null;
  /** Motor loads get no next-size allowance. We treat drop class "motor" as a motor load. */
  motorLoad: boolean;
  batterySourced: boolean;
  gauge: Gauge | null;
}

export interface FuseJudgement {
  fuseVerdict: FuseVerdict;
  findings: Judgement[];
}

const SOURCE_RULE =
  "within 7 in (178 mm) of the battery terminal (ABYC E-11; 40 in if sheathed, 72 in if sheathed and taken directly from the terminal)";

export function judgeFuse(input: FuseInput): FuseJudgement {
  const { fuseA, ampacityA, currentA } = input;
  const findings: Judgement[] = [];

  if (fuseA === null) {
    if (input.batterySourced) {
      findings.push({
        verdict: "warn",
        text: `No fuse listed on a battery-sourced run: protect it ${SOURCE_RULE}`,
      });
    } else {
      findings.push({
        verdict: "pass",
        text: "No fuse listed on this run: it must be protected upstream by a device not above its ampacity (ABYC E-11)",
      });
    }
    return { fuseVerdict: "none", findings };
  }

  if (!(fuseA > 0) || !Number.isFinite(fuseA)) {
    findings.push({
      verdict: "warn",
      text: `Fuse rating ${String(fuseA)} A is not a positive number: not checked`,
    });
    return { fuseVerdict: "not-checked", findings };
  }

  const f = formatForText(fuseA);
  let fuseVerdict: FuseVerdict;
  if (ampacityA === null) {
    fuseVerdict = "not-checked";
    findings.push({
      verdict: "warn",
      text: `Fuse ${f} A not checked: the wire has no ampacity to compare with`,
    });
  } else {
    const a = formatForText(ampacityA);
    const allowance = NEXT_SIZE_MAX_FACTOR * ampacityA;
    if (fuseA <= ampacityA) {
      fuseVerdict = "ok";
      findings.push({
        verdict: "pass",
        text: `Fuse ${f} A is not above the wire's ${a} A ampacity (ABYC E-11)`,
      });
    } else if (fuseA <= allowance && !input.motorLoad) {
      fuseVerdict = "next-size";
      findings.push({
        verdict: "warn",
        text: `Fuse ${f} A is above the wire's ${a} A ampacity; ABYC E-11 §11.10 allows only the next standard rating up, at most 150 % (${formatForText(allowance)} A), for non-motor loads: confirm it is that rating`,
      });
    } else {
      fuseVerdict = "oversized";
      const beyond = input.motorLoad
        ? `the wire's ${a} A ampacity, and motor loads get no next-size allowance`
        : `the wire's ${a} A ampacity and its 150 % next-size allowance of ${formatForText(allowance)} A`;
      findings.push({
        verdict: "fail",
        text: `Fuse ${f} A exceeds ${beyond} (ABYC E-11 §11.10): the wire can overheat before the fuse opens`,
      });
    }
  }

  if (currentA !== null && currentA > 0 && fuseA < FUSE_MIN_LOAD_FACTOR * currentA) {
    const i = formatForText(currentA);
    const what =
      fuseA < currentA
        ? `below the ${i} A load current, so it will open in normal use`
        : `below 125 % of the ${i} A load`;
    findings.push({
      verdict: "warn",
      text: `Fuse ${f} A is ${what} (common practice: fuse at least 125 % of a continuous load)`,
    });
    if (fuseVerdict === "ok") fuseVerdict = "undersized";
  }

  const cap = input.gauge ? nec2404dCapA(input.gauge) : null;
  if (cap !== null && fuseA > cap) {
    findings.push({
      verdict: "pass",
      text: `Advisory: fuse ${f} A is above the ${cap} A NEC 240.4(D) small-conductor cap for this size (building-wire rule, not applied to the verdict)`,
    });
  }

  if (input.batterySourced) {
    findings.push({ verdict: "pass", text: `Battery-sourced run: place its fuse ${SOURCE_RULE}` });
  }
  return { fuseVerdict, findings };
}
