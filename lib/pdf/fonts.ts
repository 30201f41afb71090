// Fonts for the PDF renderers: the TTF files under fonts/, their registration in pdfkit, and the text measurer lib/domain lays out with.

import fs from "node:fs";
import path from "node:path";
import PDFDocument from "pdfkit";
import type { TextFont, TextMeasurer } from "@/lib/domain/markers";

/** TTF only: pdfkit's subsetter breaks on WOFF2 (STACK.md §4). Names are the pdfkit aliases. */
export const PDF_FONT_FILES = {
  regular: "DejaVuSansCondensed.ttf",
  bold: "DejaVuSansCondensed-Bold.ttf",
  body: "DejaVuSans.ttf",
  bodyBold: "DejaVuSans-Bold.ttf",
  mono: "DejaVuSansMono.ttf",
  monoBold: "DejaVuSansMono-Bold.ttf",
} as const;

export type PdfFontName = keyof typeof PDF_FONT_FILES;

export const PT_PER_MM = 72 / 25.4;

export function mmToPt(mm: number): number {
  return mm * PT_PER_MM;
}

export function fontsDir(): string {
  return path.join(process.cwd(), "fonts");
}

const fontCache = new Map<PdfFontName, Buffer>();

export function fontData(name: PdfFontName): Buffer {
  let data = fontCache.get(name);
  if (!data) {
    data = fs.readFileSync(path.join(fontsDir(), PDF_FONT_FILES[name]));
    fontCache.set(name, data);
  }
  return data;
}

/**
 * The constructor's font: a TTF, so Helvetica is never loaded, and one we never draw with. pdfkit caches a
 * registered alias only when no font of the same name is cached yet; were this one of the faces above, every
 * `doc.font(alias)` would parse the file again. Unused fonts are not embedded.
 */
const CONSTRUCTOR_FONT_FILE = "Inter_400Regular.ttf";

/** A document with every PDF font registered under its alias. */
export function createPdfDocument(options: PDFKit.PDFDocumentOptions = {}): PDFKit.PDFDocument {
  const doc = new PDFDocument({ ...options, font: path.join(fontsDir(), CONSTRUCTOR_FONT_FILE) });
  for (const name of Object.keys(PDF_FONT_FILES) as PdfFontName[]) doc.registerFont(name, fontData(name));
  return doc;
}

/** Ends the document and resolves with the whole file. */
export function pdfToBuffer(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
    doc.end();
  });
}

const REFERENCE_PT = 100;
let metricsDoc: PDFKit.PDFDocument | null = null;

/** Line box height (ascender − descender) in pt: what pdfkit's text() occupies below its y and what pdftotext reports. */
export function lineHeightPt(font: PdfFontName, sizePt: number): number {
  // Font metrics only, no text layout, so this shared document does not grow.
  metricsDoc ??= createPdfDocument({ autoFirstPage: false });
  return (metricsDoc.font(font).fontSize(REFERENCE_PT).currentLineHeight(false) / REFERENCE_PT) * sizePt;
}

/**
 * The measurer lib/domain's marker layout takes (`bold`/`regular` are the condensed DejaVu faces), measuring with
 * pdfkit's widthOfString. Pass the document that will draw the text: its layout cache then serves the drawing,
 * and everything is freed with the job. Widths scale linearly with size, so one size per string is cached.
 */
export function pdfTextMeasurer(
  doc: PDFKit.PDFDocument = createPdfDocument({ autoFirstPage: false }),
): TextMeasurer {
  const widths = new Map<string, number>();
  const widthPt = (font: PdfFontName, text: string, sizePt: number): number => {
    const key = `${font}\u0000${text}`;
    let w = widths.get(key);
    if (w === undefined) {
      w = doc.font(font).fontSize(REFERENCE_PT).widthOfString(text) / REFERENCE_PT;
      widths.set(key, w);
    }
    return w * sizePt;
  };
  return {
    widthMm: (text: string, font: TextFont, sizePt: number) => widthPt(font, text, sizePt) / PT_PER_MM,
    lineHeightMm: (font: TextFont, sizePt: number) => lineHeightPt(font, sizePt) / PT_PER_MM,
  };
}

/** The longest start of `text` (with an ellipsis when cut) whose width, by `measurePt`, fits `widthPt`. */
export function fitTextToWidth(measurePt: (s: string) => number, text: string, widthPt: number): string {
  if (measurePt(text) <= widthPt) return text;
  const chars = [...text];
  let lo = 0;
  let hi = chars.length - 1;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (measurePt(chars.slice(0, mid).join("") + "…") <= widthPt) lo = mid;
    else hi = mid - 1;
  }
  const cut = chars.slice(0, lo).join("") + "…";
  return measurePt(cut) <= widthPt ? cut : "";
}
