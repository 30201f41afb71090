// The catalogue of a run's fields: canonical names, labels, units, header synonyms and the parser for each.

import { formatGauge, parseGauge } from "./gauge";
import { parseColour } from "./colour";
import {
  DROP_CLASSES,
  RETURN_KINDS,
  TERMINATIONS,
  type DropClass,
  type GaugeSystem,
  type ReturnKind,
  type RunData,
  type Termination,
} from "./types";
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
  type ParseResult,
} from "./units";

export type RunFieldKey = keyof RunData;

export type FieldKind =
  | "wireId"
  | "text"
  | "reference"
  | "termination"
  | "length"
  | "stripLength"
  | "gauge"
  | "colour"
  | "temperature"
  | "count"
  | "yesNo"
  | "current"
  | "voltage"
  | "resistance"
  | "percent"
  | "dropClass"
  | "returnKind";

/** A unit read from a column header, e.g. "Length (in)" → "in". */
export type UnitHint =
  LengthUnit | "A" | "mA" | "V" | "mV" | "ohm" | "mohm" | "C" | "F" | "awg" | "mm2" | "pct";

export interface RunFieldDef {
  key: RunFieldKey;
  /** Human label for messages and column pickers. */
  label: string;
  kind: FieldKind;
  /** The import refuses a file without a column for it, and a row with it blank. */
  required: boolean;
  /** What a good value looks like, for messages. */
  example: string;
  /** Header spellings besides the canonical name, already normalised (lower-case letters and digits only). */
  synonyms: readonly string[];
  /** Unit hints that make sense for this field. */
  units: readonly UnitHint[];
}

const LENGTH_HINTS: readonly UnitHint[] = ["mm", "cm", "m", "in", "ft"];

