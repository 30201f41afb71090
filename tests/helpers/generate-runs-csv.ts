// Seeded generator of realistic Harrow-3 harness runs (our own demo data) and of run-list CSV files for benchmarks.

import { pathToFileURL } from "node:url";
import { runsToCsv } from "@/lib/export/runs";
import type { RunData } from "@/lib/domain/types";

/** mulberry32: a small, well-known 32-bit PRNG; the same seed always gives the same sequence. */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface Device {
  ref: string;
  pins: number;
}

// Cedar Flats Robotics' Harrow-3 orchard mower (invented): pack, fusing, drives, deck, mast, beacon, charge port.
const DEVICES: Device[] = [
  { ref: "BAT1", pins: 2 },
  { ref: "F1", pins: 2 },
  { ref: "FB1", pins: 12 },
  { ref: "K1", pins: 4 },
  { ref: "MC1", pins: 8 },
  { ref: "MC2", pins: 8 },
  { ref: "MC3", pins: 8 },
  { ref: "DM1", pins: 3 },
  { ref: "DM2", pins: 3 },
  { ref: "MD1", pins: 3 },
  { ref: "ECU1", pins: 40 },
  { ref: "ES1", pins: 4 },
  { ref: "LID1", pins: 6 },
  { ref: "CAM1", pins: 4 },
  { ref: "GNSS1", pins: 4 },
  { ref: "BCN1", pins: 6 },
  { ref: "LED1", pins: 2 },
  { ref: "LED2", pins: 2 },
  { ref: "CP1", pins: 3 },
  { ref: "GND1", pins: 10 },
];

const CIRCUITS = [
  "pack +",
  "pack −",
  "left drive motor +",
  "right drive motor +",
  "deck motor phase U",
  "e-stop loop",
  "lidar 24 V feed",
  "camera power",
  "GNSS antenna power",
  "status beacon green",
  "charge port +",
  "controller CAN-H",
  "controller CAN-L",
];

