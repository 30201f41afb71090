// Cut sheet PDF: draws a finished cut-sheet view model (lib/domain/cut-sheet.ts) on A4 or Letter with embedded TTF fonts and a Data Matrix per cut.

import {
  buildCutSheet,
  type CutSheetBlock,
  type CutSheetColumn,
  type CutSheetInput,
  type CutSheetRow,
  type CutSheetViewModel,
} from "@/lib/domain/cut-sheet";
import { createBarcodeEngine, type BarcodeEngine } from "./barcodes";
import {
  createPdfDocument,
  fitTextToWidth,
  lineHeightPt,
  mmToPt,
  pdfToBuffer,
  type PdfFontName,
} from "./fonts";

export interface RenderCutSheetOptions {
  engine?: BarcodeEngine;
  compress?: boolean;
}

/** Body text never goes below 9 pt: the sheet is read at arm's length at the bench. */
export const CUT_SHEET_BODY_PT = 9;
const TITLE_PT = 11;
const SPOOL_TITLE_PT = 10.5;
const PAD_MM = 1;
const RULE = "#444444";
const FAINT = "#bbbbbb";

export async function renderCutSheet(
  vm: CutSheetViewModel,
  options: RenderCutSheetOptions = {},
): Promise<Buffer> {
  const engine = options.engine ?? createBarcodeEngine();
  const size = [mmToPt(vm.pageWidthMm), mmToPt(vm.pageHeightMm)];
  const doc = createPdfDocument({
    size,
    margin: 0,
    autoFirstPage: false,
    compress: options.compress ?? true,
    info: { Title: vm.title, Creator: "Loomwright", Subject: vm.planLabel },
  });
  for (const page of vm.pages) {
    doc.addPage({ size, margin: 0 });
    drawHeader(doc, vm, page.number);
    drawFooter(doc, vm);
    for (const block of page.blocks) drawBlock(doc, vm, block, engine);
  }
  return pdfToBuffer(doc);
}

/**
 * Single-line text with its line box's top at yMm, cut with an ellipsis to fit widthMm; never wraps.
 * Measured with the document itself, so pdfkit's layout cache serves the drawing too.
 */
function put(
  doc: PDFKit.PDFDocument,
  font: PdfFontName,
  sizePt: number,
  text: string,
  xMm: number,
  yMm: number,
  widthMm: number,
  align: "left" | "right" | "center" = "left",
): void {
  const widthPt = mmToPt(widthMm);
  doc.font(font).fontSize(sizePt);
  const measure = (s: string) => doc.widthOfString(s);
  const shown = fitTextToWidth(measure, text, widthPt);
  if (!shown) return;
  const w = align === "left" ? 0 : measure(shown);
  const x = mmToPt(xMm) + (align === "right" ? widthPt - w : align === "center" ? (widthPt - w) / 2 : 0);
  doc.text(shown, x, mmToPt(yMm), { lineBreak: false });
}

/** Top of a line box that centres it vertically in a band. */
function centred(font: PdfFontName, sizePt: number, yMm: number, heightMm: number): number {
  return yMm + (heightMm - lineHeightPt(font, sizePt) / mmToPt(1)) / 2;
}

function rule(
  doc: PDFKit.PDFDocument,
  x1Mm: number,
  x2Mm: number,
  yMm: number,
  color: string,
  widthPt = 0.5,
): void {
  doc
    .save()
    .lineWidth(widthPt)
    .strokeColor(color)
    .moveTo(mmToPt(x1Mm), mmToPt(yMm))
    .lineTo(mmToPt(x2Mm), mmToPt(yMm))
    .stroke()
    .restore();
}

function drawHeader(doc: PDFKit.PDFDocument, vm: CutSheetViewModel, pageNumber: number): void {
  const h = vm.headerBox;
  const pageLabel = `page ${pageNumber} of ${vm.pageCount}`;
  const rightMm = 45;
  doc.fillColor("black");
  put(doc, "bold", TITLE_PT, vm.title, h.xMm, h.yMm, h.widthMm - rightMm);
  put(doc, "regular", CUT_SHEET_BODY_PT, vm.planLabel, h.xMm, h.yMm + 5.5, h.widthMm - rightMm);
  put(doc, "bold", CUT_SHEET_BODY_PT, pageLabel, h.xMm + h.widthMm - rightMm, h.yMm, rightMm, "right");
  put(
    doc,
    "regular",
    CUT_SHEET_BODY_PT,
    "print at 100 %",
    h.xMm + h.widthMm - rightMm,
    h.yMm + 5.5,
    rightMm,
    "right",
  );
  rule(doc, h.xMm, h.xMm + h.widthMm, h.yMm + h.heightMm, RULE, 0.8);
}

function drawFooter(doc: PDFKit.PDFDocument, vm: CutSheetViewModel): void {
  const f = vm.footerBox;
  rule(doc, f.xMm, f.xMm + f.widthMm, f.yMm, RULE);
  doc
    .fillColor("black")
    .font("regular")
    .fontSize(CUT_SHEET_BODY_PT)
    .text(vm.caution, mmToPt(f.xMm), mmToPt(f.yMm + 1), {
      width: mmToPt(f.widthMm),
      height: mmToPt(f.heightMm - 1),
      ellipsis: true,
    });
}

