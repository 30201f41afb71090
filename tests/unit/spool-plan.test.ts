import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { tripletLengths } from "@/bench/instances";
import {
  firstFitDecreasing,
  planSpools,
  type HeuristicPlan,
  type PlanCut,
  type PlanOptions,
  type PlanStock,
} from "@/lib/domain/spool-plan";

// --- independent checks of a plan (no planner internals) ---

interface Checked {
  unplacedMm: number;
}

function checkPlan(
  plan: HeuristicPlan,
  cuts: PlanCut[],
  stock: PlanStock[],
  options: Pick<PlanOptions, "endDiscardMm" | "keepRemnantMm">,
): Checked {
  const cutById = new Map(cuts.map((c) => [c.id, c]));
  const stockById = new Map(stock.map((s) => [s.id, s]));
  const seen = new Map<string, number>();
  const uses = new Map<string, number>();
  let cost = 0;
  for (const sp of plan.spools) {
    const s = stockById.get(sp.stockId);
    expect(s, `stock ${sp.stockId}`).toBeDefined();
    if (!s) continue;
    expect(sp.wireType).toBe(s.wireType);
    const shelf = (s.kind ?? (s.costCents === 0 && s.available !== null ? "shelf" : "putup")) === "shelf";
    const usable = s.lengthMm - (shelf ? 0 : options.endDiscardMm);
    expect(sp.usableMm).toBe(usable);
    let used = 0;
    let prev = Infinity;
    for (const id of sp.cutIds) {
      const c = cutById.get(id);
      expect(c, `cut ${id}`).toBeDefined();
      if (!c) continue;
      expect(c.wireType).toBe(s.wireType);
      expect(c.lengthMm).toBeLessThanOrEqual(prev); // cutting order: longest first
      prev = c.lengthMm;
      used += c.lengthMm;
      seen.set(id, (seen.get(id) ?? 0) + 1);
    }
    expect(sp.usedMm).toBe(used);
    expect(used).toBeLessThanOrEqual(usable);
    expect(sp.leftoverMm).toBe(usable - used);
    expect(sp.keep).toBe(usable - used >= options.keepRemnantMm);
    expect(sp.costCents).toBe(s.costCents);
    uses.set(s.id, (uses.get(s.id) ?? 0) + 1);
    cost += s.costCents;
  }
  let unplacedMm = 0;
  for (const u of plan.unplaced) {
    seen.set(u.id, (seen.get(u.id) ?? 0) + 1);
    expect(u.reason.length).toBeGreaterThan(0);
    unplacedMm += cutById.get(u.id)?.lengthMm ?? 0;
  }
  for (const c of cuts) expect(seen.get(c.id), `cut ${c.id} placed or unplaced exactly once`).toBe(1);
  expect(seen.size).toBe(cuts.length);
  for (const [id, n] of uses) {
    const s = stockById.get(id)!;
    const limit =
      s.available ?? ((s.kind ?? (s.costCents === 0 ? "shelf" : "putup")) === "shelf" ? 1 : Infinity);
    expect(n, `uses of ${id}`).toBeLessThanOrEqual(limit);
  }
  expect(plan.costCents).toBe(cost);
  expect(plan.spoolCount).toBe(plan.spools.length);
  return { unplacedMm };
}

// --- random small instances ---

const WIRE = ["18 AWG RD TXL", "20 AWG BU TXL"] as const;
const instanceArb = fc.record({
  cuts: fc.array(fc.record({ w: fc.constantFrom(...WIRE), lengthMm: fc.integer({ min: 100, max: 5000 }) }), {
    maxLength: 14,
  }),
  remnants: fc.array(
    fc.record({ w: fc.constantFrom(...WIRE), lengthMm: fc.integer({ min: 300, max: 7000 }) }),
    {
      maxLength: 3,
    },
  ),
  putups: fc.array(
    fc.record({
      w: fc.constantFrom(...WIRE),
      lengthMm: fc.integer({ min: 1000, max: 16000 }),
      costCents: fc.integer({ min: 50, max: 2500 }),
      available: fc.option(fc.integer({ min: 0, max: 3 }), { nil: null }),
    }),
    { maxLength: 3 },
  ),
  endDiscardMm: fc.integer({ min: 0, max: 200 }),
  keepRemnantMm: fc.integer({ min: 0, max: 3000 }),
});

type Generated = {
  cuts: PlanCut[];
  stock: PlanStock[];
  options: Pick<PlanOptions, "endDiscardMm" | "keepRemnantMm">;
};

type GeneratedInput = typeof instanceArb extends fc.Arbitrary<infer T> ? T : never;

function build(g: GeneratedInput): Generated {
  return {
    cuts: g.cuts.map((c, i) => ({ id: `c${i}`, wireType: c.w, lengthMm: c.lengthMm })),
    stock: [
      ...g.remnants.map((r, i) => ({
        id: `r${i}`,
        wireType: r.w,
        lengthMm: r.lengthMm,
        costCents: 0,
        available: 1,
      })),
      ...g.putups.map((p, i) => ({ id: `p${i}`, wireType: p.w, ...p, kind: "putup" as const })),
    ],
    options: { endDiscardMm: g.endDiscardMm, keepRemnantMm: g.keepRemnantMm },
  };
}