/** In the order of PRODUCT.md §6, which is also the export's column order. */
export const RUN_FIELDS: readonly RunFieldDef[] = [
  {
    key: "wireId",
    label: "wire ID",
    kind: "wireId",
    required: false,
    example: '"HR3-041" (blank: generated from the project prefix)',
    synonyms: [
      "wireid",
      "wire",
      "wireno",
      "wirenumber",
      "wirenum",
      "wirelabel",
      "wirename",
      "wiretag",
      "id",
      "tag",
    ],
    units: [],
  },
  {
    key: "endA",
    label: "end A",
    kind: "reference",
    required: true,
    example: '"MC1:3" (device:pin)',
    synonyms: ["enda", "from", "source", "frompin", "fromref", "fromdevice", "end1", "sidea", "origin", "a"],
    units: [],
  },
  {
    key: "endB",
    label: "end B",
    kind: "reference",
    required: true,
    example: '"DM1:1" (device:pin)',
    synonyms: [
      "endb",
      "to",
      "destination",
      "dest",
      "topin",
      "toref",
      "todevice",
      "end2",
      "sideb",
      "target",
      "b",
    ],
    units: [],
  },
  {
    key: "endATermination",
    label: "end A termination",
    kind: "termination",
    required: false,
    example: `one of ${TERMINATIONS.join(", ")}`,
    synonyms: [
      "terminationa",
      "endaterm",
      "atermination",
      "aterm",
      "fromtermination",
      "fromterm",
      "terma",
      "termination1",
    ],
    units: [],
  },
  {
    key: "endBTermination",
    label: "end B termination",
    kind: "termination",
    required: false,
    example: `one of ${TERMINATIONS.join(", ")}`,
    synonyms: [
      "terminationb",
      "endbterm",
      "btermination",
      "bterm",
      "totermination",
      "toterm",
      "termb",
      "termination2",
    ],
    units: [],
  },
  {
    key: "endAStripMm",
    label: "end A strip length",
    kind: "stripLength",
    required: false,
    example: '"6", "6 mm" or "0.25 in"',
    synonyms: [
      "endastrip",
      "endastriplength",
      "stripa",
      "striplengtha",
      "astrip",
      "fromstrip",
      "fromstriplength",
      "strip1",
    ],
    units: LENGTH_HINTS,
  },
  {
    key: "endBStripMm",
    label: "end B strip length",
    kind: "stripLength",
    required: false,
    example: '"6", "6 mm" or "0.25 in"',
    synonyms: [
      "endbstrip",
      "endbstriplength",
      "stripb",
      "striplengthb",
      "bstrip",
      "tostrip",
      "tostriplength",
      "strip2",
    ],
    units: LENGTH_HINTS,
  },
  {
    key: "circuit",
    label: "circuit",
    kind: "text",
    required: false,
    example: '"left drive motor +"',
    synonyms: ["circuit", "circuitname", "function", "signal", "net", "netname", "description", "desc"],
    units: [],
  },
  {
    key: "gauge",
    label: "gauge",
    kind: "gauge",
    required: true,
    example: '"18 AWG", "1/0 AWG" or "0.75 mm²"',
    synonyms: [
      "gauge",
      "gage",
      "awg",
      "size",
      "wiresize",
      "wiregauge",
      "csa",
      "crosssection",
      "conductorsize",
      "mm2",
      "ga",
    ],
    units: ["awg", "mm2"],
  },
  {
    key: "colour",
    label: "colour",
    kind: "colour",
    required: true,
    example: '"RD", "GNYE" or "red" (IEC 60757)',
    synonyms: [
      "colour",
      "color",
      "wirecolour",
      "wirecolor",
      "col",
      "colourcode",
      "colorcode",
      "insulationcolour",
      "insulationcolor",
    ],
    units: [],
  },
  {
    key: "insulation",
    label: "insulation",
    kind: "text",
    required: false,
    example: '"TXL" or "PVC"',
    synonyms: ["insulation", "insulationtype", "insulationspec", "wiretype", "type", "spec", "jacket"],
    units: [],
  },
  {
    key: "insulationTempC",
    label: "insulation temperature rating",
    kind: "temperature",
    required: false,
    example: '"105" or "105 °C"',
    synonyms: [
      "insulationtemp",
      "insulationtemperature",
      "temprating",
      "temperaturerating",
      "tempc",
      "maxtemp",
      "temp",
      "temperature",
    ],
    units: ["C", "F"],
  },
  {
    key: "bundleSize",
    label: "bundle size",
    kind: "count",
    required: false,
    example: '"3" (current-carrying conductors in the bundle)',
    synonyms: ["bundlesize", "bundle", "bundlecount", "wiresinbundle", "conductorsinbundle", "bundled"],
    units: [],
  },
  {
    key: "hotSpace",
    label: "hot space",
    kind: "yesNo",
    required: false,
    example: '"yes" or "no"',
    synonyms: ["hotspace", "hot", "hotzone", "hotarea", "enginespace", "enginecompartment"],
    units: [],
  },
  {
    key: "routedLengthMm",
    label: "routed length",
    kind: "length",
    required: true,
    example: '"1250", "1250 mm" or "1.25 m"',
    synonyms: [
      "routedlength",
      "routed",
      "length",
      "len",
      "wirelength",
      "runlength",
      "harnesslength",
      "distance",
    ],
    units: LENGTH_HINTS,
  },
  {
    key: "currentA",
    label: "current",
    kind: "current",
    required: false,
    example: '"7.5", "7.5 A" or "750 mA"',
    synonyms: [
      "current",
      "amps",
      "amp",
      "amperes",
      "amperage",
      "load",
      "loadcurrent",
      "continuouscurrent",
      "i",
    ],
    units: ["A", "mA"],
  },
  {
    key: "peakCurrentA",
    label: "peak current",
    kind: "current",
    required: false,
    example: '"20" or "20 A"',
    synonyms: [
      "peakcurrent",
      "peak",
      "peakamps",
      "inrush",
      "inrushcurrent",
      "surge",
      "stall",
      "stallcurrent",
    ],
    units: ["A", "mA"],
  },
  {
    key: "supplyV",
    label: "supply voltage",
    kind: "voltage",
    required: false,
    example: '"24" or "24 V" (blank: the project supply)',
    synonyms: ["supply", "supplyvoltage", "voltage", "volts", "systemvoltage", "v"],
    units: ["V", "mV"],
  },
  {
    key: "dropClass",
    label: "drop class",
    kind: "dropClass",
    required: false,
    example: `one of ${DROP_CLASSES.join(", ")}`,
    synonyms: ["dropclass", "class", "voltagedropclass", "vdclass", "dropcategory", "criticality"],
    units: [],
  },
  {
    key: "dropLimitPct",
    label: "drop limit",
    kind: "percent",
    required: false,
    example: '"3" or "3 %"',
    synonyms: [
      "droplimit",
      "maxdrop",
      "allowabledrop",
      "voltagedroplimit",
      "vdlimit",
      "droppct",
      "maxdroppct",
    ],
    units: ["pct"],
  },
  {
    key: "fuseA",
    label: "fuse rating",
    kind: "current",
    required: false,
    example: '"10" or "10 A"',
    synonyms: [
      "fuse",
      "fuserating",
      "fusesize",
      "fuseamps",
      "breaker",
      "breakerrating",
      "protection",
      "ocpd",
    ],
    units: ["A", "mA"],
  },
  {
    key: "returnKind",
    label: "return kind",
    kind: "returnKind",
    required: false,
    example: `one of ${RETURN_KINDS.join(", ")}`,
    synonyms: ["returnkind", "return", "returntype", "returnpath"],
    units: [],
  },
  {
    key: "returnRunWireId",
    label: "return run wire ID",
    kind: "wireId",
    required: false,
    example: '"HR3-042"',
    synonyms: ["returnrun", "returnwire", "returnwireid", "returnid"],
    units: [],
  },
  {
    key: "returnResistanceOhm",
    label: "return resistance",
    kind: "resistance",
    required: false,
    example: '"0.002 Ω" or "2 mΩ"',
    synonyms: ["returnresistance", "chassisresistance", "returnohm", "returnohms"],
    units: ["ohm", "mohm"],
  },
  {
    key: "ledForwardV",
    label: "LED forward voltage",
    kind: "voltage",
    required: false,
    example: '"2.1" or "2.1 V"',
    synonyms: ["ledforwardvoltage", "ledvf", "vf", "forwardvoltage", "ledvoltage"],
    units: ["V", "mV"],
  },
  {
    key: "ledCurrentA",
    label: "LED current",
    kind: "current",
    required: false,
    example: '"0.02" or "20 mA"',
    synonyms: ["ledcurrent", "ledif", "ledforwardcurrent", "if"],
    units: ["A", "mA"],
  },
  {
    key: "notes",
    label: "notes",
    kind: "text",
    required: false,
    example: "any text",
    synonyms: ["notes", "note", "comment", "comments", "remark", "remarks", "memo"],
    units: [],
  },
];

