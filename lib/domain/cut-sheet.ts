// The cut sheet view model: a spool plan's cuts in cutting order, grouped by spool, with bench steps, totals and pages with repeated headers.

import { colourName } from "./colour";
import { PAGE_SIZES_MM, type Box } from "./marker-templates";
import { chooseSymbol, dotMm, type SymbolGeometry, type SymbolSizer } from "./markers";

export type CutSheetPageSize = "A4" | "Letter";

export type SpoolSourceInput =
  | { kind: "shelf"; lot: string | null; location: string | null; lengthMm: number }
  | {
      kind: "putup";
      nominalMm: number;
      supplier: string | null;
      partNumber: string | null;
      price: number | null;
    };

export interface CutSheetCutInput {
  wireId: string;
  traceCode: string;
  cutLengthMm: number;
  endA: string;
  endB: string;
  endATermination: string | null;
  endBTermination: string | null;
  endAStripMm: number | null;
  endBStripMm: number | null;
  markerCount: number;
}

export interface CutSheetSpoolInput {
  wireTypeLabel: string;
  gauge: string;
  colour: string;
  insulation: string | null;
  source: SpoolSourceInput;
  /** In cutting order (the plan's order: longest first). */
  cuts: CutSheetCutInput[];
  leftoverMm: number;
  /** True when the leftover goes back to the shelf as a remnant. */
  keep: boolean;
}

export interface CutSheetInput {
  projectName: string;
  planCreatedAt: string | Date;
  pageSize: CutSheetPageSize;
  publicBaseUrl: string;
  /** ISO 4217 code for put-up prices. */
  currency?: string;
  /** The office printer's resolution, for whole-dot barcode modules (default 300). */
  printerDpi?: number;
  /** In cutting order. */
  spools: CutSheetSpoolInput[];
  caution?: string;
}

export type CutColumnKey = "tick" | "wireId" | "cut" | "strip" | "endA" | "endB" | "markers" | "trace";

export interface CutSheetColumn {
  key: CutColumnKey;
  label: string;
  xMm: number;
  widthMm: number;
  align: "left" | "right" | "center";
}

export interface CutSheetRow {
  spoolNumber: number;
  /** 1-based position of the cut on its spool. */
  sequence: number;
  wireId: string;
  traceCode: string;
  cutLabel: string;
  stripLabel: string;
  endALabel: string;
  endBLabel: string;
  markersLabel: string;
  /** Data Matrix of the trace URL (or the code alone when the URL's symbol would not fit the row). */
  symbol: (SymbolGeometry & { box: Box }) | null;
}

export type CutSheetBlock =
  | { kind: "intro"; yMm: number; heightMm: number; steps: string[]; summary: string }
  | {
      kind: "spool-header";
      yMm: number;
      heightMm: number;
      spoolNumber: number;
      title: string;
      sourceLine: string;
      continued: boolean;
    }
  | { kind: "table-header"; yMm: number; heightMm: number }
  | { kind: "cut"; yMm: number; heightMm: number; row: CutSheetRow }
  | { kind: "spool-footer"; yMm: number; heightMm: number; spoolNumber: number; text: string }
  | { kind: "totals"; yMm: number; heightMm: number; lines: string[] };

export interface CutSheetPage {
  number: number;
  blocks: CutSheetBlock[];
}

export interface CutSheetTotals {
  cuts: number;
  lengthMm: number;
  spools: number;
  shelfSpools: number;
  newSpools: number;
  /** Sum of the new put-ups' prices; null when a price is missing. */
  cost: number | null;
  currency: string;
}

export interface CutSheetViewModel {
  pageSize: CutSheetPageSize;
  pageWidthMm: number;
  pageHeightMm: number;
  marginMm: number;
  title: string;
  projectName: string;
  planLabel: string;
  headerBox: Box;
  footerBox: Box;
  columns: CutSheetColumn[];
  pages: CutSheetPage[];
  pageCount: number;
  steps: string[];
  caution: string;
  totals: CutSheetTotals;
  printerDpi: number;
}

