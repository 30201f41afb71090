// Calibration page for a marker template: mm rulers from the paper's edges, 100 mm scale bars, crop marks and the template's cells.

import {
  cellBox,
  cutMarkLines,
  markersPerPage,
  type Line,
  type MarkerTemplate,
} from "@/lib/domain/marker-templates";
import { createPdfDocument, mmToPt, pdfToBuffer } from "./fonts";

export interface CalibrationGeometry {
  /** Tick lines of the rulers; a ruler's ticks sit at whole millimetres from the page's left or top edge. */
  ticks: Line[];
  /** The 100 mm bars: one horizontal, one vertical (absent where the page is too small). */
  scaleBars: Line[];
  /** The template's crop marks and cells as they print now, printer offset included. */
  cropMarks: Line[];
  cells: { xMm: number; yMm: number; widthMm: number; heightMm: number }[];
  labels: { text: string; xMm: number; yMm: number; sizePt: number }[];
}

const RULER_INSET_MM = 6;

/** Ruler ticks: 1 mm short, 5 mm longer, 10 mm longest and numbered. Rulers are not shifted by the printer offset. */
export function calibrationGeometry(t: MarkerTemplate): CalibrationGeometry {
  const ticks: Line[] = [];
  const labels: CalibrationGeometry["labels"] = [];
  const scaleBars: Line[] = [];
  const w = t.pageWidthMm;
  const h = t.pageHeightMm;
  const small = h < 40;
  const len = (mm: number, base: number) => (mm % 10 === 0 ? base * 2.5 : mm % 5 === 0 ? base * 1.6 : base);

  if (small) {
    // A strip: one ruler along its top edge, as long as the strip.
    const base = Math.min(1, h / 5);
    for (let x = 1; x < w; x++) ticks.push({ x1Mm: x, y1Mm: 0, x2Mm: x, y2Mm: len(x, base) });
    if (h >= 7)
      for (let x = 10; x < w - 2; x += 10)
        labels.push({ text: String(x), xMm: x + 0.4, yMm: 2.6, sizePt: 5 });
  } else {
    const y0 = RULER_INSET_MM;
    const x0 = RULER_INSET_MM;
    for (let x = x0 + 4; x <= w - RULER_INSET_MM; x++)
      ticks.push({ x1Mm: x, y1Mm: y0, x2Mm: x, y2Mm: y0 + len(x, 1.5) });
    for (let y = y0 + 4; y <= h - RULER_INSET_MM; y++)
      ticks.push({ x1Mm: x0, y1Mm: y, x2Mm: x0 + len(y, 1.5), y2Mm: y });
    for (let x = 20; x <= w - RULER_INSET_MM - 4; x += 10)
      labels.push({ text: String(x), xMm: x + 0.5, yMm: y0 + 2.2, sizePt: 6 });
    for (let y = 20; y <= h - RULER_INSET_MM - 4; y += 10)
      labels.push({ text: String(y), xMm: x0 + 2.6, yMm: y + 0.4, sizePt: 6 });
    const cx = w / 2;
    const cy = h / 2;
    scaleBars.push({ x1Mm: cx - 50, y1Mm: cy, x2Mm: cx + 50, y2Mm: cy });
    scaleBars.push({ x1Mm: cx, y1Mm: cy - 50, x2Mm: cx, y2Mm: cy + 50 });
    labels.push({ text: "100 mm", xMm: cx + 2, yMm: cy + 1, sizePt: 7 });
  }
  const cells = Array.from({ length: markersPerPage(t) }, (_, i) => cellBox(t, i));
  // Crop marks that would run into a ruler are left out; the cell outlines still show those edges.
  const clear = RULER_INSET_MM + 5;
  const cropMarks = cutMarkLines({ ...t, cutMarks: true }).filter(
    (l) => small || (Math.min(l.x1Mm, l.x2Mm) >= clear && Math.min(l.y1Mm, l.y2Mm) >= clear),
  );
  return { ticks, scaleBars, cropMarks, cells, labels };
}

const INSTRUCTIONS = [
  "Calibration: print at 100 % (no fit to page, no scaling).",
  "1. Both bars through the centre must measure 100 mm. If not, fix the print scale first.",
  "2. The numbers are mm from the paper's left and top edges. Measure where a numbered tick really lands:",
  "   measured minus printed is the printer offset (X across, Y down).",
  "3. Enter the offsets in the template, print this page again, and check that the outlines sit on the sleeves.",
];

export async function renderCalibrationPage(
  t: MarkerTemplate,
  options: { compress?: boolean } = {},
): Promise<Buffer> {
  const g = calibrationGeometry(t);
  const size = [mmToPt(t.pageWidthMm), mmToPt(t.pageHeightMm)];
  const doc = createPdfDocument({
    size,
    margin: 0,
    autoFirstPage: false,
    compress: options.compress ?? true,
    info: { Title: `Calibration — ${t.name}`, Creator: "Loomwright" },
  });
  doc.addPage({ size, margin: 0 });
  const stroke = (lines: Line[], widthPt: number, color: string) => {
    doc.save().lineWidth(widthPt).strokeColor(color);
    for (const l of lines)
      doc.moveTo(mmToPt(l.x1Mm), mmToPt(l.y1Mm)).lineTo(mmToPt(l.x2Mm), mmToPt(l.y2Mm)).stroke();
    doc.restore();
  };
  stroke(g.ticks, 0.3, "black");
  stroke(g.scaleBars, 0.6, "black");
  stroke(g.cropMarks, 0.3, "black");
  doc.save().lineWidth(0.3).strokeColor("#777777");
  for (const c of g.cells)
    doc.rect(mmToPt(c.xMm), mmToPt(c.yMm), mmToPt(c.widthMm), mmToPt(c.heightMm)).stroke();
  doc.restore();
  doc.fillColor("black");
  for (const l of g.labels)
    doc.font("regular").fontSize(l.sizePt).text(l.text, mmToPt(l.xMm), mmToPt(l.yMm), { lineBreak: false });
  if (t.pageHeightMm >= 40) {
    // On a white panel below the scale bars, so the text stays readable over the cell outlines.
    const lines = [
      ...INSTRUCTIONS,
      `${t.name}: printer offset now X ${t.printerOffsetXMm} mm, Y ${t.printerOffsetYMm} mm; ${t.printerDpi} dpi.`,
    ];
    const x = RULER_INSET_MM + 8;
    const top = Math.min(t.pageHeightMm / 2 + 54, t.pageHeightMm - RULER_INSET_MM - 4 - lines.length * 4.2);
    doc
      .save()
      .fillColor("white")
      .rect(mmToPt(x - 2), mmToPt(top - 2), mmToPt(t.pageWidthMm - 2 * x + 4), mmToPt(lines.length * 4.2 + 3))
      .fill()
      .restore();
    doc.fillColor("black");
    lines.forEach((line, i) => {
      doc
        .font(i === 0 ? "bold" : "regular")
        .fontSize(9)
        .text(line, mmToPt(x), mmToPt(top + i * 4.2), { lineBreak: false });
    });
  }
  return pdfToBuffer(doc);
}
