import { describe, expect, it } from "vitest";
import {
  ampacityMarginPct,
  baseAmpacity,
  bundleFactor,
  deratedAmpacity,
  ENGINE_SPACE_FACTORS,
  judgeAmpacity,
  USCG_TEMP_COLUMNS_C,
  uscgColumnFor,
  uscgTable5A,
} from "@/lib/domain/ampacity";
import { awgAreaMm2 } from "@/lib/domain/conductors";
import { type Gauge } from "@/lib/domain/gauge";

const awg = (n: number): Gauge => ({ system: "awg", awg: n });
const mm2 = (a: number): Gauge => ({ system: "metric", mm2: a });
const single = (g: Gauge, insulationTempC: number | null) =>
  deratedAmpacity({ gauge: g, insulationTempC, bundleSize: null, hotSpace: false });

// 33 CFR 183.425 Table 5 (federal.elaws.us copy, electrical.md §6a): insulated stranded copper, 30 °C ambient,
// single conductor; columns 60, 75, 80, 90, 105, 125, 200 °C.
const TABLE_5: [label: string, n: number, amps: number[]][] = [
  ["18", 18, [10, 10, 15, 20, 20, 25, 25]],
  ["16", 16, [15, 15, 20, 25, 25, 30, 35]],
  ["14", 14, [20, 20, 25, 30, 35, 40, 45]],
  ["12", 12, [25, 25, 35, 40, 45, 50, 55]],
  ["10", 10, [40, 40, 50, 55, 60, 70, 70]],
  ["8", 8, [55, 65, 70, 70, 80, 90, 100]],
  ["6", 6, [80, 95, 100, 100, 120, 125, 135]],
  ["4", 4, [105, 125, 130, 135, 160, 170, 180]],
  ["2", 2, [140, 170, 175, 180, 210, 225, 240]],
  ["0", 0, [195, 230, 245, 245, 285, 305, 325]],
  ["0000", -3, [300, 360, 385, 385, 445, 475, 510]],
];

describe("33 CFR 183.425 Table 5", () => {
  it("has the seven insulation columns", () => {
    expect([...USCG_TEMP_COLUMNS_C]).toEqual([60, 75, 80, 90, 105, 125, 200]);
  });

  it.each(TABLE_5)("%s AWG", (_label, n, amps) => {
    USCG_TEMP_COLUMNS_C.forEach((c, i) => {
      expect(uscgTable5A(n, c)).toBe(amps[i]);
      const r = single(awg(n), c);
      expect(r.ok && r.ampacityA).toBe(amps[i]);
      expect(r.ok && r.method).toBe("table");
    });
  });

  it("picks the highest column not above the insulation rating", () => {
    // Conservative reading of 33 CFR 183.425 Table 5: an 85 °C wire gets the 80 °C column.
    expect(uscgColumnFor(85)).toBe(80);
    expect(uscgColumnFor(105)).toBe(105);
    expect(uscgColumnFor(250)).toBe(200);
    expect(uscgColumnFor(50)).toBeNull();
  });

  it("assumes 60 °C when the rating is unknown, and says so", () => {
    // 33 CFR 183.425 Table 5: 14 AWG at 60 °C = 20 A, the lowest column.
    const r = single(awg(14), null);
    expect(r.ok && r.ampacityA).toBe(20);
    expect(r.ok && r.notes.join(" ")).toContain("60 °C assumed");
  });

  it("gives no ampacity for insulation below the 60 °C column", () => {
    const r = single(awg(14), 50);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toContain("33 CFR 183.425");
  });
});

