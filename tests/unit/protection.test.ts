import { describe, expect, it } from "vitest";
import { type Gauge } from "@/lib/domain/gauge";
import {
  deviceOf,
  FUSE_MIN_LOAD_FACTOR,
  isBatterySourced,
  judgeFuse,
  nec2404dCapA,
  NEXT_SIZE_MAX_FACTOR,
  SOURCE_PROTECTION_MAX_MM,
  type FuseInput,
} from "@/lib/domain/protection";

const awg = (n: number): Gauge => ({ system: "awg", awg: n });
const input = (over: Partial<FuseInput>): FuseInput => ({
  fuseA: null,
  ampacityA: 15,
  currentA: null,
  motorLoad: false,
  batterySourced: false,
  gauge: awg(16),
  ...over,
});

describe("fuse against the wire's ampacity (ABYC E-11 §11.10)", () => {
  it("allows the next size up to 150 % of ampacity, non-motor loads only", () => {
    // ABYC E-11 §11.10 summary (pkys "Overcurrent protection"): next standard size if ≤ 150 %, non-motor.
    expect(NEXT_SIZE_MAX_FACTOR).toBe(1.5);
  });

  // Wire ampacity 15 A throughout; 150 % = 22.5 A (ABYC E-11 §11.10).
  const table: [fuseA: number, motor: boolean, fuseVerdict: string, verdict: string][] = [
    [10, false, "ok", "pass"],
    [15, false, "ok", "pass"],
    [20, false, "next-size", "warn"],
    [22.5, false, "next-size", "warn"],
    [25, false, "oversized", "fail"],
    [20, true, "oversized", "fail"],
    [15, true, "ok", "pass"],
  ];
  it.each(table)("%f A fuse, motor %s → %s", (fuseA, motor, fuseVerdict, verdict) => {
    const j = judgeFuse(input({ fuseA, motorLoad: motor }));
    expect(j.fuseVerdict).toBe(fuseVerdict);
    expect(j.findings[0]!.verdict).toBe(verdict);
    expect(j.findings[0]!.text).toContain("ABYC E-11");
  });

  it("says why an oversized fuse is dangerous", () => {
    const j = judgeFuse(input({ fuseA: 30 }));
    expect(j.findings[0]!.text).toContain("can overheat before the fuse opens");
  });

  it("warns when the fuse is below 125 % of the load (common practice) and says when it is below the load", () => {
    // Common practice: fuse ≥ 125 % of the continuous load (electrical.md §6, circuit protection).
    expect(FUSE_MIN_LOAD_FACTOR).toBe(1.25);
    const tight = judgeFuse(input({ fuseA: 10, currentA: 9, ampacityA: 20 }));
    expect(tight.fuseVerdict).toBe("undersized");
    expect(tight.findings.some((f) => f.verdict === "warn" && f.text.includes("125 %"))).toBe(true);
    const below = judgeFuse(input({ fuseA: 10, currentA: 11, ampacityA: 20 }));
    expect(below.findings.some((f) => f.text.includes("will open in normal use"))).toBe(true);
    expect(judgeFuse(input({ fuseA: 15, currentA: 12, ampacityA: 20 })).fuseVerdict).toBe("ok");
  });

  it("cannot check a fuse against a wire without an ampacity", () => {
    const j = judgeFuse(input({ fuseA: 10, ampacityA: null }));
    expect(j.fuseVerdict).toBe("not-checked");
    expect(j.findings[0]!.verdict).toBe("warn");
  });
});

describe("NEC 240.4(D) small-conductor caps (advisory)", () => {
  // NEC 240.4(D), copper (encorewire wire size table; tradehub NEC 240.4(D) table).
  const caps: [n: number, capA: number][] = [
    [18, 7],
    [16, 10],
    [14, 15],
    [12, 20],
    [10, 30],
  ];
  it.each(caps)("%i AWG: %i A", (n, capA) => {
    expect(nec2404dCapA(awg(n))).toBe(capA);
  });

  it("has no cap for 8 AWG or metric sizes", () => {
    expect(nec2404dCapA(awg(8))).toBeNull();
    expect(nec2404dCapA({ system: "metric", mm2: 1.5 })).toBeNull();
  });

  it("adds an advisory line that does not change the verdict", () => {
    // 16 AWG 105 °C wire: 25 A (33 CFR 183.425), above the 10 A NEC cap.
    const j = judgeFuse(input({ fuseA: 15, ampacityA: 25 }));
    expect(j.fuseVerdict).toBe("ok");
    const advisory = j.findings.find((f) => f.text.includes("NEC 240.4(D)"));
    expect(advisory?.verdict).toBe("pass");
  });
});

describe("battery-sourced runs", () => {
  // Our heuristic: IEEE 315 class letter BT (practice.md, from memory) or a BAT… device, or a battery circuit.
  const table: [endA: string, endB: string, circuit: string | null, battery: boolean][] = [
    ["BT1:+", "F1:1", null, true],
    ["F1:2", "BT2:-", null, true],
    ["BAT:1", "MC1:B+", null, true],
    ["BATT2:POS", "K1:30", null, true],
    ["BT:+", "F1:1", null, true],
    ["BTN1:1", "MC1:4", null, false],
    ["MC1:3", "M1:1", null, false],
    ["F1:2", "MC1:1", "Battery main", true],
    ["F1:2", "MC1:1", "batt feed", true],
    ["F1:2", "MC1:1", "Combat lights", false],
  ];
  it.each(table)("%s → %s (%s): %s", (endA, endB, circuit, battery) => {
    expect(isBatterySourced({ endA, endB, circuit })).toBe(battery);
  });

  it("reads the device part of a reference", () => {
    expect(deviceOf("BT1:+")).toBe("BT1");
    expect(deviceOf(" MC1 ")).toBe("MC1");
  });

  it("7 in is 178 mm", () => {
    // ABYC E-11: protection within 7 in of the source connection; 7 × 25.4 = 177.8 mm.
    expect(SOURCE_PROTECTION_MAX_MM).toBe(Math.round(7 * 25.4));
  });

  it("warns about a battery-sourced run without a fuse and names the 7 in rule", () => {
    const j = judgeFuse(input({ batterySourced: true }));
    expect(j.fuseVerdict).toBe("none");
    expect(j.findings[0]!.verdict).toBe("warn");
    expect(j.findings[0]!.text).toContain("7 in (178 mm)");
    expect(j.findings[0]!.text).toContain("ABYC E-11");
  });

  it("only notes a non-battery run without a fuse, and cautions a fused battery run", () => {
    const plain = judgeFuse(input({}));
    expect(plain.fuseVerdict).toBe("none");
    expect(plain.findings[0]!.verdict).toBe("pass");
    const fused = judgeFuse(input({ fuseA: 10, batterySourced: true }));
    expect(fused.findings.some((f) => f.verdict === "pass" && f.text.includes("7 in (178 mm)"))).toBe(true);
  });
});