function drawBlock(
  doc: PDFKit.PDFDocument,
  vm: CutSheetViewModel,
  b: CutSheetBlock,
  engine: BarcodeEngine,
): void {
  const x = vm.headerBox.xMm;
  const w = vm.headerBox.widthMm;
  doc.fillColor("black");
  switch (b.kind) {
    case "intro": {
      put(doc, "bold", CUT_SHEET_BODY_PT, "Order at the bench", x, b.yMm, w);
      put(doc, "regular", CUT_SHEET_BODY_PT, b.steps.join("  ·  "), x, b.yMm + 4.2, w);
      put(doc, "regular", CUT_SHEET_BODY_PT, b.summary, x, b.yMm + 8.4, w);
      return;
    }
    case "spool-header": {
      rule(doc, x, x + w, b.yMm + 0.5, RULE, 0.8);
      put(doc, "bold", SPOOL_TITLE_PT, b.title, x, b.yMm + 1.5, w);
      put(doc, "regular", CUT_SHEET_BODY_PT, b.sourceLine, x, b.yMm + 6.8, w);
      return;
    }
    case "table-header": {
      for (const c of vm.columns) {
        const top = centred("bold", CUT_SHEET_BODY_PT, b.yMm, b.heightMm);
        put(doc, "bold", CUT_SHEET_BODY_PT, c.label, c.xMm + PAD_MM, top, c.widthMm - 2 * PAD_MM, c.align);
      }
      rule(doc, x, x + w, b.yMm + b.heightMm, RULE);
      return;
    }
    case "cut":
      drawRow(doc, vm.columns, b.row, b.yMm, b.heightMm, engine);
      rule(doc, x, x + w, b.yMm + b.heightMm, FAINT, 0.4);
      return;
    case "spool-footer": {
      const top = centred("regular", CUT_SHEET_BODY_PT, b.yMm, b.heightMm);
      put(doc, "regular", CUT_SHEET_BODY_PT, b.text, x, top, w);
      return;
    }
    case "totals": {
      rule(doc, x, x + w, b.yMm + 0.5, RULE, 0.8);
      const [heading, ...lines] = b.lines;
      put(doc, "bold", TITLE_PT, heading ?? "Totals", x, b.yMm + 1.5, w);
      lines.forEach((line, i) => put(doc, "regular", CUT_SHEET_BODY_PT, line, x, b.yMm + 7 + i * 4.6, w));
      return;
    }
  }
}

function drawRow(
  doc: PDFKit.PDFDocument,
  columns: CutSheetColumn[],
  row: CutSheetRow,
  yMm: number,
  hMm: number,
  engine: BarcodeEngine,
): void {
  for (const c of columns) {
    const inner = c.widthMm - 2 * PAD_MM;
    const left = c.xMm + PAD_MM;
    switch (c.key) {
      case "tick": {
        const box = 3.6;
        doc
          .save()
          .lineWidth(0.7)
          .strokeColor("black")
          .rect(mmToPt(left), mmToPt(yMm + (hMm - box) / 2), mmToPt(box), mmToPt(box))
          .stroke()
          .restore();
        const top = centred("regular", CUT_SHEET_BODY_PT, yMm, hMm);
        put(
          doc,
          "regular",
          CUT_SHEET_BODY_PT,
          String(row.sequence),
          left + box + 0.8,
          top,
          inner - box - 0.8,
        );
        break;
      }
      case "trace": {
        if (row.symbol) {
          const s = row.symbol;
          const uri = engine.dataUri(
            { symbology: s.symbology, payload: s.payload, version: s.version },
            s.dotsPerModule,
          );
          doc.image(uri, mmToPt(s.box.xMm), mmToPt(s.box.yMm), {
            width: mmToPt(s.box.widthMm),
            height: mmToPt(s.box.heightMm),
          });
        }
        const codeX = c.xMm + 8.2;
        const top = centred("mono", CUT_SHEET_BODY_PT, yMm, hMm);
        put(doc, "mono", CUT_SHEET_BODY_PT, row.traceCode, codeX, top, c.xMm + c.widthMm - codeX);
        break;
      }
      default: {
        const [text, font] = cellText(c.key, row);
        const top = centred(font, CUT_SHEET_BODY_PT, yMm, hMm);
        put(doc, font, CUT_SHEET_BODY_PT, text, left, top, inner, c.align);
      }
    }
  }
}

function cellText(key: CutSheetColumn["key"], row: CutSheetRow): [string, PdfFontName] {
  switch (key) {
    case "wireId":
      return [row.wireId, "bold"];
    case "cut":
      return [row.cutLabel, "bold"];
    case "strip":
      return [row.stripLabel, "regular"];
    case "endA":
      return [row.endALabel, "regular"];
    case "endB":
      return [row.endBLabel, "regular"];
    case "markers":
      return [row.markersLabel, "regular"];
    default:
      return ["", "regular"];
  }
}

/** The whole job for a route handler: view model and PDF, one barcode engine for both. */
export async function buildCutSheetPdf(
  input: CutSheetInput,
): Promise<{ pdf: Buffer; viewModel: CutSheetViewModel }> {
  const engine = createBarcodeEngine();
  const viewModel = buildCutSheet(input, engine);
  const pdf = await renderCutSheet(viewModel, { engine });
  return { pdf, viewModel };
}
