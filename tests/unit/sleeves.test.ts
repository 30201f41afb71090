import { describe, expect, it } from "vitest";
import {
  chooseSleeve,
  concentricLayOdMm,
  layFlatWidthMm,
  NEC_TABLE_8_STRANDED_OD_MM,
  sleeveFitGrade,
  SLEEVES_2_TO_1,
  SLEEVES_3_TO_1,
  strandedConductorOdMm,
  wireOuterDiameter,
} from "@/lib/domain/sleeves";

const INCH_MM = 25.4; // NIST SP 811: 1 in = 25.4 mm exactly

describe("2:1 inch sleeve series", () => {
  // Nominal sizes are inch fractions (common practice); the table gives them to 0.1 mm.
  const nominalIn = [1 / 16, 3 / 32, 1 / 8, 3 / 16, 1 / 4, 3 / 8, 1 / 2, 3 / 4, 1];
  it.each(nominalIn.map((inch, i) => [inch, SLEEVES_2_TO_1[i]!] as const))(
    "%f in expanded matches its inch size and recovers to half",
    (inch, s) => {
      expect(Math.abs(s.expandedMm - inch * INCH_MM)).toBeLessThanOrEqual(0.051);
      // 2:1 means expanded = 2 × recovered (electrical.md §8, common practice)
      expect(Math.abs(s.recoveredMm - (inch * INCH_MM) / 2)).toBeLessThanOrEqual(0.051);
      expect(s.ratio).toBe(2);
    },
  );
});

describe("lay-flat width", () => {
  // practice.md §3: flat width ≈ π × ID / 2: 3.2 mm → 5.0 mm, 4.8 → 7.5 mm, 6.4 → 10 mm (geometry, own check)
  it.each([
    [3.2, 5.0],
    [4.8, 7.5],
    [6.4, 10.0],
  ])("a %f mm tube lies %f mm flat", (d, flat) => {
    expect(layFlatWidthMm(d)).toBeCloseTo(flat, 0);
    expect(Math.abs(layFlatWidthMm(d) - flat)).toBeLessThan(0.06);
  });
});

describe("sleeve fit window on a 2:1 sleeve", () => {
  // electrical.md §8 (common practice): the recovered ID must stay below the OD, and the grip rule is
  // OD ≤ D_rec + 0.25 (D_exp − D_rec), which on an exact 2:1 sleeve is 0.625 × D_exp.
  it.each(SLEEVES_2_TO_1.map((s) => [s.label, s] as const))("%s", (_label, s) => {
    const d = s.expandedMm;
    const gripMax = s.recoveredMm + 0.25 * (s.expandedMm - s.recoveredMm);
    expect(Math.abs(gripMax / d - 0.625)).toBeLessThan(0.01);
    expect(sleeveFitGrade(s, s.recoveredMm)).toBe("too-loose");
    expect(sleeveFitGrade(s, s.recoveredMm * 1.01)).toBe("grip");
    expect(sleeveFitGrade(s, gripMax)).toBe("grip");
    expect(sleeveFitGrade(s, gripMax * 1.01)).toBe("slide-only");
    // slide-on margin: expanded at least 20 % above the OD (electrical.md §8, 20–30 %, common practice)
    expect(sleeveFitGrade(s, d / 1.2)).toBe("slide-only");
    expect(sleeveFitGrade(s, d / 1.19)).toBe("too-tight");
  });
});

