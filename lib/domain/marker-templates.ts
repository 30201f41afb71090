// Marker print templates: sheets and continuous strips, their grid, printer offset and resolution, and our default set.

/** A rectangle on the page, top-left origin, in millimetres. */
export interface Box {
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
}

/** A straight line on the page, in millimetres (cut and crop marks). */
export interface Line {
  x1Mm: number;
  y1Mm: number;
  x2Mm: number;
  y2Mm: number;
}

export type PageSizeName = "A4" | "Letter" | "custom";

/** ISO 216 A4 and ANSI/ASME Y14.1 Letter (8.5 × 11 in), in mm. */
export const PAGE_SIZES_MM: Readonly<Record<"A4" | "Letter", { widthMm: number; heightMm: number }>> = {
  A4: { widthMm: 210, heightMm: 297 },
  Letter: { widthMm: 215.9, heightMm: 279.4 },
};

/**
 * A printable layout of markers. Each marker cell is `markerWidthMm` along the sleeve's axis (left to right on
 * the page) and `markerHeightMm` across it: for heat-shrink, the flat width of the sleeves the carrier holds.
 * A continuous strip is one row of cells on a custom page the size of a strip section.
 */
export interface MarkerTemplate {
  id: string;
  name: string;
  kind: "sheet" | "continuous";
  media: "heat-shrink" | "flat-label";
  pageSize: PageSizeName;
  pageWidthMm: number;
  pageHeightMm: number;
  markerWidthMm: number;
  markerHeightMm: number;
  columns: number;
  rows: number;
  pitchXMm: number;
  pitchYMm: number;
  marginLeftMm: number;
  marginTopMm: number;
  /** Unprinted band inside each cell: at both ends along the axis, and at both folded edges across it. */
  insetAlongMm: number;
  insetAcrossMm: number;
  /** Measured from the calibration page: where the printer really puts a mark minus where it was asked to. */
  printerOffsetXMm: number;
  printerOffsetYMm: number;
  printerDpi: number;
  cutMarks: boolean;
}

// Insets: print does not reach a flattened sleeve's folds or cut ends (common practice).
const SLEEVE_INSETS = { insetAlongMm: 1, insetAcrossMm: 0.4 };
const LABEL_INSETS = { insetAlongMm: 1.5, insetAcrossMm: 1.5 };
const NO_OFFSET = { printerOffsetXMm: 0, printerOffsetYMm: 0 };

function a4(t: Omit<MarkerTemplate, "pageSize" | "pageWidthMm" | "pageHeightMm">): MarkerTemplate {
  return {
    ...t,
    pageSize: "A4",
    pageWidthMm: PAGE_SIZES_MM.A4.widthMm,
    pageHeightMm: PAGE_SIZES_MM.A4.heightMm,
  };
}

/** A continuous strip section: `columns` markers in a row, page exactly as wide as they need. */
function strip(id: string, name: string, markerHeightMm: number, printerDpi: number): MarkerTemplate {
  const columns = 4;
  const markerWidthMm = 60;
  const pitchXMm = 62;
  const marginLeftMm = 1;
  return {
    id,
    name,
    kind: "continuous",
    media: "heat-shrink",
    pageSize: "custom",
    pageWidthMm: 2 * marginLeftMm + (columns - 1) * pitchXMm + markerWidthMm,
    pageHeightMm: markerHeightMm,
    markerWidthMm,
    markerHeightMm,
    columns,
    rows: 1,
    pitchXMm,
    pitchYMm: markerHeightMm,
    marginLeftMm,
    marginTopMm: 0,
    ...SLEEVE_INSETS,
    ...NO_OFFSET,
    printerDpi,
    cutMarks: true,
  };
}