describe("sizes Table 5 does not list (our conservative rules)", () => {
  // Between two listed sizes: the next smaller listed size (33 CFR 183.425 Table 5 values).
  const between: [label: string, g: Gauge, basisAwg: number, at60: number, at105: number][] = [
    ["1 AWG", awg(1), 2, 140, 210],
    ["3 AWG", awg(3), 4, 105, 160],
    ["2/0 AWG", awg(-1), 0, 195, 285],
    ["3/0 AWG", awg(-2), 0, 195, 285],
    ["1.5 mm²", mm2(1.5), 16, 15, 25],
    ["2.5 mm²", mm2(2.5), 14, 20, 35],
    ["4 mm²", mm2(4), 12, 25, 45],
    ["50 mm²", mm2(50), 2, 140, 210],
  ];
  it.each(between)("%s is rated as the next smaller listed size", (_label, g, basisAwg, at60, at105) => {
    const r60 = single(g, 60);
    const r105 = single(g, 105);
    expect(r60.ok && r60.basisAwg).toBe(basisAwg);
    expect(r60.ok && r60.method).toBe("next-smaller-size");
    expect(r60.ok && r60.ampacityA).toBe(at60);
    expect(r105.ok && r105.ampacityA).toBe(at105);
  });

  it("scales 18 AWG by area for thinner wire, never above what FAA AC 43.13-1B's size steps imply", () => {
    // FAA AC 43.13-1B Table 11-9, 105 °C wire: 24/22/20/18 AWG = 2.5/3/4/6 A. The ratio to 18 AWG is an
    // independent, published estimate of how ampacity falls with size; linear area scaling must stay below it.
    const faa105: [number, number][] = [
      [20, 4],
      [22, 3],
      [24, 2.5],
    ];
    for (const [n, faaA] of faa105) {
      const r = single(awg(n), 105);
      expect(r.ok && r.method).toBe("area-scaled");
      const ratio = r.ok ? r.ampacityA / 20 : NaN; // 18 AWG at 105 °C = 20 A (33 CFR 183.425)
      expect(ratio).toBeLessThanOrEqual(faaA / 6);
      expect(ratio).toBeCloseTo(awgAreaMm2(n) / awgAreaMm2(18), 9);
    }
  });

  it("caps sizes above 4/0 at the 4/0 value", () => {
    // 33 CFR 183.425 Table 5: 4/0 at 60 °C = 300 A.
    const r = single(mm2(120), 60);
    expect(r.ok && r.method).toBe("largest-size");
    expect(r.ok && r.ampacityA).toBe(300);
  });

  it("never rates a bigger conductor below a smaller one", () => {
    const sizes = [
      30, 28, 26, 24, 22, 20, 18, 17, 16, 15, 14, 13, 12, 11, 10, 9, 8, 7, 6, 5, 4, 3, 2, 1, 0, -1, -2, -3,
    ];
    for (const c of USCG_TEMP_COLUMNS_C) {
      const amps = sizes.map((n) => baseAmpacity(awgAreaMm2(n), c)!.ampacityA);
      for (let i = 1; i < amps.length; i++) expect(amps[i]).toBeGreaterThanOrEqual(amps[i - 1]!);
    }
  });
});

describe("derating", () => {
  // USCG Electrical System Compliance Guideline bundle factors (delzer.com reprint, electrical.md §6a).
  const bundles: [n: number, factor: number][] = [
    [1, 1],
    [2, 1],
    [3, 0.7],
    [4, 0.6],
    [6, 0.6],
    [7, 0.5],
    [24, 0.5],
    [25, 0.4],
    [60, 0.4],
  ];
  it.each(bundles)("bundle of %i → ×%f", (n, f) => {
    expect(bundleFactor(n)).toBe(f);
  });

  it("applies the bundle factor and says it is applied below 50 V too", () => {
    // 33 CFR 183.425: 12 AWG 105 °C = 45 A; USCG 7–24 conductors × 0.50.
    const r = deratedAmpacity({ gauge: awg(12), insulationTempC: 105, bundleSize: 10, hotSpace: false });
    expect(r.ok && r.ampacityA).toBeCloseTo(22.5, 9);
    expect(r.ok && r.notes.join(" ")).toContain("50 V");
    expect(r.ok && r.notes.join(" ")).toContain("Bundle of 7–24 conductors: ×0.5");
  });

  it("engine-space factor for 105 °C wire is 0.85", () => {
    // Engine-space (50 °C) derating, 105 °C column: × 0.85 (electrical.md §6a, medium confidence).
    expect(ENGINE_SPACE_FACTORS[105]).toBe(0.85);
    const r = deratedAmpacity({ gauge: awg(10), insulationTempC: 105, bundleSize: null, hotSpace: true });
    expect(r.ok && r.ampacityA).toBeCloseTo(60 * 0.85, 9); // 33 CFR 183.425: 10 AWG 105 °C = 60 A
  });

  it("multiplies bundle and hot-space factors", () => {
    // 33 CFR 183.425: 8 AWG 90 °C = 70 A; bundle of 5 × 0.60; engine space 90 °C × 0.82 (from memory).
    const r = deratedAmpacity({ gauge: awg(8), insulationTempC: 90, bundleSize: 5, hotSpace: true });
    expect(r.ok && r.ampacityA).toBeCloseTo(70 * 0.6 * 0.82, 9);
  });
});

describe("judgeAmpacity", () => {
  // 80 % warn band is our own rule; the limit is the derated ampacity (33 CFR 183.425).
  const table: [currentA: number, ampacityA: number, verdict: string][] = [
    [26, 25, "fail"],
    [25, 25, "warn"],
    [21, 25, "warn"],
    [20, 25, "pass"],
  ];
  it.each(table)("%f A on a %f A wire → %s", (i, a, verdict) => {
    const j = judgeAmpacity(i, a);
    expect(j.verdict).toBe(verdict);
    expect(j.text).toContain("33 CFR 183.425");
  });

  it("margin is the share of ampacity left", () => {
    expect(ampacityMarginPct(15, 20)).toBeCloseTo(25, 12);
    expect(ampacityMarginPct(25, 20)).toBeCloseTo(-25, 12);
  });
});
