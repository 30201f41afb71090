// Parsers for the quantities people type into run lists: lengths, currents, voltages, resistances, temperatures.

export type ParseResult<T> = { ok: true; value: T } | { ok: false; message: string };

export const LENGTH_UNITS = ["mm", "cm", "m", "in", "ft"] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

/** International yard and pound agreement (1959): 1 in = 25.4 mm and 1 ft = 0.3048 m, both exact. */
export const MM_PER_INCH = 25.4;
export const MM_PER_FOOT = 304.8;

/** Longest length the parser accepts: no single harness run is longer than this. */
export const MAX_LENGTH_MM = 100_000;

// ---------------------------------------------------------------------------------------------------------
// Decimal numbers, kept exact (mantissa × 10^exp) so that unit conversion and rounding never drift.

interface Decimal {
  mantissa: bigint;
  exp: number;
}

type DecimalParse = { ok: true; value: Decimal } | { ok: false; ambiguous: boolean };

const PLAIN = /^\d{1,15}(?:\.\d{1,15})?$/;
const GROUPED_SPACE = /^\d{1,3}(?: \d{3})+(?:[.,]\d+)?$/;

/**
 * Reads `1250`, `1.25`, `.5`, `1,25` (decimal comma), `1,250.5`, `1.250,5`, `1 250`, `1e3`. A lone comma before
 * exactly three digits (`1,250`) is ambiguous between a thousands separator and a decimal comma, so it is refused.
 */
function parseDecimal(input: string): DecimalParse {
  // Fast path for the common plain forms "1250" and "7.5".
  if (PLAIN.test(input)) {
    const dot = input.indexOf(".");
    if (dot < 0) return { ok: true, value: { mantissa: BigInt(input), exp: 0 } };
    const frac = input.length - dot - 1;
    return { ok: true, value: { mantissa: BigInt(input.slice(0, dot) + input.slice(dot + 1)), exp: -frac } };
  }
  const m = /^([+\-\u2212])?([\d., ]*\d|[.,]\d+)(?:[eE]([+-]?\d{1,3}))?$/.exec(input);
  if (!m) return { ok: false, ambiguous: false };
  const negative = m[1] !== undefined && m[1] !== "+";
  let body = m[2]!;
  if (body.includes(" ")) {
    if (!GROUPED_SPACE.test(body)) return { ok: false, ambiguous: false };
    body = body.replace(/ /g, "");
  }
  const dots = (body.match(/\./g) ?? []).length;
  const commas = (body.match(/,/g) ?? []).length;
  let intPart: string;
  let fracPart = "";
  if (dots > 0 && commas > 0) {
    const decimalSep = body.lastIndexOf(".") > body.lastIndexOf(",") ? "." : ",";
    const thousandsSep = decimalSep === "." ? "," : ".";
    const parts = body.split(decimalSep);
    if (parts.length !== 2) return { ok: false, ambiguous: false };
    if (!validGroups(parts[0]!, thousandsSep)) return { ok: false, ambiguous: false };
    intPart = parts[0]!.split(thousandsSep).join("");
    fracPart = parts[1]!;
  } else if (dots + commas > 1) {
    const sep = dots > 0 ? "." : ",";
    if (!validGroups(body, sep)) return { ok: false, ambiguous: false };
    intPart = body.split(sep).join("");
  } else if (dots + commas === 1) {
    const [before, after] = body.split(/[.,]/) as [string, string];
    if (commas === 1 && after.length === 3 && before.length >= 1 && before.length <= 3 && before !== "0") {
      return { ok: false, ambiguous: true };
    }
    intPart = before;
    fracPart = after;
  } else {
    intPart = body;
  }
  if (!/^\d*$/.test(intPart) || !/^\d*$/.test(fracPart) || intPart + fracPart === "") {
    return { ok: false, ambiguous: false };
  }
  const digits = BigInt(intPart + fracPart);
  const exp = -fracPart.length + (m[3] ? Number(m[3]) : 0);
  return { ok: true, value: { mantissa: negative ? -digits : digits, exp } };
}

