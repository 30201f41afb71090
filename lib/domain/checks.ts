// A project's electrical checks: per run drop, ampacity, protection, loss, suggested gauge and series resistor.

import {
  ampacityMarginPct,
  baseAmpacity,
  bundleFactor,
  DEFAULT_INSULATION_TEMP_C,
  deratedAmpacity,
  ENGINE_SPACE_FACTORS,
  judgeAmpacity,
  USCG_TEMP_COLUMNS_C,
  uscgColumnFor,
  type AmpacityResult,
} from "./ampacity";
import { DEFAULT_CONDUCTOR, gaugeAreaMm2, ohmPerM, type ConductorOptions } from "./conductors";
import { formatGauge, METRIC_SIZES_MM2, parseGauge, type Gauge } from "./gauge";
import { isBatterySourced, judgeFuse, type FuseVerdict } from "./protection";
import { seriesResistor, type ESeries } from "./resistors";
import { type ProjectSettings, type RunData } from "./types";
import {
  dropLimitFor,
  formatForText,
  judgeDrop,
  voltageDrop,
  type DropLimit,
  type Judgement,
  type Verdict,
} from "./voltage-drop";

export type { Verdict } from "./voltage-drop";
export type { FuseVerdict } from "./protection";

export type CheckTopic =
  "input" | "return" | "drop" | "peak-drop" | "ampacity" | "fuse" | "gauge" | "resistor";

/** One line of a run's checks: what it is about, how it judges, and the text naming the rule. */
export interface Finding {
  readonly topic: CheckTopic;
  readonly verdict: Verdict;
  readonly text: string;
}

/** A run's checks, with the canonical field names of PRODUCT.md §6 and a few more for the screens. */
export interface RunChecks {
  wireId: string;
  /** Canonical label of the run's gauge, or null when it cannot be read. */
  gauge: string | null;
  /** The current the checks used: the run's current, else its LED current. */
  currentA: number | null;
  supplyV: number;
  loopResistanceOhm: number | null;
  dropV: number | null;
  dropPct: number | null;
  dropLimitPct: number;
  /** dropPct as a percent of its limit (100 = at the limit). */
  dropOfLimitPct: number | null;
  peakDropV: number | null;
  peakDropPct: number | null;
  /** Derated allowed continuous current. */
  ampacityA: number | null;
  /** Ampacity left at the run's current, in percent of the ampacity (negative when over). */
  ampacityMarginPct: number | null;
  fuseVerdict: FuseVerdict;
  batterySourced: boolean;
  /** I²R loss in the run's conductor and, where the return is a conductor, in the return conductor too. */
  lossW: number | null;
  /** Smallest gauge of the project's system that passes drop, ampacity and fuse together. */
  suggestedGauge: string | null;
  seriesResistorOhm: number | null;
  /** Standard power rating to fit (2× margin). */
  seriesResistorW: number | null;
  seriesResistorDissipationW: number | null;
  seriesResistorCurrentA: number | null;
  verdict: Verdict;
  /** One line each, naming the rule; fails first, then warnings, then passes. */
  reasons: string[];
  /** The same lines with their topic and verdict, in the same order. */
  findings: Finding[];
}

export interface WorstDropRun {
  wireId: string;
  dropPct: number;
  dropLimitPct: number;
  dropOfLimitPct: number;
  verdict: Verdict;
}

export interface ChecksSummary {
  runCount: number;
  pass: number;
  warn: number;
  fail: number;
  /** Runs without a current: their drop, ampacity margin and loss were not computed. */
  noCurrent: number;
  totalLossW: number;
  worstByDrop: WorstDropRun[];
}

export interface ChecksResult {
  /** Keyed by wire ID (the first run when an ID repeats). */
  runs: Record<string, RunChecks>;
  /** Every run in input order, duplicates included. */
  list: RunChecks[];
  summary: ChecksSummary;
  cautions: string[];
}

export interface ChecksOptions {
  conductor: ConductorOptions;
  resistorSeries: ESeries;
  /** How many runs the summary lists as worst by drop. */
  worstCount: number;
}

export const DEFAULT_CHECKS_OPTIONS: ChecksOptions = {
  conductor: DEFAULT_CONDUCTOR,
  resistorSeries: "E12",
  worstCount: 10,
};

