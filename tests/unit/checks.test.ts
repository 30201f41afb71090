import { describe, expect, it } from "vitest";
import { computeChecks, type RunChecks } from "@/lib/domain/checks";
import { DEFAULT_PROJECT_SETTINGS, type ProjectSettings, type RunData } from "@/lib/domain/types";

// Invented runs of the demo robot (Cedar Flats Robotics, Harrow-3, 24 V).
function run(over: Partial<RunData> & { wireId: string }): RunData {
  return {
    endA: "MC1:1",
    endB: "M1:1",
    endATermination: "ring",
    endBTermination: "ferrule",
    endAStripMm: 6,
    endBStripMm: 8,
    circuit: null,
    gauge: "18 AWG",
    colour: "RD",
    insulation: null,
    insulationTempC: 105,
    bundleSize: null,
    hotSpace: false,
    routedLengthMm: 1000,
    currentA: 1,
    peakCurrentA: null,
    supplyV: null,
    dropClass: "standard",
    dropLimitPct: null,
    fuseA: null,
    returnKind: "same",
    returnRunWireId: null,
    returnResistanceOhm: null,
    ledForwardV: null,
    ledCurrentA: null,
    notes: null,
    ...over,
  };
}

const SETTINGS: ProjectSettings = { ...DEFAULT_PROJECT_SETTINGS, supplyV: 24, conductorTempC: 60 };

/**
 * Resistance per metre of stranded copper, computed here from the published inputs: IEC 60028 ρ20 = 0.017241
 * Ω·mm²/m and α20 = 0.00393 /K, the ASTM B258 AWG diameter, and the ~2 % stranding allowance of NEC Chapter 9
 * Table 8 (the module's 1.025 factor, within Table 8's 1.018–1.026 range).
 */
function awgOhmPerM(n: number, tempC = 60): number {
  const dMm = 0.127 * Math.pow(92, (36 - n) / 39);
  const areaMm2 = (Math.PI / 4) * dMm * dMm;
  return ((0.017241 * (1 + 0.00393 * (tempC - 20))) / areaMm2) * 1.025;
}

function check(runs: RunData[], settings = SETTINGS) {
  return computeChecks(runs, settings);
}
function one(r: RunData, settings = SETTINGS): RunChecks {
  return check([r], settings).runs[r.wireId]!;
}

describe("voltage drop in computeChecks", () => {
  it("fails a critical run above 3 % and names the rule", () => {
    // 18 AWG, 5 m each way, 3 A, 24 V: loop 10 m.
    const c = one(run({ wireId: "HR3-001", routedLengthMm: 5000, currentA: 3, dropClass: "critical" }));
    const loop = awgOhmPerM(18) * 10;
    expect(c.loopResistanceOhm).toBeCloseTo(loop, 9);
    expect(c.dropV).toBeCloseTo(3 * loop, 9);
    expect(c.dropPct).toBeCloseTo(((3 * loop) / 24) * 100, 9);
    expect(c.dropPct!).toBeGreaterThan(3);
    expect(c.verdict).toBe("fail");
    expect(c.reasons[0]).toMatch(/^Drop 3\.\d+ % exceeds the 3 % limit for critical circuits \(ABYC E-11\)$/);
  });

  it("applies 10 % to standard runs and 5 % to motor runs", () => {
    // Same run as above (≈ 3.1 %): passes ABYC E-11 standard 10 %, passes motor 5 % (common practice) in the warn-free zone.
    const standard = one(
      run({ wireId: "HR3-002", routedLengthMm: 5000, currentA: 3, dropClass: "standard" }),
    );
    expect(standard.dropLimitPct).toBe(10);
    expect(standard.findings.find((f) => f.topic === "drop")?.verdict).toBe("pass");
    const motor = one(run({ wireId: "HR3-003", routedLengthMm: 5000, currentA: 3, dropClass: "motor" }));
    expect(motor.dropLimitPct).toBe(5);
    expect(motor.findings.find((f) => f.topic === "drop")?.verdict).toBe("pass");
    const motorNear = one(run({ wireId: "HR3-004", routedLengthMm: 7000, currentA: 3, dropClass: "motor" }));
    expect(motorNear.findings.find((f) => f.topic === "drop")?.verdict).toBe("warn"); // 4.3 % > 80 % of 5 %
  });

  it("uses the run's own supply voltage when it has one", () => {
    const c = one(run({ wireId: "HR3-005", routedLengthMm: 5000, currentA: 3, supplyV: 12 }));
    expect(c.supplyV).toBe(12);
    expect(c.dropPct).toBeCloseTo(((3 * awgOhmPerM(18) * 10) / 12) * 100, 9);
  });

  it("computes the peak drop and only warns on it", () => {
    const c = one(
      run({ wireId: "HR3-006", gauge: "12 AWG", routedLengthMm: 2000, currentA: 10, peakCurrentA: 60 }),
    );
    const loop = awgOhmPerM(12) * 4;
    expect(c.peakDropPct).toBeCloseTo(((60 * loop) / 24) * 100, 9);
    expect(c.findings.find((f) => f.topic === "peak-drop")?.verdict).toBe(
      c.peakDropPct! > 10 ? "warn" : "pass",
    );
  });
});

