// Marker strip PDF: draws a finished marker layout (lib/domain/markers.ts) with embedded TTF fonts and barcode PNGs at whole printer dots.

import type { ProjectSettings } from "@/lib/domain/types";
import type { MarkerTemplate } from "@/lib/domain/marker-templates";
import {
  layoutMarkerStrip,
  markersForRuns,
  type MarkerRunInput,
  type MarkerStripViewModel,
  type PlacedSymbol,
} from "@/lib/domain/markers";
import { createBarcodeEngine, type BarcodeEngine } from "./barcodes";
import { createPdfDocument, mmToPt, pdfTextMeasurer, pdfToBuffer } from "./fonts";

export interface RenderMarkerStripOptions {
  /** Reuse the engine that sized the symbols so nothing is encoded twice. */
  engine?: BarcodeEngine;
  /** Draw into this document (the one the layout measured with), from createMarkerStripDocument. */
  doc?: PDFKit.PDFDocument;
  /** Test hook: uncompressed content streams. */
  compress?: boolean;
}

const HAIRLINE_PT = 0.25;

/** A document for a marker strip: pages are added at the template's size, without margins. */
export function createMarkerStripDocument(
  title: string,
  subject: string,
  compress = true,
): PDFKit.PDFDocument {
  return createPdfDocument({
    margin: 0,
    autoFirstPage: false,
    compress,
    info: { Title: title, Creator: "Loomwright", Subject: subject },
  });
}

export async function renderMarkerStrip(
  vm: MarkerStripViewModel,
  options: RenderMarkerStripOptions = {},
): Promise<Buffer> {
  const engine = options.engine ?? createBarcodeEngine();
  const size = [mmToPt(vm.pageWidthMm), mmToPt(vm.pageHeightMm)];
  const doc = options.doc ?? createMarkerStripDocument(vm.title, vm.templateName, options.compress ?? true);
  const pages = vm.pages.length > 0 ? vm.pages : [{ markers: [] }];
  for (const page of pages) {
    doc.addPage({ size, margin: 0 });
    if (vm.cutMarks.length > 0) {
      doc.save().lineWidth(HAIRLINE_PT).strokeColor("black");
      for (const l of vm.cutMarks) {
        doc.moveTo(mmToPt(l.x1Mm), mmToPt(l.y1Mm)).lineTo(mmToPt(l.x2Mm), mmToPt(l.y2Mm)).stroke();
      }
      doc.restore();
    }
    for (const marker of page.markers) {
      if (vm.outlines) {
        const c = marker.cell;
        doc
          .save()
          .lineWidth(HAIRLINE_PT)
          .strokeColor("#888888")
          .rect(mmToPt(c.xMm), mmToPt(c.yMm), mmToPt(c.widthMm), mmToPt(c.heightMm))
          .stroke()
          .restore();
      }
      doc.fillColor("black");
      for (const t of marker.texts) {
        doc
          .font(t.font)
          .fontSize(t.sizePt)
          .text(t.text, mmToPt(t.box.xMm), mmToPt(t.box.yMm), { lineBreak: false });
      }
      if (marker.symbol) drawSymbol(doc, marker.symbol, engine);
    }
  }
  return pdfToBuffer(doc);
}

/** The PNG has one pixel per printer dot; placed at exactly modules × module size. */
function drawSymbol(doc: PDFKit.PDFDocument, s: PlacedSymbol, engine: BarcodeEngine): void {
  const uri = engine.dataUri(
    { symbology: s.symbology, payload: s.payload, version: s.version },
    s.dotsPerModule,
  );
  doc.image(uri, mmToPt(s.box.xMm), mmToPt(s.box.yMm), {
    width: mmToPt(s.box.widthMm),
    height: mmToPt(s.box.heightMm),
  });
}

export interface MarkerStripJob {
  runs: readonly MarkerRunInput[];
  settings: Pick<ProjectSettings, "markerRepeatMm">;
  template: MarkerTemplate;
  publicBaseUrl: string;
  title?: string;
  outlines?: boolean;
}

/** The whole job for a route handler: markers for the runs, their layout, and the PDF, measured and drawn in one document. */
export async function buildMarkerStripPdf(
  job: MarkerStripJob,
): Promise<{ pdf: Buffer; viewModel: MarkerStripViewModel }> {
  const engine = createBarcodeEngine();
  const title = job.title ?? `Markers — ${job.template.name}`;
  const doc = createMarkerStripDocument(title, job.template.name);
  const viewModel = layoutMarkerStrip(markersForRuns(job.runs, job.settings), job.template, {
    publicBaseUrl: job.publicBaseUrl,
    measurer: pdfTextMeasurer(doc),
    sizer: engine,
    title,
    outlines: job.outlines,
  });
  const pdf = await renderMarkerStrip(viewModel, { engine, doc });
  return { pdf, viewModel };
}
