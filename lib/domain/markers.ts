// Markers: which markers a run gets and their text, trace codes, the sleeve, the symbology and barcode geometry, and their layout on a template.

import type { ProjectSettings } from "./types";
import { traceCodeFromBytes } from "./trace-code";
import {
  chooseSleeve,
  SLEEVES_2_TO_1,
  wireOuterDiameter,
  type SleeveChoice,
  type SleeveSize,
} from "./sleeves";
import {
  cellBox,
  cutMarkLines,
  markersPerPage,
  type Box,
  type Line,
  type MarkerTemplate,
} from "./marker-templates";

// ---------------------------------------------------------------------------------------------------------
// Trace codes

/** Trace codes are 8 Crockford base32 symbols (lib/domain/trace-code.ts); 40 random bits each. */
export { normaliseTraceCode, TRACE_CODE_LENGTH } from "./trace-code";

/** An 8-symbol trace code from 40 random bits (the first 5 bytes given; pass `crypto.randomBytes(5)`). */
export function makeTraceCode(randomBytes: Uint8Array): string {
  return traceCodeFromBytes(randomBytes);
}

/** A deterministic trace code from a seed string (FNV-1a 64 + splitmix64 finaliser): for demo data and tests, not for secrecy. */
export function traceCodeFromSeed(seed: string): string {
  let h = 0xcbf29ce484222325n;
  const bytes = new TextEncoder().encode(seed);
  const M64 = 0xffffffffffffffffn;
  for (const b of bytes) h = ((h ^ BigInt(b)) * 0x100000001b3n) & M64;
  // splitmix64's finaliser, so that seeds differing in one character differ in every output symbol
  h = ((h ^ (h >> 30n)) * 0xbf58476d1ce4e5b9n) & M64;
  h = ((h ^ (h >> 27n)) * 0x94d049bb133111ebn) & M64;
  h ^= h >> 31n;
  const out = new Uint8Array(5);
  for (let i = 0; i < 5; i++) out[i] = Number((h >> BigInt(8 * (7 - i))) & 0xffn);
  return makeTraceCode(out);
}

/** The trace page a scanned marker opens. */
export function traceUrl(publicBaseUrl: string, traceCode: string): string {
  return `${publicBaseUrl.replace(/\/+$/, "")}/r/${traceCode}`;
}

// ---------------------------------------------------------------------------------------------------------
// Which markers a run gets

export type MarkerPlace = "end-a" | "end-b" | "repeat";

export interface MarkerRunInput {
  wireId: string;
  endA: string;
  endB: string;
  /** Canonical gauge label ("18 AWG", "0.75 mm²"). */
  gauge: string;
  /** IEC 60757 code. */
  colour: string;
  insulation?: string | null;
  routedLengthMm: number;
  cutLengthMm?: number | null;
  traceCode: string;
  /** The wire type's outer diameter when known; otherwise it is estimated from gauge and insulation. */
  outerDiameterMm?: number | null;
}

export interface MarkerSpec {
  /** Unique in a print job: `${wireId}#${indexInRun}`. */
  key: string;
  wireId: string;
  traceCode: string;
  place: MarkerPlace;
  indexInRun: number;
  countInRun: number;
  /** Where the marker sits, measured from end A's conductor tip. */
  alongMm: number;
  idText: string;
  farText: string;
  detailText: string;
  wireOdMm: number | null;
  odEstimated: boolean;
  sleeve: SleeveChoice | null;
  /** Why no sleeve was chosen (no OD, or none in the series fits). */
  sleeveProblem: string | null;
}

/** End markers sit this far from each conductor tip, behind the terminal (common practice). */
export const END_MARKER_OFFSET_MM = 30;

/** Repeats between the two end markers so that no gap between neighbouring markers exceeds the interval. */
export function repeatMarkerCount(
  lengthMm: number,
  intervalMm: number | null,
  endOffsetMm = END_MARKER_OFFSET_MM,
): number {
  if (intervalMm == null || !(intervalMm > 0)) return 0;
  const gapMm = lengthMm - 2 * endOffsetMm;
  if (gapMm <= intervalMm) return 0;
  return Math.ceil(gapMm / intervalMm - 1e-9) - 1;
}