describe("return paths", () => {
  it("looks up a named return run and uses its own gauge and length", () => {
    const feed = run({
      wireId: "HR3-010",
      gauge: "16 AWG",
      routedLengthMm: 4000,
      currentA: 5,
      returnKind: "run",
      returnRunWireId: "HR3-011",
    });
    const ret = run({
      wireId: "HR3-011",
      gauge: "12 AWG",
      routedLengthMm: 6000,
      currentA: null,
      colour: "BK",
    });
    const r = check([feed, ret]);
    const loop = awgOhmPerM(16) * 4 + awgOhmPerM(12) * 6;
    expect(r.runs["HR3-010"]!.loopResistanceOhm).toBeCloseTo(loop, 9);
    expect(r.runs["HR3-010"]!.lossW).toBeCloseTo(25 * loop, 9); // I²R including the return conductor
    expect(r.runs["HR3-010"]!.reasons.some((t) => t.includes("Return through run HR3-011"))).toBe(true);
    expect(r.runs["HR3-011"]!.reasons.some((t) => t.includes("return conductor of HR3-010"))).toBe(true);
    expect(r.summary.totalLossW).toBeCloseTo(25 * loop, 9);
  });

  it("does not count a return run's loss twice when it carries a current of its own", () => {
    const feed = run({
      wireId: "A",
      gauge: "16 AWG",
      routedLengthMm: 4000,
      currentA: 5,
      returnKind: "run",
      returnRunWireId: "B",
    });
    const ret = run({ wireId: "B", gauge: "12 AWG", routedLengthMm: 6000, currentA: 5 });
    const r = check([feed, ret]);
    const lossA = r.runs.A!.lossW!;
    const lossB = r.runs.B!.lossW!;
    const returnPartOfA = 25 * awgOhmPerM(12) * 6;
    expect(r.summary.totalLossW).toBeCloseTo(lossA + lossB - returnPartOfA, 9);
  });

  it("warns and falls back to the same gauge when the return run is missing", () => {
    const c = one(
      run({ wireId: "HR3-012", returnKind: "run", returnRunWireId: "HR3-999", routedLengthMm: 2000 }),
    );
    expect(c.loopResistanceOhm).toBeCloseTo(awgOhmPerM(18) * 4, 9);
    expect(c.verdict).toBe("warn");
    expect(c.reasons[0]).toContain("HR3-999 is not in this project");
  });

  it("adds a chassis return resistance and leaves it out of the conductor loss", () => {
    const c = one(
      run({
        wireId: "HR3-013",
        gauge: "14 AWG",
        routedLengthMm: 3000,
        currentA: 8,
        returnKind: "chassis",
        returnResistanceOhm: 0.02,
      }),
    );
    const wire = awgOhmPerM(14) * 3;
    expect(c.loopResistanceOhm).toBeCloseTo(wire + 0.02, 9);
    expect(c.dropV).toBeCloseTo(8 * (wire + 0.02), 9);
    expect(c.lossW).toBeCloseTo(64 * wire, 9);
  });

  it("warns when a chassis return has no resistance entered", () => {
    const c = one(run({ wireId: "HR3-014", returnKind: "chassis", returnResistanceOhm: null }));
    expect(c.loopResistanceOhm).toBeCloseTo(awgOhmPerM(18) * 1, 9);
    expect(c.verdict).toBe("warn");
    expect(c.reasons.some((t) => t.includes("drop is understated"))).toBe(true);
  });
});

