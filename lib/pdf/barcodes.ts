// Barcode symbols for the PDFs: bwip-js encodes them into module matrices; we write 1-bit PNGs at whole printer dots per module, cached per job.

import zlib from "node:zlib";
import bwipjs from "bwip-js/node";
import type { Symbology, SymbolSizer } from "@/lib/domain/markers";

/** Modules row by row, 1 = dark. Code 128 has one row: its bars run the symbol's full height. */
export interface ModuleMatrix {
  cols: number;
  rows: number;
  dark: Uint8Array;
}

export interface SymbolRequest {
  symbology: Symbology;
  payload: string;
  /** Data Matrix "RxC" or QR version; null lets the encoder pick the smallest. */
  version: string | null;
}

export interface BarcodeEngine extends SymbolSizer {
  matrix(req: SymbolRequest): ModuleMatrix;
  /** A 1-bit grey PNG with `dotsPerModule` pixels per module across (and down, for 2D symbols). */
  png(req: SymbolRequest, dotsPerModule: number): Buffer;
  /** The same PNG as a data URI: pdfkit embeds each distinct URI once per document. */
  dataUri(req: SymbolRequest, dotsPerModule: number): string;
  stats(): { encodes: number; matrixHits: number; pngs: number; pngHits: number };
}

const BCID: Record<Symbology, string> = { code128: "code128", datamatrix: "datamatrix", qrcode: "qrcode" };
/** QR error correction level M: the common default (about 15 % recovery). */
const QR_ECLEVEL = "M";

type RawSymbol =
  | { sbs: number[]; bhs: number[]; bbs: number[] }
  | { pixs: number[]; pixx: number; pixy: number; height: number; width: number };

/**
 * Encodings shared across jobs: a run's trace URL never changes, so reprints skip bwip-js. Bounded (least
 * recently used out first); about 1 KB per entry.
 */
const SHARED_LIMIT = 20_000;
const shared = new Map<string, ModuleMatrix | null>();
let bwipCalls = 0;

export function clearSharedSymbolCache(): void {
  shared.clear();
}

/** How many times bwip-js itself has been called in this process. */
export function bwipEncodeCount(): number {
  return bwipCalls;
}

/** Encodes with bwip-js (or the shared cache); null when the payload does not fit the requested symbol. */
export function encodeSymbol(
  symbology: Symbology,
  payload: string,
  extra: Record<string, string> = {},
): ModuleMatrix | null {
  const key = `${symbology}|${JSON.stringify(extra)}|${payload}`;
  if (shared.has(key)) {
    const hit = shared.get(key) ?? null;
    shared.delete(key);
    shared.set(key, hit);
    return hit;
  }
  const m = encodeUncached(symbology, payload, extra);
  remember(key, m);
  // The same symbol asked for by its size later (the renderer pins the version the layout chose).
  if (m && !extra.version && symbology !== "code128") {
    const version = symbology === "datamatrix" ? `${m.rows}x${m.cols}` : String((m.cols - 17) / 4);
    remember(`${symbology}|${JSON.stringify({ version })}|${payload}`, m);
  }
  return m;
}

function remember(key: string, m: ModuleMatrix | null): void {
  shared.set(key, m);
  if (shared.size > SHARED_LIMIT) shared.delete(shared.keys().next().value!);
}

function encodeUncached(
  symbology: Symbology,
  payload: string,
  extra: Record<string, string> = {},
): ModuleMatrix | null {
  const opts = { ...extra, ...(symbology === "qrcode" ? { eclevel: QR_ECLEVEL } : {}) };
  // BWIPP options as "key=value" words: the typed object form does not list format, version or eclevel.
  const optString = Object.entries(opts)
    .map(([k, v]) => `${k}=${v}`)
    .join(" ");
  let first: RawSymbol | undefined;
  bwipCalls++;
  try {
    first = (bwipjs.raw(BCID[symbology], payload, optString) as RawSymbol[])[0];
  } catch {
    return null;
  }
  if (!first) return null;
  if ("sbs" in first) {
    const cols = first.sbs.reduce((a, b) => a + b, 0);
    const dark = new Uint8Array(cols);
    let x = 0;
    first.sbs.forEach((w, i) => {
      if (i % 2 === 0) dark.fill(1, x, x + w); // bars and spaces alternate, starting with a bar
      x += w;
    });
    return { cols, rows: 1, dark };
  }
  return { cols: first.pixx, rows: first.pixy, dark: Uint8Array.from(first.pixs) };
}