export const RUN_FIELD_BY_KEY: Readonly<Record<RunFieldKey, RunFieldDef>> = Object.fromEntries(
  RUN_FIELDS.map((f) => [f.key, f]),
) as Record<RunFieldKey, RunFieldDef>;

export const REQUIRED_FIELDS: readonly RunFieldKey[] = RUN_FIELDS.filter((f) => f.required).map((f) => f.key);

/** Columns that exports carry but imports ignore: computed or owned by the app (PRODUCT.md §6). */
export const IGNORED_ON_IMPORT = ["cutLengthMm", "state", "version", "traceCode"] as const;

/** Header spellings of the ignored columns, normalised. */
export const IGNORED_SYNONYMS: readonly string[] = [
  "cutlengthmm",
  "cutlength",
  "cut",
  "state",
  "status",
  "benchstate",
  "version",
  "tracecode",
  "trace",
];

/** The unit a value in the field means when none is written and the header names none. */
export function defaultUnit(kind: FieldKind): UnitHint | null {
  switch (kind) {
    case "length":
    case "stripLength":
      return "mm";
    case "current":
      return "A";
    case "voltage":
      return "V";
    case "resistance":
      return "ohm";
    case "temperature":
      return "C";
    case "percent":
      return "pct";
    default:
      return null;
  }
}

