// Seeded instance generators for the spool-planner benchmark and tests: Falkenauer-style triplets and
// uniform instances, cut-up instances with a known optimum, and harness-like jobs with put-ups and remnants.

import type { PlanCut, PlanOptions, PlanStock } from "@/lib/domain/spool-plan/types";

/** mulberry32: a small, fast 32-bit PRNG; the same seed gives the same instance on every machine. */
export function makeRng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Uniform integer in [lo, hi]. */
export function randInt(rng: () => number, lo: number, hi: number): number {
  return lo + Math.floor(rng() * (hi - lo + 1));
}

function shuffle<T>(rng: () => number, a: T[]): T[] {
  for (let i = a.length - 1; i > 0; i--) {
    const j = Math.floor(rng() * (i + 1));
    [a[i], a[j]] = [a[j]!, a[i]!];
  }
  return a;
}

export interface Instance {
  name: string;
  cuts: PlanCut[];
  stock: PlanStock[];
  options: Partial<PlanOptions>;
  /** Spools in an optimal plan, when known by construction. */
  optimumSpools: number | null;
  /** One stock length: the bin capacity (mm), for bin-packing bounds. */
  capacityMm: number | null;
}

/** A single unlimited put-up and no end discard: the plan is pure bin packing. */
function binPackingInstance(
  name: string,
  lengths: number[],
  capacityMm: number,
  optimumSpools: number | null,
): Instance {
  return {
    name,
    cuts: lengths.map((lengthMm, i) => ({ id: `c${i + 1}`, wireType: "W", lengthMm })),
    stock: [
      { id: "bin", wireType: "W", lengthMm: capacityMm, costCents: 100, available: null, kind: "putup" },
    ],
    options: { endDiscardMm: 0, keepRemnantMm: capacityMm + 1 },
    optimumSpools,
    capacityMm,
  };
}

/**
 * Falkenauer (1996) triplets, as in practice.md §6: for each of m bins of capacity 1000 draw a ∈ U[380, 490],
 * s = 1000 − a, b ∈ U[250, ⌊s/2⌋], c = s − b; shuffle. Every item is in [250, 500), so no bin holds four,
 * and Σw = 1000·m: the optimum is m bins, each three items with no slack.
 */
export function tripletLengths(m: number, seed: number): number[] {
  const rng = makeRng(seed);
  const out: number[] = [];
  for (let k = 0; k < m; k++) {
    const a = randInt(rng, 380, 490);
    const s = 1000 - a;
    const b = randInt(rng, 250, Math.floor(s / 2));
    out.push(a, b, s - b);
  }
  return shuffle(rng, out);
}

export function tripletInstance(n: number, seed: number): Instance {
  const m = Math.floor(n / 3);
  return binPackingInstance(`t${n}#${seed}`, tripletLengths(m, seed), 1000, m);
}

/** Falkenauer-style uniform: n items U[20, 100] with capacity 150, scaled ×10 to mm (capacity 1500 mm). */
export function uniformInstance(n: number, seed: number): Instance {
  const rng = makeRng(seed);
  const lengths = Array.from({ length: n }, () => 10 * randInt(rng, 20, 100));
  return binPackingInstance(`u${n}#${seed}`, lengths, 1500, null);
}

/**
 * Cut-up instance: m bins of capacity C each cut at random points into 2–`maxPieces` pieces of at least
 * `minPiece`; shuffled. The pieces fill every bin exactly, so the optimum is m bins.
 */
export function cutUpLengths(
  m: number,
  capacityMm: number,
  seed: number,
  maxPieces = 4,
  minPiece = 1,
): number[] {
  const rng = makeRng(seed);
  const out: number[] = [];
  for (let k = 0; k < m; k++) {
    const pieces = randInt(rng, 2, Math.max(2, Math.min(maxPieces, Math.floor(capacityMm / minPiece))));
    const cuts = new Set<number>();
    while (cuts.size < pieces - 1) {
      const at = randInt(rng, minPiece, capacityMm - minPiece);
      // keep every piece at least minPiece long
      if ([...cuts].every((c) => Math.abs(c - at) >= minPiece)) cuts.add(at);
    }
    const points = [0, ...[...cuts].sort((a, b) => a - b), capacityMm];
    for (let j = 1; j < points.length; j++) out.push(points[j]! - points[j - 1]!);
  }
  return shuffle(rng, out);
}