describe("ampacity and protection in computeChecks", () => {
  it("fails a run above its derated ampacity (33 CFR 183.425)", () => {
    // 18 AWG 60 °C: 10 A (33 CFR 183.425 Table 5); 12 A exceeds it.
    const c = one(run({ wireId: "HR3-020", insulationTempC: 60, currentA: 12, routedLengthMm: 300 }));
    expect(c.ampacityA).toBe(10);
    expect(c.ampacityMarginPct).toBeCloseTo(-20, 9);
    expect(c.verdict).toBe("fail");
    expect(c.reasons[0]).toContain("33 CFR 183.425");
  });

  it("derates for a bundle and a hot space", () => {
    // 14 AWG 105 °C: 35 A (33 CFR 183.425); bundle of 8 × 0.50 (USCG); engine space 105 °C × 0.85.
    const c = one(run({ wireId: "HR3-021", gauge: "14 AWG", bundleSize: 8, hotSpace: true, currentA: 5 }));
    expect(c.ampacityA).toBeCloseTo(35 * 0.5 * 0.85, 9);
  });

  it("says when the insulation rating is assumed", () => {
    const c = one(run({ wireId: "HR3-022", insulationTempC: null }));
    expect(c.ampacityA).toBe(10); // 18 AWG at 60 °C, 33 CFR 183.425
    expect(c.reasons.some((t) => t.includes("60 °C assumed"))).toBe(true);
  });

  it("fails a fuse bigger than the wire's ampacity plus the 150 % allowance (ABYC E-11)", () => {
    // 16 AWG 105 °C = 25 A (33 CFR 183.425); 150 % = 37.5 A; 40 A is oversized.
    const c = one(run({ wireId: "HR3-023", gauge: "16 AWG", fuseA: 40, currentA: 5 }));
    expect(c.fuseVerdict).toBe("oversized");
    expect(c.verdict).toBe("fail");
    expect(c.reasons[0]).toContain("ABYC E-11 §11.10");
  });

  it("warns about a battery-sourced run without a fuse, and the cautions say so", () => {
    const r = check([run({ wireId: "HR3-024", endA: "BT1:+", endB: "F1:1", gauge: "4 AWG", currentA: 60 })]);
    const c = r.runs["HR3-024"]!;
    expect(c.batterySourced).toBe(true);
    expect(c.fuseVerdict).toBe("none");
    expect(c.verdict).toBe("warn");
    expect(c.reasons.some((t) => t.includes("battery-sourced") && t.includes("7 in (178 mm)"))).toBe(true);
    expect(r.cautions.some((t) => t.startsWith("1 battery-sourced run lists no fuse"))).toBe(true);
  });
});

describe("suggested gauge", () => {
  // The suggestion list in AWG, thinnest first (even sizes, then 1 … 4/0).
  const AWG_ORDER = [
    "30",
    "28",
    "26",
    "24",
    "22",
    "20",
    "18",
    "16",
    "14",
    "12",
    "10",
    "8",
    "6",
    "4",
    "2",
    "1",
    "1/0",
    "2/0",
    "3/0",
    "4/0",
  ].map((s) => `${s} AWG`);
  const METRIC_ORDER = [0.5, 0.75, 1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120].map((s) => `${s} mm²`);

  const sizingFails = (c: RunChecks) =>
    c.findings.some(
      (f) => f.verdict === "fail" && (f.topic === "drop" || f.topic === "ampacity" || f.topic === "fuse"),
    ) || c.fuseVerdict === "next-size";

  const cases: [name: string, r: RunData, settings: ProjectSettings, order: string[]][] = [
    [
      "drive motor feed (drop-bound)",
      run({
        wireId: "S1",
        gauge: "18 AWG",
        routedLengthMm: 3500,
        currentA: 25,
        dropClass: "motor",
        fuseA: 30,
      }),
      SETTINGS,
      AWG_ORDER,
    ],
    [
      "short battery lead (ampacity-bound)",
      run({
        wireId: "S2",
        gauge: "10 AWG",
        routedLengthMm: 250,
        currentA: 90,
        insulationTempC: 105,
        bundleSize: 4,
      }),
      SETTINGS,
      AWG_ORDER,
    ],
    [
      "sensor mast feed, metric project",
      run({
        wireId: "S3",
        gauge: "0.5 mm²",
        routedLengthMm: 6000,
        currentA: 4,
        dropClass: "critical",
        fuseA: 7.5,
      }),
      { ...SETTINGS, gaugeSystem: "metric" },
      METRIC_ORDER,
    ],
    [
      "fuse-bound signal run",
      run({
        wireId: "S4",
        gauge: "22 AWG",
        routedLengthMm: 500,
        currentA: 0.5,
        fuseA: 15,
        insulationTempC: 80,
      }),
      SETTINGS,
      AWG_ORDER,
    ],
  ];
  it.each(cases)(
    "%s: the suggestion passes drop, ampacity and fuse; the next smaller size does not",
    (_n, r, settings, order) => {
      const c = one(r, settings);
      expect(c.suggestedGauge).not.toBeNull();
      const atSuggestion = one({ ...r, gauge: c.suggestedGauge! }, settings);
      expect(sizingFails(atSuggestion)).toBe(false);
      expect(atSuggestion.suggestedGauge).toBe(c.suggestedGauge);
      const i = order.indexOf(c.suggestedGauge!);
      expect(i).toBeGreaterThan(0);
      const smaller = one({ ...r, gauge: order[i - 1]! }, settings);
      expect(sizingFails(smaller)).toBe(true);
    },
  );

  it("is null when nothing sizes the run, and when no size passes", () => {
    expect(one(run({ wireId: "S5", currentA: null })).suggestedGauge).toBeNull();
    const huge = one(run({ wireId: "S6", currentA: 2000, routedLengthMm: 1000 }));
    expect(huge.suggestedGauge).toBeNull();
    expect(huge.reasons.some((t) => t.startsWith("No gauge up to 4/0 AWG passes"))).toBe(true);
  });
});