export interface MarkerRunOptions {
  sleeveSeries?: readonly SleeveSize[];
  endOffsetMm?: number;
}

/** End A's marker, the repeats in order along the run, then end B's marker. */
export function markersForRun(
  run: MarkerRunInput,
  settings: Pick<ProjectSettings, "markerRepeatMm">,
  options: MarkerRunOptions = {},
): MarkerSpec[] {
  const endOffsetMm = options.endOffsetMm ?? END_MARKER_OFFSET_MM;
  const lengthMm = run.cutLengthMm ?? run.routedLengthMm;
  const repeats = repeatMarkerCount(lengthMm, settings.markerRepeatMm, endOffsetMm);
  const od = wireOuterDiameter(run);
  const sleeveResult = od ? chooseSleeve(od.odMm, options.sleeveSeries ?? SLEEVES_2_TO_1) : null;
  const sleeve = sleeveResult?.ok ? sleeveResult.choice : null;
  const sleeveProblem = !od
    ? `no outer diameter for gauge "${run.gauge}"`
    : sleeveResult && !sleeveResult.ok
      ? sleeveResult.message
      : null;
  const count = repeats + 2;
  const endAt = Math.min(endOffsetMm, lengthMm / 2);
  const gapMm = (lengthMm - 2 * endAt) / (repeats + 1);
  const detailText = `${run.gauge} ${run.colour}`.trim();

  const out: MarkerSpec[] = [];
  for (let i = 0; i < count; i++) {
    const place: MarkerPlace = i === 0 ? "end-a" : i === count - 1 ? "end-b" : "repeat";
    const farText =
      place === "end-a" ? `→ ${run.endB}` : place === "end-b" ? `→ ${run.endA}` : `${run.endA} ↔ ${run.endB}`;
    out.push({
      key: `${run.wireId}#${i + 1}`,
      wireId: run.wireId,
      traceCode: run.traceCode,
      place,
      indexInRun: i + 1,
      countInRun: count,
      alongMm: Math.round(place === "end-b" ? lengthMm - endAt : endAt + i * gapMm),
      idText: run.wireId,
      farText,
      detailText,
      wireOdMm: od ? od.odMm : null,
      odEstimated: od ? od.estimated : false,
      sleeve,
      sleeveProblem,
    });
  }
  return out;
}

export function markersForRuns(
  runs: readonly MarkerRunInput[],
  settings: Pick<ProjectSettings, "markerRepeatMm">,
  options: MarkerRunOptions = {},
): MarkerSpec[] {
  return runs.flatMap((r) => markersForRun(r, settings, options));
}

/** Markers grouped by the sleeve they need (one sheet or strip per sleeve size); `none` collects the unsized. */
export function groupMarkersBySleeve(markers: readonly MarkerSpec[]): Map<string, MarkerSpec[]> {
  const groups = new Map<string, MarkerSpec[]>();
  for (const m of markers) {
    const key = m.sleeve ? m.sleeve.sleeve.id : "none";
    const list = groups.get(key);
    if (list) list.push(m);
    else groups.set(key, [m]);
  }
  return groups;
}

// ---------------------------------------------------------------------------------------------------------
// Symbols

export type Symbology = "code128" | "datamatrix" | "qrcode";

/** Exact symbol sizes in modules, from an encoder (lib/pdf/barcodes.ts wraps bwip-js). */
export interface SymbolSizer {
  /** Total modules of a Code 128 symbol without its quiet zones. */
  code128Modules(payload: string): number | null;
  /** The smallest ECC 200 symbol of that shape that holds the payload. */
  dataMatrixSize(payload: string, shape: "square" | "rectangle"): { rows: number; cols: number } | null;
  /** Modules per side of the smallest QR symbol at error correction level M. */
  qrModules(payload: string): number | null;
}

/** Quiet zones in modules: ISO/IEC 15417 (Code 128) 10X each end, ISO/IEC 16022 (Data Matrix) 1X, ISO/IEC 18004 (QR) 4X. */
export const QUIET_ZONE_MODULES: Readonly<Record<Symbology, number>> = {
  code128: 10,
  datamatrix: 1,
  qrcode: 4,
};