describe("chooseSleeve", () => {
  // Worked by hand from the fit rules above (common practice): the smallest sleeve that grips, else the
  // smallest that slides on and recovers onto the wire.
  it.each([
    // 1.97 mm: 3.2/1.6 grips up to 1.6 + 0.4 = 2.0 mm
    [1.97, "2to1-3.2", "grip"],
    // 2.2 mm: nothing grips (3.2 stops at 2.0, 4.8 recovers to 2.4 ≥ 2.2); 2.4 is too tight (2.4 < 2.64)
    [2.2, "2to1-3.2", "slide-only"],
    // 3.0 mm: 4.8/2.4 grips up to 2.4 + 0.6 = 3.0 mm
    [3.0, "2to1-4.8", "grip"],
    // 7.05 mm: 9.5/4.8 only slides (grip ends at 5.975); 12.7/6.4 grips up to 7.975
    [7.05, "2to1-12.7", "grip"],
  ] as const)("a %f mm wire gets %s (%s)", (od, id, grade) => {
    const r = chooseSleeve(od);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.choice.sleeve.id).toBe(id);
    expect(r.choice.grade).toBe(grade);
    expect(r.choice.layFlatMm).toBeCloseTo((Math.PI * r.choice.sleeve.expandedMm) / 2, 9);
    expect(r.choice.circumferentialScale).toBeCloseTo(od / r.choice.sleeve.expandedMm, 9);
  });

  it.each([
    [0.7, /thinner than the smallest sleeve/],
    [30, /no sleeve in the series slides over/],
    [0, /above 0/],
  ] as const)("refuses a %f mm wire", (od, message) => {
    const r = chooseSleeve(od);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(message);
  });

  it("uses another series when asked (3:1: grip window recovered to 1.5 × recovered)", () => {
    // 3:1, worked by hand: 6/2 grips from 2 to 2 + 0.25 × 4 = 3 mm
    const r = chooseSleeve(2.5, SLEEVES_3_TO_1);
    expect(r.ok && r.choice.sleeve.id).toBe("3to1-6");
  });
});

describe("stranded conductor OD", () => {
  // NEC Chapter 9 Table 8, overall diameter of 7-strand copper (electrical.md §1)
  const table8: [number, number][] = [
    [18, 1.17],
    [16, 1.47],
    [14, 1.85],
    [12, 2.34],
    [10, 2.95],
    [8, 3.71],
    [6, 4.67],
    [4, 5.89],
    [2, 7.42],
  ];
  it.each(table8)("%i AWG is %f mm (NEC Ch. 9 Table 8)", (awg, odMm) => {
    expect(NEC_TABLE_8_STRANDED_OD_MM[awg]).toBe(odMm);
    expect(strandedConductorOdMm({ system: "awg", awg })).toEqual({ odMm, source: "nec-table-8" });
  });

  it.each(table8)("concentric-lay geometry reproduces Table 8 for %i AWG within 1.5 %", (awg, odMm) => {
    // ASTM B258: d = 0.127 mm × 92^((36 − n)/39)
    const solid = 0.127 * Math.pow(92, (36 - awg) / 39);
    expect(Math.abs(concentricLayOdMm(solid, 7) / odMm - 1)).toBeLessThan(0.015);
  });

  it("uses 19 strands from 1 AWG up, like Table 8 (1/0: 0.372 in, from memory)", () => {
    const r = strandedConductorOdMm({ system: "awg", awg: 0 });
    expect(r.source).toBe("concentric-lay");
    expect(Math.abs(r.odMm / (0.372 * INCH_MM) - 1)).toBeLessThan(0.01);
  });
});

describe("wire outer diameter", () => {
  it("takes the wire type's OD when it has one", () => {
    expect(wireOuterDiameter({ outerDiameterMm: 2.05, gauge: "18 AWG" })).toMatchObject({
      odMm: 2.05,
      estimated: false,
    });
  });

  it.each(["22 AWG", "18 AWG", "12 AWG", "4 AWG", "1/0 AWG", "0.75 mm²"])(
    "estimates %s as stranded OD + two insulation walls",
    (gauge) => {
      const od = wireOuterDiameter({ gauge, insulation: null });
      expect(od?.estimated).toBe(true);
      const p = gauge.endsWith("AWG")
        ? { system: "awg" as const, awg: gauge.startsWith("1/0") ? 0 : Number(gauge.split(" ")[0]) }
        : { system: "metric" as const, mm2: 0.75 };
      const wall = (od!.odMm - strandedConductorOdMm(p).odMm) / 2;
      // hook-up and battery-cable walls run about 0.3–1.5 mm (electrical.md §8, common practice)
      expect(wall).toBeGreaterThanOrEqual(0.3);
      expect(wall).toBeLessThanOrEqual(1.5);
    },
  );

  it("has no estimate for an unparseable gauge", () => {
    expect(wireOuterDiameter({ gauge: "fat" })).toBeNull();
  });
});
