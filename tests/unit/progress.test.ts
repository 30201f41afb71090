import { describe, expect, it } from "vitest";
import { summariseProgress, type ProgressRow } from "@/lib/domain/progress";

const row = (
  gauge: string,
  colour: string,
  state: ProgressRow["state"],
  count: number,
  insulation: string | null = null,
) => ({ gauge, colour, insulation, state, count }) satisfies ProgressRow;

describe("progress per state and wire type", () => {
  it("adds up groups into wire types, thickest first, with built and tested shares", () => {
    const p = summariseProgress([
      row("18 AWG", "RD", "planned", 3),
      row("18 AWG", "RD", "tested", 1),
      row("4 AWG", "RD", "terminated", 2, "SAE J1128 SXL"),
      row("18 AWG", "BK", "failed", 1),
      row("0.75 mm²", "BU", "cut", 1),
      row("18 AWG", "RD", "cut", 1),
    ]);
    expect(p.total).toBe(9);
    expect(p.byState).toEqual({ planned: 3, cut: 2, marked: 0, terminated: 2, tested: 1, failed: 1 });
    // terminated + tested + failed = 4 of 9 built; 1 of 9 tested and passed.
    expect(p.builtPct).toBeCloseTo((4 / 9) * 100, 10);
    expect(p.testedPct).toBeCloseTo((1 / 9) * 100, 10);
    // 4 AWG (21.2 mm²) > 18 AWG (0.823 mm²) > 0.75 mm²; colours alphabetically within a size.
    expect(p.wireTypes.map((t) => t.label)).toEqual([
      "4 AWG RD SAE J1128 SXL",
      "18 AWG BK",
      "18 AWG RD",
      "0.75 mm² BU",
    ]);
    const rd = p.wireTypes.find((t) => t.label === "18 AWG RD")!;
    expect(rd).toMatchObject({ total: 5, builtPct: 20, testedPct: 20 });
    expect(rd.byState).toMatchObject({ planned: 3, cut: 1, tested: 1 });
  });

  it("is all zero without runs", () => {
    expect(summariseProgress([])).toEqual({
      total: 0,
      byState: { planned: 0, cut: 0, marked: 0, terminated: 0, tested: 0, failed: 0 },
      builtPct: 0,
      testedPct: 0,
      wireTypes: [],
    });
  });
});