export function createBarcodeEngine(): BarcodeEngine {
  const matrices = new Map<string, ModuleMatrix | null>();
  const shapes = new Map<string, { rows: number; cols: number } | null>();
  const pngs = new Map<string, Buffer>();
  const uris = new Map<string, string>();
  let encodes = 0;
  let matrixHits = 0;
  let pngHits = 0;

  const keyOf = (r: SymbolRequest) => `${r.symbology}|${r.version ?? ""}|${r.payload}`;

  function encodeCached(req: SymbolRequest, extra: Record<string, string>): ModuleMatrix | null {
    const key = keyOf(req);
    if (matrices.has(key)) {
      matrixHits++;
      return matrices.get(key) ?? null;
    }
    encodes++;
    const m = encodeSymbol(req.symbology, req.payload, extra);
    matrices.set(key, m);
    return m;
  }

  function versionExtra(req: SymbolRequest): Record<string, string> {
    return req.version ? { version: req.version } : {};
  }

  const engine: BarcodeEngine = {
    code128Modules(payload) {
      return encodeCached({ symbology: "code128", payload, version: null }, {})?.cols ?? null;
    },
    dataMatrixSize(payload, shape) {
      const key = `${shape}|${payload}`;
      if (shapes.has(key)) return shapes.get(key) ?? null;
      encodes++;
      const m = encodeSymbol("datamatrix", payload, { format: shape });
      const size = m ? { rows: m.rows, cols: m.cols } : null;
      shapes.set(key, size);
      // The same symbol, pinned to its size, is what the renderer will ask for.
      if (m) matrices.set(keyOf({ symbology: "datamatrix", payload, version: `${m.rows}x${m.cols}` }), m);
      return size;
    },
    qrModules(payload) {
      const m = encodeCached({ symbology: "qrcode", payload, version: null }, {});
      if (m) matrices.set(keyOf({ symbology: "qrcode", payload, version: String((m.cols - 17) / 4) }), m);
      return m ? m.cols : null;
    },
    matrix(req) {
      const m = encodeCached(req, versionExtra(req));
      if (!m)
        throw new Error(`cannot encode "${req.payload}" as ${req.symbology} ${req.version ?? ""}`.trim());
      return m;
    },
    png(req, dotsPerModule) {
      const key = `${keyOf(req)}|${dotsPerModule}`;
      const hit = pngs.get(key);
      if (hit) {
        pngHits++;
        return hit;
      }
      const png = matrixToPng(engine.matrix(req), dotsPerModule);
      pngs.set(key, png);
      return png;
    },
    dataUri(req, dotsPerModule) {
      const key = `${keyOf(req)}|${dotsPerModule}`;
      let uri = uris.get(key);
      if (!uri) {
        uri = `data:image/png;base64,${engine.png(req, dotsPerModule).toString("base64")}`;
        uris.set(key, uri);
      }
      return uri;
    },
    stats() {
      return { encodes, matrixHits, pngs: pngs.size, pngHits };
    },
  };
  return engine;
}

// PNG (ISO/IEC 15948): signature, IHDR, one IDAT, IEND; each chunk carries a CRC-32 of type + data.
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "latin1"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(body) >>> 0);
  return Buffer.concat([length, body, crc]);
}

/** Greyscale, 1 bit per pixel (0 = black), filter type 0 on every row. 2D symbols are k×k pixels per module. */
export function matrixToPng(m: ModuleMatrix, dotsPerModule: number): Buffer {
  const k = dotsPerModule;
  const width = m.cols * k;
  const height = m.rows === 1 ? 1 : m.rows * k;
  const rowBytes = Math.ceil(width / 8);
  const raw = Buffer.alloc((rowBytes + 1) * height);
  for (let r = 0; r < m.rows; r++) {
    const line = Buffer.alloc(rowBytes + 1); // leading 0 = filter type None
    for (let x = 0; x < width; x++) {
      const i = 1 + (x >> 3);
      if (!m.dark[r * m.cols + Math.floor(x / k)]) line[i] = (line[i] ?? 0) | (0x80 >> (x & 7));
    }
    const repeat = m.rows === 1 ? 1 : k;
    for (let j = 0; j < repeat; j++) line.copy(raw, (r * repeat + j) * (rowBytes + 1));
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // colour type: greyscale
  return Buffer.concat([
    PNG_SIGNATURE,
    pngChunk("IHDR", ihdr),
    pngChunk("IDAT", zlib.deflateSync(raw)),
    pngChunk("IEND", Buffer.alloc(0)),
  ]);
}