// ---------------------------------------------------------------------------------------------------------
// Value parsers per field kind.

/** Cells that mean "nothing here" in a typed column. */
const BLANK_TOKENS = new Set(["", "-", "–", "—", "n/a", "na", "none", "nil"]);

export function isBlankValue(raw: string, kind: FieldKind): boolean {
  const t = raw.trim();
  if (t === "") return true;
  if (kind === "text" || kind === "reference" || kind === "wireId") return false;
  return BLANK_TOKENS.has(t.toLowerCase());
}

const TERMINATION_SYNONYMS: Record<string, Termination> = {
  ring: "ring",
  ringterminal: "ring",
  ringlug: "ring",
  eyelet: "ring",
  fork: "fork",
  forkterminal: "fork",
  spadefork: "fork",
  ferrule: "ferrule",
  bootlace: "ferrule",
  bootlaceferrule: "ferrule",
  wireendferrule: "ferrule",
  pin: "pin",
  crimppin: "pin",
  malepin: "pin",
  pincontact: "pin",
  socket: "socket",
  crimpsocket: "socket",
  femalesocket: "socket",
  socketcontact: "socket",
  receptacle: "socket",
  spade: "spade",
  blade: "spade",
  quickdisconnect: "spade",
  qd: "spade",
  tab: "spade",
  buttsplice: "butt-splice",
  butt: "butt-splice",
  splice: "butt-splice",
  solder: "solder",
  soldered: "solder",
  soldercup: "solder",
  lug: "lug",
  batterylug: "lug",
  cablelug: "lug",
  tubelug: "lug",
  bare: "bare",
  stripped: "bare",
  tinned: "bare",
};

export function parseTermination(raw: string): ParseResult<Termination> {
  const key = raw.toLowerCase().replace(/[^a-z]/g, "");
  const t = TERMINATION_SYNONYMS[key];
  if (t) return { ok: true, value: t };
  return {
    ok: false,
    message: `"${raw.trim()}" is not a termination kind; expected one of ${TERMINATIONS.join(", ")}`,
  };
}

const DROP_CLASS_SYNONYMS: Record<string, DropClass> = {
  critical: "critical",
  crit: "critical",
  standard: "standard",
  std: "standard",
  normal: "standard",
  general: "standard",
  motor: "motor",
  custom: "custom",
};

export function parseDropClass(raw: string): ParseResult<DropClass> {
  const v = DROP_CLASS_SYNONYMS[raw.trim().toLowerCase()];
  if (v) return { ok: true, value: v };
  return {
    ok: false,
    message: `"${raw.trim()}" is not a drop class; expected one of ${DROP_CLASSES.join(", ")}`,
  };
}

const RETURN_KIND_SYNONYMS: Record<string, ReturnKind> = {
  same: "same",
  run: "run",
  wire: "run",
  returnrun: "run",
  chassis: "chassis",
  chassisground: "chassis",
  frame: "chassis",
  ground: "chassis",
};

export function parseReturnKind(raw: string): ParseResult<ReturnKind> {
  const v = RETURN_KIND_SYNONYMS[raw.toLowerCase().replace(/[^a-z]/g, "")];
  if (v) return { ok: true, value: v };
  return {
    ok: false,
    message: `"${raw.trim()}" is not a return kind; expected one of ${RETURN_KINDS.join(", ")}`,
  };
}

const MAX_TEXT: Partial<Record<RunFieldKey, number>> = {
  wireId: 40,
  returnRunWireId: 40,
  endA: 100,
  endB: 100,
  circuit: 200,
  insulation: 100,
  notes: 2000,
};