/** Block heights in mm, sized for 9 pt body text and a 0.254 mm-module Data Matrix per row. */
export const CUT_SHEET_LAYOUT = {
  marginMm: 12,
  headerMm: 13,
  footerMm: 13,
  gapMm: 3,
  introMm: 14,
  spoolHeaderMm: 12,
  tableHeaderMm: 6,
  rowMm: 8,
  spoolFooterMm: 7,
  spoolGapMm: 4,
  totalsMm: 30,
  /** Room for the row's Data Matrix inside the trace column. */
  symbolCellMm: 7.6,
} as const;

/** The bench order of work: markers go on before the ends are terminated. */
export const BENCH_STEPS = [
  "Cut to length",
  "Slide the markers on",
  "Strip both ends",
  "Terminate",
  "Shrink the markers",
] as const;

export const DEFAULT_CUT_SHEET_CAUTION =
  "Caution: gauges and fuses come from guidance checks (ABYC E-11 voltage-drop limits, 33 CFR 183.425 ampacity); " +
  "local codes and licensed practice take precedence. Cut at or above each length, never short " +
  "(plus-only tolerance, IPC/WHMA-A-620 Table 11-1).";

export function formatPlanDate(at: string | Date): string {
  const d = typeof at === "string" ? new Date(at) : at;
  if (Number.isNaN(d.getTime())) return String(at);
  const p = (n: number) => String(n).padStart(2, "0");
  return `${d.getUTCFullYear()}-${p(d.getUTCMonth() + 1)}-${p(d.getUTCDate())} ${p(d.getUTCHours())}:${p(d.getUTCMinutes())} UTC`;
}

function metres(mm: number): string {
  return (mm / 1000).toFixed(2);
}

function sourceLine(s: SpoolSourceInput): string {
  if (s.kind === "shelf") {
    const parts = [`From the shelf: ${s.lengthMm} mm on the spool`];
    if (s.lot) parts.push(`lot ${s.lot}`);
    if (s.location) parts.push(`at ${s.location}`);
    return parts.join(", ");
  }
  const parts = [`New put-up: ${s.nominalMm} mm nominal (${metres(s.nominalMm)} m)`];
  if (s.partNumber) parts.push(`part ${s.partNumber}`);
  if (s.supplier) parts.push(`from ${s.supplier}`);
  return parts.join(", ");
}

function wireTypeLine(s: CutSheetSpoolInput): string {
  const name = colourName(s.colour);
  const colour = name && name !== s.colour ? `${s.colour} (${name})` : s.colour;
  return [s.gauge, colour, s.insulation].filter((x) => x).join(", ");
}

function endLabel(ref: string, termination: string | null): string {
  return termination ? `${ref} · ${termination}` : ref;
}

function stripLabel(a: number | null, b: number | null): string {
  const f = (v: number | null) => (v == null ? "—" : String(v));
  return `${f(a)} / ${f(b)}`;
}

export function cutSheetTotals(input: CutSheetInput): CutSheetTotals {
  let cuts = 0;
  let lengthMm = 0;
  let shelfSpools = 0;
  let newSpools = 0;
  let cost: number | null = 0;
  for (const s of input.spools) {
    cuts += s.cuts.length;
    for (const c of s.cuts) lengthMm += c.cutLengthMm;
    if (s.source.kind === "shelf") shelfSpools++;
    else {
      newSpools++;
      cost = s.source.price == null || cost === null ? null : cost + s.source.price;
    }
  }
  return {
    cuts,
    lengthMm,
    spools: input.spools.length,
    shelfSpools,
    newSpools,
    cost,
    currency: input.currency ?? "USD",
  };
}

