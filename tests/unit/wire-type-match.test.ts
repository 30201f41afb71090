import { describe, expect, it } from "vitest";
import {
  insulationKey,
  matchWireType,
  unmatchedCombinations,
  type MatchableWireType,
  type RunForMatch,
} from "@/lib/domain/wire-type-match";

const STOCK: MatchableWireType[] = [
  { id: "bk22-1007", gauge: "22 AWG", colour: "BK", insulation: "UL 1007" },
  { id: "bk22-txl", gauge: "22 AWG", colour: "BK", insulation: "SAE J1128 TXL" },
  { id: "rd18-1007", gauge: "18 AWG", colour: "RD", insulation: "UL 1007" },
  { id: "gnye10", gauge: "10 AWG", colour: "GNYE", insulation: "SAE J1128 GXL" },
  { id: "bu075-plain", gauge: "0.75 mm²", colour: "BU", insulation: null },
  { id: "bu075-h05", gauge: "0.75 mm²", colour: "BU", insulation: "H05V-K" },
];

describe("insulationKey", () => {
  it.each([
    ["UL 1007", "ul 1007"],
    ["  ul   1007 ", "ul 1007"],
    [null, ""],
    ["", ""],
    ["   ", ""],
  ])("%j → %j", (input, key) => {
    expect(insulationKey(input)).toBe(key);
  });
});

describe("matchWireType", () => {
  it.each([
    // [run gauge, colour, insulation, expected]
    ["22 AWG", "BK", "UL 1007", "bk22-1007"],
    ["22 AWG", "BK", "ul 1007", "bk22-1007"], // case-insensitive insulation
    ["22 AWG", "BK", " UL  1007 ", "bk22-1007"], // spacing ignored
    ["22", "black", "UL 1007", "bk22-1007"], // gauge and colour normalised like an import
    ["22 AWG", "BK", "SAE J1128 TXL", "bk22-txl"],
    ["18 AWG", "RD", null, "rd18-1007"], // no insulation, exactly one candidate → that one
    ["18 AWG", "RD", "", "rd18-1007"],
    ["10 AWG", "green/yellow", null, "gnye10"],
    ["0.75 mm2", "BU", null, "bu075-plain"], // no insulation, a candidate that states none either → that one
    ["0.75 mm²", "BU", "h05v-k", "bu075-h05"],
  ])("%s %s %j matches %s", (gauge, colour, insulation, id) => {
    expect(matchWireType({ gauge, colour, insulation }, STOCK)).toEqual({ kind: "matched", wireTypeId: id });
  });

  it.each([
    ["22 AWG", "BK", "UL 1015"], // another spec of a stocked gauge + colour is another stock
    ["18 AWG", "RD", "UL 1015"],
    ["22 AWG", "RD", "UL 1007"], // colour not stocked in that gauge
    ["20 AWG", "BK", null], // nothing of that gauge + colour
    ["0.75 mm²", "BU", "H07V-K"], // a wire type that states no insulation does not stand in for a stated one
  ])("%s %s %j is missing", (gauge, colour, insulation) => {
    expect(matchWireType({ gauge, colour, insulation }, STOCK)).toEqual({ kind: "missing" });
  });

  it("a run without insulation and two candidates (neither unstated) is ambiguous", () => {
    expect(matchWireType({ gauge: "22 AWG", colour: "BK", insulation: null }, STOCK)).toEqual({
      kind: "ambiguous",
      candidateIds: ["bk22-1007", "bk22-txl"],
    });
  });

  it("matches nothing against an empty stock", () => {
    expect(matchWireType({ gauge: "22 AWG", colour: "BK", insulation: null }, [])).toEqual({
      kind: "missing",
    });
  });
});

describe("unmatchedCombinations", () => {
  const run = (
    wireId: string,
    gauge: string,
    colour: string,
    insulation: string | null,
    routedLengthMm: number,
    insulationTempC: number | null = null,
  ): RunForMatch => ({
    wireId,
    gauge,
    colour,
    insulation,
    routedLengthMm,
    insulationTempC,
  });

  it("groups runs by spec, sums routed length, and leaves matched runs out", () => {
    const runs = [
      run("W-10", "14 AWG", "PK", "sae j1128 txl", 500, 85),
      run("W-2", "14 AWG", "PK", "SAE J1128 TXL", 1500, 125),
      run("W-3", "22 AWG", "BK", "UL 1007", 700),
      run("W-4", "22 AWG", "BK", null, 300),
      run("W-5", "18 AWG", "RD", null, 250),
    ];
    expect(unmatchedCombinations(runs, STOCK)).toEqual([
      {
        gauge: "14 AWG",
        colour: "PK",
        insulation: "SAE J1128 TXL", // the spelling of the first run by wire ID (W-2 before W-10)
        insulationTempC: 125,
        reason: "missing",
        candidateCount: 0,
        runCount: 2,
        routedLengthMm: 2000,
        wireIds: ["W-2", "W-10"],
      },
      {
        gauge: "22 AWG",
        colour: "BK",
        insulation: null,
        insulationTempC: null,
        reason: "ambiguous",
        candidateCount: 2,
        runCount: 1,
        routedLengthMm: 300,
        wireIds: ["W-4"],
      },
    ]);
  });

  it("is empty when every run matches, and keeps at most five wire IDs per row", () => {
    expect(unmatchedCombinations([run("A", "22 AWG", "BK", "UL 1007", 10)], STOCK)).toEqual([]);
    const many = Array.from({ length: 8 }, (_, i) => run(`R-${i + 1}`, "24 AWG", "WH", null, 100));
    const [row] = unmatchedCombinations(many, STOCK);
    expect(row).toMatchObject({
      runCount: 8,
      routedLengthMm: 800,
      wireIds: ["R-1", "R-2", "R-3", "R-4", "R-5"],
    });
  });
});
