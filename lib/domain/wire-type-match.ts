// Which stocked wire type a run is cut from: gauge + colour + insulation spec, and the combinations nothing matches.
import { normaliseColour } from "@/lib/domain/colour";
import { normaliseGauge } from "@/lib/domain/gauge";

/** What a run says about its wire. */
export interface WireSpec {
  gauge: string;
  colour: string;
  insulation: string | null;
}

/** A stocked wire type, as far as matching needs it. */
export interface MatchableWireType extends WireSpec {
  id: string;
}

export type WireTypeMatch =
  | { kind: "matched"; wireTypeId: string }
  /** No wire type of this gauge + colour + insulation. */
  | { kind: "missing" }
  /** The run names no insulation and several wire types of its gauge + colour exist. */
  | { kind: "ambiguous"; candidateIds: string[] };

/** Insulation compared without case, outer spaces or repeated inner spaces; empty means "not stated". */
export function insulationKey(insulation: string | null | undefined): string {
  return (insulation ?? "").trim().replace(/\s+/g, " ").toLowerCase();
}

function gaugeKey(gauge: string): string {
  return normaliseGauge(gauge) ?? gauge.trim();
}

function colourKey(colour: string): string {
  return normaliseColour(colour) ?? colour.trim().toUpperCase();
}

/** The key two specs share exactly when they name the same stock (gauge and colour normalised, insulation case-folded). */
export function wireSpecKey(s: WireSpec): string {
  return `${gaugeKey(s.gauge)}|${colourKey(s.colour)}|${insulationKey(s.insulation)}`;
}

/**
 * The matching rule:
 * 1. Only wire types of the run's gauge and colour are candidates (both normalised, so "18" = "18 AWG", "red" = "RD").
 * 2. A run that names its insulation matches the candidate with the same insulation, ignoring case and spacing.
 *    Nothing else: the same gauge and colour in another spec is another stock, and a wire type whose insulation
 *    is not stated does not stand in for a stated one.
 * 3. A run that names no insulation matches a candidate that states none either; failing that, the only
 *    candidate if there is exactly one. Two or more candidates leave it ambiguous: the lead must say which.
 *
 * Returns a matcher that indexes the wire types once, for matching many runs.
 */
export function wireTypeMatcher(wireTypes: readonly MatchableWireType[]): {
  match: (run: WireSpec) => WireTypeMatch;
  /** How many wire types share this gauge and colour. */
  candidateCount: (run: WireSpec) => number;
} {
  const byGaugeColour = new Map<string, { id: string; ins: string }[]>();
  for (const w of wireTypes) {
    const k = `${gaugeKey(w.gauge)}|${colourKey(w.colour)}`;
    const list = byGaugeColour.get(k) ?? [];
    list.push({ id: w.id, ins: insulationKey(w.insulation) });
    byGaugeColour.set(k, list);
  }
  const candidatesOf = (run: WireSpec) =>
    byGaugeColour.get(`${gaugeKey(run.gauge)}|${colourKey(run.colour)}`) ?? [];
  return {
    candidateCount: (run) => candidatesOf(run).length,
    match: (run) => {
      const candidates = candidatesOf(run);
      const ins = insulationKey(run.insulation);
      const exact = candidates.find((w) => w.ins === ins);
      if (exact) return { kind: "matched", wireTypeId: exact.id };
      if (ins !== "") return { kind: "missing" };
      if (candidates.length === 1) return { kind: "matched", wireTypeId: candidates[0]!.id };
      if (candidates.length === 0) return { kind: "missing" };
      return { kind: "ambiguous", candidateIds: candidates.map((w) => w.id) };
    },
  };
}

/** The matching rule above for one run (see wireTypeMatcher for many). */
export function matchWireType(run: WireSpec, wireTypes: readonly MatchableWireType[]): WireTypeMatch {
  return wireTypeMatcher(wireTypes).match(run);
}

/** A run as the unmatched list needs it. */
export interface RunForMatch extends WireSpec {
  wireId: string;
  routedLengthMm: number;
  insulationTempC: number | null;
}

export interface UnmatchedCombination {
  gauge: string;
  colour: string;
  /** As the first run (by wire ID) spells it; null when the runs name none. */
  insulation: string | null;
  /** The highest temperature rating the runs ask for, to pre-fill a new wire type. */
  insulationTempC: number | null;
  reason: "missing" | "ambiguous";
  /** Wire types of this gauge and colour (other specs), for the lead's information. */
  candidateCount: number;
  runCount: number;
  routedLengthMm: number;
  /** Up to five wire IDs, sorted. */
  wireIds: string[];
}

/** Groups a project's runs by wire spec and lists the groups no wire type matches, longest routed total first. */
export function unmatchedCombinations(
  runs: readonly RunForMatch[],
  wireTypes: readonly MatchableWireType[],
): UnmatchedCombination[] {
  const sorted = [...runs].sort((a, b) => a.wireId.localeCompare(b.wireId, "en", { numeric: true }));
  const groups = new Map<string, RunForMatch[]>();
  for (const r of sorted) {
    const k = wireSpecKey(r);
    const g = groups.get(k);
    if (g) g.push(r);
    else groups.set(k, [r]);
  }
  const matcher = wireTypeMatcher(wireTypes);
  const out: UnmatchedCombination[] = [];
  for (const group of groups.values()) {
    const first = group[0]!;
    const m = matcher.match(first);
    if (m.kind === "matched") continue;
    const g = gaugeKey(first.gauge);
    const c = colourKey(first.colour);
    const temps = group.map((r) => r.insulationTempC).filter((t): t is number => t !== null);
    const ins = first.insulation?.trim().replace(/\s+/g, " ") ?? "";
    out.push({
      gauge: g,
      colour: c,
      insulation: ins === "" ? null : ins,
      insulationTempC: temps.length ? Math.max(...temps) : null,
      reason: m.kind,
      candidateCount: matcher.candidateCount(first),
      runCount: group.length,
      routedLengthMm: group.reduce((s, r) => s + r.routedLengthMm, 0),
      wireIds: group.slice(0, 5).map((r) => r.wireId),
    });
  }
  return out.sort(
    (a, b) =>
      b.routedLengthMm - a.routedLengthMm || `${a.gauge}${a.colour}`.localeCompare(`${b.gauge}${b.colour}`),
  );
}
