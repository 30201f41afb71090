import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import zlib from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { findMarkerTemplate, withPrinterOffset, type MarkerTemplate } from "@/lib/domain/marker-templates";
import {
  traceCodeFromSeed,
  traceUrl,
  type MarkerRunInput,
  type MarkerStripViewModel,
  type PlacedMarker,
} from "@/lib/domain/markers";
import { calibrationGeometry, renderCalibrationPage } from "@/lib/pdf/calibration";
import { buildMarkerStripPdf } from "@/lib/pdf/marker-strip";

// ---------------------------------------------------------------------------------------------------------
// Debian tools: independent decoders and PDF readers. Missing tools fail loudly with the package to install.

const TOOLS: [string, string][] = [
  ["pdftoppm", "poppler-utils"],
  ["pdftotext", "poppler-utils"],
  ["pdfinfo", "poppler-utils"],
  ["pdffonts", "poppler-utils"],
  ["zbarimg", "zbar-tools"],
  ["dmtxread", "dmtx-utils"],
];

function requireTools(): void {
  const missing = TOOLS.filter(([tool]) => spawnSync("sh", ["-c", `command -v ${tool}`]).status !== 0);
  if (missing.length > 0) {
    const pkgs = [...new Set(missing.map(([, p]) => p))].join(" ");
    throw new Error(
      `missing ${missing.map(([t]) => t).join(", ")}: install with \`apt-get install -y ${pkgs}\` to run the round-trip tests`,
    );
  }
}

function tool(cmd: string, args: string[]): string {
  const r = spawnSync(cmd, args, { encoding: "latin1", maxBuffer: 64 * 1024 * 1024 });
  if (r.error) throw r.error;
  return r.stdout;
}

// ---------------------------------------------------------------------------------------------------------
// A small reader for the PDFs pdfkit writes: objects, page content (q/Q/cm/re/m/l/Do) and 1-bit images.

const PT_PER_MM = 72 / 25.4;

interface Rect {
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
}

interface PdfImage {
  widthPx: number;
  heightPx: number;
  /** 1 = dark. */
  dark: Uint8Array;
}

interface PdfPage {
  widthPt: number;
  heightPt: number;
  rects: Rect[];
  lines: { x1Mm: number; y1Mm: number; x2Mm: number; y2Mm: number }[];
  images: (Rect & { image: PdfImage })[];
}

type Matrix = [number, number, number, number, number, number];

function multiply(m: Matrix, n: Matrix): Matrix {
  // m applied first, then n (PDF: cm pre-multiplies the CTM)
  return [
    m[0] * n[0] + m[1] * n[2],
    m[0] * n[1] + m[1] * n[3],
    m[2] * n[0] + m[3] * n[2],
    m[2] * n[1] + m[3] * n[3],
    m[4] * n[0] + m[5] * n[2] + n[4],
    m[4] * n[1] + m[5] * n[3] + n[5],
  ];
}

function apply(m: Matrix, x: number, y: number): [number, number] {
  return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
}

