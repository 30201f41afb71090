import { describe, expect, it } from "vitest";
import {
  awgAreaCmil,
  awgAreaMm2,
  awgDiameterIn,
  awgDiameterMm,
  conductorResistance,
  iec60228CorrectionFactor,
  iec60228MaxOhmPerKm,
  MM2_PER_CMIL,
  ohmPerKm,
  ohmPerM,
  resistivityAt,
  RESISTIVITY,
  STRANDING_FACTOR,
  type ConductorOptions,
} from "@/lib/domain/conductors";
import { type Gauge } from "@/lib/domain/gauge";

const awg = (n: number): Gauge => ({ system: "awg", awg: n });
const mm2 = (a: number): Gauge => ({ system: "metric", mm2: a });
const SOLID_CU: ConductorOptions = { material: "copper", stranded: false, iecClass: "5/6", tinned: false };
const STRANDED_CU: ConductorOptions = { ...SOLID_CU, stranded: true };
const STRANDED_AL: ConductorOptions = { ...STRANDED_CU, material: "aluminium" };

/**
 * Passes when `actual` agrees with `shown` to the decimals it is printed with: within half a unit of its last
 * place, or `units` units where the printed table rounded an already rounded value.
 */
function expectShown(actual: number, shown: string, units = 0.5): void {
  const decimals = shown.includes(".") ? shown.split(".")[1]!.length : 0;
  const unit = Math.pow(10, -decimals);
  expect(Math.abs(actual - Number(shown))).toBeLessThanOrEqual(units * unit + 1e-12);
}

describe("AWG geometry (ASTM B258)", () => {
  it("fixes the two defining sizes: 36 AWG = 0.0050 in, 0000 = 0.4600 in", () => {
    // ASTM B258 definition (electrical.md §1).
    expect(awgDiameterIn(36)).toBeCloseTo(0.005, 12);
    expect(awgDiameterIn(-3)).toBeCloseTo(0.46, 12);
  });

  it("steps by 92^(1/39) = 1.1229322 per gauge", () => {
    // ASTM B258 definition (electrical.md §1).
    expect(awgDiameterIn(11) / awgDiameterIn(12)).toBeCloseTo(1.1229322, 7);
  });

  // d (in) to 0.0001 in as ASTM B258 rounds; mm, mm² and cmil as electrical.md §1 prints them (calc from B258,
  // agrees with the NBS-derived solid copper table of Lessons in Electric Circuits, ref. chapter).
  const table: [label: string, n: number, dIn: string, dMm: string, areaMm2: string, cmil: string][] = [
    ["4/0", -3, "0.4600", "11.684", "107.22", "211600"],
    ["3/0", -2, "0.4096", "10.405", "85.03", "167806"],
    ["2/0", -1, "0.3648", "9.266", "67.43", "133077"],
    ["1/0", 0, "0.3249", "8.252", "53.48", "105535"],
    ["2", 2, "0.2576", "6.544", "33.63", "66371"],
    ["4", 4, "0.2043", "5.189", "21.15", "41741"],
    ["6", 6, "0.1620", "4.115", "13.30", "26251"],
    ["8", 8, "0.1285", "3.264", "8.366", "16510"],
    ["10", 10, "0.1019", "2.588", "5.261", "10383"],
    ["12", 12, "0.0808", "2.053", "3.309", "6530"],
    ["14", 14, "0.0641", "1.628", "2.081", "4107"],
    ["16", 16, "0.0508", "1.291", "1.309", "2583"],
    ["18", 18, "0.0403", "1.024", "0.823", "1624"],
    ["20", 20, "0.0320", "0.812", "0.518", "1022"],
    ["22", 22, "0.0253", "0.644", "0.326", "642"],
    ["24", 24, "0.0201", "0.511", "0.205", "404"],
    ["26", 26, "0.0159", "0.405", "0.129", "254"],
    ["28", 28, "0.0126", "0.321", "0.0810", "160"],
    ["30", 30, "0.0100", "0.255", "0.0509", "101"],
  ];
  it.each(table)("%s AWG (n = %i): d %s in, %s mm, %s mm², %s cmil", (_label, n, dIn, dMm, areaMm2, cmil) => {
    expect(awgDiameterIn(n).toFixed(4)).toBe(dIn);
    // The mm column was converted from the rounded inches for some rows (1/0: 0.3249 in → 8.252 mm).
    expectShown(awgDiameterMm(n), dMm, 1);
    expectShown(awgAreaMm2(n), areaMm2);
    expectShown(awgAreaCmil(n), cmil);
  });

  it("doubles the area every 3 gauges and the diameter every 6", () => {
    // Rule of thumb implied by the B258 series (electrical.md §1, tonetastic AWG page).
    expect(awgAreaMm2(9) / awgAreaMm2(12)).toBeCloseTo(2, 1);
    expect(awgDiameterMm(6) / awgDiameterMm(12)).toBeCloseTo(2, 1);
  });

  it("uses 1 cmil = 5.0671e-4 mm²", () => {
    // electrical.md §1.
    expect(MM2_PER_CMIL).toBeCloseTo(5.0671e-4, 8);
  });
});