/** Our default templates. Sleeve sizes refer to the 2:1 series in lib/domain/sleeves.ts. */
export const DEFAULT_MARKER_TEMPLATES: readonly MarkerTemplate[] = [
  a4({
    id: "a4-sleeve-3.2",
    name: "Sleeve sheet A4 — 3.2 mm sleeves (5 mm flat)",
    kind: "sheet",
    media: "heat-shrink",
    markerWidthMm: 60,
    markerHeightMm: 5,
    columns: 3,
    rows: 33,
    pitchXMm: 64,
    pitchYMm: 8,
    marginLeftMm: 9,
    marginTopMm: 16,
    ...SLEEVE_INSETS,
    ...NO_OFFSET,
    printerDpi: 300,
    cutMarks: true,
  }),
  a4({
    id: "a4-sleeve-6.4",
    name: "Sleeve sheet A4 — 6.4 mm sleeves (10 mm flat)",
    kind: "sheet",
    media: "heat-shrink",
    markerWidthMm: 60,
    markerHeightMm: 10,
    columns: 3,
    rows: 22,
    pitchXMm: 64,
    pitchYMm: 12,
    marginLeftMm: 9,
    marginTopMm: 16,
    ...SLEEVE_INSETS,
    ...NO_OFFSET,
    printerDpi: 300,
    cutMarks: true,
  }),
  {
    id: "letter-sleeve-6.4",
    name: "Letter sleeve sheet — 6.4 mm sleeves (10 mm flat)",
    kind: "sheet",
    media: "heat-shrink",
    pageSize: "Letter",
    pageWidthMm: PAGE_SIZES_MM.Letter.widthMm,
    pageHeightMm: PAGE_SIZES_MM.Letter.heightMm,
    markerWidthMm: 60,
    markerHeightMm: 10,
    columns: 3,
    rows: 20,
    pitchXMm: 66,
    pitchYMm: 12,
    marginLeftMm: 12,
    marginTopMm: 14,
    ...SLEEVE_INSETS,
    ...NO_OFFSET,
    printerDpi: 300,
    cutMarks: true,
  },
  a4({
    id: "a4-proof-mixed",
    name: "Proof sheet A4 — mixed sleeves up to 12.7 mm (20 mm rows)",
    kind: "sheet",
    media: "heat-shrink",
    markerWidthMm: 60,
    markerHeightMm: 20,
    columns: 3,
    rows: 12,
    pitchXMm: 64,
    pitchYMm: 22,
    marginLeftMm: 9,
    marginTopMm: 16,
    ...SLEEVE_INSETS,
    ...NO_OFFSET,
    printerDpi: 300,
    cutMarks: true,
  }),
  strip("strip-3.2", "Continuous strip — 3.2 mm sleeve (5 mm flat)", 5, 300),
  strip("strip-4.8", "Continuous strip — 4.8 mm sleeve (7.5 mm flat)", 7.5, 300),
  a4({
    id: "a4-flag-labels",
    name: "Flag labels A4 — 60 × 25 mm",
    kind: "sheet",
    media: "flat-label",
    markerWidthMm: 60,
    markerHeightMm: 25,
    columns: 3,
    rows: 10,
    pitchXMm: 64,
    pitchYMm: 27,
    marginLeftMm: 9,
    marginTopMm: 16,
    ...LABEL_INSETS,
    ...NO_OFFSET,
    printerDpi: 300,
    cutMarks: true,
  }),
];

export function findMarkerTemplate(id: string): MarkerTemplate | null {
  return DEFAULT_MARKER_TEMPLATES.find((t) => t.id === id) ?? null;
}

export function withPrinterOffset(t: MarkerTemplate, offsetXMm: number, offsetYMm: number): MarkerTemplate {
  return { ...t, printerOffsetXMm: offsetXMm, printerOffsetYMm: offsetYMm };
}

export function markersPerPage(t: MarkerTemplate): number {
  return t.columns * t.rows;
}

/** The cell of the `index`-th marker on a page (row by row), with the printer offset applied. */
export function cellBox(t: MarkerTemplate, index: number): Box {
  const col = index % t.columns;
  const row = Math.floor(index / t.columns);
  return {
    xMm: t.marginLeftMm + t.printerOffsetXMm + col * t.pitchXMm,
    yMm: t.marginTopMm + t.printerOffsetYMm + row * t.pitchYMm,
    widthMm: t.markerWidthMm,
    heightMm: t.markerHeightMm,
  };
}

/** The problems that make a template unusable; empty when it is fine. */
export function validateTemplate(t: MarkerTemplate): string[] {
  const problems: string[] = [];
  const positive: [string, number][] = [
    ["page width", t.pageWidthMm],
    ["page height", t.pageHeightMm],
    ["marker width", t.markerWidthMm],
    ["marker height", t.markerHeightMm],
    ["printer resolution", t.printerDpi],
  ];
  for (const [label, v] of positive) if (!(v > 0)) problems.push(`${label} must be above 0`);
  if (!Number.isInteger(t.columns) || t.columns < 1)
    problems.push("columns must be a whole number of at least 1");
  if (!Number.isInteger(t.rows) || t.rows < 1) problems.push("rows must be a whole number of at least 1");
  if (t.columns > 1 && t.pitchXMm < t.markerWidthMm)
    problems.push("horizontal pitch is smaller than the marker width");
  if (t.rows > 1 && t.pitchYMm < t.markerHeightMm)
    problems.push("vertical pitch is smaller than the marker height");
  if (t.marginLeftMm < 0 || t.marginTopMm < 0) problems.push("margins cannot be negative");
  if (2 * t.insetAlongMm >= t.markerWidthMm)
    problems.push("the insets along the marker leave no printable width");
  if (2 * t.insetAcrossMm >= t.markerHeightMm)
    problems.push("the insets across the marker leave no printable height");
  const right = t.marginLeftMm + (t.columns - 1) * t.pitchXMm + t.markerWidthMm;
  const bottom = t.marginTopMm + (t.rows - 1) * t.pitchYMm + t.markerHeightMm;
  if (right > t.pageWidthMm + 1e-9)
    problems.push(`the grid is ${round2(right)} mm wide; the page is ${t.pageWidthMm} mm`);
  if (bottom > t.pageHeightMm + 1e-9) {
    problems.push(`the grid is ${round2(bottom)} mm tall; the page is ${t.pageHeightMm} mm`);
  }
  return problems;
}