function validGroups(s: string, sep: string): boolean {
  const groups = s.split(sep);
  return /^\d{1,3}$/.test(groups[0]!) && groups.slice(1).every((g) => /^\d{3}$/.test(g));
}

function decimalToNumber(d: Decimal, shift = 0): number {
  return Number(`${d.mantissa}e${d.exp + shift}`);
}

/** Splits "7.5 A" into a number part and whatever follows it. */
function splitNumberUnit(input: string): { num: string; unit: string } | null {
  const m = /^([+\-\u2212]?(?:[\d., ]*\d|[.,]\d+)(?:[eE][+-]?\d{1,3})?)\s*(.*)$/s.exec(input);
  if (!m) return null;
  return { num: m[1]!.trim(), unit: m[2]!.trim() };
}

const NEEDS_TIDY = /[^\x21-\x7e ]|''|\s\s/;

/** Folds the spaces, quotes and primes that spreadsheets and keyboards produce into plain ASCII forms. */
function tidy(input: string): string {
  if (!NEEDS_TIDY.test(input)) return input.trim();
  return input
    .replace(/[\u00a0\u2007\u2009\u202f]/g, " ")
    .replace(/[\u201c\u201d\u2033\u02ba]/g, '"')
    .replace(/[\u2018\u2019\u2032\u00b4`]/g, "'")
    .replace(/''/g, '"')
    .replace(/\s+/g, " ")
    .trim();
}

const AMBIGUOUS_HINT = 'write it without a thousands separator, e.g. "1250" or "1.25"';

// ---------------------------------------------------------------------------------------------------------
// Lengths → integer millimetres.

/** Exact length of one unit in tenths of a millimetre (so the inch, 254, is an integer). */
const TENTHS_MM: Record<LengthUnit, bigint> = { mm: 10n, cm: 100n, m: 10_000n, in: 254n, ft: 3048n };

const LENGTH_UNIT_WORDS: Record<string, LengthUnit> = {
  mm: "mm",
  millimetre: "mm",
  millimetres: "mm",
  millimeter: "mm",
  millimeters: "mm",
  cm: "cm",
  centimetre: "cm",
  centimetres: "cm",
  centimeter: "cm",
  centimeters: "cm",
  m: "m",
  metre: "m",
  metres: "m",
  meter: "m",
  meters: "m",
  mtr: "m",
  in: "in",
  inch: "in",
  inches: "in",
  '"': "in",
  ft: "ft",
  foot: "ft",
  feet: "ft",
  "'": "ft",
};

export const LENGTH_UNIT_NAMES: Record<LengthUnit, string> = {
  mm: "millimetres",
  cm: "centimetres",
  m: "metres",
  in: "inches",
  ft: "feet",
};

/** Reads a unit word such as "mm", "metres", "in", `"` or "ft"; null if it is not a length unit. */
export function lengthUnitFromText(text: string): LengthUnit | null {
  return LENGTH_UNIT_WORDS[tidy(text).toLowerCase().replace(/\.$/, "")] ?? null;
}

export interface LengthOptions {
  /** Unit of a bare number (the column's unit). Default mm. */
  defaultUnit?: LengthUnit;
  /** Longest accepted length in mm. Default 100 m. */
  maxMm?: number;
  /** What the value is, for messages ("a length", "a strip length"). */
  what?: string;
}

interface Rational {
  num: bigint;
  den: bigint;
}

function toTenthsRational(d: Decimal, unit: LengthUnit): Rational {
  // value in mm = mantissa × 10^exp × TENTHS_MM / 10
  const f = TENTHS_MM[unit];
  if (d.exp >= 0) return { num: d.mantissa * 10n ** BigInt(d.exp) * f, den: 10n };
  return { num: d.mantissa * f, den: 10n * 10n ** BigInt(-d.exp) };
}

function addRational(a: Rational, b: Rational): Rational {
  return { num: a.num * b.den + b.num * a.den, den: a.den * b.den };
}

function lengthExamples(what: string): string {
  return `expected ${what} such as "1250", "1250 mm", "1.25 m", "125 cm", "49.2 in" or "4' 1""`;
}

function formatMm(mm: number): string {
  return mm >= 1000 ? `${Number((mm / 1000).toFixed(3))} m` : `${mm} mm`;
}

/**
 * Parses a length as people type it and returns whole millimetres, rounded to the nearest mm (halves round up):
 * `1250`, `1250 mm`, `1.25 m`, `125 cm`, `49.2 in`, `49.2"`, `4.1 ft`, `4' 1"`, `4'-1"`, `4 ft 1 in`. A bare number
 * takes `defaultUnit`. Conversion is exact (1 in = 25.4 mm); zero, negative and over-long lengths are refused.
 */
export function parseLengthMm(input: string, options: LengthOptions = {}): ParseResult<number> {
  const defaultUnit = options.defaultUnit ?? "mm";
  const maxMm = options.maxMm ?? MAX_LENGTH_MM;
  const what = options.what ?? "a length";
  const raw = tidy(input);
  const examples = lengthExamples(what);
  if (raw === "") return { ok: false, message: `empty; ${examples}` };
  const lower = raw.toLowerCase();

  let exact: Rational | null = null;
  let unitWritten = true;
  const compound =
    /^([+\-\u2212]?[\d.,]+)\s*(?:'|ft|feet|foot)\s*-?\s*([\d.,]+)\s*(?:"|in|inch|inches)?$/.exec(lower);
  if (compound) {
    const ft = parseDecimal(compound[1]!);
    const inch = parseDecimal(compound[2]!);
    if (!ft.ok || !inch.ok) return { ok: false, message: `"${raw}" is not ${what}; ${examples}` };
    if (ft.value.mantissa < 0n) return { ok: false, message: `"${raw}" is negative; ${examples}` };
    exact = addRational(toTenthsRational(ft.value, "ft"), toTenthsRational(inch.value, "in"));
  } else {
    const split = splitNumberUnit(lower);
    if (!split) return { ok: false, message: `"${raw}" is not ${what}; ${examples}` };
    let unit: LengthUnit = defaultUnit;
    if (split.unit === "") unitWritten = false;
    else {
      const u = LENGTH_UNIT_WORDS[split.unit.replace(/\.$/, "")];
      if (!u) {
        return {
          ok: false,
          message: `"${raw}" has an unknown unit "${split.unit}"; expected a unit of mm, cm, m, in or ft, such as "1250 mm", "1.25 m" or "49.2 in"`,
        };
      }
      unit = u;
    }
    const d = parseDecimal(split.num);
    if (!d.ok) {
      return {
        ok: false,
        message: d.ambiguous
          ? `"${raw}" is ambiguous; ${AMBIGUOUS_HINT}`
          : `"${raw}" is not ${what}; ${examples}`,
      };
    }
    exact = toTenthsRational(d.value, unit);
    if (d.value.mantissa < 0n) {
      return { ok: false, message: `"${raw}" is negative; expected ${what} greater than zero` };
    }
  }

  if (exact.num === 0n) return { ok: false, message: `"${raw}" is zero; expected ${what} greater than zero` };
  // Round half up: floor((2n + d) / 2d) for positive n.
  const mm = Number((2n * exact.num + exact.den) / (2n * exact.den));
  if (mm === 0) return { ok: false, message: `"${raw}" rounds to 0 mm; expected ${what} of at least 1 mm` };
  if (mm > maxMm) {
    const hint =
      !unitWritten && defaultUnit !== "mm"
        ? ` (a number without a unit is read in ${LENGTH_UNIT_NAMES[defaultUnit]} in this column; write "${raw} mm" if you meant millimetres)`
        : "";
    return {
      ok: false,
      message: `"${raw}" is ${formatMm(mm)}, more than the ${formatMm(maxMm)} limit; expected ${what} up to ${formatMm(maxMm)}${hint}`,
    };
  }
  return { ok: true, value: mm };
}

// ---------------------------------------------------------------------------------------------------------
// Currents, voltages, resistances: a number and an SI-prefixed unit (SI Brochure, 9th ed., Table 7).

interface ScaledSpec {
  what: string;
  examples: string;
  /** Unit word → power of ten relative to the base unit. */
  units: Record<string, number>;
  /** Compare unit words case-insensitively (safe where no upper-case prefix could be meant). */
  foldCase: boolean;
  baseSymbol: string;
}

export interface QuantityOptions {
  /** Unit of a bare number, as a power of ten of the base unit (e.g. -3 for a column in mA). Default 0. */
  defaultExp?: number;
  /** Smallest accepted value in the base unit; negatives are always refused. Default 0. */
  min?: number;
  /** Refuse exactly zero. Default false. */
  positive?: boolean;
  /** Largest accepted value in the base unit. */
  max?: number;
}

function parseScaled(
  input: string,
  spec: ScaledSpec,
  options: QuantityOptions,
  max: number,
): ParseResult<number> {
  const raw = tidy(input);
  const expected = `expected ${spec.what} such as ${spec.examples}`;
  if (raw === "") return { ok: false, message: `empty; ${expected}` };
  const split = splitNumberUnit(raw);
  if (!split) return { ok: false, message: `"${raw}" is not a number; ${expected}` };
  let exp = options.defaultExp ?? 0;
  if (split.unit !== "") {
    const key = spec.foldCase
      ? split.unit.toLowerCase().replace(/\s+/g, " ")
      : split.unit.replace(/\s+/g, " ");
    const found = spec.units[key];
    if (found === undefined) {
      if (/\b(?:ac|vac)\b/i.test(split.unit)) {
        return {
          ok: false,
          message: `"${raw}" is an AC value; Loomwright checks DC circuits only, so expected ${spec.what} such as ${spec.examples}`,
        };
      }
      return {
        ok: false,
        message: `"${raw}" has an unknown unit "${split.unit}"; ${expected}`,
      };
    }
    exp = found;
  }
  const d = parseDecimal(split.num);
  if (!d.ok) {
    return {
      ok: false,
      message: d.ambiguous
        ? `"${raw}" is ambiguous; ${AMBIGUOUS_HINT}`
        : `"${raw}" is not a number; ${expected}`,
    };
  }
  const value = decimalToNumber(d.value, exp);
  if (value < 0 || Object.is(value, -0)) {
    return { ok: false, message: `"${raw}" is negative; ${expected}` };
  }
  if (options.positive && value === 0) {
    return { ok: false, message: `"${raw}" is zero; expected ${spec.what} greater than zero` };
  }
  const min = options.min ?? 0;
  if (value < min) {
    return {
      ok: false,
      message: `"${raw}" is less than ${min} ${spec.baseSymbol}; expected ${spec.what} of at least ${min} ${spec.baseSymbol}`,
    };
  }
  if (value > max) {
    return {
      ok: false,
      message: `"${raw}" is more than ${max} ${spec.baseSymbol}; expected ${spec.what} up to ${max} ${spec.baseSymbol}`,
    };
  }
  return { ok: true, value };
}

const CURRENT_SPEC: ScaledSpec = {
  what: "a current in amperes",
  examples: '"7.5", "7.5 A" or "750 mA"',
  // Case folded: "MA" in an all-capitals sheet means milliamperes; megaamperes never occur in a harness.
  foldCase: true,
  baseSymbol: "A",
  units: {
    a: 0,
    amp: 0,
    amps: 0,
    ampere: 0,
    amperes: 0,
    adc: 0,
    "a dc": 0,
    ma: -3,
    milliamp: -3,
    milliamps: -3,
    milliampere: -3,
    milliamperes: -3,
    ka: 3,
  },
};

/** Currents: `7.5`, `7.5 A`, `7.5A`, `750 mA`, `7.5 amps`. Result in amperes. Default range 0 … 10 000 A. */
export function parseCurrentA(input: string, options: QuantityOptions = {}): ParseResult<number> {
  return parseScaled(input, CURRENT_SPEC, options, options.max ?? 10_000);
}

const VOLTAGE_SPEC: ScaledSpec = {
  what: "a DC voltage in volts",
  examples: '"24", "24 V" or "24VDC"',
  foldCase: true,
  baseSymbol: "V",
  units: {
    v: 0,
    volt: 0,
    volts: 0,
    vdc: 0,
    "v dc": 0,
    "v d.c.": 0,
    dc: 0,
    mv: -3,
    millivolt: -3,
    millivolts: -3,
    kv: 3,
  },
};

/** Voltages: `24`, `24 V`, `24VDC`, `24 V DC`, `2100 mV`. Result in volts; AC values are refused. */
export function parseVoltageV(input: string, options: QuantityOptions = {}): ParseResult<number> {
  return parseScaled(input, VOLTAGE_SPEC, { positive: true, ...options }, options.max ?? 1500);
}

const OHM_WORDS = ["Ω", "ohm", "ohms", "Ohm", "Ohms", "OHM", "OHMS"];

function ohmUnits(): Record<string, number> {
  const units: Record<string, number> = {};
  const prefixes: Record<string, number> = { "": 0, m: -3, µ: -6, u: -6, k: 3, K: 3, M: 6 };
  for (const [p, e] of Object.entries(prefixes)) {
    for (const w of OHM_WORDS) units[`${p}${w}`] = e;
  }
  Object.assign(units, { milliohm: -3, milliohms: -3, megohm: 6, megohms: 6, kilohm: 3, kilohms: 3 });
  return units;
}

const RESISTANCE_SPEC: ScaledSpec = {
  what: "a resistance in ohms",
  examples: '"0.002", "0.002 Ω", "2 mΩ" or "0.002 ohm"',
  // Case kept: "m" is milli and "M" is mega (SI Brochure Table 7); the range check catches a slip.
  foldCase: false,
  baseSymbol: "Ω",
  units: ohmUnits(),
};

/** Resistances: `0.002`, `0.002 Ω`, `2 mΩ`, `0.002 ohm`, `2 mohm`. Result in ohms. Default range 0 … 1000 Ω. */
export function parseResistanceOhm(input: string, options: QuantityOptions = {}): ParseResult<number> {
  // U+2126 OHM SIGN and U+03A9 GREEK CAPITAL OMEGA are the same unit to a reader.
  return parseScaled(
    input.replace(/\u2126/g, "Ω").replace(/μ/g, "µ"),
    RESISTANCE_SPEC,
    options,
    options.max ?? 1000,
  );
}

// ---------------------------------------------------------------------------------------------------------
// Temperatures → degrees Celsius.

export type TemperatureUnit = "C" | "F";

const TEMPERATURE_WORDS: Record<string, TemperatureUnit> = {
  c: "C",
  "°c": "C",
  "º c": "C",
  ºc: "C",
  "° c": "C",
  "°": "C",
  degc: "C",
  "deg c": "C",
  "deg. c": "C",
  "degrees c": "C",
  celsius: "C",
  "degrees celsius": "C",
  f: "F",
  "°f": "F",
  "° f": "F",
  ºf: "F",
  degf: "F",
  "deg f": "F",
  "degrees f": "F",
  fahrenheit: "F",
};

export interface TemperatureOptions {
  defaultUnit?: TemperatureUnit;
  minC?: number;
  maxC?: number;
}

/**
 * Temperatures: `105`, `105 °C`, `105C`, `105 deg C`, `221 °F`. Result in °C; °F is converted by
 * t/°C = (t/°F − 32) / 1.8 (NIST SP 811 §B.9) and kept to 0.01 °C.
 */
export function parseTemperatureC(input: string, options: TemperatureOptions = {}): ParseResult<number> {
  const raw = tidy(input);
  const minC = options.minC ?? -273.15;
  const maxC = options.maxC ?? 1000;
  const expected = `expected a temperature such as "105", "105 °C" or "105C"`;
  if (raw === "") return { ok: false, message: `empty; ${expected}` };
  const split = splitNumberUnit(raw);
  if (!split) return { ok: false, message: `"${raw}" is not a number; ${expected}` };
  let unit: TemperatureUnit = options.defaultUnit ?? "C";
  if (split.unit !== "") {
    const u = TEMPERATURE_WORDS[split.unit.toLowerCase()];
    if (!u) return { ok: false, message: `"${raw}" has an unknown unit "${split.unit}"; ${expected}` };
    unit = u;
  }
  const d = parseDecimal(split.num);
  if (!d.ok) return { ok: false, message: `"${raw}" is not a number; ${expected}` };
  const t = decimalToNumber(d.value);
  const c = unit === "C" ? t : Math.round(((t - 32) / 1.8) * 100) / 100;
  if (c < minC || c > maxC) {
    return {
      ok: false,
      message: `"${raw}" is outside ${minC} … ${maxC} °C; ${expected}`,
    };
  }
  return { ok: true, value: c };
}

// ---------------------------------------------------------------------------------------------------------
// Small plain values: percentages, counts, yes/no.

/** Percentages: `3`, `3 %`, `3%`, `3 pct`. Result in percent, within (0, max] (default 100). */
export function parsePercent(input: string, options: { max?: number } = {}): ParseResult<number> {
  const raw = tidy(input);
  const max = options.max ?? 100;
  const expected = `expected a percentage such as "3", "3 %" or "10%"`;
  if (raw === "") return { ok: false, message: `empty; ${expected}` };
  const split = splitNumberUnit(raw);
  if (!split || !["", "%", "pct", "percent"].includes(split.unit.toLowerCase())) {
    return { ok: false, message: `"${raw}" is not a percentage; ${expected}` };
  }
  const d = parseDecimal(split.num);
  if (!d.ok) return { ok: false, message: `"${raw}" is not a percentage; ${expected}` };
  const pct = decimalToNumber(d.value);
  if (pct <= 0 || pct > max) {
    return {
      ok: false,
      message: `"${raw}" is outside 0 … ${max} %; expected a percentage greater than 0 and up to ${max}`,
    };
  }
  return { ok: true, value: pct };
}

/** Whole counts: `3`, `3.0`. Result an integer within [min, max]. */
export function parseCount(
  input: string,
  options: { min?: number; max?: number; what?: string } = {},
): ParseResult<number> {
  const raw = tidy(input);
  const min = options.min ?? 1;
  const max = options.max ?? 1000;
  const what = options.what ?? "a whole number";
  const expected = `expected ${what} from ${min} to ${max}, such as "3"`;
  if (raw === "") return { ok: false, message: `empty; ${expected}` };
  const d = parseDecimal(raw);
  if (!d.ok) return { ok: false, message: `"${raw}" is not a number; ${expected}` };
  const n = decimalToNumber(d.value);
  if (!Number.isInteger(n)) return { ok: false, message: `"${raw}" is not a whole number; ${expected}` };
  if (n < min || n > max) return { ok: false, message: `"${raw}" is outside ${min} … ${max}; ${expected}` };
  return { ok: true, value: n };
}

const YES = new Set(["yes", "y", "true", "t", "1", "x", "✓", "✔", "on", "hot"]);
const NO = new Set(["no", "n", "false", "f", "0", "off", ""]);

/** Yes/no: `yes`, `y`, `true`, `1`, `x`, `✓` → true; `no`, `n`, `false`, `0`, blank → false. */
export function parseYesNo(input: string): ParseResult<boolean> {
  const raw = tidy(input).toLowerCase();
  if (YES.has(raw)) return { ok: true, value: true };
  if (NO.has(raw)) return { ok: true, value: false };
  return {
    ok: false,
    message: `"${input.trim()}" is not yes or no; expected "yes", "no", "true", "false", "1" or "0"`,
  };
}
