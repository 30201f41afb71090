// A project's bench progress: runs counted per state, overall and per wire type (gauge + colour + insulation).
import { gaugeAreaMm2 } from "./conductors";
import { parseGauge } from "./gauge";
import { BENCH_STATES, type BenchState } from "./types";

export type StateCounts = Record<BenchState, number>;

/** One group of runs with the same wire type and state. */
export interface ProgressRow {
  gauge: string;
  colour: string;
  insulation: string | null;
  state: BenchState;
  count: number;
}

export interface WireTypeProgress {
  /** "18 AWG RD PVC" */
  label: string;
  gauge: string;
  colour: string;
  insulation: string | null;
  total: number;
  byState: StateCounts;
  /** Runs built at the bench (terminated, tested or failed), in percent of the wire type's runs. */
  builtPct: number;
  /** Runs that passed their test, in percent. */
  testedPct: number;
}

export interface ProjectProgress {
  total: number;
  byState: StateCounts;
  builtPct: number;
  testedPct: number;
  wireTypes: WireTypeProgress[];
}

const BUILT: readonly BenchState[] = ["terminated", "tested", "failed"];

export function emptyCounts(): StateCounts {
  return { planned: 0, cut: 0, marked: 0, terminated: 0, tested: 0, failed: 0 };
}

function pct(part: number, whole: number): number {
  return whole === 0 ? 0 : (part / whole) * 100;
}

function shares(byState: StateCounts, total: number) {
  const built = BUILT.reduce((s, k) => s + byState[k], 0);
  return { builtPct: pct(built, total), testedPct: pct(byState.tested, total) };
}

/** Larger conductors first (as a cut list reads), then colour and insulation; unreadable gauges last. */
function areaOf(gauge: string): number {
  const g = parseGauge(gauge);
  return g.ok ? gaugeAreaMm2(g.gauge) : -1;
}

export function summariseProgress(rows: readonly ProgressRow[]): ProjectProgress {
  const byState = emptyCounts();
  const types = new Map<string, WireTypeProgress>();
  for (const r of rows) {
    if (!BENCH_STATES.includes(r.state)) continue;
    byState[r.state] += r.count;
    const key = `${r.gauge}\u0000${r.colour}\u0000${r.insulation ?? ""}`;
    let t = types.get(key);
    if (!t) {
      t = {
        label: [r.gauge, r.colour, r.insulation].filter(Boolean).join(" "),
        gauge: r.gauge,
        colour: r.colour,
        insulation: r.insulation,
        total: 0,
        byState: emptyCounts(),
        builtPct: 0,
        testedPct: 0,
      };
      types.set(key, t);
    }
    t.byState[r.state] += r.count;
    t.total += r.count;
  }
  const wireTypes = [...types.values()]
    .map((t) => ({ ...t, ...shares(t.byState, t.total) }))
    .sort(
      (a, b) =>
        areaOf(b.gauge) - areaOf(a.gauge) ||
        a.colour.localeCompare(b.colour) ||
        (a.insulation ?? "").localeCompare(b.insulation ?? ""),
    );
  const total = BENCH_STATES.reduce((s, k) => s + byState[k], 0);
  return { total, byState, ...shares(byState, total), wireTypes };
}