describe("resistivity (IEC 60028) and temperature", () => {
  it("annealed copper: 1/58 Ω·mm²/m = 0.017241, α20 = 0.00393 /K", () => {
    // IEC 60028 (Industrial Power Engineering Handbook Table 30.1; tnlab IEC 60028 page).
    expect(RESISTIVITY.copper.rho20OhmMm2PerM).toBeCloseTo(1 / 58, 6);
    expect(RESISTIVITY.copper.alpha20PerK).toBe(0.00393);
  });

  it("EC aluminium: 2.8264e-8 Ω·m is 61 % IACS, α20 = 0.00403 /K", () => {
    // IEC 60028 / tnlab (61 % IACS), Handbook Table 30.1 (α).
    expect(RESISTIVITY.aluminium.rho20OhmMm2PerM).toBeCloseTo(0.017241 / 0.61, 5);
    expect(RESISTIVITY.aluminium.alpha20PerK).toBe(0.00403);
  });

  it("copper 20 → 75 °C factor is 1.21615 and matches the 234.5 rule", () => {
    // electrical.md §3: R(T) = R20 (1 + α (T − 20)); R2/R1 = (234.5 + T2)/(234.5 + T1).
    const f = resistivityAt("copper", 75) / resistivityAt("copper", 20);
    expect(f).toBeCloseTo(1.21615, 5);
    expect(f).toBeCloseTo((234.5 + 75) / (234.5 + 20), 3);
  });

  it("NEC Table 8 note: α = 0.00323 /K about its 75 °C base", () => {
    // NEC Chapter 9 Table 8 note: R2 = R1 (1 + 0.00323 (T2 − 75)) for copper.
    const r75 = resistivityAt("copper", 75);
    const r90 = resistivityAt("copper", 90);
    expect((r90 / r75 - 1) / 15).toBeCloseTo(0.00323, 5);
  });

  it("copper is 10.37 Ω·cmil/ft at 20 °C", () => {
    // pearen.ca wire reference: 10.37 Ω·cmil/ft.
    const ohmCmilPerFt = (resistivityAt("copper", 20) / MM2_PER_CMIL) * 0.3048;
    expect(ohmCmilPerFt).toBeCloseTo(10.37, 2);
  });

  it("R20 of solid copper per km matches the NBS-derived table (electrical.md §1)", () => {
    // electrical.md §1 R20 column (ρ20/A, agrees with the Lessons in Electric Circuits solid copper table).
    const rows: [number, number][] = [
      [-3, 0.161],
      [-1, 0.256],
      [0, 0.322],
      [10, 3.277],
      [12, 5.211],
      [14, 8.285],
      [18, 20.95],
      [24, 84.21],
    ];
    for (const [n, r20] of rows) expectShown(ohmPerKm(awg(n), 20, SOLID_CU), String(r20));
  });
});

describe("NEC Chapter 9 Table 8: DC resistance at 75 °C, Ω per 1000 ft", () => {
  const perKft = (g: Gauge, o: ConductorOptions) => ohmPerKm(g, 75, o) * 0.3048;

  // NEC Chapter 9 Table 8, uncoated copper, solid column.
  const solid: [number, number][] = [
    [18, 7.77],
    [16, 4.89],
    [14, 3.07],
    [12, 1.93],
    [10, 1.21],
    [8, 0.764],
  ];
  it.each(solid)("%i AWG solid: %f (within 0.5 %: Table 8 rounds cmil and to 3 figures)", (n, nec) => {
    expect(Math.abs(perKft(awg(n), SOLID_CU) / nec - 1)).toBeLessThan(0.005);
  });

  // NEC Chapter 9 Table 8, uncoated copper, stranded column (7 strands; 19 for 1/0 and 4/0).
  const stranded: [number, number][] = [
    [18, 7.95],
    [16, 4.99],
    [14, 3.14],
    [12, 1.98],
    [10, 1.24],
    [8, 0.778],
    [6, 0.491],
    [4, 0.308],
    [2, 0.194],
    [0, 0.122],
    [-3, 0.0608],
  ];
  it.each(stranded)("AWG n=%i stranded: %f (never below it, at most 1 % above)", (n, nec) => {
    const ratio = perKft(awg(n), STRANDED_CU) / nec;
    expect(ratio).toBeGreaterThanOrEqual(0.999);
    expect(ratio).toBeLessThan(1.01);
  });

  // NEC Chapter 9 Table 8, aluminium stranded column.
  const aluminium: [number, number][] = [
    [18, 13.1],
    [12, 3.25],
    [8, 1.28],
    [2, 0.319],
    [0, 0.201],
    [-3, 0.1],
  ];
  it.each(aluminium)("AWG n=%i aluminium stranded: %f (within 1 %)", (n, nec) => {
    expect(Math.abs(perKft(awg(n), STRANDED_AL) / nec - 1)).toBeLessThan(0.01);
  });

  it("the stranding factor lies in Table 8's stranded/solid range 1.018–1.026", () => {
    // NEC Chapter 9 Table 8 ratios for 18–8 AWG (electrical.md §1).
    const ratios = [7.95 / 7.77, 4.99 / 4.89, 3.14 / 3.07, 1.98 / 1.93, 1.24 / 1.21, 0.778 / 0.764];
    expect(STRANDING_FACTOR).toBeGreaterThanOrEqual(Math.min(...ratios));
    expect(STRANDING_FACTOR).toBeLessThanOrEqual(Math.max(...ratios));
  });

  it("12 AWG stranded is 6.50 mΩ/m at 75 °C", () => {
    // electrical.md §4: 1.98 Ω/kft ÷ 304.8.
    expect(ohmPerM(awg(12), 75, STRANDED_CU) * 1000).toBeCloseTo(6.5, 1);
  });
});