export const CHECKS_CAUTIONS: readonly string[] = [
  "These checks are guidance that follows the published rules they name (ABYC E-11, 33 CFR 183.425, IEC 60228, IEC 60028, NEC Chapter 9 Table 8); local codes, the equipment maker's ratings and licensed practice take precedence.",
  "Undersized wire and fuses larger than the wire can carry can overheat and start fires: do not build a run that fails ampacity or protection as listed.",
  "A battery can deliver hundreds to thousands of amperes into a fault: protect every battery-sourced run within 7 in (178 mm) of the battery terminal (ABYC E-11), with a fuse whose interrupt rating suits the battery.",
  "Bundle derating is applied at every voltage, also below 50 V where the USCG guideline does not require it (conservative); engine-space factors are approximate.",
];

const NO_CURRENT_TEXT = "No current given: drop, ampacity margin and loss not checked";

// Sizes a suggestion may pick: the ones sold as harness and battery wire (odd AWG sizes are rarely stocked).
const AWG_CANDIDATES: readonly number[] = [
  30, 28, 26, 24, 22, 20, 18, 16, 14, 12, 10, 8, 6, 4, 2, 1, 0, -1, -2, -3,
];

/** A gauge read once per computeChecks call, with what every run of that gauge needs. */
interface GaugeInfo {
  gauge: Gauge;
  label: string;
  /** Conductor resistance at the project's conductor temperature. */
  ohmPerM: number;
  /** Undereated Table 5 ampacity per column of USCG_TEMP_COLUMNS_C (0 where there is none). */
  baseA: readonly number[];
}

type GaugeLookup = { ok: true; info: GaugeInfo } | { ok: false; message: string };

function gaugeInfo(g: Gauge, settings: ProjectSettings, opts: ConductorOptions): GaugeInfo {
  const areaMm2 = gaugeAreaMm2(g);
  return {
    gauge: g,
    label: formatGauge(g),
    ohmPerM: ohmPerM(g, settings.conductorTempC, opts),
    baseA: USCG_TEMP_COLUMNS_C.map((c) => baseAmpacity(areaMm2, c)?.ampacityA ?? 0),
  };
}

function suggestionCandidates(settings: ProjectSettings, opts: ConductorOptions): GaugeInfo[] {
  const gauges: Gauge[] =
    settings.gaugeSystem === "awg"
      ? AWG_CANDIDATES.map((awg) => ({ system: "awg", awg }))
      : METRIC_SIZES_MM2.map((mm2) => ({ system: "metric", mm2 }));
  return gauges.map((g) => gaugeInfo(g, settings, opts));
}

interface RunContext {
  settings: ProjectSettings;
  opts: ChecksOptions;
  lookupGauge: (s: string) => GaugeLookup;
  ampacity: (info: GaugeInfo, run: RunData) => AmpacityResult;
  byId: ReadonlyMap<string, RunData>;
  idCount: ReadonlyMap<string, number>;
  returnOf: ReadonlyMap<string, string[]>;
  candidates: readonly GaugeInfo[];
}

function memo<K, V>(compute: (k: K) => V): (k: K) => V {
  const cache = new Map<K, V>();
  return (k) => {
    let v = cache.get(k);
    if (v === undefined) {
      v = compute(k);
      cache.set(k, v);
    }
    return v;
  };
}

