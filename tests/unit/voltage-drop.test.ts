import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  awgAreaCmil,
  MM2_PER_CMIL,
  M_PER_FT,
  resistivityAt,
  type ConductorOptions,
} from "@/lib/domain/conductors";
import { type Gauge } from "@/lib/domain/gauge";
import {
  ABYC_K_COPPER,
  abycCircularMils,
  DROP_LIMITS,
  dropLimitFor,
  judgeDrop,
  loopResistance,
  minAreaMm2ForDrop,
  voltageDrop,
  worstVerdict,
} from "@/lib/domain/voltage-drop";

const awg = (n: number): Gauge => ({ system: "awg", awg: n });
const SOLID_CU: ConductorOptions = { material: "copper", stranded: false, iecClass: "5/6", tinned: false };

describe("ABYC E-11 circular-mil formula CM = K·I·L/E", () => {
  it("uses K = 10.75 for copper", () => {
    // ABYC E-11 11.14 excerpt (cruisersforum thread quoting it): K = 10.75.
    expect(ABYC_K_COPPER).toBe(10.75);
  });

  it("10 A, 20 ft loop, 12 V, 3 % → CM 5 972", () => {
    // Worked example, electrical.md §5 (from the ABYC E-11 formula).
    const allowedV = 12 * (DROP_LIMITS.critical.limitPct / 100);
    expect(allowedV).toBeCloseTo(0.36, 12);
    expect(Math.round(abycCircularMils(10, 20, allowedV))).toBe(5972);
  });

  it("nominal 12 AWG passes that example, the SAE-minimum 12 AWG fails it, 10 AWG passes both ways", () => {
    // electrical.md §5: nominal 12 AWG = 6 530 cmil (ASTM B258); SAE minimum 12 AWG 5 833, 10 AWG 9 343 (mem, M).
    const need = abycCircularMils(10, 20, 0.36);
    expect(awgAreaCmil(12)).toBeGreaterThan(need);
    expect(5833).toBeLessThan(need);
    expect(9343).toBeGreaterThan(need);
  });

  it("K = 10.75 is copper's resistivity at about 29 °C", () => {
    // electrical.md §5: "10.75 corresponds to copper at roughly 29 C" (calc from IEC 60028 ρ and α).
    const ohmCmilPerFt = (t: number) => (resistivityAt("copper", t) / MM2_PER_CMIL) * M_PER_FT;
    expect(ohmCmilPerFt(28)).toBeLessThan(10.75);
    expect(ohmCmilPerFt(30)).toBeGreaterThan(10.75);
  });

  it("the SI form A = ρ·L·I/V gives the same area as the ABYC form", () => {
    // ABYC E-11 formula vs electrical.md §5 SI form, with ρ = K converted to Ω·mm²/m.
    const rho = (ABYC_K_COPPER * MM2_PER_CMIL) / M_PER_FT;
    const aMm2 = minAreaMm2ForDrop(10, 20 * M_PER_FT, 0.36, rho);
    expect(aMm2 / MM2_PER_CMIL).toBeCloseTo(abycCircularMils(10, 20, 0.36), 6);
  });
});

describe("drop limits by class", () => {
  // ABYC E-11 (11.14.2.6 as quoted): 3 % critical, 10 % other circuits; 5 % motor is common practice.
  const table: [cls: "critical" | "standard" | "motor", pct: number, rule: string][] = [
    ["critical", 3, "ABYC E-11"],
    ["standard", 10, "ABYC E-11"],
    ["motor", 5, "common practice"],
  ];
  it.each(table)("%s: %i %% (%s)", (cls, pct, rule) => {
    const r = dropLimitFor(cls, null);
    expect(r.ok).toBe(true);
    expect(r.limit.limitPct).toBe(pct);
    expect(r.limit.rule).toBe(rule);
  });

  it("custom uses dropLimitPct; without one it falls back to the strictest limit and says so", () => {
    expect(dropLimitFor("custom", 4).limit.limitPct).toBe(4);
    const r = dropLimitFor("custom", null);
    expect(r.ok).toBe(false);
    expect(r.limit.limitPct).toBe(3);
  });
});

describe("judgeDrop", () => {
  const critical = DROP_LIMITS.critical;
  // Limits: ABYC E-11 3 %; the 80 % warn band is our own rule.
  const table: [pct: number, verdict: string][] = [
    [4.1, "fail"],
    [3.01, "fail"],
    [3, "warn"],
    [2.5, "warn"],
    [2.4, "pass"],
    [0.5, "pass"],
  ];
  it.each(table)("%f %% against 3 %% → %s", (pct, verdict) => {
    const j = judgeDrop(pct, critical);
    expect(j.verdict).toBe(verdict);
    expect(j.text).toContain("ABYC E-11");
    expect(j.text).toContain("3 % limit for critical circuits");
  });

  it("names the numbers in the reason", () => {
    expect(judgeDrop(4.1, critical).text).toBe(
      "Drop 4.1 % exceeds the 3 % limit for critical circuits (ABYC E-11)",
    );
  });
});

