import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cutUpLengths, tripletLengths } from "@/bench/instances";
import { packExactly } from "@/lib/domain/spool-plan/purchase-search";
import {
  firstFitDecreasing,
  l1Bound,
  martelloTothL2,
  minCostCover,
  type PlanStock,
} from "@/lib/domain/spool-plan";

/** A bin-packing instance as planner input: one unlimited put-up of `capacityMm`, no end discard. */
function binPacking(lengths: number[], capacityMm: number) {
  return {
    cuts: lengths.map((lengthMm, i) => ({ id: `i${i}`, wireType: "W", lengthMm })),
    stock: [{ id: "bin", wireType: "W", lengthMm: capacityMm, costCents: 1, available: null }] as PlanStock[],
    options: { endDiscardMm: 0 },
  };
}

describe("Martello–Toth L2 (Martello & Toth 1990, Discrete Applied Mathematics 28:59–70)", () => {
  // Hand-checked from the paper's definition of L(α); OPT found by hand.
  it.each([
    // α = 5: J1 = {6,6,6}, J2 = ∅, J3 = {5,5}: L = 3 + 0 + ⌈10/10⌉ = 4 > L1 = ⌈28/10⌉ = 3. OPT = 4 (6+5 > 10).
    { items: [6, 6, 6, 5, 5], c: 10, l1: 3, l2: 4 },
    // α = 40: J1 = {70,70,70}, J2 = ∅, J3 = {40,40,40}: L = 3 + ⌈120/100⌉ = 5 > L1 = ⌈330/100⌉ = 4. OPT = 5.
    { items: [70, 70, 70, 40, 40, 40], c: 100, l1: 4, l2: 5 },
    // α = 40: J2 = {60}, J3 = {50, 40}: L = 1 + ⌈(90 − 40)/100⌉ = 2 = L1. OPT = 2 (60+40, 50).
    { items: [60, 50, 40], c: 100, l1: 2, l2: 2 },
    // α = 30: J2 = {51,51,51} with 147 free, J3 = {30,30,30} = 90 fits: L = 3 = L1 = ⌈243/100⌉. OPT = 3.
    { items: [51, 51, 51, 30, 30, 30], c: 100, l1: 3, l2: 3 },
  ])("items $items, C = $c: L1 = $l1, L2 = $l2", ({ items, c, l1, l2 }) => {
    expect(l1Bound(items, c)).toBe(l1);
    expect(martelloTothL2(items, c)).toBe(l2);
  });

  it("L1 ≤ L2 ≤ OPT on triplets, where OPT = m (Falkenauer 1996 construction)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 1e6 }), (m, seed) => {
        const items = tripletLengths(m, seed);
        const l2 = martelloTothL2(items, 1000);
        expect(l1Bound(items, 1000)).toBeLessThanOrEqual(l2);
        expect(l2).toBeLessThanOrEqual(m);
      }),
      { numRuns: 100, seed: 11 },
    );
  });
});

