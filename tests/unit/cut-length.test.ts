import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  END_ALLOWANCE_MM,
  UNSPECIFIED_END_ALLOWANCE_MM,
  cutLengthBreakdown,
  cutLengthMm,
  lengthTolerancePlusMm,
  runCutLengthMm,
} from "@/lib/domain/cut-length";
import { DEFAULT_PROJECT_SETTINGS, TERMINATIONS } from "@/lib/domain/types";

// The slack rule max(pct × routed, minimum) + per-end service loop, and the per-termination allowances, are
// common practice (shop rules of thumb, no published source): the expected values below are that rule worked by
// hand. The one published property is IPC/WHMA-A-620 Table 11-1: length tolerance is plus-only, nothing may be short.

const S = { slackPct: 5, slackMinMm: 50, serviceLoopMm: 25, roundingMm: 5 }; // common practice

describe("cut length: the project's slack rule (common practice)", () => {
  const cases: {
    why: string;
    routed: number;
    strips: [number | null, number | null];
    terms: [string | null, string | null];
    settings?: Partial<typeof S>;
    slack: number;
    rule: "percent" | "minimum";
    loops: number;
    ends: number;
    cut: number;
  }[] = [
    {
      why: "5 % of 1000 equals the 50 mm minimum; ring ends 25 + 25, loops 25 + 25",
      routed: 1000,
      strips: [null, null],
      terms: ["ring", "ring"],
      slack: 50,
      rule: "percent",
      loops: 50,
      ends: 50,
      cut: 1150,
    },
    {
      why: "short run: the minimum slack wins over 5 % (5 mm)",
      routed: 100,
      strips: [null, null],
      terms: [null, null],
      slack: 50,
      rule: "minimum",
      loops: 50,
      ends: 2 * UNSPECIFIED_END_ALLOWANCE_MM,
      cut: 240,
    },
    {
      why: "long run: 5 % of 3000 = 150; ferrule 20 + pin 20",
      routed: 3000,
      strips: [10, 4],
      terms: ["ferrule", "pin"],
      slack: 150,
      rule: "percent",
      loops: 50,
      ends: 40,
      cut: 3240,
    },
    {
      why: "fractional slack 61.7 mm; 1234 + 61.7 + 50 + 25 + 40 = 1410.7, rounded UP to 1415",
      routed: 1234,
      strips: [8, 18],
      terms: ["ring", "lug"],
      slack: 61.7,
      rule: "percent",
      loops: 50,
      ends: 65,
      cut: 1415,
    },
    {
      why: "same run, 10 mm step: 1410.7 → 1420",
      routed: 1234,
      strips: [8, 18],
      terms: ["ring", "lug"],
      settings: { roundingMm: 10 },
      slack: 61.7,
      rule: "percent",
      loops: 50,
      ends: 65,
      cut: 1420,
    },
    {
      why: "same run, 1 mm step: 1410.7 → 1411",
      routed: 1234,
      strips: [8, 18],
      terms: ["ring", "lug"],
      settings: { roundingMm: 1 },
      slack: 61.7,
      rule: "percent",
      loops: 50,
      ends: 65,
      cut: 1411,
    },
    {
      why: "a butt splice sits inside the bundle: no service loop at that end",
      routed: 1000,
      strips: [null, null],
      terms: ["ring", "butt-splice"],
      slack: 50,
      rule: "percent",
      loops: 25,
      ends: 35,
      cut: 1110,
    },
    {
      why: "a strip longer than the lug allowance sets that end's allowance",
      routed: 1000,
      strips: [45, null],
      terms: ["lug", "ring"],
      slack: 50,
      rule: "percent",
      loops: 50,
      ends: 70,
      cut: 1170,
    },
    {
      why: "an unknown termination gets the unspecified allowance",
      routed: 1000,
      strips: [null, null],
      terms: ["wire nut", "RING"],
      slack: 50,
      rule: "percent",
      loops: 50,
      ends: UNSPECIFIED_END_ALLOWANCE_MM + 25,
      cut: 1145,
    },
    {
      why: "10 % slack, 80 mm minimum, 100 mm loops",
      routed: 2000,
      strips: [null, null],
      terms: ["socket", "spade"],
      settings: { slackPct: 10, slackMinMm: 80, serviceLoopMm: 100 },
      slack: 200,
      rule: "percent",
      loops: 200,
      ends: 45,
      cut: 2445,
    },
    {
      why: "an exact multiple of the step is not bumped",
      routed: 1100,
      strips: [null, null],
      terms: ["ring", "ring"],
      slack: 55,
      rule: "percent",
      loops: 50,
      ends: 50,
      cut: 1255,
    },
  ];

  it.each(cases)("$why", (c) => {
    const settings = { ...S, ...c.settings };
    const b = cutLengthBreakdown(c.routed, c.strips[0], c.strips[1], c.terms[0], c.terms[1], settings);
    expect(b.slackMm).toBeCloseTo(c.slack, 9);
    expect(b.slackRule).toBe(c.rule);
    expect(b.serviceLoopMm).toBe(c.loops);
    expect(b.endAllowanceMm).toBe(c.ends);
    expect(b.cutLengthMm).toBe(c.cut);
    expect(b.unroundedMm + b.roundingAddedMm).toBeCloseTo(c.cut, 9);
    expect(cutLengthMm(c.routed, c.strips[0], c.strips[1], c.terms[0], c.terms[1], settings)).toBe(c.cut);
  });

  it("reads a run and the default project settings", () => {
    const run = {
      routedLengthMm: 1000,
      endAStripMm: null,
      endBStripMm: null,
      endATermination: "ring",
      endBTermination: "ring",
    };
    const d = DEFAULT_PROJECT_SETTINGS;
    const expected =
      Math.ceil(
        (1000 + Math.max((1000 * d.slackPct) / 100, d.slackMinMm) + 2 * d.serviceLoopMm + 50) / d.roundingMm,
      ) * d.roundingMm;
    expect(runCutLengthMm(run, d)).toBe(expected);
  });

  it("covers every termination kind in the allowance table", () => {
    for (const t of TERMINATIONS) expect(END_ALLOWANCE_MM[t]).toBeGreaterThan(0);
  });

  it.each([
    [0, S],
    [-5, S],
    [Number.NaN, S],
    [1000, { ...S, slackPct: -1 }],
    [1000, { ...S, serviceLoopMm: -25 }],
  ])("refuses routed %f mm or negative settings", (routed, settings) => {
    expect(() => cutLengthMm(routed, null, null, null, null, settings)).toThrow(RangeError);
  });

  it("a rounding step below 1 mm is taken as 1 mm (whole millimetres)", () => {
    // 1234 + 61.7 + 50 + 50 = 1395.7 → 1396
    expect(cutLengthMm(1234, null, null, "ring", "ring", { ...S, roundingMm: 0 })).toBe(1396);
  });
});