describe("loop resistance and drop", () => {
  it('"same" return doubles the run: Vdrop = 2ρLI/A (round-trip rule)', () => {
    // electrical.md §5 round-trip rule; ρ20 from IEC 60028, A from ASTM B258.
    const loop = loopResistance(
      { gauge: awg(12), lengthMm: 5000 },
      { kind: "conductor", leg: { gauge: awg(12), lengthMm: 5000 } },
      20,
      SOLID_CU,
    );
    const areaMm2 = awgAreaCmil(12) * MM2_PER_CMIL;
    expect(loop.loopResistanceOhm).toBeCloseTo((2 * 0.017241 * 5) / areaMm2, 9);
    expect(loop.returnIsConductor).toBe(true);
    const d = voltageDrop(10, loop.loopResistanceOhm, 12);
    expect(d.dropV).toBeCloseTo(10 * loop.loopResistanceOhm, 12);
    expect(d.dropPct).toBeCloseTo((d.dropV / 12) * 100, 12);
  });

  it("a chassis return adds its entered resistance and is not a conductor of the loop", () => {
    const loop = loopResistance(
      { gauge: awg(12), lengthMm: 5000 },
      { kind: "fixed", ohm: 0.01 },
      20,
      SOLID_CU,
    );
    expect(loop.loopResistanceOhm - loop.supplyOhm).toBeCloseTo(0.01, 12);
    expect(loop.returnIsConductor).toBe(false);
  });

  it("a thicker return conductor lowers the loop", () => {
    const supply = { gauge: awg(12), lengthMm: 5000 };
    const same = loopResistance(supply, { kind: "conductor", leg: supply }, 60);
    const thick = loopResistance(supply, { kind: "conductor", leg: { gauge: awg(8), lengthMm: 5000 } }, 60);
    expect(thick.loopResistanceOhm).toBeLessThan(same.loopResistanceOhm);
    expect(thick.supplyOhm).toBe(same.supplyOhm);
  });

  it("worstVerdict orders fail > warn > pass", () => {
    expect(worstVerdict(["pass", "warn", "pass"])).toBe("warn");
    expect(worstVerdict(["warn", "fail"])).toBe("fail");
    expect(worstVerdict([])).toBe("pass");
  });
});

describe("properties (fast-check)", () => {
  const dropPct = (n: number, lengthMm: number, currentA: number, tempC = 60) => {
    const leg = { gauge: awg(n), lengthMm };
    const loop = loopResistance(leg, { kind: "conductor", leg }, tempC);
    return voltageDrop(currentA, loop.loopResistanceOhm, 24).dropPct;
  };
  const gaugeArb = fc.integer({ min: -3, max: 30 });
  const lengthArb = fc.integer({ min: 1, max: 50_000 });
  const currentArb = fc.double({ min: 0.001, max: 400, noNaN: true });

  it("drop grows with length", () => {
    fc.assert(
      fc.property(gaugeArb, lengthArb, fc.integer({ min: 1, max: 10_000 }), currentArb, (n, l, extra, i) => {
        expect(dropPct(n, l + extra, i)).toBeGreaterThan(dropPct(n, l, i));
      }),
    );
  });

  it("drop grows with current", () => {
    fc.assert(
      fc.property(
        gaugeArb,
        lengthArb,
        currentArb,
        fc.double({ min: 0.001, max: 100, noNaN: true }),
        (n, l, i, di) => {
          expect(dropPct(n, l, i + di)).toBeGreaterThan(dropPct(n, l, i));
        },
      ),
    );
  });

  it("drop falls as the area grows (a smaller AWG number)", () => {
    fc.assert(
      fc.property(fc.integer({ min: -2, max: 30 }), lengthArb, currentArb, (n, l, i) => {
        expect(dropPct(n - 1, l, i)).toBeLessThan(dropPct(n, l, i));
      }),
    );
  });

  it("drop grows with conductor temperature", () => {
    fc.assert(
      fc.property(gaugeArb, lengthArb, currentArb, fc.integer({ min: -20, max: 150 }), (n, l, i, t) => {
        expect(dropPct(n, l, i, t + 10)).toBeGreaterThan(dropPct(n, l, i, t));
      }),
    );
  });
});