describe("first-fit decreasing", () => {
  it("packs a hand-checked example: C = 10, items 7 6 5 4 3 2 → 3 bins (7+3, 6+4, 5+2)", () => {
    const inst = binPacking([3, 7, 2, 5, 4, 6], 10);
    const plan = firstFitDecreasing(inst.cuts, inst.stock, inst.options);
    const contents = plan.spools.map((s) =>
      s.cutIds.map((id) => inst.cuts.find((c) => c.id === id)!.lengthMm),
    );
    expect(contents).toEqual([
      [7, 3],
      [6, 4],
      [5, 2],
    ]);
  });

  // Dósa (2007): FFD(L) ≤ 11/9·OPT(L) + 6/9, tight (full proof Dósa, Li, Han & Tuza, TCS 510, 2013).
  const dosa = (opt: number): number => (11 / 9) * opt + 6 / 9;

  it("meets Dósa's bound on triplets (OPT = m by construction)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.integer({ min: 1, max: 1e6 }), (m, seed) => {
        const inst = binPacking(tripletLengths(m, seed), 1000);
        const ffd = firstFitDecreasing(inst.cuts, inst.stock, inst.options);
        expect(ffd.unplaced).toEqual([]);
        expect(ffd.spoolCount).toBeGreaterThanOrEqual(m);
        expect(ffd.spoolCount).toBeLessThanOrEqual(dosa(m) + 1e-9);
      }),
      { numRuns: 100, seed: 5 },
    );
  });

  it("meets Dósa's bound on cut-up instances (bins cut into pieces: OPT = m)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 200, max: 5000 }),
        fc.integer({ min: 2, max: 5 }),
        fc.integer({ min: 1, max: 1e6 }),
        (m, capacity, pieces, seed) => {
          const lengths = cutUpLengths(m, capacity, seed, pieces, Math.floor(capacity / 20));
          expect(lengths.reduce((a, b) => a + b, 0)).toBe(m * capacity);
          const inst = binPacking(lengths, capacity);
          const ffd = firstFitDecreasing(inst.cuts, inst.stock, inst.options);
          expect(ffd.spoolCount).toBeGreaterThanOrEqual(m);
          expect(ffd.spoolCount).toBeLessThanOrEqual(dosa(m) + 1e-9);
        },
      ),
      { numRuns: 100, seed: 9 },
    );
  });
});

describe("cover bound", () => {
  it.each([
    // 18 m of cut length from spools holding 7.5 m (cost 4) and 15 m (cost 7): 15 + 7.5 = 22.5 m for 11.
    {
      stock: [
        { fill: 7500, cost: 4, available: null },
        { fill: 15000, cost: 7, available: null },
      ],
      demand: 18000,
      want: 11,
    },
    // Same, but only one 15 m spool may be bought and no 7.5 m: cannot cover.
    { stock: [{ fill: 15000, cost: 7, available: 1 }], demand: 18000, want: Infinity },
    // A free 4 m remnant leaves 14 m to cover: one 15 m spool.
    {
      stock: [
        { fill: 4000, cost: 0, available: 1 },
        { fill: 15000, cost: 7, available: null },
        { fill: 7500, cost: 4, available: null },
      ],
      demand: 18000,
      want: 7,
    },
  ])("least cost to cover $demand mm: $want (hand-checked)", ({ stock, demand, want }) => {
    expect(minCostCover(stock, demand)).toBe(want);
  });
});

describe("exact packing check (bin completion)", () => {
  it.each([
    // Two 10s: 6+4 and 5+5 fill both exactly (hand-checked).
    { lengths: [6, 5, 4], demand: [1, 2, 1], caps: [10, 10], feasible: true },
    // 6, 6, 5, 3 into two 10s: each 6 needs a partner ≤ 4, only the 3 qualifies (hand-checked).
    { lengths: [6, 5, 3], demand: [2, 1, 1], caps: [10, 10], feasible: false },
    // Falkenauer-style triplet bin: 420 + 300 + 280 = 1000 exactly, and 260 fits nowhere else.
    { lengths: [420, 300, 280, 260], demand: [1, 1, 1, 1], caps: [1000], feasible: false },
  ])("$lengths × $demand into $caps: feasible = $feasible", ({ lengths, demand, caps, feasible }) => {
    const res = packExactly(lengths, demand, caps, 100_000);
    expect(res).not.toBeNull();
    if (!feasible) {
      expect(res).toBe("infeasible");
      return;
    }
    expect(Array.isArray(res)).toBe(true);
    const perBin = res as number[][];
    perBin.forEach((counts, b) => {
      const used = counts.reduce((s, n, i) => s + n * lengths[i]!, 0);
      expect(used).toBeLessThanOrEqual(caps[b]!);
    });
    lengths.forEach((_, i) => expect(perBin.reduce((s, c) => s + c[i]!, 0)).toBe(demand[i]));
  });
});