/** Phone cameras: at least 0.25 mm modules; 0.3–0.33 mm is better (electrical.md §10, common practice). */
export const MIN_MODULE_MM = 0.25;
export const PREFERRED_MODULE_MM = 0.33;
/** Shortest Code 128 bars we print (common practice). */
export const MIN_BAR_HEIGHT_MM = 2;
/** A 2D symbol may cover at most 60° of arc: GS1's 30° tangent rule gives π·D/6 around a cylinder. */
export const CURVATURE_ARC_SHARE = 1 / 6;

export function dotMm(dpi: number): number {
  return 25.4 / dpi;
}

/** The fewest whole printer dots that make a module at least `minModuleMm` wide. */
export function dotsPerModule(minModuleMm: number, dpi: number): number {
  return Math.max(1, Math.ceil(minModuleMm / dotMm(dpi) - 1e-9));
}

/** Code 128 length in modules for n symbol characters (data only): 11·(n + start + check) + 13-module stop. */
export function code128ModulesForChars(dataChars: number): number {
  return 11 * dataChars + 35;
}

export interface SymbolGeometry {
  symbology: Symbology;
  payload: string;
  payloadKind: "url" | "code";
  /** Modules across the symbol (Code 128: its length) and down it (Code 128: 1, the bars run the full height). */
  cols: number;
  rows: number;
  moduleMm: number;
  dotsPerModule: number;
  quietZoneModules: number;
  /** Encoder version when it must be pinned: Data Matrix "RxC", QR version number. */
  version: string | null;
}

export interface SymbolRoom {
  /** Room for the symbol including its quiet zones. */
  maxWidthMm: number;
  maxHeightMm: number;
  dpi: number;
  /** On a heat-shrink sleeve: its flat width and how much shrinking squeezes print around the wire. */
  sleeve: { layFlatMm: number; circumferentialScale: number } | null;
  /** False on heat-shrink without a known sleeve: the squeeze cannot be judged, so only Code 128 along the axis. */
  allow2d: boolean;
  /** Restrict the symbologies tried (default: all, in order of preference). */
  symbologies?: readonly Symbology[];
  /** Data Matrix shapes to try, in order (default: rectangles first, since marker zones are long and low). */
  dataMatrixShapes?: readonly ("rectangle" | "square")[];
}

interface Candidate {
  symbology: Symbology;
  payloadKind: "url" | "code";
}

/** Preference: a URL a phone camera opens (QR), a compact URL (Data Matrix), then the short code alone. */
const CANDIDATES: readonly Candidate[] = [
  { symbology: "qrcode", payloadKind: "url" },
  { symbology: "datamatrix", payloadKind: "url" },
  { symbology: "datamatrix", payloadKind: "code" },
  { symbology: "code128", payloadKind: "code" },
];

/**
 * The best symbol that fits: preferred module size first, then the minimum, each a whole number of printer dots.
 * A 2D symbol on a sleeve must keep its modules at least MIN_MODULE_MM around the wire after shrinking and cover
 * no more than π·D/6 of the installed circumference (on the flat print: a third of the flat width).
 * Code 128 runs along the sleeve axis, where neither curvature nor the squeeze touches its bars' widths.
 */
