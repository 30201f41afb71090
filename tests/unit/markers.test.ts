import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  cellBox,
  cutMarkLines,
  DEFAULT_MARKER_TEMPLATES,
  findMarkerTemplate,
  PAGE_SIZES_MM,
  validateTemplate,
  withPrinterOffset,
  type Box,
  type MarkerTemplate,
} from "@/lib/domain/marker-templates";
import {
  dotsPerModule,
  fitMarkerText,
  layoutMarker,
  makeTraceCode,
  markersForRun,
  MAX_ID_PT,
  MIN_TEXT_PT,
  normaliseTraceCode,
  QUIET_ZONE_MODULES,
  repeatMarkerCount,
  traceCodeFromSeed,
  traceUrl,
  type MarkerRunInput,
  type PlacedMarker,
} from "@/lib/domain/markers";
import { createBarcodeEngine } from "@/lib/pdf/barcodes";
import { pdfTextMeasurer } from "@/lib/pdf/fonts";

const BASE = "https://loomwright.example.test";
// crockford.com/base32.html: symbol values 0–31 are 0–9, A–H, J, K, M, N, P–T, V–Z (no I, L, O, U).
const CROCKFORD = "0123456789ABCDEFGHJKMNPQRSTVWXYZ";

function crockfordOf(bytes: number[]): string {
  // Reference: ECMAScript's radix-32 digits (0–9, a–v) mapped onto Crockford's symbols.
  const value = bytes.reduce((v, b) => v * 256n + BigInt(b), 0n);
  return [...value.toString(32).padStart(8, "0")].map((d) => CROCKFORD[parseInt(d, 32)]).join("");
}

describe("trace codes", () => {
  it.each([
    [[0, 0, 0, 0, 0], "00000000"],
    [[255, 255, 255, 255, 255], "ZZZZZZZZ"],
    [[0, 0, 0, 0, 32], "00000010"], // 32 = "10" in base 32
    [[0, 0, 0, 0, 31], "0000000Z"],
  ])("encodes %j as %s", (bytes, code) => {
    expect(makeTraceCode(Uint8Array.from(bytes))).toBe(code);
    expect(crockfordOf(bytes)).toBe(code);
  });

  it("encodes any 40 bits as Crockford base32 would", () => {
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 5, maxLength: 5 }), (bytes) => {
        const code = makeTraceCode(bytes);
        expect(code).toBe(crockfordOf([...bytes]));
        expect(code).toMatch(/^[0-9A-HJKMNP-TV-Z]{8}$/);
      }),
    );
  });

  it("refuses fewer than 5 bytes", () => {
    expect(() => makeTraceCode(Uint8Array.from([1, 2, 3]))).toThrow();
  });

  // Crockford's decoding rules: case-insensitive, O→0, I and L→1, hyphens ignored; U is not a symbol.
  it.each([
    ["7k3m-9qxa", "7K3M9QXA"],
    ["OOOO IIII", "00001111"],
    ["llll0000", "11110000"],
    ["7K3M9QXU", null],
    ["7K3M9QX", null],
  ])("reads %s as %s", (input, code) => {
    expect(normaliseTraceCode(input)).toBe(code);
  });

  it("derives stable, well-spread codes from seeds", () => {
    const codes = Array.from({ length: 2000 }, (_, i) => traceCodeFromSeed(`HR3-${i}`));
    expect(new Set(codes).size).toBe(codes.length);
    expect(traceCodeFromSeed("HR3-001")).toBe(traceCodeFromSeed("HR3-001"));
    // neighbouring seeds should not share a prefix (first two symbols equal by chance: 1 in 1024)
    const shared = codes.slice(1).filter((c, i) => c.slice(0, 2) === codes[i]!.slice(0, 2)).length;
    expect(shared).toBeLessThan(10);
  });

  it("builds the trace page URL /r/<code> (PRODUCT.md §3)", () => {
    expect(traceUrl(BASE, "7K3M9QXA")).toBe("https://loomwright.example.test/r/7K3M9QXA");
    expect(traceUrl(`${BASE}//`, "7K3M9QXA")).toBe("https://loomwright.example.test/r/7K3M9QXA");
  });
});

function run(over: Partial<MarkerRunInput> = {}): MarkerRunInput {
  return {
    wireId: "HR3-001",
    endA: "BAT1:+",
    endB: "F1:1",
    gauge: "18 AWG",
    colour: "RD",
    insulation: "TXL",
    routedLengthMm: 600,
    traceCode: "7K3M9QXA",
    ...over,
  };
}

