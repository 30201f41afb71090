// Spool-planner benchmark: generated triplet, uniform and harness-like instances; the planner against
// first-fit decreasing, the known optimum or the proven lower bound, time and peak memory.
// Run: npx tsx bench/spool-plan.ts [--quick] [--family=t|u|h]

import { harnessInstance, tripletInstance, uniformInstance, type Instance } from "@/bench/instances";
import { firstFitDecreasing, planSpools } from "@/lib/domain/spool-plan";

interface Row {
  name: string;
  cuts: number;
  spools: number;
  costCents: number;
  lowerBoundCents: number;
  optimumSpools: number | null;
  /** Lower bound in spools, for single-put-up (bin-packing) instances. */
  boundSpools: number | null;
  ffdSpools: number;
  ffdCostCents: number;
  ms: number;
  limitMs: number | undefined;
}

let peakRssMb = 0;
function sampleRss(): void {
  peakRssMb = Math.max(peakRssMb, process.memoryUsage().rss / 1e6);
}

async function runOne(inst: Instance, timeLimitMs: number | undefined): Promise<Row> {
  const t0 = performance.now();
  const options = timeLimitMs === undefined ? inst.options : { ...inst.options, timeLimitMs };
  const plan = await planSpools(inst.cuts, inst.stock, options);
  const ms = performance.now() - t0;
  sampleRss();
  const ffd = firstFitDecreasing(inst.cuts, inst.stock, inst.options);
  if (plan.unplaced.length !== ffd.unplaced.length) throw new Error(`${inst.name}: unplaced cuts differ`);
  if (plan.costCents > ffd.costCents) throw new Error(`${inst.name}: planner costlier than FFD`);
  return {
    name: inst.name,
    cuts: inst.cuts.length,
    spools: plan.spoolCount,
    costCents: plan.costCents,
    lowerBoundCents: plan.lowerBoundCents,
    optimumSpools: inst.optimumSpools,
    boundSpools:
      inst.capacityMm !== null && inst.stock[0] ? plan.lowerBoundCents / inst.stock[0].costCents : null,
    ffdSpools: ffd.spoolCount,
    ffdCostCents: ffd.costCents,
    ms,
    limitMs: timeLimitMs,
  };
}

const mean = (xs: number[]): number => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : 0);
const pct = (a: number, b: number): number => (b > 0 ? ((a - b) / b) * 100 : 0);
const f2 = (x: number): string => x.toFixed(2);

function reportBins(family: string, rows: Row[]): void {
  const byOpt = rows.every((r) => r.optimumSpools !== null);
  const ref = (r: Row): number => (byOpt ? r.optimumSpools! : (r.boundSpools ?? 0));
  const gaps = rows.map((r) => pct(r.spools, ref(r)));
  const ffdGaps = rows.map((r) => pct(r.ffdSpools, ref(r)));
  const over = rows.map((r) => r.spools - ref(r));
  const ms = rows.map((r) => r.ms);
  console.log(
    `${family.padEnd(6)} n=${String(rows.length).padStart(2)}  spools ${String(rows.reduce((s, r) => s + r.spools, 0)).padStart(5)}` +
      `  ${byOpt ? "optimum" : "bound  "} ${String(rows.reduce((s, r) => s + ref(r), 0)).padStart(5)}` +
      `  mean gap ${f2(mean(gaps)).padStart(5)} %  max over ${Math.max(...over)}  at ref ${over.filter((o) => o === 0).length}/${rows.length}` +
      `  | FFD spools ${String(rows.reduce((s, r) => s + r.ffdSpools, 0)).padStart(5)} mean gap ${f2(mean(ffdGaps)).padStart(5)} %` +
      `  | time mean ${mean(ms).toFixed(0)} ms max ${Math.max(...ms).toFixed(0)} ms (limit ${rows[0]?.limitMs ?? "default"})`,
  );
}

function reportCost(family: string, rows: Row[]): void {
  const gaps = rows.map((r) => pct(r.costCents, r.lowerBoundCents));
  const ffdGaps = rows.map((r) => pct(r.ffdCostCents, r.lowerBoundCents));
  const ms = rows.map((r) => r.ms);
  const money = (c: number): string => `$${(c / 100).toFixed(2)}`;
  console.log(
    `${family.padEnd(10)} n=${String(rows.length).padStart(2)}  cost ${money(mean(rows.map((r) => r.costCents))).padStart(9)}` +
      `  bound ${money(mean(rows.map((r) => r.lowerBoundCents))).padStart(9)}  mean gap ${f2(mean(gaps)).padStart(5)} %  max gap ${f2(Math.max(...gaps)).padStart(5)} %` +
      `  spools ${mean(rows.map((r) => r.spools)).toFixed(1)}` +
      `  | FFD cost ${money(mean(rows.map((r) => r.ffdCostCents))).padStart(9)} gap ${f2(mean(ffdGaps)).padStart(5)} % spools ${mean(rows.map((r) => r.ffdSpools)).toFixed(1)}` +
      `  | time mean ${mean(ms).toFixed(0)} ms max ${Math.max(...ms).toFixed(0)} ms`,
  );
}

async function main(): Promise<void> {
  const quick = process.argv.includes("--quick");
  const family = process.argv.find((a) => a.startsWith("--family="))?.slice(9) ?? "tuh";
  const perSize = quick ? 3 : 20;
  // Time limits per plan: bigger bin-packing instances get more (the planner stops early once optimal).
  const tripletLimitMs: Record<number, number> = { 60: 3000, 120: 3000, 249: 6000, 501: 10000 };
  const uniformLimitMs = 3000;
  console.log(
    `spool-plan benchmark${quick ? " (quick)" : ""}: ${perSize} instances per size, seeds 1…${perSize}`,
  );

  if (family.includes("t")) {
    console.log(
      "\nFalkenauer-style triplets (capacity 1000 mm, no end discard; optimum known by construction)",
    );
    for (const n of [60, 120, 249, 501]) {
      const rows: Row[] = [];
      for (let s = 1; s <= perSize; s++) rows.push(await runOne(tripletInstance(n, s), tripletLimitMs[n]));
      reportBins(`t${n}`, rows);
    }
  }
  if (family.includes("u")) {
    console.log("\nFalkenauer-style uniform (items 200–1000 mm, capacity 1500 mm; gap to the lower bound)");
    for (const n of [120, 250, 500]) {
      const rows: Row[] = [];
      for (let s = 1; s <= perSize; s++) rows.push(await runOne(uniformInstance(n, s), uniformLimitMs));
      reportBins(`u${n}`, rows);
    }
  }
  if (family.includes("h")) {
    console.log(
      "\nHarness-like jobs (8 wire types, put-ups 25–1000 ft, remnants; default options, gap to the bound)",
    );
    const jobs: [string, number, number][] = [
      ["150 cuts", 50, 3],
      ["500 cuts", 50, 10],
      ["2000 cuts", 80, 25],
    ];
    for (const [label, runs, builds] of jobs) {
      const rows: Row[] = [];
      for (let s = 1; s <= (quick ? 3 : 10); s++)
        rows.push(await runOne(harnessInstance(runs, builds, s), undefined));
      reportCost(label, rows);
    }
  }
  sampleRss();
  console.log(`\npeak RSS ${peakRssMb.toFixed(0)} MB (sampled after each plan)`);
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
