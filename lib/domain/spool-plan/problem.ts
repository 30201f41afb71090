// The per-wire-type packing problem: equal cut lengths merged into demands, stock merged into types, and the
// internal solution shape (bins of item indices) with its evaluation and conversion to planned spools.

import type {
  PlanCut,
  PlanOptions,
  PlanStock,
  PlannedSpool,
  StockKind,
  UnplacedCut,
} from "@/lib/domain/spool-plan/types";

/** Distinct cut length with the ids of the cuts that have it (input order). Items are sorted longest first. */
export interface Item {
  lengthMm: number;
  demand: number;
  cutIds: string[];
}

/** Stock merged by (kind, usable length, cost); members keep their ids and availability. */
export interface StockType {
  kind: StockKind;
  usableMm: number;
  endDiscardMm: number;
  costCents: number;
  /** Total uses allowed (null = unlimited). */
  available: number | null;
  members: { stockId: string; available: number | null }[];
}

export interface WireProblem {
  wireType: string;
  items: Item[];
  types: StockType[];
  /** Cuts of this wire type that no spool can hold (too long, or no stock at all). */
  rejected: UnplacedCut[];
  cutCount: number;
  keepRemnantMm: number;
}

/** A spool in the internal solution: its stock type and the items cut from it (indices, repeated). */
export interface Bin {
  type: number;
  items: number[];
}

export interface WireSolution {
  bins: Bin[];
  /** Per item: how many of its cuts are left unplaced (stock exhausted). */
  unplaced: number[];
  method: string;
}

/** Lexicographic objective: unplaced length, then purchase cost, then spools opened, then scrap. */
export interface SolutionKey {
  unplacedMm: number;
  costCents: number;
  spoolCount: number;
  scrapMm: number;
}

export function resolveKind(s: PlanStock): StockKind {
  if (s.kind) return s.kind;
  return s.costCents === 0 && s.available !== null ? "shelf" : "putup";
}

function isWholeNonNegative(v: number): boolean {
  return Number.isInteger(v) && v >= 0;
}

/** Checks the inputs; throws RangeError naming the bad entry (the CLI validates earlier with a friendlier message). */
export function validateInput(
  cuts: readonly PlanCut[],
  stock: readonly PlanStock[],
  options: PlanOptions,
): void {
  const ids = new Set<string>();
  for (const c of cuts) {
    if (!Number.isInteger(c.lengthMm) || c.lengthMm <= 0)
      throw new RangeError(`cut ${c.id}: lengthMm must be a positive whole number of mm`);
    if (ids.has(c.id)) throw new RangeError(`cut ${c.id}: duplicate id`);
    ids.add(c.id);
  }
  const stockIds = new Set<string>();
  for (const s of stock) {
    if (!isWholeNonNegative(s.lengthMm))
      throw new RangeError(`stock ${s.id}: lengthMm must be a whole number ≥ 0`);
    if (!isWholeNonNegative(s.costCents))
      throw new RangeError(`stock ${s.id}: costCents must be a whole number ≥ 0`);
    if (s.available !== null && !isWholeNonNegative(s.available))
      throw new RangeError(`stock ${s.id}: available must be null or a whole number ≥ 0`);
    if (stockIds.has(s.id)) throw new RangeError(`stock ${s.id}: duplicate id`);
    stockIds.add(s.id);
  }
  if (!isWholeNonNegative(options.endDiscardMm))
    throw new RangeError("endDiscardMm must be a whole number ≥ 0");
  if (!isWholeNonNegative(options.keepRemnantMm))
    throw new RangeError("keepRemnantMm must be a whole number ≥ 0");
  if (!(options.timeLimitMs >= 0)) throw new RangeError("timeLimitMs must be ≥ 0");
}

/** Splits the input by wire type, in order of first appearance among the cuts. */
export function buildProblems(
  cuts: readonly PlanCut[],
  stock: readonly PlanStock[],
  options: PlanOptions,
): WireProblem[] {
  const order: string[] = [];
  const cutsByType = new Map<string, PlanCut[]>();
  for (const c of cuts) {
    let list = cutsByType.get(c.wireType);
    if (!list) {
      list = [];
      cutsByType.set(c.wireType, list);
      order.push(c.wireType);
    }
    list.push(c);
  }
  return order.map((wt) => buildProblem(wt, cutsByType.get(wt) ?? [], stock, options));
}

function buildProblem(
  wireType: string,
  cuts: PlanCut[],
  stock: readonly PlanStock[],
  options: PlanOptions,
): WireProblem {
  const types: StockType[] = [];
  const typeIndex = new Map<string, number>();
  for (const s of stock) {
    if (s.wireType !== wireType) continue;
    if (s.available === 0) continue;
    const kind = resolveKind(s);
    // A shelf spool is one physical piece: "unlimited" makes no sense for it, so it counts once.
    const available = kind === "shelf" ? (s.available ?? 1) : s.available;
    const endDiscardMm = kind === "putup" ? options.endDiscardMm : 0;
    const usableMm = s.lengthMm - endDiscardMm;
    if (usableMm <= 0) continue;
    const key = `${kind}|${usableMm}|${s.costCents}`;
    let t = typeIndex.get(key);
    if (t === undefined) {
      t = types.length;
      typeIndex.set(key, t);
      types.push({ kind, usableMm, endDiscardMm, costCents: s.costCents, available: 0, members: [] });
    }
    const type = types[t]!;
    type.members.push({ stockId: s.id, available });
    type.available = type.available === null || available === null ? null : type.available + available;
  }
  const maxUsable = types.reduce((m, t) => Math.max(m, t.usableMm), 0);
  const rejected: UnplacedCut[] = [];
  const byLength = new Map<number, string[]>();
  for (const c of cuts) {
    if (types.length === 0) {
      rejected.push({ ...pickCut(c), reason: `no stock of wire type ${wireType}` });
    } else if (c.lengthMm > maxUsable) {
      rejected.push({
        ...pickCut(c),
        reason: `longer than any spool of wire type ${wireType} (longest usable ${maxUsable} mm)`,
      });
    } else {
      const ids = byLength.get(c.lengthMm);
      if (ids) ids.push(c.id);
      else byLength.set(c.lengthMm, [c.id]);
    }
  }
  const items: Item[] = [...byLength.entries()]
    .sort((a, b) => b[0] - a[0])
    .map(([lengthMm, cutIds]) => ({ lengthMm, demand: cutIds.length, cutIds }));
  return { wireType, items, types, rejected, cutCount: cuts.length, keepRemnantMm: options.keepRemnantMm };
}