function parseText(raw: string, def: RunFieldDef): ParseResult<string> {
  // Notes keep their line breaks, as "\n": XLSX (XML 1.0 §2.11) turns CRLF into LF anyway, so CSV does the same.
  const value = def.key === "notes" ? raw.trim().replace(/\r\n?/g, "\n") : raw.trim().replace(/\s+/g, " ");
  const max = MAX_TEXT[def.key] ?? 200;
  if (value.length > max) {
    return {
      ok: false,
      message: `${value.length} characters is too long; expected ${def.label} of at most ${max} characters`,
    };
  }
  if (def.kind !== "text" && /[\u0000-\u001f\u007f]/.test(value)) {
    return {
      ok: false,
      message: `contains a control character; expected ${def.label} such as ${def.example}`,
    };
  }
  return { ok: true, value };
}

export interface FieldParseContext {
  /** The unit the column's header names, if any. */
  unit: UnitHint | null;
  /** How a bare whole number in a gauge column is read when the header names no system. */
  gaugeSystem: GaugeSystem;
}

export type FieldValue = RunData[RunFieldKey];

function lengthUnitOf(hint: UnitHint | null): LengthUnit {
  return hint === "cm" || hint === "m" || hint === "in" || hint === "ft" ? hint : "mm";
}

function gaugeText(raw: string, ctx: FieldParseContext): string {
  const t = raw.trim();
  // Only a bare number takes the column's system; anything with a unit or slash speaks for itself.
  if (!/^\d+(?:[.,]\d+)?$/.test(t)) return t;
  if (ctx.unit === "awg") return `${t} AWG`;
  if (ctx.unit === "mm2" || ctx.gaugeSystem === "metric") return `${t} mm²`;
  // An AWG project: parseGauge reads a whole number as AWG and a decimal ("2.5") as mm².
  return t;
}

/**
 * Parses one non-blank cell for a field. The message says what was expected; the caller adds the row and
 * column. Lengths come back as whole millimetres, gauges and colours in their canonical form.
 */
export function parseFieldValue(
  def: RunFieldDef,
  raw: string,
  ctx: FieldParseContext,
): ParseResult<FieldValue> {
  switch (def.kind) {
    case "wireId":
    case "text":
    case "reference":
      return parseText(raw, def);
    case "termination":
      return parseTermination(raw);
    case "length":
      return parseLengthMm(raw, { defaultUnit: lengthUnitOf(ctx.unit), what: `a ${def.label}` });
    case "stripLength":
      return parseLengthMm(raw, { defaultUnit: lengthUnitOf(ctx.unit), maxMm: 200, what: `a ${def.label}` });
    case "gauge": {
      const g = parseGauge(gaugeText(raw, ctx));
      return g.ok ? { ok: true, value: formatGauge(g.gauge) } : { ok: false, message: g.message };
    }
    case "colour": {
      const c = parseColour(raw);
      return c.ok ? { ok: true, value: c.code } : { ok: false, message: c.message };
    }
    case "temperature":
      return parseTemperatureC(raw, { defaultUnit: ctx.unit === "F" ? "F" : "C", minC: 40, maxC: 400 });
    case "count":
      return parseCount(raw, { min: 1, max: 1000, what: `a ${def.label}` });
    case "yesNo":
      return parseYesNo(raw);
    case "current":
      return parseCurrentA(raw, { defaultExp: ctx.unit === "mA" ? -3 : 0, positive: def.key === "fuseA" });
    case "voltage":
      return parseVoltageV(raw, { defaultExp: ctx.unit === "mV" ? -3 : 0 });
    case "resistance":
      return parseResistanceOhm(raw, { defaultExp: ctx.unit === "mohm" ? -3 : 0 });
    case "percent":
      return parsePercent(raw);
    case "dropClass":
      return parseDropClass(raw);
    case "returnKind":
      return parseReturnKind(raw);
  }
}

/** The value a field takes when its cell is blank (or its column absent). */
export function blankValue(key: RunFieldKey): FieldValue {
  switch (key) {
    case "hotSpace":
      return false;
    case "dropClass":
      return "standard";
    case "returnKind":
      return "same";
    case "wireId":
      return "";
    default:
      return null;
  }
}