function readPdf(buf: Buffer): PdfPage[] {
  const s = buf.toString("latin1");
  const objects = new Map<number, { dict: string; stream: Buffer | null }>();
  for (const m of s.matchAll(/(\d+) 0 obj\s/g)) {
    const start = m.index! + m[0].length;
    const end = s.indexOf("endobj", start);
    const body = s.slice(start, end);
    const at = body.indexOf("stream\n");
    if (at >= 0) {
      const dict = body.slice(0, at);
      const length = Number(/\/Length (\d+)/.exec(dict)![1]);
      const from = start + at + "stream\n".length;
      objects.set(Number(m[1]), { dict, stream: buf.subarray(from, from + length) });
    } else {
      objects.set(Number(m[1]), { dict: body, stream: null });
    }
  }
  const ref = (dict: string, key: string) => Number(new RegExp(`/${key} (\\d+) 0 R`).exec(dict)![1]);
  const pagesObj = [...objects.values()].find((o) => /\/Type \/Pages/.test(o.dict))!;
  const kids = [.../\/Kids \[([^\]]*)\]/.exec(pagesObj.dict)![1]!.matchAll(/(\d+) 0 R/g)].map((k) =>
    Number(k[1]),
  );
  const images = new Map<number, PdfImage>();

  const imageOf = (id: number): PdfImage => {
    const hit = images.get(id);
    if (hit) return hit;
    const o = objects.get(id)!;
    const w = Number(/\/Width (\d+)/.exec(o.dict)![1]);
    const h = Number(/\/Height (\d+)/.exec(o.dict)![1]);
    expect(o.dict).toMatch(/\/BitsPerComponent 1/);
    const raw = zlib.inflateSync(o.stream!);
    const rowBytes = Math.ceil(w / 8);
    const dark = new Uint8Array(w * h);
    let prev = new Uint8Array(rowBytes);
    for (let y = 0; y < h; y++) {
      const filter = raw[y * (rowBytes + 1)]!;
      const row = Uint8Array.from(raw.subarray(y * (rowBytes + 1) + 1, (y + 1) * (rowBytes + 1)));
      // PNG predictors (ISO/IEC 15948 §9): bytes to the left count at 1 byte per pixel group
      for (let i = 0; i < rowBytes; i++) {
        const a = i > 0 ? row[i - 1]! : 0;
        const b = prev[i]!;
        const c = i > 0 ? prev[i - 1]! : 0;
        const p = a + b - c;
        const paeth =
          Math.abs(p - a) <= Math.abs(p - b) && Math.abs(p - a) <= Math.abs(p - c)
            ? a
            : Math.abs(p - b) <= Math.abs(p - c)
              ? b
              : c;
        const add = [0, a, b, (a + b) >> 1, paeth][filter];
        if (add === undefined) throw new Error(`PNG filter ${filter}`);
        row[i] = (row[i]! + add) & 0xff;
      }
      for (let x = 0; x < w; x++) dark[y * w + x] = (row[x >> 3]! >> (7 - (x & 7))) & 1 ? 0 : 1;
      prev = row;
    }
    const img = { widthPx: w, heightPx: h, dark };
    images.set(id, img);
    return img;
  };

  return kids.map((pageId) => {
    const page = objects.get(pageId)!;
    const box = /\/MediaBox \[([^\]]*)\]/.exec(page.dict)![1]!.trim().split(/\s+/).map(Number);
    const [, , widthPt, heightPt] = box as [number, number, number, number];
    const resources = objects.get(ref(page.dict, "Resources"))!.dict;
    const xobjects = new Map<string, number>();
    const xo = /\/XObject <<([^>]*)>>/.exec(resources);
    if (xo) for (const m of xo[1]!.matchAll(/\/(\w+) (\d+) 0 R/g)) xobjects.set(m[1]!, Number(m[2]));
    const content = zlib.inflateSync(objects.get(ref(page.dict, "Contents"))!.stream!).toString("latin1");
    const out: PdfPage = { widthPt, heightPt, rects: [], lines: [], images: [] };
    const toMm = (pts: [number, number][]): Rect => {
      const xs = pts.map((p) => p[0]);
      const ys = pts.map((p) => p[1]);
      return {
        xMm: Math.min(...xs) / PT_PER_MM,
        yMm: (heightPt - Math.max(...ys)) / PT_PER_MM,
        widthMm: (Math.max(...xs) - Math.min(...xs)) / PT_PER_MM,
        heightMm: (Math.max(...ys) - Math.min(...ys)) / PT_PER_MM,
      };
    };
    let ctm: Matrix = [1, 0, 0, 1, 0, 0];
    const stack: Matrix[] = [];
    let operands: (number | string)[] = [];
    let cursor: [number, number] = [0, 0];
    for (const tok of tokens(content)) {
      if (typeof tok === "number" || tok.startsWith("/")) {
        operands.push(tok);
        continue;
      }
      const n = operands.filter((o): o is number => typeof o === "number");
      if (tok === "q") stack.push(ctm);
      else if (tok === "Q") ctm = stack.pop()!;
      else if (tok === "cm") ctm = multiply(n.slice(-6) as Matrix, ctm);
      else if (tok === "re") {
        const [x, y, w, h] = n.slice(-4) as [number, number, number, number];
        out.rects.push(
          toMm([apply(ctm, x, y), apply(ctm, x + w, y), apply(ctm, x, y + h), apply(ctm, x + w, y + h)]),
        );
      } else if (tok === "m") cursor = apply(ctm, n.at(-2)!, n.at(-1)!);
      else if (tok === "l") {
        const to = apply(ctm, n.at(-2)!, n.at(-1)!);
        const mm = (p: [number, number]) => [p[0] / PT_PER_MM, (heightPt - p[1]) / PT_PER_MM] as const;
        const [x1Mm, y1Mm] = mm(cursor);
        const [x2Mm, y2Mm] = mm(to);
        out.lines.push({ x1Mm, y1Mm, x2Mm, y2Mm });
        cursor = to;
      } else if (tok === "Do") {
        const name = String(operands.at(-1)).slice(1);
        const id = xobjects.get(name)!;
        out.images.push({
          ...toMm([apply(ctm, 0, 0), apply(ctm, 1, 0), apply(ctm, 0, 1), apply(ctm, 1, 1)]),
          image: imageOf(id),
        });
      }
      operands = [];
    }
    return out;
  });
}

