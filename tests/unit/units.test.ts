import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  parseCount,
  parseCurrentA,
  parseLengthMm,
  parsePercent,
  parseResistanceOhm,
  parseTemperatureC,
  parseVoltageV,
  parseYesNo,
  type LengthUnit,
} from "@/lib/domain/units";

// Conversion factors used below:
//   1 in = 25.4 mm, 1 ft = 12 in = 304.8 mm, 1 yd = 0.9144 m — international yard and pound agreement (1959).
//   milli = 10⁻³, centi = 10⁻², kilo = 10³, mega = 10⁶ — SI Brochure, 9th ed. (BIPM 2019), Table 7.
//   t/°C = (t/°F − 32) / 1.8 — NIST SP 811 (2008), §B.9.

describe("parseLengthMm: accepted forms", () => {
  const cases: [string, LengthUnit | undefined, number, string][] = [
    ["1250", undefined, 1250, "bare number in the default mm"],
    ["1250 mm", undefined, 1250, "mm"],
    ["1250mm", undefined, 1250, "mm without a space"],
    ["1.25 m", undefined, 1250, "1 m = 1000 mm (SI)"],
    ["1.25 metres", undefined, 1250, "1 m = 1000 mm (SI)"],
    ["125 cm", undefined, 1250, "1 cm = 10 mm (SI centi)"],
    ["49.2 in", undefined, 1250, "49.2 × 25.4 = 1249.68 mm (1959 agreement) → 1250"],
    ['49.2"', undefined, 1250, "inch mark"],
    ["49.2″", undefined, 1250, "double prime as inch mark"],
    ["4' 1\"", undefined, 1245, "49 in = 1244.6 mm (1959 agreement) → 1245"],
    ["4'1\"", undefined, 1245, "feet and inches without a space"],
    ["4'-1\"", undefined, 1245, "architectural feet-dash-inches"],
    ["4’ 1”", undefined, 1245, "curly quotes from a spreadsheet's autocorrect"],
    ["4 ft 1 in", undefined, 1245, "words"],
    ["4.1 ft", undefined, 1250, "4.1 × 304.8 = 1249.68 mm → 1250"],
    ["3 ft", undefined, 914, "1 yd = 0.9144 m exactly (1959 agreement) → 914.4 → 914"],
    ["1 ft", undefined, 305, "304.8 mm → 305"],
    ["0.5 in", undefined, 13, "12.7 mm → 13"],
    ["2.5 mm", undefined, 3, "a half rounds up"],
    ["0.0125 m", undefined, 13, "12.5 mm exactly: a half rounds up with no floating-point drift"],
    ["1.0005 m", undefined, 1001, "1000.5 mm → 1001"],
    ["1,25 m", undefined, 1250, "decimal comma"],
    ["1 250 mm", undefined, 1250, "space as thousands separator"],
    ["1,250.5 mm", undefined, 1251, "comma thousands, dot decimal"],
    ["1.250,5 mm", undefined, 1251, "dot thousands, comma decimal"],
    ["1e3", undefined, 1000, "exponent, as a spreadsheet may write a number"],
    ["100 m", undefined, 100_000, "the upper limit itself"],
    ["  1250  ", undefined, 1250, "surrounding spaces"],
    ["1.25", "m", 1250, "bare number in a column in metres"],
    ["49.2", "in", 1250, "bare number in a column in inches"],
    ["1250 mm", "m", 1250, "a written unit beats the column's unit"],
  ];
  it.each(cases)("%j (column unit %s) → %i mm: %s", (input, defaultUnit, mm) => {
    expect(parseLengthMm(input, { defaultUnit })).toEqual({ ok: true, value: mm });
  });
});