function columnsFor(contentLeftMm: number, contentWidthMm: number): CutSheetColumn[] {
  const fixed: [CutColumnKey, string, number, CutSheetColumn["align"]][] = [
    ["tick", "Done", 11, "left"],
    ["wireId", "Wire ID", 22, "left"],
    ["cut", "Cut mm", 17, "right"],
    ["strip", "Strip A/B", 17, "center"],
    ["endA", "End A · termination", 0, "left"],
    ["endB", "End B · termination", 0, "left"],
    ["markers", "Markers", 16, "center"],
    ["trace", "Trace", 26, "left"],
  ];
  const fixedMm = fixed.reduce((a, c) => a + c[2], 0);
  const endMm = (contentWidthMm - fixedMm) / 2;
  let x = contentLeftMm;
  return fixed.map(([key, label, w, align]) => {
    const widthMm = w === 0 ? endMm : w;
    const col = { key, label, xMm: x, widthMm, align };
    x += widthMm;
    return col;
  });
}

/** Paginates the plan: a spool's header never sits alone at a page foot, and a section that runs on repeats its headers. */
export function buildCutSheet(input: CutSheetInput, sizer: SymbolSizer): CutSheetViewModel {
  const L = CUT_SHEET_LAYOUT;
  const page = PAGE_SIZES_MM[input.pageSize];
  const dpi = input.printerDpi ?? 300;
  const contentWidthMm = page.widthMm - 2 * L.marginMm;
  const headerBox: Box = { xMm: L.marginMm, yMm: L.marginMm, widthMm: contentWidthMm, heightMm: L.headerMm };
  const footerBox: Box = {
    xMm: L.marginMm,
    yMm: page.heightMm - L.marginMm - L.footerMm,
    widthMm: contentWidthMm,
    heightMm: L.footerMm,
  };
  const bodyTop = headerBox.yMm + headerBox.heightMm + L.gapMm;
  const bodyBottom = footerBox.yMm - L.gapMm;
  const columns = columnsFor(L.marginMm, contentWidthMm);
  const traceCol = columns.find((c) => c.key === "trace")!;
  const totals = cutSheetTotals(input);
  const dot = dotMm(dpi);

  const pages: CutSheetPage[] = [];
  let current: CutSheetPage = { number: 1, blocks: [] };
  pages.push(current);
  let y = bodyTop;
  const newPage = () => {
    current = { number: pages.length + 1, blocks: [] };
    pages.push(current);
    y = bodyTop;
  };
  const fits = (h: number) => y + h <= bodyBottom + 1e-9;

  current.blocks.push({
    kind: "intro",
    yMm: y,
    heightMm: L.introMm,
    steps: BENCH_STEPS.map((s, i) => `${i + 1} ${s}`),
    summary:
      `${totals.cuts} cuts on ${totals.spools} spools, ${metres(totals.lengthMm)} m in all. ` +
      "Work each spool top to bottom; tick each cut when it is done.",
  });
  y += L.introMm;

  input.spools.forEach((spool, si) => {
    const spoolNumber = si + 1;
    const title = `Spool ${spoolNumber} of ${input.spools.length}: ${spool.wireTypeLabel}`;
    const header = (continued: boolean) => {
      current.blocks.push({
        kind: "spool-header",
        yMm: y,
        heightMm: L.spoolHeaderMm,
        spoolNumber,
        title: continued ? `${title} (continued)` : title,
        sourceLine: `${wireTypeLine(spool)}. ${sourceLine(spool.source)}`,
        continued,
      });
      y += L.spoolHeaderMm;
    };
    const tableHeader = () => {
      current.blocks.push({ kind: "table-header", yMm: y, heightMm: L.tableHeaderMm });
      y += L.tableHeaderMm;
    };
    const firstRowMm = spool.cuts.length > 0 ? L.rowMm : L.spoolFooterMm;
    if (!fits(L.spoolHeaderMm + L.tableHeaderMm + firstRowMm)) newPage();
    header(false);
    tableHeader();
    spool.cuts.forEach((cut, ci) => {
      if (!fits(L.rowMm)) {
        newPage();
        header(true);
        tableHeader();
      }
      current.blocks.push({
        kind: "cut",
        yMm: y,
        heightMm: L.rowMm,
        row: cutRow(cut, spoolNumber, ci + 1, y, traceCol, input.publicBaseUrl, sizer, dpi, dot),
      });
      y += L.rowMm;
    });
    if (!fits(L.spoolFooterMm)) {
      newPage();
      header(true);
    }
    const leftover = `Leftover ${spool.leftoverMm} mm (${metres(spool.leftoverMm)} m): ${
      spool.keep ? "label it and put it back on the shelf" : "scrap"
    }.`;
    current.blocks.push({
      kind: "spool-footer",
      yMm: y,
      heightMm: L.spoolFooterMm,
      spoolNumber,
      text: leftover,
    });
    y += L.spoolFooterMm + L.spoolGapMm;
  });

  if (!fits(L.totalsMm)) newPage();
  const costLine =
    totals.newSpools === 0
      ? "Cost of new put-ups: none needed"
      : totals.cost === null
        ? "Cost of new put-ups: not known (a put-up has no price)"
        : `Cost of new put-ups: ${totals.cost.toFixed(2)} ${totals.currency}`;
  current.blocks.push({
    kind: "totals",
    yMm: y,
    heightMm: L.totalsMm,
    lines: [
      "Totals",
      `Cuts: ${totals.cuts}`,
      `Cut length: ${totals.lengthMm} mm (${metres(totals.lengthMm)} m)`,
      `Spools: ${totals.spools} (${totals.shelfSpools} from the shelf, ${totals.newSpools} new)`,
      costLine,
    ],
  });

  return {
    pageSize: input.pageSize,
    pageWidthMm: page.widthMm,
    pageHeightMm: page.heightMm,
    marginMm: L.marginMm,
    title: `Cut sheet — ${input.projectName}`,
    projectName: input.projectName,
    planLabel: `Plan of ${formatPlanDate(input.planCreatedAt)}`,
    headerBox,
    footerBox,
    columns,
    pages,
    pageCount: pages.length,
    steps: [...BENCH_STEPS],
    caution: input.caution ?? DEFAULT_CUT_SHEET_CAUTION,
    totals,
    printerDpi: dpi,
  };
}