/** Runs every electrical check for a project's runs. Pure; linear in the number of runs. */
export function computeChecks(
  runs: readonly RunData[],
  settings: ProjectSettings,
  options: Partial<ChecksOptions> = {},
): ChecksResult {
  const opts: ChecksOptions = { ...DEFAULT_CHECKS_OPTIONS, ...options };

  const lookupGauge = memo((s: string): GaugeLookup => {
    const p = parseGauge(s);
    return p.ok ? { ok: true, info: gaugeInfo(p.gauge, settings, opts.conductor) } : p;
  });
  // Runs share few (gauge, insulation, bundle, hot space) combinations; each is derated, with its notes, once.
  const ampacityCache = new Map<GaugeInfo, Map<number | null, Map<number, AmpacityResult[]>>>();
  const ampacity = (info: GaugeInfo, run: RunData): AmpacityResult => {
    let byInsulation = ampacityCache.get(info);
    if (!byInsulation) ampacityCache.set(info, (byInsulation = new Map()));
    let byBundle = byInsulation.get(run.insulationTempC);
    if (!byBundle) byInsulation.set(run.insulationTempC, (byBundle = new Map()));
    // Keyed by the bundle's derating factor: every size in one USCG bracket derates (and reads) the same.
    const bundle = run.bundleSize ?? 1;
    const factor = bundleFactor(bundle);
    let pair = byBundle.get(factor);
    if (!pair) byBundle.set(factor, (pair = []));
    const slot = run.hotSpace ? 1 : 0;
    return (pair[slot] ??= deratedAmpacity({
      gauge: info.gauge,
      insulationTempC: run.insulationTempC,
      bundleSize: bundle,
      hotSpace: run.hotSpace,
    }));
  };

  // One pass to index runs: first occurrence per wire ID, counts for duplicates, and who uses whom as return.
  const byId = new Map<string, RunData>();
  const idCount = new Map<string, number>();
  const returnOf = new Map<string, string[]>();
  for (const r of runs) {
    if (!byId.has(r.wireId)) byId.set(r.wireId, r);
    idCount.set(r.wireId, (idCount.get(r.wireId) ?? 0) + 1);
    if (r.returnKind === "run" && r.returnRunWireId) {
      const users = returnOf.get(r.returnRunWireId);
      if (users) users.push(r.wireId);
      else returnOf.set(r.returnRunWireId, [r.wireId]);
    }
  }

  const ctx: RunContext = {
    settings,
    opts,
    lookupGauge,
    ampacity,
    byId,
    idCount,
    returnOf,
    candidates: suggestionCandidates(settings, opts.conductor),
  };

  const list: RunChecks[] = [];
  // A null-prototype object: any wire ID is a safe key, and it is quicker to fill than a literal.
  const byWireId = Object.create(null) as Record<string, RunChecks>;
  let totalLossW = 0;
  for (const run of runs) {
    const { checks, totalContributionW } = checkRun(run, ctx);
    list.push(checks);
    if (!(checks.wireId in byWireId)) byWireId[checks.wireId] = checks;
    totalLossW += totalContributionW;
  }

  return {
    runs: byWireId,
    list,
    summary: summarise(list, totalLossW, opts.worstCount),
    cautions: cautionsFor(list),
  };
}

/** The return path of a loop. "run" and "chassis" have a fixed resistance; "same" follows the run's gauge. */
type LoopReturn =
  | { kind: "same" }
  | { kind: "run"; ohm: number; countedElsewhere: boolean }
  | { kind: "chassis"; ohm: number };

function positive(x: number | null): x is number {
  return x !== null && Number.isFinite(x) && x > 0;
}

function validLength(mm: number): boolean {
  return Number.isFinite(mm) && mm >= 0;
}

function resolveReturn(run: RunData, ctx: RunContext, add: (f: Finding) => void): LoopReturn {
  if (run.returnKind === "chassis") {
    const ohm = run.returnResistanceOhm;
    if (ohm === null || !Number.isFinite(ohm) || ohm < 0) {
      add({
        topic: "return",
        verdict: "warn",
        text: "Chassis return without a return resistance: only the insulated conductor is counted, so the drop is understated",
      });
      return { kind: "chassis", ohm: 0 };
    }
    add({
      topic: "return",
      verdict: "pass",
      text: `Chassis return: ${formatForText(ohm)} Ω added to the loop as entered`,
    });
    return { kind: "chassis", ohm };
  }
  if (run.returnKind !== "run") return { kind: "same" };

  const id = run.returnRunWireId;
  const fallback = (why: string): LoopReturn => {
    add({
      topic: "return",
      verdict: "warn",
      text: `${why}: the return is taken as the same gauge and length as this run`,
    });
    return { kind: "same" };
  };
  if (!id) return fallback('Return kind is "run" but no return run is named');
  const ret = ctx.byId.get(id);
  if (!ret) return fallback(`Return run ${id} is not in this project`);
  if (ret.wireId === run.wireId) return fallback("The run names itself as its return");
  const g = ctx.lookupGauge(ret.gauge);
  if (!g.ok) return fallback(`Return run ${id} has a gauge that cannot be read`);
  if (!validLength(ret.routedLengthMm)) return fallback(`Return run ${id} has no valid length`);
  add({
    topic: "return",
    verdict: "pass",
    text: `Return through run ${id} (${g.info.label}, ${formatForText(ret.routedLengthMm)} mm)`,
  });
  return {
    kind: "run",
    ohm: g.info.ohmPerM * (ret.routedLengthMm / 1000),
    // A return run with a current of its own has its loss in its own row: the total must not count it twice.
    countedElsewhere: positive(ret.currentA) || (ret.currentA === null && positive(ret.ledCurrentA)),
  };
}