describe("which markers a run gets", () => {
  it("has one marker per end, each naming the far end", () => {
    const m = markersForRun(run(), { markerRepeatMm: null });
    expect(m.map((x) => [x.place, x.farText])).toEqual([
      ["end-a", "→ F1:1"],
      ["end-b", "→ BAT1:+"],
    ]);
    expect(m.every((x) => x.idText === "HR3-001" && x.detailText === "18 AWG RD" && x.countInRun === 2)).toBe(
      true,
    );
  });

  // AC 43.13-1B par. 11-208: identification at each end and at intervals of no more than 15 in (381 mm).
  const INTERVAL = 381;
  it.each([100, 380, 440, 441, 1000, 2400, 7600])(
    "a %i mm run gets markers no more than 15 in apart",
    (len) => {
      const m = markersForRun(run({ routedLengthMm: len }), { markerRepeatMm: INTERVAL });
      const along = m.map((x) => x.alongMm);
      expect([...along].sort((a, b) => a - b)).toEqual(along);
      for (let i = 1; i < along.length; i++)
        expect(along[i]! - along[i - 1]!).toBeLessThanOrEqual(INTERVAL + 1);
      // and no more than needed: one repeat fewer would leave a gap above the interval
      const repeats = m.length - 2;
      const span = along[along.length - 1]! - along[0]!;
      if (repeats > 0) expect(span / repeats).toBeGreaterThan(INTERVAL);
      expect(repeatMarkerCount(len, INTERVAL)).toBe(repeats);
      expect(m.slice(1, -1).every((x) => x.place === "repeat" && x.farText === "BAT1:+ ↔ F1:1")).toBe(true);
    },
  );

  it("uses the cut length when it is known", () => {
    const m = markersForRun(run({ routedLengthMm: 300, cutLengthMm: 1300 }), { markerRepeatMm: INTERVAL });
    expect(m.at(-1)!.alongMm).toBe(1300 - 30);
    expect(m.length).toBe(2 + repeatMarkerCount(1300, INTERVAL));
  });

  it("records why a wire got no sleeve", () => {
    const m = markersForRun(run({ outerDiameterMm: 0.5 }), { markerRepeatMm: null });
    expect(m[0]!.sleeve).toBeNull();
    expect(m[0]!.sleeveProblem).toMatch(/thinner/);
  });
});

describe("module size in printer dots", () => {
  // electrical.md §10 (calc from 1 in = 25.4 mm): a 300 dpi dot is 0.0847 mm, 3 dots = 0.254 mm;
  // a 203 dpi dot is 0.125 mm, 2 dots = 0.25 mm.
  it.each([
    [300, 3, 0.254],
    [203, 2, 0.25],
    [600, 6, 0.254],
  ])("at %i dpi a 0.25 mm module takes %i dots (%f mm)", (dpi, dots, mm) => {
    expect(dotsPerModule(0.25, dpi)).toBe(dots);
    expect((dots * 25.4) / dpi).toBeCloseTo(mm, 3);
    expect((dots * 25.4) / dpi).toBeGreaterThanOrEqual(0.25);
  });

  it("uses the quiet zones of ISO/IEC 15417, 16022 and 18004", () => {
    expect(QUIET_ZONE_MODULES).toEqual({ code128: 10, datamatrix: 1, qrcode: 4 });
  });

  // Code 128 structure (ISO/IEC 15417 via electrical.md §10): 11 modules per character plus start and
  // check characters, and a 13-module stop: 11·n + 35. Digits pack two to a character in set C.
  it.each([
    ["A", 46],
    ["7K3M9QXA", 123],
    ["HARROWTHREE", 156],
    ["12345678", 79],
  ])("bwip-js draws %s in %i modules", (text, modules) => {
    expect(createBarcodeEngine().code128Modules(text)).toBe(modules);
  });
});

const ISO_16022_RECTANGLES = ["8x18", "8x32", "12x26", "12x36", "16x36", "16x48"]; // electrical.md §10
const ISO_16022_SQUARES = [10, 12, 14, 16, 18, 20, 22, 24, 26].map((n) => `${n}x${n}`); // ISO/IEC 16022, from memory