export function chooseSymbol(
  room: SymbolRoom,
  payloads: { url: string; code: string },
  sizer: SymbolSizer,
): SymbolGeometry | null {
  const dot = dotMm(room.dpi);
  for (const c of CANDIDATES) {
    const is2d = c.symbology !== "code128";
    if (is2d && !room.allow2d) continue;
    if (room.symbologies && !room.symbologies.includes(c.symbology)) continue;
    const squeeze = is2d && room.sleeve ? room.sleeve.circumferentialScale : 1;
    const kMin = dotsPerModule(MIN_MODULE_MM / squeeze, room.dpi);
    const kPreferred = Math.max(kMin, dotsPerModule(PREFERRED_MODULE_MM / squeeze, room.dpi));
    const payload = c.payloadKind === "url" ? payloads.url : payloads.code;
    const q = QUIET_ZONE_MODULES[c.symbology];
    for (const k of kPreferred === kMin ? [kMin] : [kPreferred, kMin]) {
      const x = k * dot;
      // The fit keeps one spare dot each way so that snapping to the printer's dot grid cannot eat a quiet zone.
      const fits = (cols: number, rows: number): boolean => {
        if ((cols + 2 * q) * x + dot > room.maxWidthMm + 1e-9) return false;
        if (c.symbology === "code128") return room.maxHeightMm >= MIN_BAR_HEIGHT_MM;
        if ((rows + 2 * q) * x + dot > room.maxHeightMm + 1e-9) return false;
        if (!room.sleeve) return true;
        const expandedMm = (2 * room.sleeve.layFlatMm) / Math.PI;
        return rows * x <= Math.PI * expandedMm * CURVATURE_ARC_SHARE + 1e-9;
      };
      const g = sized(c, payload, sizer, fits, room.dataMatrixShapes ?? ["rectangle", "square"]);
      if (g) return { ...g, moduleMm: x, dotsPerModule: k };
    }
  }
  return null;
}

function sized(
  c: Candidate,
  payload: string,
  sizer: SymbolSizer,
  fits: (cols: number, rows: number) => boolean,
  shapes: readonly ("rectangle" | "square")[],
): Omit<SymbolGeometry, "moduleMm" | "dotsPerModule"> | null {
  const base = {
    symbology: c.symbology,
    payload,
    payloadKind: c.payloadKind,
    quietZoneModules: QUIET_ZONE_MODULES[c.symbology],
  };
  if (c.symbology === "code128") {
    // Cheapest bound first: at least start + 1 char + check + stop.
    if (!fits(code128ModulesForChars(1), 1)) return null;
    const cols = sizer.code128Modules(payload);
    return cols !== null && fits(cols, 1) ? { ...base, cols, rows: 1, version: null } : null;
  }
  if (c.symbology === "qrcode") {
    if (!fits(21, 21)) return null; // version 1 is the smallest QR symbol
    const side = sizer.qrModules(payload);
    return side !== null && fits(side, side)
      ? { ...base, cols: side, rows: side, version: String((side - 17) / 4) }
      : null;
  }
  // Skip the encoder when no symbol of the shape that could hold the payload fits the room.
  const tryShapes = shapes.filter((sh) =>
    DATA_MATRIX_SIZES[sh].some((z) => z.dataCodewords >= minDataCodewords(payload) && fits(z.cols, z.rows)),
  );
  for (const shape of tryShapes) {
    const s = sizer.dataMatrixSize(payload, shape);
    if (s && fits(s.cols, s.rows))
      return { ...base, cols: s.cols, rows: s.rows, version: `${s.rows}x${s.cols}` };
  }
  return null;
}

/**
 * ECC 200 sizes with their data codewords (ISO/IEC 16022; electrical.md §10 lists the rectangles' capacities,
 * two digits per codeword). Squares stop at 26x26: larger symbols never fit a marker.
 */
const DATA_MATRIX_SIZES: Readonly<
  Record<"rectangle" | "square", readonly { rows: number; cols: number; dataCodewords: number }[]>
> = {
  rectangle: [
    { rows: 8, cols: 18, dataCodewords: 5 },
    { rows: 8, cols: 32, dataCodewords: 10 },
    { rows: 12, cols: 26, dataCodewords: 16 },
    { rows: 12, cols: 36, dataCodewords: 22 },
    { rows: 16, cols: 36, dataCodewords: 32 },
    { rows: 16, cols: 48, dataCodewords: 49 },
  ],
  square: [
    { rows: 10, cols: 10, dataCodewords: 3 },
    { rows: 12, cols: 12, dataCodewords: 5 },
    { rows: 14, cols: 14, dataCodewords: 8 },
    { rows: 16, cols: 16, dataCodewords: 12 },
    { rows: 18, cols: 18, dataCodewords: 18 },
    { rows: 20, cols: 20, dataCodewords: 22 },
    { rows: 22, cols: 22, dataCodewords: 30 },
    { rows: 24, cols: 24, dataCodewords: 36 },
    { rows: 26, cols: 26, dataCodewords: 44 },
  ],
};