/** PDF content tokens: numbers, names (with "/"), operators; strings, arrays and dictionaries are skipped. */
function* tokens(s: string): Generator<number | string> {
  let i = 0;
  while (i < s.length) {
    const c = s[i]!;
    if (/\s/.test(c)) i++;
    else if (c === "%") while (i < s.length && s[i] !== "\n") i++;
    else if (c === "(") {
      let depth = 0;
      for (; i < s.length; i++) {
        if (s[i] === "\\") i++;
        else if (s[i] === "(") depth++;
        else if (s[i] === ")" && --depth === 0) break;
      }
      i++;
    } else if (c === "<" && s[i + 1] !== "<") i = s.indexOf(">", i) + 1;
    else if ("[]{}".includes(c) || (c === "<" && s[i + 1] === "<") || (c === ">" && s[i + 1] === ">"))
      i += c === "<" || c === ">" ? 2 : 1;
    else {
      const m = /^[^\s()<>[\]{}/%]+|^\/[^\s()<>[\]{}/%]*/.exec(s.slice(i, i + 64))!;
      const t = m[0];
      i += t.length;
      yield /^[+-]?(\d+\.?\d*|\.\d+)$/.test(t) ? Number(t) : t;
    }
  }
}

// ---------------------------------------------------------------------------------------------------------
// Raster (PGM from pdftoppm -gray) and word boxes (pdftotext -bbox)

interface Gray {
  width: number;
  height: number;
  px: Buffer;
}

function rasterise(pdfPath: string, page: number, dpi: number, outBase: string): Gray {
  tool("pdftoppm", [
    "-r",
    String(dpi),
    "-gray",
    "-f",
    String(page),
    "-l",
    String(page),
    "-singlefile",
    pdfPath,
    outBase,
  ]);
  const b = fs.readFileSync(`${outBase}.pgm`);
  const header = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(b.subarray(0, 50).toString("latin1"))!;
  return { width: Number(header[1]), height: Number(header[2]), px: b.subarray(header[0].length) };
}

function writeCrop(g: Gray, r: Rect, dpi: number, file: string): void {
  const x0 = Math.round((r.xMm / 25.4) * dpi);
  const y0 = Math.round((r.yMm / 25.4) * dpi);
  const w = Math.round((r.widthMm / 25.4) * dpi);
  const h = Math.round((r.heightMm / 25.4) * dpi);
  const out = Buffer.alloc(w * h, 255);
  for (let y = 0; y < h; y++) g.px.copy(out, y * w, (y0 + y) * g.width + x0, (y0 + y) * g.width + x0 + w);
  fs.writeFileSync(file, Buffer.concat([Buffer.from(`P5\n${w} ${h}\n255\n`), out]));
}

interface Word extends Rect {
  page: number;
  text: string;
}