/** Lexicographic order the planner promises: unplaced length, cost, spools. */
function notWorse(a: HeuristicPlan & Checked, b: HeuristicPlan & Checked): boolean {
  if (a.unplacedMm !== b.unplacedMm) return a.unplacedMm < b.unplacedMm;
  if (a.costCents !== b.costCents) return a.costCents < b.costCents;
  return a.spoolCount <= b.spoolCount;
}

/**
 * Exhaustive optimum for one wire type with an unlimited put-up that holds every cut: every partition of the
 * cuts into spools, each part on the cheapest stock that fits (availability respected). Independent oracle.
 */
function bruteForceCost(
  cuts: number[],
  stock: { usable: number; cost: number; available: number }[],
): number {
  let best = Infinity;
  const parts: number[][] = [];
  const assignParts = (j: number, left: number[], cost: number): void => {
    if (cost >= best) return;
    if (j === parts.length) {
      best = cost;
      return;
    }
    const len = parts[j]!.reduce((a, b) => a + b, 0);
    stock.forEach((s, k) => {
      if (s.usable >= len && left[k]! > 0) {
        left[k]!--;
        assignParts(j + 1, left, cost + s.cost);
        left[k]!++;
      }
    });
  };
  const partition = (i: number): void => {
    if (i === cuts.length) {
      assignParts(
        0,
        stock.map((s) => s.available),
        0,
      );
      return;
    }
    for (const part of parts) {
      part.push(cuts[i]!);
      partition(i + 1);
      part.pop();
    }
    parts.push([cuts[i]!]);
    partition(i + 1);
    parts.pop();
  };
  partition(0);
  return best;
}

describe("planSpools on random small instances (fast-check)", () => {
  it("places every cut once or reports it, within capacity and availability, never worse than FFD", async () => {
    await fc.assert(
      fc.asyncProperty(instanceArb, async (g) => {
        const { cuts, stock, options } = build(g);
        const plan = await planSpools(cuts, stock, { ...options, timeLimitMs: 400 });
        const a = { ...plan, ...checkPlan(plan, cuts, stock, options) };
        const ffd = firstFitDecreasing(cuts, stock, options);
        const b = { ...ffd, ...checkPlan(ffd, cuts, stock, options) };
        expect(plan.costCents).toBeGreaterThanOrEqual(plan.lowerBoundCents);
        expect(notWorse(a, b)).toBe(true);
        if (plan.gapPct !== null) expect(plan.gapPct).toBeGreaterThanOrEqual(0);
      }),
      { numRuns: 40, seed: 20261201 },
    );
  }, 60_000);

  it("matches an exhaustive search on tiny single-wire-type instances", async () => {
    const tinyArb = fc.record({
      cuts: fc.array(fc.integer({ min: 200, max: 4000 }), { minLength: 1, maxLength: 6 }),
      remnant: fc.option(fc.integer({ min: 500, max: 6000 }), { nil: null }),
      small: fc.record({
        lengthMm: fc.integer({ min: 2000, max: 8000 }),
        costCents: fc.integer({ min: 100, max: 900 }),
      }),
      bigCost: fc.integer({ min: 500, max: 3000 }),
    });
    await fc.assert(
      fc.asyncProperty(tinyArb, async (t) => {
        const wt = "16 AWG YE TXL";
        const cuts = t.cuts.map((lengthMm, i) => ({ id: `c${i}`, wireType: wt, lengthMm }));
        const stock: PlanStock[] = [
          { id: "small", wireType: wt, ...t.small, available: null },
          { id: "big", wireType: wt, lengthMm: 24_000, costCents: t.bigCost, available: null }, // holds every cut
        ];
        if (t.remnant !== null)
          stock.push({ id: "rem", wireType: wt, lengthMm: t.remnant, costCents: 0, available: 1 });
        const options = { endDiscardMm: 100, keepRemnantMm: 1000 };
        const plan = await planSpools(cuts, stock, { ...options, timeLimitMs: 1000 });
        checkPlan(plan, cuts, stock, options);
        const oracle = bruteForceCost(t.cuts, [
          { usable: t.small.lengthMm - 100, cost: t.small.costCents, available: t.cuts.length },
          { usable: 24_000 - 100, cost: t.bigCost, available: t.cuts.length },
          ...(t.remnant !== null ? [{ usable: t.remnant, cost: 0, available: 1 }] : []),
        ]);
        expect(plan.unplaced).toEqual([]);
        expect(plan.costCents).toBe(oracle);
        expect(plan.lowerBoundCents).toBeLessThanOrEqual(oracle);
      }),
      { numRuns: 30, seed: 7 },
    );
  }, 60_000);
});

