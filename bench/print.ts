// Print benchmark: 2,000 markers and a 2,000-cut sheet, timed against bwip-js alone on the same symbols; `npx tsx bench/print.ts`.

import os from "node:os";
import bwipjs from "bwip-js/node";
import { findMarkerTemplate } from "@/lib/domain/marker-templates";
import {
  layoutMarkerStrip,
  markersForRuns,
  traceCodeFromSeed,
  type MarkerRunInput,
} from "@/lib/domain/markers";
import { buildCutSheet, type CutSheetInput } from "@/lib/domain/cut-sheet";
import { clearSharedSymbolCache, createBarcodeEngine, type SymbolRequest } from "@/lib/pdf/barcodes";
import { createMarkerStripDocument, renderMarkerStrip } from "@/lib/pdf/marker-strip";
import { buildCutSheetPdf, renderCutSheet } from "@/lib/pdf/cut-sheet";
import { pdfTextMeasurer } from "@/lib/pdf/fonts";

const BASE_URL = "https://loomwright.example.test";
const MARKERS = 2000;
const CUTS = 2000;

// Harrow-3-like mix (invented): gauge, colour, insulation.
const WIRE_TYPES: [string, string, string][] = [
  ["22 AWG", "WH", "TXL"],
  ["20 AWG", "BU", "TXL"],
  ["18 AWG", "RD", "TXL"],
  ["18 AWG", "BK", "TXL"],
  ["16 AWG", "YE", "TXL"],
  ["14 AWG", "OG", "GXL"],
  ["12 AWG", "RD", "GXL"],
  ["10 AWG", "BK", "GXL"],
  ["8 AWG", "RD", "GXL"],
  ["6 AWG", "BK", "GXL"],
  ["4 AWG", "RD", "GXL"],
];
const DEVICES = [
  "BAT1",
  "F1",
  "MC1",
  "MC2",
  "DM1",
  "DM2",
  "DECK1",
  "ES1",
  "K1",
  "MAST1",
  "LIDAR1",
  "PC1",
  "BCN1",
];

function runs(n: number): MarkerRunInput[] {
  return Array.from({ length: n }, (_, i) => {
    const [gauge, colour, insulation] = WIRE_TYPES[i % WIRE_TYPES.length]!;
    const wireId = `HR3-${String(i + 1).padStart(4, "0")}`;
    return {
      wireId,
      endA: `${DEVICES[i % DEVICES.length]}:${(i % 8) + 1}`,
      endB: `${DEVICES[(i * 7 + 3) % DEVICES.length]}:${(i % 5) + 1}`,
      gauge,
      colour,
      insulation,
      routedLengthMm: 200 + ((i * 37) % 300),
      traceCode: traceCodeFromSeed(wireId),
    };
  });
}

function cutSheetInput(n: number): CutSheetInput {
  const perSpool = 50;
  const spools: CutSheetInput["spools"] = [];
  for (let s = 0; s * perSpool < n; s++) {
    const [gauge, colour, insulation] = WIRE_TYPES[s % WIRE_TYPES.length]!;
    const cuts = Array.from({ length: Math.min(perSpool, n - s * perSpool) }, (_, j) => {
      const i = s * perSpool + j;
      const wireId = `HR3-${String(i + 1).padStart(4, "0")}`;
      return {
        wireId,
        traceCode: traceCodeFromSeed(wireId),
        cutLengthMm: 3000 - j * 40,
        endA: `${DEVICES[i % DEVICES.length]}:${(i % 8) + 1}`,
        endB: `${DEVICES[(i * 7 + 3) % DEVICES.length]}:${(i % 5) + 1}`,
        endATermination: "ring",
        endBTermination: "ferrule",
        endAStripMm: 6,
        endBStripMm: 8,
        markerCount: 2,
      };
    });
    spools.push({
      wireTypeLabel: `${gauge} ${colour} ${insulation}`,
      gauge,
      colour,
      insulation,
      source:
        s % 3 === 0
          ? { kind: "shelf", lot: `L-${2200 + s}`, location: `Rack B${s % 6}`, lengthMm: 120_000 }
          : {
              kind: "putup",
              nominalMm: 152_400,
              supplier: "Orchard Supply (example)",
              partNumber: `W-${s}`,
              price: 89,
            },
      cuts,
      leftoverMm: 1500,
      keep: true,
    });
  }
  return {
    projectName: "Harrow-3",
    planCreatedAt: "2026-12-01T14:05:00Z",
    pageSize: "A4",
    publicBaseUrl: BASE_URL,
    spools,
  };
}