function checkRun(run: RunData, ctx: RunContext): { checks: RunChecks; totalContributionW: number } {
  const { settings, opts } = ctx;
  // Findings go straight into three buckets so the output order needs no sort.
  const fails: Finding[] = [];
  const warns: Finding[] = [];
  const passes: Finding[] = [];
  const add = (f: Finding): void => {
    (f.verdict === "fail" ? fails : f.verdict === "warn" ? warns : passes).push(f);
  };
  const addJudgement = (topic: CheckTopic, j: Judgement): void =>
    add({ topic, verdict: j.verdict, text: j.text });

  const supplyV = run.supplyV ?? settings.supplyV;
  const supplyOk = Number.isFinite(supplyV) && supplyV > 0;
  if (!supplyOk) {
    add({
      topic: "input",
      verdict: "warn",
      text: `Supply voltage ${String(supplyV)} V is not positive: drop percent not computed`,
    });
  }

  const dup = ctx.idCount.get(run.wireId) ?? 1;
  if (dup > 1) {
    add({
      topic: "input",
      verdict: "fail",
      text: `Wire ID ${run.wireId} appears ${dup} times in the project: IDs must be unique`,
    });
  }

  const users = ctx.returnOf.get(run.wireId);
  if (users) {
    add({
      topic: "return",
      verdict: "pass",
      text: `Serves as the return conductor of ${users.join(", ")}; counted in that loop`,
    });
  }

  // The current the checks use: the run's own, else the LED current it carries.
  let currentA: number | null = null;
  if (run.currentA !== null) {
    if (Number.isFinite(run.currentA) && run.currentA >= 0) currentA = run.currentA;
    else
      add({
        topic: "input",
        verdict: "warn",
        text: `Current ${String(run.currentA)} A is not valid: ignored`,
      });
  } else if (positive(run.ledCurrentA)) {
    currentA = run.ledCurrentA;
    add({
      topic: "input",
      verdict: "pass",
      text: `No current given: the LED current ${formatForText(currentA)} A is used`,
    });
  }
  if (currentA === null) add({ topic: "input", verdict: "pass", text: NO_CURRENT_TEXT });

  const limitResult = dropLimitFor(run.dropClass, run.dropLimitPct);
  if (!limitResult.ok) add({ topic: "drop", verdict: "warn", text: limitResult.message });
  const limit = limitResult.limit;

  const lengthOk = validLength(run.routedLengthMm);
  if (!lengthOk) {
    add({
      topic: "input",
      verdict: "fail",
      text: `Routed length ${String(run.routedLengthMm)} mm is not a valid length: drop not computed`,
    });
  }

  const g = ctx.lookupGauge(run.gauge);
  const info = g.ok ? g.info : null;
  if (!g.ok) add({ topic: "input", verdict: "fail", text: `Gauge cannot be read: ${g.message}` });

  const ret = lengthOk ? resolveReturn(run, ctx, add) : null;

  let loopResistanceOhm: number | null = null;
  let dropV: number | null = null;
  let dropPct: number | null = null;
  let peakDropV: number | null = null;
  let peakDropPct: number | null = null;
  let lossW: number | null = null;
  let totalContributionW = 0;
  if (info && ret) {
    // Loop resistance = the run + its return path (electrical.md §5: the round trip).
    const supplyOhm = info.ohmPerM * (run.routedLengthMm / 1000);
    const returnOhm = ret.kind === "same" ? supplyOhm : ret.ohm;
    loopResistanceOhm = supplyOhm + returnOhm;
    if (currentA !== null) {
      const i2 = currentA * currentA;
      // Conductor loss only: a chassis return is not a harness conductor.
      const returnLossW = ret.kind === "chassis" ? 0 : i2 * returnOhm;
      lossW = i2 * supplyOhm + returnLossW;
      totalContributionW = ret.kind === "run" && ret.countedElsewhere ? lossW - returnLossW : lossW;
      if (supplyOk) {
        const d = voltageDrop(currentA, loopResistanceOhm, supplyV);
        dropV = d.dropV;
        dropPct = d.dropPct;
        addJudgement("drop", judgeDrop(d.dropPct, limit));
      }
    }
    if (positive(run.peakCurrentA) && supplyOk) {
      const d = voltageDrop(run.peakCurrentA, loopResistanceOhm, supplyV);
      peakDropV = d.dropV;
      peakDropPct = d.dropPct;
      addJudgement("peak-drop", judgePeakDrop(d.dropPct, run.peakCurrentA, limit));
    }
  }

  let ampacityA: number | null = null;
  let marginPct: number | null = null;
  if (info) {
    const amp = ctx.ampacity(info, run);
    if (amp.ok) {
      ampacityA = amp.ampacityA;
      for (const note of amp.notes) add({ topic: "ampacity", verdict: "pass", text: note });
      if (currentA !== null) {
        marginPct = ampacityMarginPct(currentA, amp.ampacityA);
        addJudgement("ampacity", judgeAmpacity(currentA, amp.ampacityA));
      }
    } else {
      add({ topic: "ampacity", verdict: "fail", text: amp.message });
    }
  }

  const batterySourced = isBatterySourced(run);
  const fuse = judgeFuse({
    fuseA: run.fuseA,
    ampacityA,
    currentA,
    motorLoad: run.dropClass === "motor",
    batterySourced,
    gauge: info ? info.gauge : null,
  });
  for (const f of fuse.findings) addJudgement("fuse", f);

  const suggestedGauge = suggestGauge(run, ret, currentA, limit, supplyV, ctx, add);

  let seriesResistorOhm: number | null = null;
  let seriesResistorW: number | null = null;
  let seriesResistorDissipationW: number | null = null;
  let seriesResistorCurrentA: number | null = null;
  if (run.ledForwardV !== null || run.ledCurrentA !== null) {
    if (run.ledForwardV === null || run.ledCurrentA === null) {
      add({
        topic: "resistor",
        verdict: "warn",
        text: "Series resistor needs both the LED forward voltage and the LED current",
      });
    } else {
      const r = seriesResistor({
        supplyV,
        ledForwardV: run.ledForwardV,
        ledCurrentA: run.ledCurrentA,
        series: opts.resistorSeries,
      });
      if (r.ok) {
        seriesResistorOhm = r.ohm;
        seriesResistorW = r.ratingW;
        seriesResistorDissipationW = r.dissipationW;
        seriesResistorCurrentA = r.currentA;
        for (const f of r.findings) addJudgement("resistor", f);
      } else {
        add({ topic: "resistor", verdict: "warn", text: r.message });
      }
    }
  }

  const findings = fails.concat(warns, passes);
  const reasons = new Array<string>(findings.length);
  for (let i = 0; i < findings.length; i++) reasons[i] = findings[i]!.text;

  const checks: RunChecks = {
    wireId: run.wireId,
    gauge: info ? info.label : null,
    currentA,
    supplyV,
    loopResistanceOhm,
    dropV,
    dropPct,
    dropLimitPct: limit.limitPct,
    dropOfLimitPct: dropPct === null ? null : (dropPct / limit.limitPct) * 100,
    peakDropV,
    peakDropPct,
    ampacityA,
    ampacityMarginPct: marginPct,
    fuseVerdict: fuse.fuseVerdict,
    batterySourced,
    lossW,
    suggestedGauge,
    seriesResistorOhm,
    seriesResistorW,
    seriesResistorDissipationW,
    seriesResistorCurrentA,
    verdict: fails.length > 0 ? "fail" : warns.length > 0 ? "warn" : "pass",
    reasons,
    findings,
  };
  return { checks, totalContributionW };
}