describe("parseLengthMm: refusals say what was expected", () => {
  const cases: [string, LengthUnit | undefined, string][] = [
    ["", undefined, "empty; expected a length"],
    ["-5", undefined, "is negative"],
    ["-4' 1\"", undefined, "is negative"],
    ["0", undefined, "is zero"],
    ["0 m", undefined, "is zero"],
    ["0.4 mm", undefined, "rounds to 0 mm"],
    ["100.001 m", undefined, "more than the 100 m limit"],
    ["250000", undefined, "250 m, more than the 100 m limit"],
    ["1250", "m", 'write "1250 mm" if you meant millimetres'],
    ["abc", undefined, '"abc" is not a length; expected a length such as "1250"'],
    ["12 furlongs", undefined, 'unknown unit "furlongs"; expected a unit of mm, cm, m, in or ft'],
    ["1,250", undefined, "is ambiguous"],
    ["1.2.3", undefined, "is not a length"],
    ["4 1", undefined, "is not a length"],
  ];
  it.each(cases)("%j (column unit %s) is refused: %s", (input, defaultUnit, fragment) => {
    const r = parseLengthMm(input, { defaultUnit });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain(fragment);
  });

  it("a smaller limit for strip lengths", () => {
    const r = parseLengthMm("250", { maxMm: 200, what: "a strip length" });
    expect(r).toEqual({
      ok: false,
      message: expect.stringContaining("expected a strip length up to 200 mm"),
    });
  });
});

describe("parseLengthMm: properties", () => {
  it("whole millimetres read back unchanged, in mm and as metres", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 100_000 }), (mm) => {
        expect(parseLengthMm(String(mm))).toEqual({ ok: true, value: mm });
        expect(parseLengthMm(`${mm / 1000} m`)).toEqual({ ok: true, value: mm });
      }),
    );
  });

  it("whole inches convert exactly at 25.4 mm/in (1959 agreement), rounded half up", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 3900 }), (inches) => {
        // 25.4 × k = 254k / 10 mm; integer arithmetic gives the rounded value without floating point.
        const expected = Math.floor((254 * inches + 5) / 10);
        expect(parseLengthMm(`${inches} in`)).toEqual({ ok: true, value: expected });
      }),
    );
  });

  it("feet and inches equal the same number of inches (1 ft = 12 in)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 300 }), fc.integer({ min: 0, max: 11 }), (ft, inch) => {
        fc.pre(ft + inch > 0);
        expect(parseLengthMm(`${ft}' ${inch}"`)).toEqual(parseLengthMm(`${ft * 12 + inch} in`));
      }),
    );
  });
});

describe("parseCurrentA", () => {
  const ok: [string, number, string][] = [
    ["7.5", 7.5, "bare number in amperes"],
    ["7.5 A", 7.5, "A"],
    ["7.5A", 7.5, "A without a space"],
    ["7.5 amps", 7.5, "word"],
    ["750 mA", 0.75, "milli = 10⁻³ (SI Brochure Table 7)"],
    ["750MA", 0.75, "all capitals still means milliamperes (no harness carries megaamperes)"],
    ["0", 0, "no load"],
    ["1,5 A", 1.5, "decimal comma"],
  ];
  it.each(ok)("%j → %f A (%s)", (input, amps) => {
    expect(parseCurrentA(input)).toEqual({ ok: true, value: amps });
  });

  it("a column in mA reads bare numbers as milliamperes", () => {
    expect(parseCurrentA("20", { defaultExp: -3 })).toEqual({ ok: true, value: 0.02 });
  });

  const bad: [string, string][] = [
    ["-1", "is negative"],
    ["lots", '"lots" is not a number; expected a current in amperes such as "7.5", "7.5 A" or "750 mA"'],
    ["7.5 W", 'unknown unit "W"'],
    ["20000", "more than 10000 A"],
  ];
  it.each(bad)("%j is refused: %s", (input, fragment) => {
    const r = parseCurrentA(input);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain(fragment);
  });

  it("a fuse rating must be above zero", () => {
    expect(parseCurrentA("0", { positive: true })).toEqual({
      ok: false,
      message: expect.stringContaining("is zero"),
    });
  });
});

describe("parseVoltageV", () => {
  const ok: [string, number][] = [
    ["24", 24],
    ["24 V", 24],
    ["24V", 24],
    ["24VDC", 24],
    ["24 V DC", 24],
    ["24 Vdc", 24],
    ["12v", 12],
    ["2100 mV", 2.1], // milli = 10⁻³ (SI Brochure Table 7)
  ];
  it.each(ok)("%j → %f V", (input, volts) => {
    expect(parseVoltageV(input)).toEqual({ ok: true, value: volts });
  });

  const bad: [string, string][] = [
    ["230 VAC", "is an AC value; Loomwright checks DC circuits only"],
    ["0", "is zero"],
    ["-12", "is negative"],
    ["twelve", "is not a number"],
  ];
  it.each(bad)("%j is refused: %s", (input, fragment) => {
    const r = parseVoltageV(input);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain(fragment);
  });
});

