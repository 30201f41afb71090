import { describe, expect, it } from "vitest";
import {
  expectedContinuityOhm,
  formatTestValue,
  stateChangeRefusal,
  statesRoleMaySet,
  type StateRole,
} from "@/lib/domain/bench-state";
import { BENCH_STATES, type BenchState } from "@/lib/domain/types";

// Our own rules (PRODUCT.md §2 and the issue): the lead may make any change; a builder records planned → cut →
// marked → terminated and never moves a run that has a test result; a technician records terminated, tested and
// failed, and sends only a failed run back to the bench (planned: cut a new wire; cut: rework the ends).
const allowed: Record<StateRole, (from: BenchState, to: BenchState) => boolean> = {
  lead: () => true,
  builder: (from, to) =>
    ["planned", "cut", "marked", "terminated"].includes(to) && !["tested", "failed"].includes(from),
  technician: (from, to) =>
    ["terminated", "tested", "failed"].includes(to) || (["planned", "cut"].includes(to) && from === "failed"),
};

describe("who may move a run from one bench state to another", () => {
  for (const role of ["lead", "builder", "technician"] as const) {
    it(`${role}: every pair of states`, () => {
      for (const from of BENCH_STATES) {
        for (const to of BENCH_STATES) {
          const refusal = stateChangeRefusal(role, from, to);
          expect(refusal === null, `${role} ${from} → ${to}: ${refusal}`).toBe(allowed[role](from, to));
        }
      }
    });
  }

  it("explains a refusal in words", () => {
    expect(stateChangeRefusal("builder", "failed", "cut")).toMatch(/technician or the lead/);
    expect(stateChangeRefusal("technician", "tested", "planned")).toMatch(/Only a failed run/);
    expect(stateChangeRefusal("builder", "cut", "tested")).toMatch(/may not set a run to "tested"/);
  });

  it("lists what each role can ever set", () => {
    expect([...statesRoleMaySet("builder")].sort()).toEqual(["cut", "marked", "planned", "terminated"]);
    expect([...statesRoleMaySet("technician")].sort()).toEqual([
      "cut",
      "failed",
      "planned",
      "terminated",
      "tested",
    ]);
    expect(statesRoleMaySet("lead")).toHaveLength(6);
  });
});

describe("test values", () => {
  it("carry the unit of their kind: Ω for continuity, MΩ for insulation", () => {
    expect(formatTestValue("continuity", 0.0214)).toBe("0.0214 Ω");
    expect(formatTestValue("insulation", 550)).toBe("550 MΩ");
    expect(formatTestValue("insulation", 12345)).toBe("12350 MΩ");
    expect(formatTestValue("continuity", null)).toBe("no value");
  });

  it("expects a continuity reading near the conductor's resistance at 20 °C over its cut length", () => {
    // IEC 60228 Table 3: class 5 plain copper 1.5 mm², at most 13.3 Ω/km at 20 °C → 13.3 mΩ over 1 m.
    expect(expectedContinuityOhm("1.5 mm²", 1000)).toBeCloseTo(0.0133, 6);
    // 18 AWG: ASTM B258 area 0.8231 mm², IEC 60028 ρ20 = 1/58 Ω·mm²/m, stranded × 1.025 (NEC Ch. 9 Table 8 ratios).
    expect(expectedContinuityOhm("18 AWG", 2500)).toBeCloseTo((1 / 58 / 0.8231) * 1.025 * 2.5, 4);
    expect(expectedContinuityOhm("not a gauge", 1000)).toBeNull();
    expect(expectedContinuityOhm("18 AWG", 0)).toBeNull();
  });
});