describe("cut length: IPC/WHMA-A-620 Table 11-1 plus-only tolerance (nothing may be short)", () => {
  const settingsArb = fc.record({
    slackPct: fc.double({ min: 0, max: 20, noNaN: true }),
    slackMinMm: fc.integer({ min: 0, max: 300 }),
    serviceLoopMm: fc.integer({ min: 0, max: 200 }),
    roundingMm: fc.integer({ min: 1, max: 50 }),
  });
  const termArb = fc.option(fc.constantFrom<string>(...TERMINATIONS, "unknown"), { nil: null });
  const stripArb = fc.option(fc.integer({ min: 0, max: 60 }), { nil: null });

  it("cut ≥ routed, a whole multiple of the step, and less than one step above the rule", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 100_000 }),
        stripArb,
        stripArb,
        termArb,
        termArb,
        settingsArb,
        (routed, sa, sb, ta, tb, settings) => {
          const b = cutLengthBreakdown(routed, sa, sb, ta, tb, settings);
          expect(b.cutLengthMm).toBeGreaterThanOrEqual(routed);
          expect(b.cutLengthMm).toBeGreaterThanOrEqual(b.unroundedMm - 1e-6);
          expect(b.cutLengthMm - b.unroundedMm).toBeLessThan(settings.roundingMm);
          expect(b.cutLengthMm % settings.roundingMm).toBe(0);
          expect(Number.isInteger(b.cutLengthMm)).toBe(true);
          expect(b.slackMm).toBeGreaterThanOrEqual(settings.slackMinMm);
          expect(b.slackMm).toBeGreaterThanOrEqual((routed * settings.slackPct) / 100 - 1e-9);
          expect(b.endA.allowanceMm).toBeGreaterThanOrEqual(sa ?? 0);
          expect(b.endB.allowanceMm).toBeGreaterThanOrEqual(sb ?? 0);
        },
      ),
    );
  });

  it("a longer routed length never gives a shorter cut", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 99_999 }),
        fc.integer({ min: 1, max: 1000 }),
        settingsArb,
        (r, d, s) => {
          expect(cutLengthMm(r + d, null, null, "ring", "pin", s)).toBeGreaterThanOrEqual(
            cutLengthMm(r, null, null, "ring", "pin", s),
          );
        },
      ),
    );
  });

  // IPC/WHMA-A-620 Table 11-1 (as summarised in the project's practice notes, §7): +25 mm up to 0.3 m,
  // +50 mm to 1.5 m, +100 mm to 3 m, +150 mm to 7.5 m, +5 % beyond; −0 throughout.
  it.each([
    [100, 25],
    [300, 25],
    [1000, 50],
    [2000, 100],
    [5000, 150],
    [10_000, 500],
    [20_000, 1000],
  ])("plus tolerance at %i mm is %i mm", (len, tol) => {
    expect(lengthTolerancePlusMm(len)).toBe(tol);
  });
});
