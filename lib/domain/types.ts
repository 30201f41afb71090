// Plain data shapes shared by the domain modules: a run and a project's settings, with units in the names.

export const BENCH_STATES = ["planned", "cut", "marked", "terminated", "tested", "failed"] as const;
export type BenchState = (typeof BENCH_STATES)[number];

export const DROP_CLASSES = ["critical", "standard", "motor", "custom"] as const;
export type DropClass = (typeof DROP_CLASSES)[number];

export const RETURN_KINDS = ["same", "run", "chassis"] as const;
export type ReturnKind = (typeof RETURN_KINDS)[number];

export const TERMINATIONS = [
  "ring",
  "fork",
  "ferrule",
  "pin",
  "socket",
  "spade",
  "butt-splice",
  "solder",
  "lug",
  "bare",
] as const;
export type Termination = (typeof TERMINATIONS)[number];

export const GAUGE_SYSTEMS = ["awg", "metric"] as const;
export type GaugeSystem = (typeof GAUGE_SYSTEMS)[number];

/** One wire from end A to end B. Lengths in whole millimetres, currents in amperes, voltages in volts. */
export interface RunData {
  wireId: string;
  endA: string;
  endB: string;
  endATermination: string | null;
  endBTermination: string | null;
  endAStripMm: number | null;
  endBStripMm: number | null;
  circuit: string | null;
  /** Canonical label: "18 AWG", "1/0 AWG", "0.75 mm²". */
  gauge: string;
  /** IEC 60757 code: "RD", "GNYE", "RDBU". */
  colour: string;
  insulation: string | null;
  insulationTempC: number | null;
  bundleSize: number | null;
  hotSpace: boolean;
  routedLengthMm: number;
  currentA: number | null;
  peakCurrentA: number | null;
  supplyV: number | null;
  dropClass: DropClass;
  dropLimitPct: number | null;
  fuseA: number | null;
  returnKind: ReturnKind;
  returnRunWireId: string | null;
  returnResistanceOhm: number | null;
  ledForwardV: number | null;
  ledCurrentA: number | null;
  notes: string | null;
}

/** A project's settings that the computations read. */
export interface ProjectSettings {
  supplyV: number;
  conductorTempC: number;
  gaugeSystem: GaugeSystem;
  /** Service slack: max(slackPct % of routed length, slackMinMm) … */
  slackPct: number;
  slackMinMm: number;
  /** … plus this service loop at each end. */
  serviceLoopMm: number;
  /** Cut lengths are rounded up to a multiple of this step. */
  roundingMm: number;
  /** Discarded from the start of every newly opened spool. */
  endDiscardMm: number;
  /** A leftover at least this long goes back to the shelf as a remnant; shorter is scrap. */
  keepRemnantMm: number;
  /** Repeat markers along runs longer than this (null: ends only). */
  markerRepeatMm: number | null;
}

export const DEFAULT_PROJECT_SETTINGS: ProjectSettings = {
  supplyV: 24,
  conductorTempC: 60,
  gaugeSystem: "awg",
  slackPct: 5, // common practice
  slackMinMm: 50, // common practice
  serviceLoopMm: 25, // common practice
  roundingMm: 5,
  endDiscardMm: 100, // common practice
  keepRemnantMm: 1000, // common practice
  markerRepeatMm: null,
};