describe("symbol choice on sleeves", () => {
  const engine = createBarcodeEngine();
  const measurer = pdfTextMeasurer();
  const proof = findMarkerTemplate("a4-proof-mixed")!;
  const layoutFor = (r: MarkerRunInput, t: MarkerTemplate): PlacedMarker =>
    layoutMarker(markersForRun(r, { markerRepeatMm: null })[0]!, cellBox(t, 0), t, {
      publicBaseUrl: BASE,
      measurer,
      sizer: engine,
    });

  const gauges = [
    "22 AWG",
    "20 AWG",
    "18 AWG",
    "16 AWG",
    "14 AWG",
    "12 AWG",
    "10 AWG",
    "8 AWG",
    "6 AWG",
    "4 AWG",
    "1/0 AWG",
  ];
  it.each(gauges)("%s: the symbol obeys module, quiet zone and curvature rules", (gauge) => {
    const r = run({ gauge, insulation: "GXL", traceCode: traceCodeFromSeed(gauge) });
    const placed = layoutFor(r, proof);
    const spec = markersForRun(r, { markerRepeatMm: null })[0]!;
    const s = placed.symbol;
    expect(s).not.toBeNull();
    if (!s || !spec.sleeve) return;
    const dot = 25.4 / proof.printerDpi;
    expect(s.moduleMm).toBeGreaterThanOrEqual(0.25);
    expect(s.moduleMm / dot).toBeCloseTo(Math.round(s.moduleMm / dot), 9);
    expect(s.payload).toBe(s.payloadKind === "url" ? traceUrl(BASE, r.traceCode) : r.traceCode);
    const q = QUIET_ZONE_MODULES[s.symbology] * s.moduleMm;
    expect(s.quietBox.widthMm).toBeCloseTo(s.box.widthMm + 2 * q, 9);
    expect(inside(s.quietBox, placed.printable)).toBe(true);
    if (s.symbology === "code128") {
      expect((s.cols - 35) % 11).toBe(0); // 11·n + 35 (ISO/IEC 15417)
    } else {
      const D = spec.sleeve.sleeve.expandedMm;
      // GS1: the symbol may wrap at most π·D/6 around a cylinder (30° tangent rule), on the flat print too
      expect(s.rows * s.moduleMm).toBeLessThanOrEqual((Math.PI * D) / 6 + 1e-9);
      // after shrinking onto the wire, modules around it must still be ≥ 0.25 mm
      expect(s.moduleMm * (spec.sleeve.wireOdMm / D)).toBeGreaterThanOrEqual(0.25);
      if (s.symbology === "datamatrix")
        expect([...ISO_16022_RECTANGLES, ...ISO_16022_SQUARES]).toContain(`${s.rows}x${s.cols}`);
    }
  });

  it("puts Code 128 along the axis of thin sleeves (electrical.md §10: OD under about 5 mm)", () => {
    for (const gauge of ["22 AWG", "18 AWG", "14 AWG"]) {
      expect(layoutFor(run({ gauge }), proof).symbol?.symbology).toBe("code128");
    }
  });

  // electrical.md §10, item 2: from about 5 mm installed OD a rectangular Data Matrix fits the curvature rule
  it("puts a 2D symbol on a heavy battery cable's sleeve", () => {
    const s = layoutFor(run({ gauge: "4 AWG", insulation: "GXL" }), proof).symbol;
    expect(s?.symbology).toBe("datamatrix");
  });

  it("prints a QR of the trace URL on a flat label, where phone cameras open it directly", () => {
    const label = findMarkerTemplate("a4-flag-labels")!;
    const s = layoutFor(run(), label).symbol;
    expect(s?.symbology).toBe("qrcode");
    expect(s?.payload).toBe(traceUrl(BASE, "7K3M9QXA"));
    expect(((s?.cols ?? 0) - 17) % 4).toBe(0); // side = 4·version + 17 (ISO/IEC 18004)
    expect(s?.cols).toBe(s?.rows);
  });

  it("drops the symbol, not the wire ID, when the marker is too short", () => {
    const short: MarkerTemplate = { ...proof, id: "short", markerWidthMm: 24, pitchXMm: 30 };
    const placed = layoutFor(run(), short);
    expect(placed.symbol).toBeNull();
    expect(placed.flags).toContain("no-symbol");
    expect(placed.texts.find((t) => t.role === "id")?.text).toBe("HR3-001");
  });

  it("keeps 203 dpi modules at whole dots", () => {
    const t = { ...proof, printerDpi: 203 };
    const s = layoutFor(run({ gauge: "18 AWG" }), t).symbol!;
    expect(s.dotsPerModule).toBe(2);
    expect(s.moduleMm).toBeCloseTo(2 * (25.4 / 203), 12);
  });
});

function inside(a: Box, b: Box, tol = 1e-6): boolean {
  return (
    a.xMm >= b.xMm - tol &&
    a.yMm >= b.yMm - tol &&
    a.xMm + a.widthMm <= b.xMm + b.widthMm + tol &&
    a.yMm + a.heightMm <= b.yMm + b.heightMm + tol
  );
}

function overlaps(a: Box, b: Box): boolean {
  return (
    a.xMm < b.xMm + b.widthMm - 1e-6 &&
    b.xMm < a.xMm + a.widthMm - 1e-6 &&
    a.yMm < b.yMm + b.heightMm - 1e-6 &&
    b.yMm < a.yMm + a.heightMm - 1e-6
  );
}