/** No encodation packs more than two characters (digit pairs) into one codeword. */
function minDataCodewords(payload: string): number {
  return Math.ceil(payload.length / 2);
}

// ---------------------------------------------------------------------------------------------------------
// Text

export type TextFont = "bold" | "regular";

/** Measures text in the fonts the PDF renderer embeds (lib/pdf/fonts.ts measures with pdfkit). */
export interface TextMeasurer {
  widthMm(text: string, font: TextFont, sizePt: number): number;
  /** Height of one line box (ascender to descender). */
  lineHeightMm(font: TextFont, sizePt: number): number;
}

/** Smallest legible marker text: about 1.5 mm capital height (common practice). */
export const MIN_TEXT_PT = 6;
export const MAX_ID_PT = 16;
export const MAX_TEXT_PT = 10;
export const ELLIPSIS = "…";
const MIN_KEPT_CHARS = 3;

export type TextRole = "id" | "far" | "detail";

export interface PlacedText {
  role: TextRole;
  text: string;
  font: TextFont;
  sizePt: number;
  /** The line box: top at the ascender, bottom at the descender; the renderer draws with its top at yMm. */
  box: Box;
  truncated: boolean;
}

interface Segment {
  role: TextRole;
  text: string;
  font: TextFont;
  truncated?: boolean;
}

const ARRANGEMENTS: readonly (readonly (readonly TextRole[])[])[] = [
  [["id"], ["far"], ["detail"]],
  [["id"], ["far", "detail"]],
  [["id", "far"], ["detail"]],
  [["id", "far", "detail"]],
];

interface RowFit {
  segments: Segment[];
  sizePt: number;
  truncatedChars: number;
}

interface BlockFit {
  rows: RowFit[];
  truncatedChars: number;
  idPt: number;
  otherPt: number;
}

/** Lays out the ID, far end and detail inside `box`: the largest legible sizes that fit, never overflowing. */
export function fitMarkerText(content: Record<TextRole, string>, box: Box, m: TextMeasurer): PlacedText[] {
  const segmentsOf = (roles: readonly TextRole[]): Segment[] =>
    roles
      .filter((r) => content[r] !== "")
      .map((r) => ({ role: r, text: content[r], font: r === "id" ? "bold" : "regular" }));
  const lhPerPt = Math.max(m.lineHeightMm("bold", 1), m.lineHeightMm("regular", 1));
  let best: BlockFit | null = null;
  for (const arrangement of ARRANGEMENTS) {
    const rows = arrangement.map(segmentsOf).filter((r) => r.length > 0);
    const weights = rows.map((r) => (r.some((s) => s.role === "id") ? 1.4 : 1));
    const total = weights.reduce((a, b) => a + b, 0);
    const fitted: RowFit[] = [];
    const byHeight = rows.map((row, i) =>
      Math.min(
        row.some((s) => s.role === "id") ? MAX_ID_PT : MAX_TEXT_PT,
        (box.heightMm * (weights[i]! / total)) / lhPerPt,
      ),
    );
    if (byHeight.some((pt) => pt < MIN_TEXT_PT)) continue;
    rows.forEach((row, i) => fitted.push(fitRow(row, box.widthMm, byHeight[i]!, m)));
    const idRow = fitted.find((r) => r.segments.some((s) => s.role === "id"));
    const others = fitted.filter((r) => r !== idRow).map((r) => r.sizePt);
    const fit: BlockFit = {
      rows: fitted,
      truncatedChars: fitted.reduce((a, r) => a + r.truncatedChars, 0),
      idPt: idRow ? idRow.sizePt : 0,
      otherPt: Math.min(MAX_TEXT_PT, ...(others.length ? others : [idRow ? idRow.sizePt : 0])),
    };
    if (!best || better(fit, best)) best = fit;
  }
  if (!best) {
    // Not even one row of minimum-size text fits the height: say so with nothing drawn rather than overflow.
    return [];
  }
  return place(best, box, m, lhPerPt);
}