const TERMS = [
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
const COLOURS = ["RD", "BK", "BU", "BN", "GNYE", "WH", "YE", "OG", "VT", "GY", "RDBU", "WHBU", "BKWH"];
const INSULATION = ["TXL", "GXL", "PVC", "silicone", null] as const;
const TEMPS = [80, 90, 105, 125, 150, 200] as const;
/** Gauge bands by current: thick for the drive path, thin for signals (our own choice of realistic sizes). */
const GAUGE_BY_BAND = [
  ["22 AWG", "20 AWG", "0.5 mm²", "0.75 mm²"],
  ["18 AWG", "16 AWG", "1 mm²", "1.5 mm²"],
  ["14 AWG", "12 AWG", "2.5 mm²", "4 mm²"],
  ["10 AWG", "8 AWG", "6 mm²", "10 mm²"],
  ["4 AWG", "2 AWG", "1/0 AWG", "2/0 AWG", "25 mm²", "35 mm²"],
] as const;
/** Currents in tenths of an ampere per band. */
const CURRENT_DECI_A = [
  [1, 20],
  [20, 80],
  [80, 250],
  [250, 600],
  [600, 2000],
] as const;
/** Common blade and bolt-down fuse ratings in amperes; a run gets the first at least 125 % of its current. */
const FUSES_A = [1, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 40, 50, 60, 80, 100, 125, 150, 200, 250, 300];
/** Return resistances in mΩ (as typed in a "Return resistance (mΩ)" column). */
const RETURN_MOHM = ["1", "1.5", "2", "3", "5"];

/** Number(`${x}e${exp}`) is exactly what the import's decimal parser yields, so generated data round-trips. */
function scaled(x: string, exp: number): number {
  return Number(`${x}e${exp}`);
}

export function generateRuns(n: number, seed = 1): RunData[] {
  const rnd = mulberry32(seed);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
  const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const width = Math.max(3, String(n).length);
  const id = (i: number) => `HR3-${String(i).padStart(width, "0")}`;
  const end = () => {
    const d = pick(DEVICES);
    return `${d.ref}:${int(1, d.pins)}`;
  };
  const runs: RunData[] = [];
  for (let i = 1; i <= n; i++) {
    const band = int(0, GAUGE_BY_BAND.length - 1);
    const [lo, hi] = CURRENT_DECI_A[band]!;
    const deci = int(lo, hi);
    const currentA = deci / 10;
    const hasCurrent = rnd() < 0.85;
    const returnKind = pick(["same", "same", "run", "chassis"] as const);
    const endA = end();
    let endB = end();
    if (endB === endA) endB = `${endA.split(":")[0]}:${Number(endA.split(":")[1]) + 1}`;
    const dropClass = pick(["standard", "standard", "critical", "motor", "custom"] as const);
    const led = rnd() < 0.05;
    runs.push({
      wireId: id(i),
      endA,
      endB,
      endATermination: rnd() < 0.9 ? pick(TERMS) : null,
      endBTermination: rnd() < 0.9 ? pick(TERMS) : null,
      endAStripMm: rnd() < 0.7 ? int(3, 12) : null,
      endBStripMm: rnd() < 0.7 ? int(3, 12) : null,
      circuit: rnd() < 0.8 ? pick(CIRCUITS) : null,
      gauge: pick(GAUGE_BY_BAND[band]!),
      colour: pick(COLOURS),
      insulation: pick(INSULATION),
      insulationTempC: rnd() < 0.7 ? pick(TEMPS) : null,
      bundleSize: rnd() < 0.5 ? int(1, 12) : null,
      hotSpace: rnd() < 0.1,
      routedLengthMm: int(80, 6000),
      currentA: hasCurrent ? currentA : null,
      peakCurrentA: hasCurrent && rnd() < 0.3 ? (deci * int(2, 5)) / 10 : null,
      supplyV: rnd() < 0.2 ? pick([12, 24, 48]) : null,
      dropClass,
      dropLimitPct: dropClass === "custom" ? pick([2, 3, 5, 7.5]) : null,
      fuseA: hasCurrent && rnd() < 0.6 ? (FUSES_A.find((f) => f >= currentA * 1.25) ?? null) : null,
      returnKind,
      returnRunWireId: returnKind === "run" ? id(i === 1 ? 2 : i - 1) : null,
      returnResistanceOhm: returnKind === "chassis" && rnd() < 0.7 ? scaled(pick(RETURN_MOHM), -3) : null,
      ledForwardV: led ? pick([1.8, 2.1, 3.2]) : null,
      ledCurrentA: led ? scaled(pick(["10", "15", "20"]), -3) : null,
      notes:
        rnd() < 0.15
          ? pick([
              "route behind the deck guard",
              'tie to frame, "P-clip" at 300 mm',
              "check polarity, then heat-shrink",
              "=spare; do not cut",
              "spare\nsecond line",
            ])
          : null,
    });
  }
  return runs;
}

/** Headers as a person might write them; each maps to a field through matchHeaders. */
const HUMAN_HEADERS = [
  "Wire ID",
  "From",
  "To",
  "Term A",
  "Term B",
  "Strip A (mm)",
  "Strip B (mm)",
  "Circuit",
  "Gauge",
  "Colour",
  "Insulation",
  "Temp (°C)",
  "Bundle",
  "Hot",
  "Length (m)",
  "Current (A)",
  "Peak (A)",
  "Supply (V)",
  "Drop class",
  "Drop limit (%)",
  "Fuse (A)",
  "Return",
  "Return run",
  "Return resistance (mΩ)",
  "LED Vf",
  "LED current (mA)",
  "Notes",
];

function csvCell(s: string): string {
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

function num(x: number | null, shift = 0): string {
  if (x === null) return "";
  // Shift the decimal point in text so 0.0015 Ω is written "1.5" (mΩ) without floating-point noise.
  return shift === 0 ? String(x) : String(Number(`${x}e${shift}`));
}

/** The runs as a person's CSV: human headers, lengths in metres, LED current in mA, resistance in mΩ. */
export function runsToHumanCsv(runs: readonly RunData[]): string {
  const lines = [HUMAN_HEADERS.join(",")];
  for (const r of runs) {
    const cells = [
      r.wireId,
      r.endA,
      r.endB,
      r.endATermination ?? "",
      r.endBTermination ?? "",
      num(r.endAStripMm),
      num(r.endBStripMm),
      r.circuit ?? "",
      r.gauge,
      r.colour,
      r.insulation ?? "",
      num(r.insulationTempC),
      num(r.bundleSize),
      r.hotSpace ? "yes" : "no",
      num(r.routedLengthMm, -3),
      num(r.currentA),
      num(r.peakCurrentA),
      num(r.supplyV),
      r.dropClass,
      num(r.dropLimitPct),
      num(r.fuseA),
      r.returnKind,
      r.returnRunWireId ?? "",
      num(r.returnResistanceOhm, 3),
      num(r.ledForwardV),
      num(r.ledCurrentA, 3),
      // A leading "=" would be read as a formula by a spreadsheet; a person would not type it like that.
      (r.notes ?? "").replace(/^=/, "'="),
    ];
    lines.push(cells.map(csvCell).join(","));
  }
  return lines.join("\r\n") + "\r\n";
}

/** A valid N-row run-list CSV. `style` "canonical" is what our export writes; "human" is hand-made headers. */
export function generateRunsCsv(n: number, seed = 1, style: "canonical" | "human" = "human"): string {
  const runs = generateRuns(n, seed);
  return style === "canonical" ? runsToCsv(runs) : runsToHumanCsv(runs);
}

// npx tsx tests/helpers/generate-runs-csv.ts 10000 [seed] [human|canonical] > runs.csv
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const n = Number(process.argv[2] ?? 10_000);
  const seed = Number(process.argv[3] ?? 1);
  const style = process.argv[4] === "canonical" ? "canonical" : "human";
  process.stdout.write(generateRunsCsv(n, seed, style));
}