describe("marker text fit", () => {
  const m = pdfTextMeasurer();
  const content = { id: "HR3-014", far: "→ PC1:J5-3", detail: "22 AWG WH" };

  // Content and priority per practice.md §3 (IEC 62491 summary): wire ID, far end, then gauge/colour.
  it("fits all three lines, unshrunk, on a roomy marker", () => {
    const texts = fitMarkerText(content, { xMm: 0, yMm: 0, widthMm: 40, heightMm: 19 }, m);
    expect(texts.map((t) => t.text)).toEqual(["HR3-014", "→ PC1:J5-3", "22 AWG WH"]);
    expect(texts.every((t) => !t.truncated)).toBe(true);
    expect(texts[0]!.sizePt).toBe(MAX_ID_PT);
  });

  it("shrinks to one line on a thin sleeve and cuts with an ellipsis only at the minimum size", () => {
    const texts = fitMarkerText(content, { xMm: 0, yMm: 0, widthMm: 18, heightMm: 2.97 }, m);
    expect(texts[0]!.text).toBe("HR3-014");
    for (const t of texts) {
      expect(t.sizePt).toBeGreaterThanOrEqual(MIN_TEXT_PT);
      if (t.truncated) {
        expect(t.text.endsWith("…")).toBe(true);
        expect(t.sizePt).toBe(MIN_TEXT_PT);
      }
    }
  });

  it("never overflows, whatever the text and the room", () => {
    fc.assert(
      fc.property(
        fc.record({
          id: fc.string({ minLength: 1, maxLength: 14 }),
          far: fc.string({ maxLength: 40 }),
          detail: fc.string({ maxLength: 20 }),
        }),
        fc.double({ min: 2, max: 60, noNaN: true }),
        fc.double({ min: 1.5, max: 25, noNaN: true }),
        (c, w, h) => {
          const box = { xMm: 3, yMm: 7, widthMm: w, heightMm: h };
          const texts = fitMarkerText(c, box, m);
          texts.forEach((t, i) => {
            expect(inside(t.box, box)).toBe(true);
            // the box is the text's real extent as pdfkit measures it
            expect(t.box.widthMm).toBeCloseTo(m.widthMm(t.text, t.font, t.sizePt), 9);
            expect(t.sizePt).toBeGreaterThanOrEqual(MIN_TEXT_PT);
            for (const o of texts.slice(i + 1)) expect(overlaps(t.box, o.box)).toBe(false);
          });
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("templates", () => {
  it("use ISO 216 A4 and ANSI Letter (8.5 × 11 in)", () => {
    expect(PAGE_SIZES_MM.A4).toEqual({ widthMm: 210, heightMm: 297 });
    expect(PAGE_SIZES_MM.Letter.widthMm).toBeCloseTo(8.5 * 25.4, 9);
    expect(PAGE_SIZES_MM.Letter.heightMm).toBeCloseTo(11 * 25.4, 9);
  });

  it.each(DEFAULT_MARKER_TEMPLATES.map((t) => [t.name, t] as const))(
    "%s is valid and its marks stay out of the cells",
    (_n, t) => {
      expect(validateTemplate(t)).toEqual([]);
      const cells = Array.from({ length: t.columns * t.rows }, (_, i) => cellBox(t, i));
      for (const l of cutMarkLines(t)) {
        const box = {
          xMm: Math.min(l.x1Mm, l.x2Mm),
          yMm: Math.min(l.y1Mm, l.y2Mm),
          widthMm: Math.abs(l.x2Mm - l.x1Mm),
          heightMm: Math.abs(l.y2Mm - l.y1Mm),
        };
        const printable = cells.map((c) => ({
          xMm: c.xMm + t.insetAlongMm,
          yMm: c.yMm + t.insetAcrossMm,
          widthMm: c.widthMm - 2 * t.insetAlongMm,
          heightMm: c.heightMm - 2 * t.insetAcrossMm,
        }));
        expect(printable.some((p) => overlaps(box, p))).toBe(false);
      }
    },
  );

  it("has unique ids and names", () => {
    expect(new Set(DEFAULT_MARKER_TEMPLATES.map((t) => t.id)).size).toBe(DEFAULT_MARKER_TEMPLATES.length);
    expect(new Set(DEFAULT_MARKER_TEMPLATES.map((t) => t.name)).size).toBe(DEFAULT_MARKER_TEMPLATES.length);
  });

  it("shifts every cell by the printer offset", () => {
    const t = findMarkerTemplate("a4-sleeve-6.4")!;
    const shifted = withPrinterOffset(t, 0.7, -0.4);
    const a = cellBox(t, 5);
    const b = cellBox(shifted, 5);
    expect(b.xMm - a.xMm).toBeCloseTo(0.7, 9);
    expect(b.yMm - a.yMm).toBeCloseTo(-0.4, 9);
  });

  it("reports a grid that does not fit its page", () => {
    const t = { ...findMarkerTemplate("a4-sleeve-6.4")!, rows: 40 };
    expect(validateTemplate(t).join(" ")).toMatch(/grid is .* tall/);
  });
});