function better(a: BlockFit, b: BlockFit): boolean {
  if (a.truncatedChars !== b.truncatedChars) return a.truncatedChars < b.truncatedChars;
  return a.idPt + a.otherPt > b.idPt + b.otherPt + 1e-6;
}

function rowWidthMm(segments: Segment[], sizePt: number, m: TextMeasurer): number {
  const gap = m.widthMm(" ", "regular", sizePt);
  return segments.reduce((w, s, i) => w + m.widthMm(s.text, s.font, sizePt) + (i > 0 ? gap : 0), 0);
}

function fitRow(row: Segment[], widthMm: number, maxPt: number, m: TextMeasurer): RowFit {
  const at1 = rowWidthMm(row, 1, m);
  let size = Math.floor(Math.min(maxPt, at1 > 0 ? widthMm / at1 : maxPt) * 10) / 10;
  while (size >= MIN_TEXT_PT && rowWidthMm(row, size, m) > widthMm) size -= 0.1;
  if (size >= MIN_TEXT_PT) return { segments: row, sizePt: size, truncatedChars: 0 };
  return truncateRow(row, widthMm, MIN_TEXT_PT, m);
}

/** At the minimum size, cut the lowest-priority text first, ending each cut with an ellipsis. */
function truncateRow(row: Segment[], widthMm: number, sizePt: number, m: TextMeasurer): RowFit {
  const segs = row.map((s) => ({ ...s }));
  if (rowWidthMm(segs, sizePt, m) <= widthMm) return { segments: segs, sizePt, truncatedChars: 0 };
  let truncatedChars = 0;
  const byPriority = [...segs].sort((a, b) => priority(b.role) - priority(a.role));
  for (const seg of byPriority) {
    if (rowWidthMm(segs, sizePt, m) <= widthMm) break;
    const others = segs.filter((s) => s !== seg);
    const gap = others.length ? m.widthMm(" ", "regular", sizePt) : 0;
    const room = widthMm - rowWidthMm(others, sizePt, m) - gap;
    const kept = longestPrefix(seg, room, sizePt, m);
    truncatedChars += [...seg.text].length - kept.length;
    // A secondary text cut to a stub ("1…", "→ …") says nothing: drop it instead.
    if (seg.role !== "id" && kept.join("").replace(/[^\p{L}\p{N}]/gu, "").length < MIN_KEPT_CHARS) {
      segs.splice(segs.indexOf(seg), 1);
      truncatedChars += kept.length;
      continue;
    }
    seg.text = kept.join("") + ELLIPSIS;
    seg.truncated = true;
  }
  // A lone ellipsis that still does not fit goes too: never overflow.
  while (segs.length && rowWidthMm(segs, sizePt, m) > widthMm) {
    truncatedChars += [...segs.pop()!.text].length;
  }
  return { segments: segs, sizePt, truncatedChars };
}

function priority(role: TextRole): number {
  return role === "id" ? 0 : role === "far" ? 1 : 2;
}

/**
 * The most characters of `seg` that fit `roomMm` with an ellipsis. The search runs on summed character widths
 * (cheap, cached per character); the answer is then checked with a real measurement, kerning included.
 */
function longestPrefix(seg: Segment, roomMm: number, sizePt: number, m: TextMeasurer): string[] {
  const chars = [...seg.text];
  const ellipsisMm = m.widthMm(ELLIPSIS, seg.font, sizePt);
  const sums = [0];
  for (const ch of chars) sums.push(sums[sums.length - 1]! + m.widthMm(ch, seg.font, sizePt));
  let n = chars.length - 1;
  while (n > 0 && sums[n]! + ellipsisMm > roomMm) n--;
  while (n > 0 && m.widthMm(chars.slice(0, n).join("") + ELLIPSIS, seg.font, sizePt) > roomMm) n--;
  return chars.slice(0, n);
}