interface Timing {
  wallMs: number;
  cpuMs: number;
}

async function timed<T>(f: () => Promise<T> | T): Promise<[T, Timing]> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const out = await f();
  const wallMs = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return [out, { wallMs, cpuMs: (c.user + c.system) / 1000 }];
}

function fmt(t: Timing): string {
  return `${(t.wallMs / 1000).toFixed(2)} s wall, ${(t.cpuMs / 1000).toFixed(2)} s CPU`;
}

/** bwip-js alone on the same symbols: its own PNG rendering (toBuffer) and its encoder only (raw). */
async function bwipAlone(
  symbols: (SymbolRequest & { dotsPerModule: number })[],
): Promise<{ png: Timing; raw: Timing }> {
  const [, png] = await timed(async () => {
    for (const s of symbols) {
      // BWIPP's own option names (version, eclevel) are not in bwip-js's typed options; a variable passes them.
      const opts = {
        bcid: s.symbology,
        text: s.payload,
        scale: s.dotsPerModule,
        ...(s.symbology === "code128" ? { height: 4 } : {}),
        ...(s.version ? { version: s.version } : {}),
        ...(s.symbology === "qrcode" ? { eclevel: "M" } : {}),
      };
      await bwipjs.toBuffer(opts);
    }
  });
  const [, raw] = await timed(() => {
    for (const s of symbols) {
      const opts = [s.version ? `version=${s.version}` : "", s.symbology === "qrcode" ? "eclevel=M" : ""]
        .join(" ")
        .trim();
      bwipjs.raw(s.symbology, s.payload, opts);
    }
  });
  return { png, raw };
}