function round2(v: number): number {
  return Number(v.toFixed(2));
}

const TICK_MM = 4;
const TICK_GAP_MM = 1;

/** Crop marks: on sheets, ticks in the margins in line with every cell edge; on strips, short ticks between cells. */
export function cutMarkLines(t: MarkerTemplate): Line[] {
  if (!t.cutMarks) return [];
  const lines: Line[] = [];
  const ox = t.printerOffsetXMm;
  const oy = t.printerOffsetYMm;
  const left = t.marginLeftMm + ox;
  const top = t.marginTopMm + oy;
  const right = left + (t.columns - 1) * t.pitchXMm + t.markerWidthMm;
  const bottom = top + (t.rows - 1) * t.pitchYMm + t.markerHeightMm;
  const xs = edges(left, t.columns, t.pitchXMm, t.markerWidthMm);
  const ys = edges(top, t.rows, t.pitchYMm, t.markerHeightMm);

  if (t.kind === "continuous") {
    // Between neighbouring cells, a short tick at the strip's two edges, centred in the gap.
    const tickMm = Math.min(0.8, t.markerHeightMm / 4);
    for (let c = 0; c + 1 < t.columns; c++) {
      const x = left + c * t.pitchXMm + t.markerWidthMm + (t.pitchXMm - t.markerWidthMm) / 2;
      lines.push({ x1Mm: x, y1Mm: top, x2Mm: x, y2Mm: top + tickMm });
      lines.push({ x1Mm: x, y1Mm: bottom - tickMm, x2Mm: x, y2Mm: bottom });
    }
    return lines;
  }

  const topRoom = top;
  const bottomRoom = t.pageHeightMm - bottom;
  const leftRoom = left;
  const rightRoom = t.pageWidthMm - right;
  for (const x of xs) {
    if (topRoom >= TICK_MM + TICK_GAP_MM) {
      lines.push({ x1Mm: x, y1Mm: top - TICK_GAP_MM - TICK_MM, x2Mm: x, y2Mm: top - TICK_GAP_MM });
    }
    if (bottomRoom >= TICK_MM + TICK_GAP_MM) {
      lines.push({ x1Mm: x, y1Mm: bottom + TICK_GAP_MM, x2Mm: x, y2Mm: bottom + TICK_GAP_MM + TICK_MM });
    }
  }
  for (const y of ys) {
    if (leftRoom >= TICK_MM + TICK_GAP_MM) {
      lines.push({ x1Mm: left - TICK_GAP_MM - TICK_MM, y1Mm: y, x2Mm: left - TICK_GAP_MM, y2Mm: y });
    }
    if (rightRoom >= TICK_MM + TICK_GAP_MM) {
      lines.push({ x1Mm: right + TICK_GAP_MM, y1Mm: y, x2Mm: right + TICK_GAP_MM + TICK_MM, y2Mm: y });
    }
  }
  return lines;
}

/** Distinct cell edge positions along one axis (shared edges of abutting cells appear once). */
function edges(start: number, count: number, pitch: number, size: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < count; i++) {
    for (const v of [start + i * pitch, start + i * pitch + size]) {
      if (!out.some((o) => Math.abs(o - v) < 1e-6)) out.push(v);
    }
  }
  return out;
}

/** A continuous strip template for a sleeve of the given flat width, based on our 4-up strip section. */
export function stripTemplateForFlatWidth(layFlatMm: number, printerDpi = 300): MarkerTemplate {
  const h = Number(layFlatMm.toFixed(1));
  return strip(`strip-flat-${h}`, `Continuous strip — ${h} mm flat`, h, printerDpi);
}
