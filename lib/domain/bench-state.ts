// Bench states and test results: who may move a run from one state to another, and the tests a run can record.
import { ohmPerM } from "./conductors";
import { parseGauge } from "./gauge";
import type { BenchState } from "./types";

export const TEST_KINDS = ["continuity", "insulation"] as const;
export type TestKind = (typeof TEST_KINDS)[number];

/** The unit a test's value is given in: end-to-end conductor resistance in Ω, insulation resistance in MΩ. */
export const TEST_UNITS: Record<TestKind, string> = { continuity: "Ω", insulation: "MΩ" };
export const TEST_LABELS: Record<TestKind, string> = { continuity: "Continuity", insulation: "Insulation" };

/** Setting one of these states records a test result: tested = pass, failed = fail. */
export const TEST_STATES: readonly BenchState[] = ["tested", "failed"];
/** What a builder records at the bench. */
export const BUILDER_STATES: readonly BenchState[] = ["planned", "cut", "marked", "terminated"];
/** What a technician records; `terminated` undoes a test state that was set by mistake. */
export const TECHNICIAN_STATES: readonly BenchState[] = ["terminated", "tested", "failed"];
/** Where a failed run goes back to: `planned` to cut a new wire, `cut` to rework the ends of the same wire. */
export const BACK_TO_BENCH_STATES: readonly BenchState[] = ["planned", "cut"];

export type StateRole = "lead" | "builder" | "technician";

export function isTestState(s: BenchState): boolean {
  return TEST_STATES.includes(s);
}

/** States a role may ever set, whatever the run's current state (used before the run is read). */
export function statesRoleMaySet(role: StateRole): readonly BenchState[] {
  if (role === "builder") return BUILDER_STATES;
  if (role === "technician") return [...TECHNICIAN_STATES, ...BACK_TO_BENCH_STATES];
  return ["planned", "cut", "marked", "terminated", "tested", "failed"];
}

/**
 * Why `role` may not move a run from `from` to `to`, or null when it may. The lead may make any change; a builder
 * never moves a run that has a test result (tested or failed); a technician records test states, and sends only a
 * failed run back to the bench.
 */
export function stateChangeRefusal(role: StateRole, from: BenchState, to: BenchState): string | null {
  if (role === "lead") return null;
  if (!statesRoleMaySet(role).includes(to)) return `Your role may not set a run to "${to}".`;
  if (role === "builder") {
    return isTestState(from)
      ? `This run is ${from}: the technician or the lead sends it back to the bench.`
      : null;
  }
  if (!TECHNICIAN_STATES.includes(to) && from !== "failed") {
    return `Only a failed run can be sent back to the bench as "${to}"; this one is ${from}.`;
  }
  return null;
}

/** A test value with its unit, e.g. "0.042 Ω" or "550 MΩ". */
export function formatTestValue(kind: TestKind, value: number | null): string {
  if (value === null) return "no value";
  return `${String(Number(value.toPrecision(4)))} ${TEST_UNITS[kind]}`;
}

/**
 * What a continuity reading of the conductor alone should be near: its resistance over the cut length at 20 °C
 * (a bench at room temperature), from the conductor tables. Null when the gauge cannot be read.
 */
export function expectedContinuityOhm(gauge: string, cutLengthMm: number, tempC = 20): number | null {
  const g = parseGauge(gauge);
  if (!g.ok || !(cutLengthMm > 0)) return null;
  return ohmPerM(g.gauge, tempC) * (cutLengthMm / 1000);
}