function place(fit: BlockFit, box: Box, m: TextMeasurer, lhPerPt: number): PlacedText[] {
  const heights = fit.rows.map((r) => r.sizePt * lhPerPt);
  const used = heights.reduce((a, b) => a + b, 0);
  let y = box.yMm + Math.max(0, (box.heightMm - used) / 2);
  const out: PlacedText[] = [];
  fit.rows.forEach((row, i) => {
    const gap = m.widthMm(" ", "regular", row.sizePt);
    let x = box.xMm;
    for (const s of row.segments) {
      const w = m.widthMm(s.text, s.font, row.sizePt);
      out.push({
        role: s.role,
        text: s.text,
        font: s.font,
        sizePt: row.sizePt,
        box: { xMm: x, yMm: y, widthMm: w, heightMm: m.lineHeightMm(s.font, row.sizePt) },
        truncated: s.truncated === true,
      });
      x += w + gap;
    }
    y += heights[i]!;
  });
  return out;
}

// ---------------------------------------------------------------------------------------------------------
// Layout on a template

export type MarkerFlag =
  | "od-estimated"
  | "no-sleeve"
  | "sleeve-slide-only"
  | "sleeve-wider-than-cell"
  | "text-truncated"
  | "id-truncated"
  | "no-text-room"
  | "no-symbol";

export interface PlacedSymbol extends SymbolGeometry {
  /** The symbol itself (Code 128: bars at full height). Its corners sit on the printer's dot grid. */
  box: Box;
  /** The symbol plus its quiet zones; nothing else is printed inside. */
  quietBox: Box;
}

export interface PlacedMarker {
  key: string;
  wireId: string;
  traceCode: string;
  place: MarkerPlace;
  indexInRun: number;
  countInRun: number;
  alongMm: number;
  sleeveLabel: string | null;
  cell: Box;
  printable: Box;
  texts: PlacedText[];
  symbol: PlacedSymbol | null;
  flags: MarkerFlag[];
}

export interface MarkerStripViewModel {
  title: string;
  templateId: string;
  templateName: string;
  pageWidthMm: number;
  pageHeightMm: number;
  printerDpi: number;
  pages: { markers: PlacedMarker[] }[];
  /** Drawn on every page. */
  cutMarks: Line[];
  /** Draw each cell's outline (proof prints on plain paper). */
  outlines: boolean;
  markerCount: number;
}

export interface MarkerLayoutOptions {
  publicBaseUrl: string;
  measurer: TextMeasurer;
  sizer: SymbolSizer;
  title?: string;
  outlines?: boolean;
}

/** Space kept between the text block and a symbol's quiet zone. */
export const TEXT_SYMBOL_GAP_MM = 0.5;

export function layoutMarkerStrip(
  markers: readonly MarkerSpec[],
  template: MarkerTemplate,
  options: MarkerLayoutOptions,
): MarkerStripViewModel {
  const perPage = markersPerPage(template);
  const pages: { markers: PlacedMarker[] }[] = [];
  markers.forEach((spec, i) => {
    const pageIndex = Math.floor(i / perPage);
    if (!pages[pageIndex]) pages[pageIndex] = { markers: [] };
    pages[pageIndex].markers.push(layoutMarker(spec, cellBox(template, i % perPage), template, options));
  });
  return {
    title: options.title ?? `Markers — ${template.name}`,
    templateId: template.id,
    templateName: template.name,
    pageWidthMm: template.pageWidthMm,
    pageHeightMm: template.pageHeightMm,
    printerDpi: template.printerDpi,
    pages,
    cutMarks: cutMarkLines(template),
    outlines: options.outlines ?? false,
    markerCount: markers.length,
  };
}