function words(pdfPath: string): Word[] {
  const html = tool("pdftotext", ["-bbox", pdfPath, "-"]);
  const out: Word[] = [];
  let page = 0;
  for (const m of html.matchAll(
    /<page [^>]*>|<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g,
  )) {
    if (m[0].startsWith("<page")) {
      page++;
      continue;
    }
    const [x1, y1, x2, y2] = [m[1], m[2], m[3], m[4]].map((v) => Number(v) / PT_PER_MM) as [
      number,
      number,
      number,
      number,
    ];
    out.push({
      page,
      text: Buffer.from(m[5]!, "latin1").toString("utf8"),
      xMm: x1,
      yMm: y1,
      widthMm: x2 - x1,
      heightMm: y2 - y1,
    });
  }
  return out;
}

function inside(a: Rect, b: Rect, tol: number): boolean {
  return (
    a.xMm >= b.xMm - tol &&
    a.yMm >= b.yMm - tol &&
    a.xMm + a.widthMm <= b.xMm + b.widthMm + tol &&
    a.yMm + a.heightMm <= b.yMm + b.heightMm + tol
  );
}

function intersects(a: Rect, b: Rect): boolean {
  return (
    a.xMm < b.xMm + b.widthMm &&
    b.xMm < a.xMm + a.widthMm &&
    a.yMm < b.yMm + b.heightMm &&
    b.yMm < a.yMm + a.heightMm
  );
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** Pixels per module: the greatest common divisor of the run lengths across rows and down columns. */
function pixelsPerModule(img: PdfImage): number {
  let g = 0;
  const runs = (get: (i: number) => number, n: number) => {
    let len = 1;
    for (let i = 1; i <= n; i++) {
      if (i < n && get(i) === get(i - 1)) len++;
      else {
        g = gcd(g, len);
        len = 1;
      }
    }
  };
  for (let y = 0; y < img.heightPx; y++) runs((x) => img.dark[y * img.widthPx + x]!, img.widthPx);
  if (img.heightPx > 1)
    for (let x = 0; x < img.widthPx; x++) runs((y) => img.dark[y * img.widthPx + x]!, img.heightPx);
  return g;
}

// ---------------------------------------------------------------------------------------------------------
// The demo scenario (invented): Harrow-3's runs, 22 AWG to 4 AWG plus the battery disconnect's 1/0.

const BASE = "https://loomwright.example.test";
const REPEAT_MM = 381; // AC 43.13-1B par. 11-208: markers at intervals of no more than 15 in

const RUNS: MarkerRunInput[] = (
  [
    ["HR3-001", "BAT1:+", "F1:1", "4 AWG", "RD", "GXL", 350],
    ["HR3-002", "F1:2", "MC1:B+", "4 AWG", "RD", "GXL", 900],
    ["HR3-003", "BAT1:-", "MC1:B-", "4 AWG", "BK", "GXL", 1100],
    ["HR3-004", "MC1:M1+", "DM1:+", "8 AWG", "RD", "GXL", 700],
    ["HR3-005", "MC1:M1-", "DM1:-", "8 AWG", "BK", "GXL", 700],
    ["HR3-006", "F2:2", "MC2:B+", "6 AWG", "RD", null, 650],
    ["HR3-007", "MC2:M+", "DECK1:+", "6 AWG", "RD", null, 820],
    ["HR3-009", "ES1:1", "K1:A1", "18 AWG", "RD", "TXL", 1500],
    ["HR3-010", "ES1:2", "ES2:1", "18 AWG", "RD", "TXL", 420],
    ["HR3-011", "K1:A2", "GND1:3", "18 AWG", "BK", "TXL", 400],
    ["HR3-012", "F3:2", "MAST1:+24V", "16 AWG", "RD", "TXL", 900],
    ["HR3-014", "LIDAR1:TX+", "PC1:J5-3", "22 AWG", "WH", "TXL", 1300],
    ["HR3-015", "LIDAR1:TX-", "PC1:J5-4", "22 AWG", "BUWH", "TXL", 1300],
    ["HR3-016", "GNSS1:PWR", "F3:4", "20 AWG", "RD", "TXL", 600],
    ["HR3-017", "BCN1:R", "R1:1", "22 AWG", "RD", "UL1007", 300],
    ["HR3-018", "R1:2", "LED1:A", "22 AWG", "OG", "UL1007", 120],
    ["HR3-019", "CHG1:+", "F4:1", "10 AWG", "RD", null, 600],
    ["HR3-020", "CHG1:-", "BAT1:-", "10 AWG", "BK", null, 640],
    ["HR3-021", "BAT1:+", "SW1:1", "1/0 AWG", "RD", null, 420],
    ["HR3-022", "SW1:2", "F1:IN", "12 AWG", "RD", null, 300],
    ["HR3-023", "PC1:J2-1", "MAIN-CONTROLLER-CABINET:CAN_H", "14 AWG", "YE", null, 500],
  ] as const
).map(([wireId, endA, endB, gauge, colour, insulation, routedLengthMm]) => ({
  wireId,
  endA,
  endB,
  gauge,
  colour,
  insulation,
  routedLengthMm,
  traceCode: traceCodeFromSeed(`harrow-3/${wireId}`),
}));

/** Expected markers per run, straight from the rule: both ends, plus the fewest repeats keeping gaps ≤ 15 in. */
function expectedCount(lengthMm: number): number {
  const span = lengthMm - 2 * 30; // end markers 30 mm from each tip (END_MARKER_OFFSET_MM)
  let repeats = 0;
  while (span / (repeats + 1) > REPEAT_MM) repeats++;
  return 2 + repeats;
}

// ECC 200 sizes: the rectangles as listed in electrical.md §10 (ISO/IEC 16022); the squares from memory.
const ISO_16022_SIZES = [
  "8x18",
  "8x32",
  "12x26",
  "12x36",
  "16x36",
  "16x48",
  ...[10, 12, 14, 16, 18, 20, 22, 24, 26].map((n) => `${n}x${n}`),
];
const QUIET: Record<string, number> = { code128: 10, datamatrix: 1, qrcode: 4 }; // ISO/IEC 15417, 16022, 18004

interface Job {
  template: MarkerTemplate;
  runs: MarkerRunInput[];
  vm: MarkerStripViewModel;
  pdfPath: string;
  pages: PdfPage[];
  rasters: Gray[];
  words: Word[];
  decoded: Map<string, string[]>;
}

let dir = "";
const jobs: Job[] = [];

async function runJob(name: string, template: MarkerTemplate, runs: MarkerRunInput[]): Promise<Job> {
  const { pdf, viewModel } = await buildMarkerStripPdf({
    runs,
    settings: { markerRepeatMm: REPEAT_MM },
    template,
    publicBaseUrl: BASE,
    outlines: true,
  });
  const pdfPath = path.join(dir, `${name}.pdf`);
  fs.writeFileSync(pdfPath, pdf);
  const dpi = template.printerDpi;
  const rasters = viewModel.pages.map((_, i) =>
    rasterise(pdfPath, i + 1, dpi, path.join(dir, `${name}-p${i + 1}`)),
  );
  // One crop per marker cell (just inside its outline), each decoded on its own.
  const decoded = new Map<string, string[]>();
  const zbarFiles: [string, string][] = [];
  viewModel.pages.forEach((page, pi) => {
    for (const m of page.markers) {
      const file = path.join(dir, `${name}-${m.key.replace(/\W/g, "_")}.pgm`);
      const c = m.cell;
      writeCrop(
        rasters[pi]!,
        { xMm: c.xMm + 0.2, yMm: c.yMm + 0.2, widthMm: c.widthMm - 0.4, heightMm: c.heightMm - 0.4 },
        dpi,
        file,
      );
      decoded.set(m.key, []);
      if (m.symbol?.symbology === "datamatrix") {
        const size = `${m.symbol.rows}x${m.symbol.cols}`;
        const out = tool("dmtxread", ["-n", "-N", "1", "-s", size, file]);
        decoded.set(
          m.key,
          out
            .split("\n")
            .filter((l) => l.length > 0)
            .map((l) => `datamatrix:${l}`),
        );
      } else zbarFiles.push([m.key, file]);
    }
  });
  if (zbarFiles.length > 0) {
    const xml = tool("zbarimg", ["--xml", "--nodbus", "-q", ...zbarFiles.map(([, f]) => f)]);
    for (const src of xml.split("<source href='").slice(1)) {
      const file = src.slice(0, src.indexOf("'"));
      const key = zbarFiles.find(([, f]) => f === file)![0];
      const found = [
        ...src.matchAll(/<symbol type='([^']+)'[^>]*><data><!\[CDATA\[([^\]]*)\]\]><\/data>/g),
      ].map((m) => `${m[1] === "CODE-128" ? "code128" : m[1] === "QR-Code" ? "qrcode" : m[1]}:${m[2]}`);
      decoded.set(key, found);
    }
  }
  return {
    template,
    runs,
    vm: viewModel,
    pdfPath,
    pages: readPdf(pdf),
    rasters,
    words: words(pdfPath),
    decoded,
  };
}

