// Times computeChecks on 5,000 generated runs (seeded, so every machine times the same input).
// Run with: npx tsx bench/checks-domain.ts [runCount] [repeats]

import { performance } from "node:perf_hooks";
import { computeChecks } from "../lib/domain/checks";
import { DEFAULT_PROJECT_SETTINGS, DROP_CLASSES, type RunData } from "../lib/domain/types";

/** mulberry32: a small, well-known 32-bit seeded PRNG. */
function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const GAUGES = [
  "22 AWG",
  "20 AWG",
  "18 AWG",
  "16 AWG",
  "14 AWG",
  "12 AWG",
  "10 AWG",
  "8 AWG",
  "4 AWG",
  "1/0 AWG",
];
const METRIC = ["0.5 mm²", "0.75 mm²", "1.5 mm²", "2.5 mm²", "6 mm²", "16 mm²"];
const DEVICES = ["BT1", "F1", "MC1", "MC2", "M1", "LID1", "CAM1", "GNSS1", "DS1", "K1", "X1", "ESTOP1"];
const INSULATION_C = [null, 60, 75, 80, 90, 105, 125];

export function generateRuns(count: number, seed = 20261201): RunData[] {
  const rnd = mulberry32(seed);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
  const runs: RunData[] = [];
  for (let i = 0; i < count; i++) {
    const wireId = `HR3-${String(i + 1).padStart(5, "0")}`;
    const led = rnd() < 0.05;
    const returnRoll = rnd();
    const returnKind = returnRoll < 0.15 && i > 0 ? "run" : returnRoll < 0.25 ? "chassis" : "same";
    const dropClass = pick(DROP_CLASSES);
    runs.push({
      wireId,
      endA: `${pick(DEVICES)}:${1 + Math.floor(rnd() * 8)}`,
      endB: `${pick(DEVICES)}:${1 + Math.floor(rnd() * 8)}`,
      endATermination: "ring",
      endBTermination: "ferrule",
      endAStripMm: 6,
      endBStripMm: 8,
      circuit: rnd() < 0.1 ? "Battery main" : "Drive",
      gauge: rnd() < 0.002 ? "thick" : rnd() < 0.2 ? pick(METRIC) : pick(GAUGES),
      colour: "RD",
      insulation: null,
      insulationTempC: pick(INSULATION_C),
      bundleSize: rnd() < 0.5 ? null : 1 + Math.floor(rnd() * 30),
      hotSpace: rnd() < 0.1,
      routedLengthMm: 100 + Math.floor(rnd() * 8000),
      currentA: led ? null : rnd() < 0.1 ? null : Math.round(rnd() * 600) / 10,
      peakCurrentA: rnd() < 0.2 ? Math.round(rnd() * 3000) / 10 : null,
      supplyV: rnd() < 0.1 ? 12 : null,
      dropClass,
      dropLimitPct: dropClass === "custom" ? 1 + Math.floor(rnd() * 8) : null,
      fuseA: rnd() < 0.3 ? null : pick([3, 5, 7.5, 10, 15, 20, 25, 30, 40, 60, 80, 100]),
      returnKind,
      returnRunWireId:
        returnKind === "run" ? `HR3-${String(1 + Math.floor(rnd() * i)).padStart(5, "0")}` : null,
      returnResistanceOhm: returnKind === "chassis" && rnd() < 0.8 ? Math.round(rnd() * 50) / 1000 : null,
      ledForwardV: led ? pick([1.8, 2.1, 3.0, 3.2]) : null,
      ledCurrentA: led ? pick([0.005, 0.01, 0.02]) : null,
      notes: null,
    });
  }
  return runs;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

function main(): void {
  const count = Number(process.argv[2] ?? 5000);
  const repeats = Number(process.argv[3] ?? 11);
  const runs = generateRuns(count);
  computeChecks(runs, DEFAULT_PROJECT_SETTINGS); // warm-up (JIT)
  const timesMs: number[] = [];
  // CPU time (all threads of this process, GC helpers included) is steadier than wall time on a busy machine.
  const cpuMs: number[] = [];
  let last = computeChecks(runs, DEFAULT_PROJECT_SETTINGS);
  for (let r = 0; r < repeats; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    last = computeChecks(runs, DEFAULT_PROJECT_SETTINGS);
    timesMs.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpuMs.push((c.user + c.system) / 1000);
  }
  const s = last.summary;
  console.log(`computeChecks: ${count} runs, ${repeats} timed repeats after one warm-up`);
  console.log(
    `wall: median ${median(timesMs).toFixed(1)} ms, min ${Math.min(...timesMs).toFixed(1)} ms, max ${Math.max(...timesMs).toFixed(1)} ms`,
  );
  console.log(`cpu:  median ${median(cpuMs).toFixed(1)} ms, min ${Math.min(...cpuMs).toFixed(1)} ms`);
  console.log(
    `verdicts: ${s.pass} pass, ${s.warn} warn, ${s.fail} fail; no current ${s.noCurrent}; total loss ${s.totalLossW.toFixed(1)} W`,
  );
}

main();