export function layoutMarker(
  spec: MarkerSpec,
  cell: Box,
  t: MarkerTemplate,
  options: MarkerLayoutOptions,
): PlacedMarker {
  const flags: MarkerFlag[] = [];
  const heatShrink = t.media === "heat-shrink";
  const sleeve = heatShrink ? spec.sleeve : null;
  if (heatShrink) {
    if (spec.odEstimated) flags.push("od-estimated");
    if (!spec.sleeve) flags.push("no-sleeve");
    else if (spec.sleeve.grade === "slide-only") flags.push("sleeve-slide-only");
  }
  let bandMm = cell.heightMm;
  if (sleeve) {
    if (sleeve.layFlatMm > cell.heightMm + 0.5) flags.push("sleeve-wider-than-cell");
    bandMm = Math.min(cell.heightMm, sleeve.layFlatMm);
  }
  const printable: Box = {
    xMm: cell.xMm + t.insetAlongMm,
    yMm: cell.yMm + (cell.heightMm - bandMm) / 2 + t.insetAcrossMm,
    widthMm: cell.widthMm - 2 * t.insetAlongMm,
    heightMm: bandMm - 2 * t.insetAcrossMm,
  };
  const m = options.measurer;
  const idMinMm = m.widthMm(spec.idText, "bold", MIN_TEXT_PT);
  const geometry = chooseSymbol(
    {
      maxWidthMm: printable.widthMm - Math.min(idMinMm, printable.widthMm) - TEXT_SYMBOL_GAP_MM,
      maxHeightMm: printable.heightMm,
      dpi: t.printerDpi,
      sleeve: sleeve
        ? { layFlatMm: sleeve.layFlatMm, circumferentialScale: sleeve.circumferentialScale }
        : null,
      allow2d: !heatShrink || sleeve !== null,
    },
    { url: traceUrl(options.publicBaseUrl, spec.traceCode), code: spec.traceCode },
    options.sizer,
  );
  const symbol = geometry ? placeSymbol(geometry, printable, t.printerDpi) : null;
  if (!symbol) flags.push("no-symbol");

  const textBox: Box = symbol
    ? { ...printable, widthMm: symbol.quietBox.xMm - TEXT_SYMBOL_GAP_MM - printable.xMm }
    : printable;
  const texts = fitMarkerText({ id: spec.idText, far: spec.farText, detail: spec.detailText }, textBox, m);
  const idText = texts.find((x) => x.role === "id");
  if (texts.length === 0) flags.push("no-text-room");
  else if (!idText || idText.truncated) flags.push("id-truncated");
  const shown = texts.map((x) => x.text).join(" ");
  if (texts.some((x) => x.truncated) || !shown.includes(spec.farText) || !shown.includes(spec.detailText)) {
    flags.push("text-truncated");
  }

  return {
    key: spec.key,
    wireId: spec.wireId,
    traceCode: spec.traceCode,
    place: spec.place,
    indexInRun: spec.indexInRun,
    countInRun: spec.countInRun,
    alongMm: spec.alongMm,
    sleeveLabel: spec.sleeve ? spec.sleeve.sleeve.label : null,
    cell,
    printable,
    texts,
    symbol,
    flags,
  };
}

/** Right-aligned in the printable band, corners on the printer's dot grid (page origin), quiet zones kept inside. */
function placeSymbol(g: SymbolGeometry, printable: Box, dpi: number): PlacedSymbol {
  const dot = dotMm(dpi);
  const q = g.quietZoneModules * g.moduleMm;
  const inkW = g.cols * g.moduleMm;
  const right = printable.xMm + printable.widthMm;
  const x = Math.floor((right - q - inkW) / dot + 1e-9) * dot;
  let y: number;
  let inkH: number;
  if (g.symbology === "code128") {
    y = Math.ceil(printable.yMm / dot - 1e-9) * dot;
    inkH = Math.floor((printable.yMm + printable.heightMm - y) / dot + 1e-9) * dot;
    return {
      ...g,
      box: { xMm: x, yMm: y, widthMm: inkW, heightMm: inkH },
      quietBox: { xMm: x - q, yMm: y, widthMm: inkW + 2 * q, heightMm: inkH },
    };
  }
  inkH = g.rows * g.moduleMm;
  y = Math.round((printable.yMm + (printable.heightMm - inkH) / 2) / dot) * dot;
  if (y - q < printable.yMm - 1e-9) y = Math.ceil((printable.yMm + q) / dot - 1e-9) * dot;
  if (y + inkH + q > printable.yMm + printable.heightMm + 1e-9) {
    y = Math.floor((printable.yMm + printable.heightMm - q - inkH) / dot + 1e-9) * dot;
  }
  return {
    ...g,
    box: { xMm: x, yMm: y, widthMm: inkW, heightMm: inkH },
    quietBox: { xMm: x - q, yMm: y - q, widthMm: inkW + 2 * q, heightMm: inkH + 2 * q },
  };
}