async function main(): Promise<void> {
  // A server is long-running: warm the fonts, pdfkit and bwip-js with a small job of other runs first.
  const warmRuns = runs(60).map((r) => ({ ...r, traceCode: traceCodeFromSeed(`warm/${r.wireId}`) }));
  const warmEngine = createBarcodeEngine();
  await renderMarkerStrip(
    layoutMarkerStrip(
      markersForRuns(warmRuns, { markerRepeatMm: null }),
      findMarkerTemplate("a4-proof-mixed")!,
      {
        publicBaseUrl: BASE_URL,
        measurer: pdfTextMeasurer(),
        sizer: warmEngine,
      },
    ),
    { engine: warmEngine },
  );
  const warmSheet = cutSheetInput(60);
  warmSheet.spools.forEach((sp) =>
    sp.cuts.forEach((c) => (c.traceCode = traceCodeFromSeed(`warm/${c.wireId}`))),
  );
  await renderCutSheet(buildCutSheet(warmSheet, warmEngine), { engine: warmEngine });

  // --- markers (cold: nothing from earlier jobs in the shared symbol cache)
  clearSharedSymbolCache();
  const runList = runs(MARKERS / 2);
  const template = findMarkerTemplate("a4-proof-mixed")!;
  const engineM = createBarcodeEngine();
  const docM = createMarkerStripDocument("Markers", template.name);
  const [vm, layoutT] = await timed(() =>
    layoutMarkerStrip(markersForRuns(runList, { markerRepeatMm: null }), template, {
      publicBaseUrl: BASE_URL,
      measurer: pdfTextMeasurer(docM),
      sizer: engineM,
    }),
  );
  const [pdfM, renderT] = await timed(() => renderMarkerStrip(vm, { engine: engineM, doc: docM }));
  const placed = vm.pages.flatMap((p) => p.markers);
  const symbolsM = uniqueSymbols(placed.flatMap((m) => (m.symbol ? [m.symbol] : [])));
  const bySymbology = new Map<string, number>();
  for (const m of placed)
    if (m.symbol) bySymbology.set(m.symbol.symbology, (bySymbology.get(m.symbol.symbology) ?? 0) + 1);
  const aloneM = await bwipAlone(symbolsM);

  // --- cut sheet, cold, then a reprint of the same plan (its symbols come from the shared cache)
  clearSharedSymbolCache();
  const input = cutSheetInput(CUTS);
  const engineC = createBarcodeEngine();
  const [cs, csLayoutT] = await timed(() => buildCutSheet(input, engineC));
  const [pdfC, csRenderT] = await timed(() => renderCutSheet(cs, { engine: engineC }));
  const rows = cs.pages.flatMap((p) =>
    p.blocks.flatMap((b) => (b.kind === "cut" && b.row.symbol ? [b.row.symbol] : [])),
  );
  const symbolsC = uniqueSymbols(rows);
  const aloneC = await bwipAlone(symbolsC);
  const [, reprintT] = await timed(() => buildCutSheetPdf(input));

  const totalM = layoutT.wallMs + renderT.wallMs;
  const totalC = csLayoutT.wallMs + csRenderT.wallMs;
  const lines = [
    `Markers: ${placed.length} on ${vm.pages.length} pages (${template.name}); symbols ${[...bySymbology].map(([k, v]) => `${k} ${v}`).join(", ")}; ${symbolsM.length} distinct`,
    `  layout (sleeves, text fit, symbol sizing): ${fmt(layoutT)}`,
    `  render (pdfkit + PNGs): ${fmt(renderT)}; PDF ${(pdfM.length / 1e6).toFixed(2)} MB`,
    `  total ${(totalM / 1000).toFixed(2)} s = ${(totalM / placed.length).toFixed(2)} ms per marker, ${(totalM / symbolsM.length).toFixed(2)} ms per distinct symbol`,
    `  bwip-js alone on the same ${symbolsM.length} symbols: toBuffer PNG ${fmt(aloneM.png)} (${(aloneM.png.wallMs / symbolsM.length).toFixed(2)} ms each); raw encode ${fmt(aloneM.raw)} (${(aloneM.raw.wallMs / symbolsM.length).toFixed(2)} ms each)`,
    `  engine: ${JSON.stringify(engineM.stats())}`,
    `Cut sheet: ${input.spools.reduce((a, s) => a + s.cuts.length, 0)} cuts, ${input.spools.length} spools, ${cs.pageCount} pages`,
    `  layout (pagination, symbol sizing): ${fmt(csLayoutT)}`,
    `  render: ${fmt(csRenderT)}; PDF ${(pdfC.length / 1e6).toFixed(2)} MB`,
    `  total ${(totalC / 1000).toFixed(2)} s = ${(totalC / symbolsC.length).toFixed(2)} ms per cut (one Data Matrix each)`,
    `  reprint of the same plan (symbols from the shared cache): ${fmt(reprintT)}`,
    `  bwip-js alone on the same ${symbolsC.length} symbols: toBuffer PNG ${fmt(aloneC.png)} (${(aloneC.png.wallMs / symbolsC.length).toFixed(2)} ms each); raw encode ${fmt(aloneC.raw)} (${(aloneC.raw.wallMs / symbolsC.length).toFixed(2)} ms each)`,
    `Peak RSS: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB; load average ${os
      .loadavg()
      .map((v) => v.toFixed(1))
      .join(
        " ",
      )} on ${os.cpus().length} CPUs (wall times stretch when the machine is busy; CPU times less so)`,
    `Targets: each under 3 s wall (markers ${totalM < 3000 ? "met" : "MISSED"}, cut sheet ${totalC < 3000 ? "met" : "MISSED"}); memory under 500 MB (${process.resourceUsage().maxRSS / 1024 < 500 ? "met" : "MISSED"})`,
  ];
  console.log(lines.join("\n"));
}

function uniqueSymbols<T extends SymbolRequest & { dotsPerModule: number }>(list: T[]): T[] {
  const seen = new Map<string, T>();
  for (const s of list) seen.set(`${s.symbology}|${s.version}|${s.payload}|${s.dotsPerModule}`, s);
  return [...seen.values()];
}

void main();