describe("IEC 60228 maximum DC resistance at 20 °C, copper, Ω/km", () => {
  // IEC 60228 (mycableengineering, uecables and etechnik-synergie reproductions agree; electrical.md §2).
  const rows: [size: number, class12: number, class56: number, class56Tinned: number][] = [
    [0.5, 36.0, 39.0, 40.1],
    [0.75, 24.5, 26.0, 26.7],
    [1, 18.1, 19.5, 20.0],
    [1.5, 12.1, 13.3, 13.7],
    [2.5, 7.41, 7.98, 8.21],
    [4, 4.61, 4.95, 5.09],
    [6, 3.08, 3.3, 3.39],
    [10, 1.83, 1.91, 1.95],
    [16, 1.15, 1.21, 1.24],
    [25, 0.727, 0.78, 0.795],
    [35, 0.524, 0.554, 0.565],
    [50, 0.387, 0.386, 0.393],
  ];
  it.each(rows)("%f mm²: class 1/2 %f, class 5/6 %f, tinned %f", (size, c12, c56, tinned) => {
    expect(iec60228MaxOhmPerKm(size, "1/2", false)).toBe(c12);
    expect(iec60228MaxOhmPerKm(size, "5/6", false)).toBe(c56);
    expect(iec60228MaxOhmPerKm(size, "5/6", true)).toBe(tinned);
    // A maximum is at least the nominal ρ20/A (IEC 60028 resistivity).
    expect(c12).toBeGreaterThanOrEqual((0.017241 / size) * 1000);
  });

  it("keeps the standard's quirk: class 5 50 mm² is below class 2", () => {
    // IEC 60228 (electrical.md §2 quirk).
    expect(iec60228MaxOhmPerKm(50, "5/6", false)!).toBeLessThan(iec60228MaxOhmPerKm(50, "1/2", false)!);
  });

  it("0.35 mm² is not an IEC 60228 size", () => {
    // IEC 60228 series starts at 0.5 mm² (electrical.md §2).
    expect(iec60228MaxOhmPerKm(0.35, "5/6", false)).toBeNull();
  });

  // IEC 60228 temperature correction factors kt (uecables reproduction, electrical.md §2).
  const kt: [number, number][] = [
    [5, 1.064],
    [10, 1.042],
    [25, 0.98],
    [30, 0.962],
    [40, 0.926],
    [50, 0.893],
    [60, 0.862],
    [70, 0.833],
    [75, 0.82],
    [80, 0.806],
    [90, 0.781],
    [100, 0.758],
  ];
  it.each(kt)("kt at %i °C is %f", (t, k) => {
    expect(iec60228CorrectionFactor(t).toFixed(3)).toBe(k.toFixed(3));
  });

  it("a tabulated metric size uses the IEC maximum, moved to temperature by kt", () => {
    // IEC 60228: 1.5 mm² class 5 ≤ 13.3 Ω/km at 20 °C; at 60 °C divide by kt = 0.862.
    const r20 = conductorResistance(mm2(1.5), 20);
    expect(r20.basis).toBe("iec-60228-max");
    expect(r20.ohmPerKm).toBeCloseTo(13.3, 6);
    expect(conductorResistance(mm2(1.5), 60).ohmPerKm).toBeCloseTo(13.3 / 0.862, 1);
  });

  it("an untabulated metric size falls back to ρ/A with the stranding factor", () => {
    // IEC 60028 ρ20 = 0.017241 Ω·mm²/m; 0.35 mm² is outside IEC 60228.
    const r = conductorResistance(mm2(0.35), 20);
    expect(r.basis).toBe("resistivity");
    expect(r.ohmPerKm).toBeCloseTo((0.017241 / 0.35) * 1000 * STRANDING_FACTOR, 6);
  });
});