function cutRow(
  cut: CutSheetCutInput,
  spoolNumber: number,
  sequence: number,
  rowYMm: number,
  traceCol: CutSheetColumn,
  publicBaseUrl: string,
  sizer: SymbolSizer,
  dpi: number,
  dot: number,
): CutSheetRow {
  const L = CUT_SHEET_LAYOUT;
  const g = chooseSymbol(
    {
      maxWidthMm: L.symbolCellMm,
      maxHeightMm: L.rowMm - 0.4,
      dpi,
      sleeve: null,
      allow2d: true,
      symbologies: ["datamatrix"],
      dataMatrixShapes: ["square"],
    },
    // The row's symbol carries the 8-character trace code, which the Bench scan field and the Scan screen read;
    // a 2,000-cut sheet of URL symbols takes bwip-js several seconds to encode on two cores.
    { url: cut.traceCode, code: cut.traceCode },
    sizer,
  );
  let symbol: CutSheetRow["symbol"] = null;
  if (g) {
    const w = g.cols * g.moduleMm;
    const h = g.rows * g.moduleMm;
    const x = Math.round((traceCol.xMm + (L.symbolCellMm - w) / 2) / dot) * dot;
    const y = Math.round((rowYMm + (L.rowMm - h) / 2) / dot) * dot;
    symbol = { ...g, box: { xMm: x, yMm: y, widthMm: w, heightMm: h } };
  }
  return {
    spoolNumber,
    sequence,
    wireId: cut.wireId,
    traceCode: cut.traceCode,
    cutLabel: String(cut.cutLengthMm),
    stripLabel: stripLabel(cut.endAStripMm, cut.endBStripMm),
    endALabel: endLabel(cut.endA, cut.endATermination),
    endBLabel: endLabel(cut.endB, cut.endBTermination),
    markersLabel: String(cut.markerCount),
    symbol,
  };
}