describe("parseResistanceOhm", () => {
  const ok: [string, number, string][] = [
    ["0.002 Ω", 0.002, "Greek capital omega U+03A9"],
    ["0.002 \u2126", 0.002, "OHM SIGN U+2126"],
    ["0.002Ω", 0.002, "no space"],
    ["2 mΩ", 0.002, "milli = 10⁻³ (SI Brochure Table 7)"],
    ["0.002 ohm", 0.002, "word"],
    ["2 mohm", 0.002, "milli + word"],
    ["2 milliohms", 0.002, "long word"],
    ["0.5 kΩ", 500, "kilo = 10³ (SI Brochure Table 7)"],
    ["0", 0, "an ideal return"],
  ];
  it.each(ok)("%j → %f Ω (%s)", (input, ohms) => {
    expect(parseResistanceOhm(input)).toEqual({ ok: true, value: ohms });
  });

  const bad: [string, string][] = [
    ["2 MΩ", "more than 1000 Ω"], // mega = 10⁶: 2 MΩ is 2 000 000 Ω
    ["2 MOHM", "more than 1000 Ω"],
    ["-0.002", "is negative"],
    ["2 mV", 'unknown unit "mV"'],
  ];
  it.each(bad)("%j is refused: %s", (input, fragment) => {
    const r = parseResistanceOhm(input);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain(fragment);
  });
});

describe("parseTemperatureC", () => {
  const ok: [string, number, string][] = [
    ["105", 105, "bare number in °C"],
    ["105 °C", 105, "degree sign"],
    ["105C", 105, "letter only"],
    ["105 ºC", 105, "masculine ordinal typed for a degree sign"],
    ["105 deg C", 105, "words"],
    ["221 °F", 105, "(221 − 32) / 1.8 = 105 (NIST SP 811 §B.9)"],
    ["212 F", 100, "(212 − 32) / 1.8 = 100 (NIST SP 811 §B.9)"],
    ["32 °F", 0, "(32 − 32) / 1.8 = 0 (NIST SP 811 §B.9)"],
  ];
  it.each(ok)("%j → %f °C (%s)", (input, c) => {
    expect(parseTemperatureC(input)).toEqual({ ok: true, value: c });
  });

  it("a column in °F reads bare numbers as °F", () => {
    expect(parseTemperatureC("194", { defaultUnit: "F" })).toEqual({ ok: true, value: 90 }); // (194 − 32) / 1.8
  });

  const bad: [string, string][] = [
    ["105 K", 'unknown unit "K"'],
    ["hot", "is not a number"],
    ["500", "outside 40 … 400 °C"],
  ];
  it.each(bad)("%j is refused: %s", (input, fragment) => {
    const r = parseTemperatureC(input, { minC: 40, maxC: 400 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain(fragment);
  });
});

describe("percent, count, yes/no", () => {
  it.each([
    ["3", 3],
    ["3 %", 3],
    ["3%", 3],
    ["7,5 %", 7.5],
  ] as const)("percent %j → %f", (input, pct) => {
    expect(parsePercent(input)).toEqual({ ok: true, value: pct });
  });
  it.each(["0", "120", "3 V"])("percent %j is refused", (input) => {
    expect(parsePercent(input).ok).toBe(false);
  });
  it.each([
    ["3", 3],
    ["3.0", 3],
  ] as const)("count %j → %i", (input, n) => {
    expect(parseCount(input)).toEqual({ ok: true, value: n });
  });
  it.each(["2.5", "0", "many"])("count %j is refused", (input) => {
    expect(parseCount(input).ok).toBe(false);
  });
  it.each([
    ["yes", true],
    ["Y", true],
    ["TRUE", true],
    ["1", true],
    ["x", true],
    ["✓", true],
    ["no", false],
    ["false", false],
    ["0", false],
    ["", false],
  ] as const)("yes/no %j → %s", (input, v) => {
    expect(parseYesNo(input)).toEqual({ ok: true, value: v });
  });
  it("yes/no refuses anything else", () => {
    expect(parseYesNo("maybe")).toEqual({ ok: false, message: expect.stringContaining("is not yes or no") });
  });
});