beforeAll(async () => {
  requireTools();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "loomwright-markers-"));
  // A mixed proof sheet with a printer offset (so the offset is checked too), and flag labels for QR.
  const proof = withPrinterOffset(findMarkerTemplate("a4-proof-mixed")!, 0.6, -0.4);
  jobs.push(await runJob("proof", proof, RUNS));
  jobs.push(await runJob("labels", findMarkerTemplate("a4-flag-labels")!, RUNS.slice(7, 11)));
}, 60_000);

afterAll(() => {
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

const allMarkers = (j: Job): [PlacedMarker, number][] =>
  j.vm.pages.flatMap((p, pi) => p.markers.map((m) => [m, pi] as [PlacedMarker, number]));

describe("marker strip round trip", () => {
  it("prints every symbology somewhere", () => {
    const seen = new Set(jobs.flatMap((j) => allMarkers(j).map(([m]) => m.symbol?.symbology)));
    expect([...seen].sort()).toEqual(["code128", "datamatrix", "qrcode"]);
  });

  it("decodes every marker, with independent decoders, to its run's trace URL or code", () => {
    for (const j of jobs) {
      for (const [m] of allMarkers(j)) {
        const run = j.runs.find((r) => r.wireId === m.wireId)!;
        const got = j.decoded.get(m.key);
        expect(got, `${m.key} on ${j.template.name}`).toHaveLength(1);
        const [symbology, value] = [
          got![0]!.slice(0, got![0]!.indexOf(":")),
          got![0]!.slice(got![0]!.indexOf(":") + 1),
        ];
        expect(symbology).toBe(m.symbol!.symbology);
        expect([traceUrl(BASE, run.traceCode), run.traceCode]).toContain(value);
        expect(value).toBe(m.symbol!.payloadKind === "url" ? traceUrl(BASE, run.traceCode) : run.traceCode);
      }
    }
  });

  it("has every run's markers: both ends plus repeats no more than 15 in apart", () => {
    for (const j of jobs) {
      const count = new Map<string, number>();
      for (const [m] of allMarkers(j)) {
        const value = j.decoded.get(m.key)![0]!.replace(/^\w+:/, "");
        const run = j.runs.find((r) => value === r.traceCode || value === traceUrl(BASE, r.traceCode))!;
        count.set(run.wireId, (count.get(run.wireId) ?? 0) + 1);
      }
      for (const r of j.runs) expect(count.get(r.wireId), r.wireId).toBe(expectedCount(r.routedLengthMm));
    }
  });

  it("places every marker cell within 0.1 mm of the template (read back from the PDF)", () => {
    for (const j of jobs) {
      const t = j.template;
      const perPage = t.columns * t.rows;
      j.pages.forEach((page, pi) => {
        expect(page.widthPt / PT_PER_MM).toBeCloseTo(t.pageWidthMm, 1);
        expect(page.heightPt / PT_PER_MM).toBeCloseTo(t.pageHeightMm, 1);
        const n = j.vm.pages[pi]!.markers.length;
        expect(page.rects).toHaveLength(n);
        for (let i = 0; i < n; i++) {
          const index = pi * perPage + i;
          const col = (index % perPage) % t.columns;
          const row = Math.floor((index % perPage) / t.columns);
          const want = {
            xMm: t.marginLeftMm + t.printerOffsetXMm + col * t.pitchXMm,
            yMm: t.marginTopMm + t.printerOffsetYMm + row * t.pitchYMm,
            widthMm: t.markerWidthMm,
            heightMm: t.markerHeightMm,
          };
          const got = page.rects[i]!;
          for (const k of ["xMm", "yMm", "widthMm", "heightMm"] as const)
            expect(Math.abs(got[k] - want[k]), k).toBeLessThan(0.1);
        }
      });
    }
  });

  it("sizes symbols in whole printer dots of at least 0.25 mm, with standard structure", () => {
    for (const j of jobs) {
      const dot = 25.4 / j.template.printerDpi;
      for (const [m, pi] of allMarkers(j)) {
        const s = m.symbol!;
        const imgs = j.pages[pi]!.images.filter((im) => inside(im, m.cell, 1e-6));
        expect(imgs, m.key).toHaveLength(1);
        const im = imgs[0]!;
        // one image pixel per printer dot
        expect(im.widthMm / im.image.widthPx).toBeCloseTo(dot, 6);
        const k = pixelsPerModule(im.image);
        const moduleMm = k * dot;
        expect(moduleMm).toBeGreaterThanOrEqual(0.25);
        expect(k).toBe(s.dotsPerModule);
        const cols = im.image.widthPx / k;
        if (s.symbology === "code128") {
          expect(im.image.heightPx).toBe(1);
          expect((cols - 35) % 11).toBe(0); // 11·n + 35 modules (ISO/IEC 15417 structure)
          expect(im.heightMm).toBeGreaterThan(m.printable.heightMm - 2 * dot);
        } else {
          expect(im.heightMm / im.image.heightPx).toBeCloseTo(dot, 6);
          const rows = im.image.heightPx / k;
          if (s.symbology === "datamatrix") expect(ISO_16022_SIZES).toContain(`${rows}x${cols}`);
          else expect(rows === cols && (cols - 17) % 4 === 0).toBe(true); // QR side = 4v + 17 (ISO/IEC 18004)
        }
        expect(cols).toBe(s.cols);
      }
    }
  });

  it("keeps the quiet zones clear: 10X (Code 128), 1X (Data Matrix), 4X (QR)", () => {
    for (const j of jobs) {
      const dpi = j.template.printerDpi;
      const dot = 25.4 / dpi;
      for (const [m, pi] of allMarkers(j)) {
        const im = j.pages[pi]!.images.find((x) => inside(x, m.cell, 1e-6))!;
        const s = m.symbol!;
        const q = QUIET[s.symbology]! * pixelsPerModule(im.image) * dot;
        const zone = {
          xMm: im.xMm - q,
          yMm: s.symbology === "code128" ? im.yMm : im.yMm - q,
          widthMm: im.widthMm + 2 * q,
          heightMm: s.symbology === "code128" ? im.heightMm : im.heightMm + 2 * q,
        };
        // inside the template's printable band of the cell, and inside the sleeve's flat band
        const c = m.cell;
        const t = j.template;
        const band = {
          xMm: c.xMm + t.insetAlongMm,
          yMm: c.yMm + t.insetAcrossMm,
          widthMm: c.widthMm - 2 * t.insetAlongMm,
          heightMm: c.heightMm - 2 * t.insetAcrossMm,
        };
        expect(inside(zone, band, 1e-6), m.key).toBe(true);
        expect(inside(zone, m.printable, 1e-6), m.key).toBe(true);
        for (const w of j.words.filter((x) => x.page === pi + 1))
          expect(intersects(w, zone), `${w.text} in ${m.key}'s quiet zone`).toBe(false);
        // On the 300 dpi raster the quiet zone is white (one pixel next to the symbol is left for resampling).
        const g = j.rasters[pi]!;
        const px = (mm: number) => (mm / 25.4) * dpi;
        const [sx0, sx1, sy0, sy1] = [
          px(im.xMm),
          px(im.xMm + im.widthMm),
          px(im.yMm),
          px(im.yMm + im.heightMm),
        ];
        const [zx0, zx1, zy0, zy1] = [
          px(zone.xMm),
          px(zone.xMm + zone.widthMm),
          px(zone.yMm),
          px(zone.yMm + zone.heightMm),
        ];
        let darkest = 255;
        for (let y = Math.ceil(zy0); y < Math.floor(zy1); y++) {
          for (let x = Math.ceil(zx0); x < Math.floor(zx1); x++) {
            const nearSymbol = x >= sx0 - 1.5 && x < sx1 + 1.5 && y >= sy0 - 1.5 && y < sy1 + 1.5;
            if (!nearSymbol) darkest = Math.min(darkest, g.px[y * g.width + x]!);
          }
        }
        expect(darkest, `${m.key} quiet zone`).toBeGreaterThan(200);
      }
    }
  });

  it("never lets text overflow its marker (pdftotext word boxes)", () => {
    for (const j of jobs) {
      const t = j.template;
      for (const w of j.words) {
        const owner = j.vm.pages[w.page - 1]!.markers.find((m) =>
          inside(
            { ...w, widthMm: 0, heightMm: 0, xMm: w.xMm + w.widthMm / 2, yMm: w.yMm + w.heightMm / 2 },
            m.cell,
            0,
          ),
        );
        expect(owner, `stray word ${w.text}`).toBeDefined();
        const cell = owner!.cell;
        const band = {
          xMm: cell.xMm + t.insetAlongMm,
          yMm: cell.yMm + t.insetAcrossMm,
          widthMm: cell.widthMm - 2 * t.insetAlongMm,
          heightMm: cell.heightMm - 2 * t.insetAcrossMm,
        };
        expect(inside(w, band, 0.02), `${w.text} inside ${owner!.key}`).toBe(true);
        // and inside the sleeve's own flat band when the sleeve is narrower than the cell
        expect(inside(w, owner!.printable, 0.02), `${w.text} inside ${owner!.key}'s sleeve band`).toBe(true);
      }
      for (const [m, pi] of allMarkers(j)) {
        const mine = j.words.filter((w) => w.page === pi + 1 && inside(w, m.cell, 0.02)).map((w) => w.text);
        expect(mine, m.key).toContain(m.wireId);
        if (!m.flags.includes("text-truncated"))
          expect(mine.join(" ")).toContain(
            m.texts
              .find((x) => x.role === "far")!
              .text.split(" ")
              .at(-1)!,
          );
      }
    }
  });

  it("embeds its fonts", () => {
    for (const j of jobs) {
      const rows = tool("pdffonts", [j.pdfPath])
        .split("\n")
        .slice(2)
        .filter((l) => l.trim());
      expect(rows.length).toBeGreaterThan(0);
      for (const r of rows) expect(r).toMatch(/CID TrueType\s+Identity-H\s+yes\s+yes/);
    }
  });
});

describe("calibration page", () => {
  it("has mm ruler ticks, 100 mm scale bars and the template's cells with the printer offset", async () => {
    const t = withPrinterOffset(findMarkerTemplate("a4-sleeve-6.4")!, 0.5, -0.3);
    const pdf = await renderCalibrationPage(t);
    const file = path.join(dir, "calibration.pdf");
    fs.writeFileSync(file, pdf);
    const [page] = readPdf(pdf);
    // Horizontal ruler: vertical ticks starting 6 mm from the top edge, at whole mm from the left edge.
    const ticks = page!.lines.filter((l) => Math.abs(l.x1Mm - l.x2Mm) < 1e-6 && Math.abs(l.y1Mm - 6) < 1e-6);
    expect(ticks.length).toBeGreaterThan(180);
    for (const l of ticks) expect(Math.abs(l.x1Mm - Math.round(l.x1Mm))).toBeLessThan(0.005);
    const bars = page!.lines.filter((l) => Math.hypot(l.x2Mm - l.x1Mm, l.y2Mm - l.y1Mm) > 99);
    expect(bars.map((l) => Math.hypot(l.x2Mm - l.x1Mm, l.y2Mm - l.y1Mm))).toEqual([
      expect.closeTo(100, 2),
      expect.closeTo(100, 2),
    ]);
    expect(page!.rects.length).toBe(t.columns * t.rows + 1); // cells, plus the instruction panel
    const first = page!.rects[0]!;
    expect(first.xMm).toBeCloseTo(t.marginLeftMm + 0.5, 2);
    expect(first.yMm).toBeCloseTo(t.marginTopMm - 0.3, 2);
    const text = tool("pdftotext", [file, "-"]);
    expect(text).toContain("print at 100 %");
    expect(calibrationGeometry(t).cropMarks.length).toBeGreaterThan(0);
  });
});