/** Peak (inrush) drop only warns: it is brief, but it can brown out logic on the same supply. */
function judgePeakDrop(peakDropPct: number, peakCurrentA: number, limit: DropLimit): Judgement {
  const pct = formatForText(peakDropPct);
  const at = `at the ${formatForText(peakCurrentA)} A peak`;
  const lim = `${formatForText(limit.limitPct)} % limit for ${limit.appliesTo} (${limit.rule})`;
  if (peakDropPct > limit.limitPct) {
    return {
      verdict: "warn",
      text: `Peak drop ${pct} % ${at} exceeds the ${lim}: check for brown-out during inrush (common practice)`,
    };
  }
  return { verdict: "pass", text: `Peak drop ${pct} % ${at} is within the ${lim}` };
}

/**
 * The smallest candidate gauge with drop ≤ limit, current ≤ derated ampacity and fuse ≤ derated ampacity
 * (no next-size allowance: a suggestion should not need one). A named or chassis return keeps its resistance.
 * Null when the run gives neither a current nor a fuse (nothing to size by) or when no candidate passes.
 */
function suggestGauge(
  run: RunData,
  ret: LoopReturn | null,
  currentA: number | null,
  limit: DropLimit,
  supplyV: number,
  ctx: RunContext,
  add: (f: Finding) => void,
): string | null {
  const fuseA = positive(run.fuseA) ? run.fuseA : null;
  const current = positive(currentA) ? currentA : null;
  if (current === null && fuseA === null) return null;

  const column = uscgColumnFor(run.insulationTempC ?? DEFAULT_INSULATION_TEMP_C);
  if (column === null) return null;
  const col = USCG_TEMP_COLUMNS_C.indexOf(column);
  const derate = bundleFactor(run.bundleSize ?? 1) * (run.hotSpace ? ENGINE_SPACE_FACTORS[column] : 1);

  const checkDrop = current !== null && ret !== null && Number.isFinite(supplyV) && supplyV > 0;
  const allowedDropV = (limit.limitPct / 100) * supplyV;
  const lengthM = run.routedLengthMm / 1000;
  const follows = ret === null || ret.kind === "same";
  const fixedReturnOhm = ret === null || ret.kind === "same" ? 0 : ret.ohm;

  for (const c of ctx.candidates) {
    const ampA = (c.baseA[col] ?? 0) * derate;
    if (current !== null && current > ampA) continue;
    if (fuseA !== null && fuseA > ampA) continue;
    if (checkDrop) {
      const loopOhm = c.ohmPerM * lengthM * (follows ? 2 : 1) + fixedReturnOhm;
      if (current * loopOhm > allowedDropV) continue;
    }
    return c.label;
  }
  const largest = ctx.candidates[ctx.candidates.length - 1]?.label ?? "";
  add({
    topic: "gauge",
    verdict: "warn",
    text: `No gauge up to ${largest} passes drop, ampacity and fuse together: split the load or shorten the run`,
  });
  return null;
}

