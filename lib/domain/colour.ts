// Wire colours as IEC 60757 letter codes: single colours, green-and-yellow, and base + tracer combinations.

/** IEC 60757 colour codes with an English name and a display swatch (the swatch hex values are our own). */
export const IEC_COLOURS = {
  BK: { name: "black", hex: "#1c1c1c" },
  BN: { name: "brown", hex: "#7a4a24" },
  RD: { name: "red", hex: "#d62d20" },
  OG: { name: "orange", hex: "#f07f13" },
  YE: { name: "yellow", hex: "#f5d21f" },
  GN: { name: "green", hex: "#2e9d48" },
  BU: { name: "blue", hex: "#2563c9" },
  VT: { name: "violet", hex: "#7b3fb5" },
  GY: { name: "grey", hex: "#8a8d91" },
  WH: { name: "white", hex: "#f7f7f5" },
  PK: { name: "pink", hex: "#f29ab8" },
  GD: { name: "gold", hex: "#c9a23a" },
  TQ: { name: "turquoise", hex: "#1fb5b0" },
  SR: { name: "silver", hex: "#c4c8cc" },
} as const;

export type ColourCode = keyof typeof IEC_COLOURS;

const CODES = Object.keys(IEC_COLOURS) as ColourCode[];

/** Other names people use for the same colours. */
const NAME_ALIASES: Record<string, ColourCode> = {
  black: "BK",
  brown: "BN",
  red: "RD",
  orange: "OG",
  yellow: "YE",
  green: "GN",
  blue: "BU",
  violet: "VT",
  purple: "VT",
  grey: "GY",
  gray: "GY",
  white: "WH",
  pink: "PK",
  gold: "GD",
  turquoise: "TQ",
  silver: "SR",
  // common letter abbreviations seen in spreadsheets
  blk: "BK",
  brn: "BN",
  org: "OG",
  yel: "YE",
  grn: "GN",
  blu: "BU",
  vio: "VT",
  pur: "VT",
  gry: "GY",
  wht: "WH",
  pnk: "PK",
};

export type ColourParse = { ok: true; code: string; parts: ColourCode[] } | { ok: false; message: string };

const EXPECTED =
  'an IEC 60757 code such as "RD", "GNYE" or "RDBU", or a colour name such as "red", "green/yellow" or "white-blue"';

function isCode(s: string): s is ColourCode {
  return (CODES as string[]).includes(s);
}

/** Splits a run of letter codes ("RDBU" → RD, BU). Every IEC 60757 code is two letters. */
function splitCodes(s: string): ColourCode[] | null {
  if (s.length === 0 || s.length % 2 !== 0) return null;
  const parts: ColourCode[] = [];
  for (let i = 0; i < s.length; i += 2) {
    const c = s.slice(i, i + 2);
    if (!isCode(c)) return null;
    parts.push(c);
  }
  return parts;
}

function token(t: string): ColourCode | null {
  const up = t.toUpperCase();
  if (isCode(up)) return up;
  return NAME_ALIASES[t.toLowerCase()] ?? null;
}

/**
 * Normalises a colour to its IEC 60757 code: `RD`, `rd`, `GNYE`, `GN/YE`, `red`, `green/yellow`,
 * `green-and-yellow`, `white-blue`, `wht/blu`. A two-colour code names the base colour first, then the tracer.
 */
export function parseColour(input: string): ColourParse {
  const raw = input.trim();
  if (raw === "") return { ok: false, message: `empty; expected ${EXPECTED}` };
  const compact = raw.toUpperCase().replace(/\s+/g, "");
  const direct = splitCodes(compact);
  if (direct && direct.length <= 2) return done(direct, raw);

  const words = raw
    .toLowerCase()
    .split(/\s*(?:\/|-|\+|,|\band\b|\bwith\b|\s)\s*/)
    .filter((w) => w.length > 0 && w !== "stripe" && w !== "striped" && w !== "tracer");
  const parts: ColourCode[] = [];
  for (const w of words) {
    const c = token(w);
    if (!c) return { ok: false, message: `"${raw}" is not ${EXPECTED}` };
    parts.push(c);
  }
  if (parts.length === 0 || parts.length > 2) return { ok: false, message: `"${raw}" is not ${EXPECTED}` };
  return done(parts, raw);
}

function done(parts: ColourCode[], raw: string): ColourParse {
  if (parts.length === 2 && parts[0] === parts[1]) {
    return { ok: false, message: `"${raw}" names the same colour twice` };
  }
  return { ok: true, code: parts.join(""), parts };
}

export function normaliseColour(input: string): string | null {
  const p = parseColour(input);
  return p.ok ? p.code : null;
}

/** A readable name for a normalised code: "GNYE" → "green-yellow". */
export function colourName(code: string): string {
  const parts = splitCodes(code);
  if (!parts) return code;
  return parts.map((p) => IEC_COLOURS[p].name).join("-");
}

/** Swatch colours for a normalised code: one or two hex values (base, tracer). */
export function colourSwatch(code: string): string[] {
  const parts = splitCodes(code);
  return parts ? parts.map((p) => IEC_COLOURS[p].hex) : [];
}
