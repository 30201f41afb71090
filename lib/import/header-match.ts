// Matches a file's column headers to run fields: canonical names first, then synonyms, with units read from the header.

import {
  IGNORED_ON_IMPORT,
  IGNORED_SYNONYMS,
  RUN_FIELDS,
  RUN_FIELD_BY_KEY,
  defaultUnit,
  type RunFieldKey,
  type UnitHint,
} from "../domain/run-fields";
import type { ColumnMapping, HeaderMatch } from "./types";

/** Lower-case letters and digits only; "²" → "2", "Ω" → "ohm", so "Length (mm²)" and "LENGTH mm2" agree. */
export function normaliseHeader(header: string): string {
  return foldUnicode(header).replace(/[^a-z0-9]/g, "");
}

function foldUnicode(s: string): string {
  return s.normalize("NFKC").toLowerCase().replace(/[ωΩ]/g, "ohm").replace(/[µμ]/g, "u");
}

/** "A", "B", …, "Z", "AA": the spreadsheet letter of a 0-based column index. */
export function columnLetter(index: number): string {
  let n = index + 1;
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

const UNIT_WORDS: Record<string, UnitHint> = {
  mm: "mm",
  millimetre: "mm",
  millimetres: "mm",
  millimeter: "mm",
  millimeters: "mm",
  cm: "cm",
  m: "m",
  metre: "m",
  metres: "m",
  meter: "m",
  meters: "m",
  in: "in",
  inch: "in",
  inches: "in",
  '"': "in",
  ft: "ft",
  feet: "ft",
  foot: "ft",
  "'": "ft",
  a: "A",
  amp: "A",
  amps: "A",
  amperes: "A",
  ma: "mA",
  milliamps: "mA",
  v: "V",
  volts: "V",
  vdc: "V",
  mv: "mV",
  ohm: "ohm",
  ohms: "ohm",
  mohm: "mohm",
  milliohm: "mohm",
  milliohms: "mohm",
  c: "C",
  "°c": "C",
  degc: "C",
  celsius: "C",
  "°f": "F",
  f: "F",
  degf: "F",
  fahrenheit: "F",
  awg: "awg",
  mm2: "mm2",
  sqmm: "mm2",
  "%": "pct",
  pct: "pct",
  percent: "pct",
};

/** Reads a unit from header text such as "mm", "m", "in", "A", "mΩ", "°C", "AWG", "mm²", "%". */
export function unitHintFromText(text: string): UnitHint | null {
  const t = text.trim();
  // Upper-case M before Ω or ohm is mega, which no run field is measured in.
  if (/^M(?:Ω|ohm)/.test(t)) return null;
  // Primes first: NFKC would turn a double prime into two single ones.
  const k = foldUnicode(t.replace(/[\u201c\u201d\u2033]/g, '"').replace(/[\u2019\u2032]/g, "'"))
    .replace(/º/g, "°")
    .replace(/\s+/g, "")
    .replace(/\.$/, "");
  return UNIT_WORDS[k] ?? null;
}

/** Units implied by a header word itself ("AWG", "Amps", "Volts"). */
const IMPLIED_UNITS: Record<string, UnitHint> = {
  awg: "awg",
  mm2: "mm2",
  amps: "A",
  amp: "A",
  amperes: "A",
  fuseamps: "A",
  peakamps: "A",
  volts: "V",
};

type Target = { field: RunFieldKey; matchedBy: "canonical" | "synonym" } | { ignored: true };

const TARGETS: Map<string, Target> = buildTargets();

function buildTargets(): Map<string, Target> {
  const m = new Map<string, Target>();
  for (const f of RUN_FIELDS) m.set(f.key.toLowerCase(), { field: f.key, matchedBy: "canonical" });
  for (const k of IGNORED_ON_IMPORT) m.set(k.toLowerCase(), { ignored: true });
  for (const s of IGNORED_SYNONYMS) if (!m.has(s)) m.set(s, { ignored: true });
  for (const f of RUN_FIELDS) {
    for (const s of f.synonyms) if (!m.has(s)) m.set(s, { field: f.key, matchedBy: "synonym" });
  }
  return m;
}

/** Every normalised header spelling the matcher knows, with its field (for tests and the column picker). */
export function knownHeaderSpellings(): { spelling: string; field: RunFieldKey | null }[] {
  return [...TARGETS.entries()].map(([spelling, t]) => ({ spelling, field: "field" in t ? t.field : null }));
}

interface Resolved {
  target: Target;
  unit: UnitHint | null;
  /** A unit was written in the header but does not fit the field. */
  misfit: string | null;
}

function fits(field: RunFieldKey, unit: UnitHint): boolean {
  return RUN_FIELD_BY_KEY[field].units.includes(unit);
}

function resolveWithUnit(base: string, unitText: string | null): Resolved | null {
  const target = TARGETS.get(base);
  if (!target) return null;
  if ("ignored" in target) return { target, unit: null, misfit: null };
  const implied = IMPLIED_UNITS[base] ?? null;
  const fallback =
    implied ?? (target.matchedBy === "canonical" ? defaultUnit(RUN_FIELD_BY_KEY[target.field].kind) : null);
  if (unitText === null) return { target, unit: fallback, misfit: null };
  const unit = unitHintFromText(unitText);
  if (unit && fits(target.field, unit)) return { target, unit, misfit: null };
  return { target, unit: fallback, misfit: unit ? unitText : null };
}

const BRACKETED = /[([{]([^)\]}]*)[)\]}]/g;