function summarise(list: readonly RunChecks[], totalLossW: number, worstCount: number): ChecksSummary {
  let pass = 0;
  let warn = 0;
  let fail = 0;
  let noCurrent = 0;
  const withDrop: WorstDropRun[] = [];
  for (const c of list) {
    if (c.verdict === "pass") pass++;
    else if (c.verdict === "warn") warn++;
    else fail++;
    if (c.currentA === null) noCurrent++;
    if (c.dropPct !== null && c.dropOfLimitPct !== null) {
      withDrop.push({
        wireId: c.wireId,
        dropPct: c.dropPct,
        dropLimitPct: c.dropLimitPct,
        dropOfLimitPct: c.dropOfLimitPct,
        verdict: c.verdict,
      });
    }
  }
  withDrop.sort((a, b) => b.dropOfLimitPct - a.dropOfLimitPct);
  return {
    runCount: list.length,
    pass,
    warn,
    fail,
    noCurrent,
    totalLossW,
    worstByDrop: withDrop.slice(0, Math.max(0, worstCount)),
  };
}

function cautionsFor(list: readonly RunChecks[]): string[] {
  const cautions = [...CHECKS_CAUTIONS];
  let unfusedBattery = 0;
  let noCurrent = 0;
  for (const c of list) {
    if (c.batterySourced && c.fuseVerdict === "none") unfusedBattery++;
    if (c.currentA === null) noCurrent++;
  }
  if (unfusedBattery > 0) {
    cautions.push(
      `${unfusedBattery} battery-sourced run${unfusedBattery === 1 ? " lists" : "s list"} no fuse: add protection close to the battery (ABYC E-11).`,
    );
  }
  if (noCurrent > 0) {
    cautions.push(
      `${noCurrent} run${noCurrent === 1 ? " has" : "s have"} no current given: drop, ampacity margin and loss were not checked for ${noCurrent === 1 ? "it" : "them"}.`,
    );
  }
  return cautions;
}