function pickCut(c: PlanCut): { id: string; wireType: string; lengthMm: number } {
  return { id: c.id, wireType: c.wireType, lengthMm: c.lengthMm };
}

export function binUsedMm(p: WireProblem, bin: Bin): number {
  let used = 0;
  for (const i of bin.items) used += p.items[i]!.lengthMm;
  return used;
}

export function evaluate(p: WireProblem, s: WireSolution): SolutionKey {
  let costCents = 0;
  let scrapMm = 0;
  for (const bin of s.bins) {
    const t = p.types[bin.type]!;
    costCents += t.costCents;
    const leftover = t.usableMm - binUsedMm(p, bin);
    if (leftover < p.keepRemnantMm) scrapMm += leftover;
  }
  let unplacedMm = 0;
  s.unplaced.forEach((n, i) => (unplacedMm += n * p.items[i]!.lengthMm));
  return { unplacedMm, costCents, spoolCount: s.bins.length, scrapMm };
}

export function compareKeys(a: SolutionKey, b: SolutionKey): number {
  return (
    a.unplacedMm - b.unplacedMm ||
    a.costCents - b.costCents ||
    a.spoolCount - b.spoolCount ||
    a.scrapMm - b.scrapMm
  );
}

/** Checks a solution against demands, capacities and availability; returns a message or null. */
export function solutionError(p: WireProblem, s: WireSolution): string | null {
  const placed = p.items.map(() => 0);
  const uses = p.types.map(() => 0);
  for (const bin of s.bins) {
    const t = p.types[bin.type];
    if (!t) return "bin with unknown stock type";
    if (binUsedMm(p, bin) > t.usableMm) return "bin over capacity";
    uses[bin.type]!++;
    for (const i of bin.items) placed[i]!++;
  }
  for (let i = 0; i < p.items.length; i++) {
    if (placed[i]! + s.unplaced[i]! !== p.items[i]!.demand) return `item ${i} placed ${placed[i]} times`;
  }
  for (let k = 0; k < p.types.length; k++) {
    const a = p.types[k]!.available;
    if (a !== null && uses[k]! > a) return `stock type ${k} used ${uses[k]} times of ${a}`;
  }
  return null;
}

/** Turns bins into planned spools: cut ids in cutting order, stock ids by member availability. */
export function materialize(
  p: WireProblem,
  s: WireSolution,
): { spools: PlannedSpool[]; unplaced: UnplacedCut[] } {
  // Deterministic spool order: shelf first, then put-ups; larger spools first; fuller spools first.
  const bins = s.bins
    .map((bin) => ({ bin, used: binUsedMm(p, bin) }))
    .sort((a, b) => {
      const ta = p.types[a.bin.type]!;
      const tb = p.types[b.bin.type]!;
      return (
        (ta.kind === tb.kind ? 0 : ta.kind === "shelf" ? -1 : 1) ||
        tb.usableMm - ta.usableMm ||
        a.bin.type - b.bin.type ||
        b.used - a.used
      );
    });
  const nextCut = p.items.map(() => 0);
  const memberUse = p.types.map((t) => t.members.map(() => 0));
  const spools: PlannedSpool[] = [];
  for (const { bin, used } of bins) {
    const t = p.types[bin.type]!;
    const uses = memberUse[bin.type]!;
    let m = t.members.findIndex((mem, j) => mem.available === null || uses[j]! < mem.available);
    if (m < 0) m = 0; // cannot happen for a valid solution; keep the first member rather than crash
    uses[m]!++;
    const order = [...bin.items].sort((a, b) => a - b); // items are indexed longest first
    const cutIds = order.map((i) => p.items[i]!.cutIds[nextCut[i]!++]!);
    const leftoverMm = t.usableMm - used;
    spools.push({
      stockId: t.members[m]!.stockId,
      wireType: p.wireType,
      kind: t.kind,
      cutIds,
      usableMm: t.usableMm,
      endDiscardMm: t.endDiscardMm,
      usedMm: used,
      leftoverMm,
      keep: leftoverMm >= p.keepRemnantMm,
      costCents: t.costCents,
    });
  }
  const unplaced: UnplacedCut[] = [];
  p.items.forEach((item, i) => {
    for (let k = nextCut[i]!; k < item.demand; k++) {
      unplaced.push({
        id: item.cutIds[k]!,
        wireType: p.wireType,
        lengthMm: item.lengthMm,
        reason: `stock of wire type ${p.wireType} exhausted`,
      });
    }
  });
  return { spools, unplaced };
}