/** Finds the field (and unit) a single header means, or null. */
export function resolveHeader(header: string): Resolved | null {
  const full = normaliseHeader(header);
  if (full === "") return null;
  // 1. A bracketed part is a unit ("Length (mm)", "Length [m]") or a remark ("From (device:pin)").
  const bracketed = [...header.matchAll(BRACKETED)].map((m) => m[1]!.trim());
  if (bracketed.length > 0) {
    const base = normaliseHeader(header.replace(BRACKETED, " "));
    const unitText = bracketed.find((b) => unitHintFromText(b) !== null) ?? null;
    const r = resolveWithUnit(base, unitText);
    if (r) return r;
  }

  // 2. The whole header as written: canonical names ("routedLengthMm") and plain synonyms ("End A").
  const whole = resolveWithUnit(full, null);
  if (whole) return whole;

  // 3. A trailing unit word: "Length mm", "length_m", "Current in mA", "Size mm²".
  const tokens = foldUnicode(header.replace(BRACKETED, " "))
    .split(/[\s_,/:;|-]+/)
    .filter((t) => t !== "");
  if (tokens.length >= 2) {
    const last = tokens[tokens.length - 1]!;
    if (unitHintFromText(last) !== null) {
      let rest = tokens.slice(0, -1);
      if (rest.length >= 2 && rest[rest.length - 1] === "in") rest = rest.slice(0, -1);
      const r = resolveWithUnit(normaliseHeader(rest.join(" ")), last);
      if (
        r &&
        !("ignored" in r.target) &&
        r.misfit === null &&
        r.unit !== null &&
        fits(r.target.field, r.unit)
      ) {
        return r;
      }
      if (r && "ignored" in r.target) return r;
    }
  }
  return null;
}

/**
 * Maps each header to a run field. Two columns that map to one field are both kept in the mapping and listed in
 * `duplicates`, so the preview can refuse the file until the user picks one.
 */
export function matchHeaders(headers: readonly string[]): HeaderMatch {
  const columns: ColumnMapping[] = [];
  const unmatched: string[] = [];
  const ignored: string[] = [];
  const warnings: string[] = [];
  headers.forEach((raw, index) => {
    const header = raw.trim() === "" ? `Column ${columnLetter(index)}` : raw.trim();
    const r = raw.trim() === "" ? null : resolveHeader(raw);
    if (!r) {
      unmatched.push(header);
      columns.push({ index, header, field: null, unit: null, matchedBy: null, ignored: false });
      return;
    }
    if ("ignored" in r.target) {
      ignored.push(header);
      columns.push({ index, header, field: null, unit: null, matchedBy: null, ignored: true });
      return;
    }
    if (r.misfit) {
      warnings.push(
        `Column "${header}": the unit "${r.misfit}" does not fit ${RUN_FIELD_BY_KEY[r.target.field].label}; it is ignored`,
      );
    }
    columns.push({
      index,
      header,
      field: r.target.field,
      unit: r.unit,
      matchedBy: r.target.matchedBy,
      ignored: false,
    });
  });
  return { columns, unmatched, ignored, duplicates: findDuplicates(columns), warnings };
}

/** Fields that more than one column maps to (also used on a mapping the user edited). */
export function findDuplicates(columns: readonly ColumnMapping[]): HeaderMatch["duplicates"] {
  const byField = new Map<RunFieldKey, ColumnMapping[]>();
  for (const c of columns) {
    if (c.field === null || c.ignored) continue;
    const list = byField.get(c.field) ?? [];
    list.push(c);
    byField.set(c.field, list);
  }
  return [...byField.entries()]
    .filter(([, list]) => list.length > 1)
    .map(([field, list]) => ({
      field,
      headers: list.map((c) => c.header),
      indexes: list.map((c) => c.index),
    }));
}

/** How many headers name a run field: used to pick the worksheet that holds the run list. */
export function countMatchedHeaders(headers: readonly string[]): number {
  return new Set(matchHeaders(headers).columns.flatMap((c) => (c.field ? [c.field] : []))).size;
}