describe("planSpools: spool rules", () => {
  // Put-up 25 ft = 7620 mm; end discard 100 mm and keep-remnant 1000 mm are common practice.
  const wt = "18 AWG RD TXL";
  const putup: PlanStock = { id: "25 ft", wireType: wt, lengthMm: 7620, costCents: 457, available: null };
  const cutsOf = (lengths: number[]): PlanCut[] =>
    lengths.map((lengthMm, i) => ({ id: `c${i}`, wireType: wt, lengthMm }));

  const cases: { name: string; cuts: number[]; stock: PlanStock[]; spools: number; leftovers: number[] }[] = [
    // 3 × 2500 = 7500 ≤ 7620 − 100: one spool, 20 mm scrap.
    {
      name: "end discard leaves 7520 mm usable",
      cuts: [2500, 2500, 2500],
      stock: [putup],
      spools: 1,
      leftovers: [20],
    },
    // 4 × 1900 = 7600 > 7520: the discard forces a second spool.
    {
      name: "end discard forces a second spool",
      cuts: [1900, 1900, 1900, 1900],
      stock: [putup],
      spools: 2,
      leftovers: [1820, 5620],
    },
    // A 5000 mm remnant has no end discard: 2 × 2500 fit exactly, nothing bought.
    {
      name: "shelf spool: measured length all usable",
      cuts: [2500, 2500],
      stock: [{ id: "rem", wireType: wt, lengthMm: 5000, costCents: 0, available: 1 }, putup],
      spools: 1,
      leftovers: [0],
    },
  ];
  it.each(cases)("$name", async ({ cuts, stock, spools, leftovers }) => {
    const plan = await planSpools(cutsOf(cuts), stock, { timeLimitMs: 1000 });
    expect(plan.spoolCount).toBe(spools);
    expect(plan.spools.map((s) => s.leftoverMm).sort((a, b) => a - b)).toEqual(leftovers);
  });

  it("keeps a leftover of at least keepRemnantMm and scraps a shorter one", async () => {
    const plan = await planSpools(cutsOf([2000]), [putup], { timeLimitMs: 1000 });
    expect(plan.spools[0]).toMatchObject({ leftoverMm: 5520, keep: true });
    const tight = await planSpools(cutsOf([7000]), [putup], { timeLimitMs: 1000 });
    expect(tight.spools[0]).toMatchObject({ leftoverMm: 520, keep: false });
    expect(tight.scrapMm).toBe(520);
  });

  it("reports a cut longer than every spool, and cuts the shelf cannot hold when nothing can be bought", async () => {
    const plan = await planSpools(
      [...cutsOf([8000, 3000, 2500]), { id: "x", wireType: "22 AWG GN TXL", lengthMm: 500 }],
      [{ id: "rem", wireType: wt, lengthMm: 4000, costCents: 0, available: 1 }],
      { timeLimitMs: 1000 },
    );
    const reasons = new Map(plan.unplaced.map((u) => [u.id, u.reason]));
    expect(reasons.get("c0")).toMatch(/longer than any spool/);
    expect(reasons.get("x")).toMatch(/no stock/);
    expect(plan.spools).toHaveLength(1);
    expect([...reasons.keys()].filter((id) => id === "c1" || id === "c2")).toHaveLength(1);
    expect(reasons.get("c1") ?? reasons.get("c2")).toMatch(/exhausted/);
  });

  it("gives the same plan for the same input", async () => {
    const cuts = cutsOf([3100, 2900, 2200, 1800, 1500, 1500, 900, 650, 400]);
    const stock = [putup, { ...putup, id: "50 ft", lengthMm: 15240, costCents: 731 }];
    const a = await planSpools(cuts, stock, { timeLimitMs: 2000 });
    const b = await planSpools(cuts, stock, { timeLimitMs: 2000 });
    expect(b.spools).toEqual(a.spools);
    expect(b.lowerBoundCents).toBe(a.lowerBoundCents);
  });
});

describe("planSpools on Falkenauer triplets (optimum known by construction)", () => {
  // Falkenauer (1996) triplets, practice.md §6: every bin of the optimum holds three items summing to
  // exactly 1000, every item is in [250, 500), so OPT = m and also L1 = m.
  it.each([
    { m: 10, seed: 1 },
    { m: 10, seed: 2 },
    { m: 20, seed: 3 },
    { m: 20, seed: 4 },
  ])(
    "m = $m, seed $seed: at most one spool over the optimum, bound = optimum",
    async ({ m, seed }) => {
      const lengths = tripletLengths(m, seed);
      expect(lengths).toHaveLength(3 * m);
      expect(lengths.reduce((a, b) => a + b, 0)).toBe(1000 * m);
      for (const l of lengths) {
        expect(l).toBeGreaterThanOrEqual(250);
        expect(l).toBeLessThan(500);
      }
      const cuts = lengths.map((lengthMm, i) => ({ id: `t${i}`, wireType: "W", lengthMm }));
      const stock = [{ id: "bin", wireType: "W", lengthMm: 1000, costCents: 100, available: null }];
      const plan = await planSpools(cuts, stock, { endDiscardMm: 0, timeLimitMs: 2500 });
      expect(plan.unplaced).toEqual([]);
      expect(plan.spoolCount).toBeGreaterThanOrEqual(m);
      expect(plan.spoolCount).toBeLessThanOrEqual(m + 1);
      expect(plan.lowerBoundCents).toBe(100 * m);
    },
    10_000,
  );
});