export function cutUpInstance(m: number, capacityMm: number, seed: number, maxPieces = 4): Instance {
  const lengths = cutUpLengths(m, capacityMm, seed, maxPieces, Math.max(1, Math.floor(capacityMm / 20)));
  return binPackingInstance(`cut${m}#${seed}`, lengths, capacityMm, m);
}

/** Nominal put-up lengths: 25, 50, 100, 500 and 1000 ft in mm. */
export const PUTUP_FT = [25, 50, 100, 500, 1000] as const;
const MM_PER_FT = 304.8;
/** Price per metre relative to the 25 ft put-up: bigger spools are cheaper per metre (our own figures). */
const PRICE_FACTOR = [1, 0.8, 0.65, 0.45, 0.38] as const;

const WIRE_TYPES = [
  { name: "18 AWG RD TXL", centsPerM: 60, share: 3 },
  { name: "18 AWG BK TXL", centsPerM: 60, share: 3 },
  { name: "20 AWG WH TXL", centsPerM: 45, share: 2 },
  { name: "20 AWG BU TXL", centsPerM: 45, share: 2 },
  { name: "16 AWG YE TXL", centsPerM: 80, share: 1 },
  { name: "22 AWG GN TXL", centsPerM: 35, share: 2 },
  { name: "14 AWG RD GXL", centsPerM: 110, share: 1 },
  { name: "14 AWG BK GXL", centsPerM: 110, share: 1 },
] as const;

/**
 * Harness-like job: `builds` copies of one harness of `runs` runs spread over eight wire types (some far more
 * common than others); cut lengths log-uniform 150–4500 mm rounded up to 5 mm; put-ups of 25/50/100/500/1000 ft
 * with prices per metre falling with spool size; 0–3 shelf remnants (1–12 m) per wire type.
 */
export function harnessInstance(runs: number, builds: number, seed: number): Instance {
  const rng = makeRng(seed);
  const shareTotal = WIRE_TYPES.reduce((s, w) => s + w.share, 0);
  const harness: { wireType: string; lengthMm: number }[] = [];
  for (let r = 0; r < runs; r++) {
    let pick = rng() * shareTotal;
    let wt: (typeof WIRE_TYPES)[number] = WIRE_TYPES[0];
    for (const w of WIRE_TYPES) {
      pick -= w.share;
      if (pick < 0) {
        wt = w;
        break;
      }
    }
    const raw = Math.exp(Math.log(150) + rng() * (Math.log(4500) - Math.log(150)));
    harness.push({ wireType: wt.name, lengthMm: Math.ceil(raw / 5) * 5 });
  }
  const cuts: PlanCut[] = [];
  for (let b = 1; b <= builds; b++) {
    harness.forEach((h, r) =>
      cuts.push({ id: `B${b}-R${r + 1}`, wireType: h.wireType, lengthMm: h.lengthMm }),
    );
  }
  const stock: PlanStock[] = [];
  for (const w of WIRE_TYPES) {
    PUTUP_FT.forEach((ft, j) => {
      const lengthMm = Math.round(ft * MM_PER_FT);
      stock.push({
        id: `${w.name} ${ft} ft`,
        wireType: w.name,
        lengthMm,
        costCents: Math.round((w.centsPerM * PRICE_FACTOR[j]! * lengthMm) / 1000),
        available: null,
        kind: "putup",
      });
    });
    const remnants = randInt(rng, 0, 3);
    for (let k = 1; k <= remnants; k++) {
      stock.push({
        id: `${w.name} remnant ${k}`,
        wireType: w.name,
        lengthMm: randInt(rng, 1000, 12000),
        costCents: 0,
        available: 1,
        kind: "shelf",
      });
    }
  }
  return {
    name: `harness ${runs}x${builds}#${seed}`,
    cuts,
    stock,
    options: {},
    optimumSpools: null,
    capacityMm: null,
  };
}