describe("loss, resistors, bad input and the summary", () => {
  it("loss is I²R of the loop and sums over the project", () => {
    const a = run({ wireId: "L1", gauge: "12 AWG", routedLengthMm: 2000, currentA: 10 });
    const b = run({ wireId: "L2", gauge: "16 AWG", routedLengthMm: 1500, currentA: 4 });
    const r = check([a, b]);
    const lossA = 100 * awgOhmPerM(12) * 4;
    const lossB = 16 * awgOhmPerM(16) * 3;
    expect(r.runs.L1!.lossW).toBeCloseTo(lossA, 9);
    expect(r.summary.totalLossW).toBeCloseTo(lossA + lossB, 9);
  });

  it("sizes the series resistor of an indicator run", () => {
    // 24 V, 2.1 V LED at 20 mA: 1 095 Ω → E12 1 200 Ω (IEC 60063); 0.40 W × 2 → 1 W (common practice).
    const c = one(
      run({ wireId: "HR3-030", gauge: "22 AWG", currentA: null, ledForwardV: 2.1, ledCurrentA: 0.02 }),
    );
    expect(c.seriesResistorOhm).toBe(1200);
    expect(c.seriesResistorDissipationW).toBeCloseTo((21.9 * 21.9) / 1200, 12);
    expect(c.seriesResistorW).toBe(1);
    expect(c.currentA).toBe(0.02); // the LED current stands in for the run's current
  });

  it("passes a run without a current and says what was not checked", () => {
    const c = one(run({ wireId: "HR3-031", currentA: null }));
    expect(c.verdict).toBe("pass");
    expect(c.dropPct).toBeNull();
    expect(c.lossW).toBeNull();
    expect(c.reasons).toContain("No current given: drop, ampacity margin and loss not checked");
  });

  it("fails a run whose gauge cannot be read", () => {
    const c = one(run({ wireId: "HR3-032", gauge: "thick" }));
    expect(c.verdict).toBe("fail");
    expect(c.gauge).toBeNull();
    expect(c.reasons[0]).toMatch(/^Gauge cannot be read/);
  });

  it("fails duplicate wire IDs and keys the record by the first", () => {
    const r = check([run({ wireId: "D1", currentA: 1 }), run({ wireId: "D1", currentA: 2 })]);
    expect(r.list).toHaveLength(2);
    expect(r.runs.D1!.currentA).toBe(1);
    expect(r.list.every((c) => c.verdict === "fail")).toBe(true);
  });

  it("summarises verdicts, the worst drops against their limits, and cautions", () => {
    const r = check([
      run({ wireId: "W1", routedLengthMm: 5000, currentA: 3, dropClass: "critical" }), // ≈ 3.1 % of 3 %: fail
      run({ wireId: "W2", routedLengthMm: 5000, currentA: 3, dropClass: "standard" }), // ≈ 3.1 % of 10 %
      run({ wireId: "W3", currentA: null }),
      run({ wireId: "W4", routedLengthMm: 1000, currentA: 10, dropClass: "standard", insulationTempC: 105 }),
    ]);
    expect(r.summary.runCount).toBe(4);
    expect(r.summary.pass + r.summary.warn + r.summary.fail).toBe(4);
    expect(r.summary.fail).toBeGreaterThanOrEqual(1);
    expect(r.summary.noCurrent).toBe(1);
    expect(r.summary.worstByDrop[0]!.wireId).toBe("W1");
    expect(r.summary.worstByDrop.map((w) => w.wireId)).not.toContain("W3");
    const all = r.cautions.join(" ");
    expect(all).toContain("local codes");
    expect(all).toContain("licensed practice");
    expect(all).toContain("start fires");
    expect(all).toContain("7 in (178 mm)");
  });

  it("every reason names a rule or says what it assumed", () => {
    const r = check([
      run({
        wireId: "R1",
        routedLengthMm: 5000,
        currentA: 3,
        dropClass: "critical",
        fuseA: 40,
        endA: "BT1:+",
      }),
      run({ wireId: "R2", gauge: "14 AWG", bundleSize: 6, hotSpace: true, currentA: 9, fuseA: 20 }),
    ]);
    for (const c of r.list) {
      for (const t of c.reasons) {
        expect(t).toMatch(
          /ABYC|33 CFR|NEC|IEC|USCG|common practice|our (own )?rule|engine-space|not checked|assumed|used/,
        );
      }
    }
  });
});
