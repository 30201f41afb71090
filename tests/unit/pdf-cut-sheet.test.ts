import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  buildCutSheet,
  CUT_SHEET_LAYOUT,
  cutSheetTotals,
  formatPlanDate,
  type CutSheetInput,
  type CutSheetViewModel,
} from "@/lib/domain/cut-sheet";
import { traceCodeFromSeed } from "@/lib/domain/markers";
import { createBarcodeEngine } from "@/lib/pdf/barcodes";
import { buildCutSheetPdf } from "@/lib/pdf/cut-sheet";
import { lineHeightPt } from "@/lib/pdf/fonts";

const TOOLS: [string, string][] = [
  ["pdftotext", "poppler-utils"],
  ["pdfinfo", "poppler-utils"],
  ["pdffonts", "poppler-utils"],
  ["pdftoppm", "poppler-utils"],
  ["dmtxread", "dmtx-utils"],
];

function requireTools(): void {
  const missing = TOOLS.filter(([t]) => spawnSync("sh", ["-c", `command -v ${t}`]).status !== 0);
  if (missing.length > 0) {
    const pkgs = [...new Set(missing.map(([, p]) => p))].join(" ");
    throw new Error(
      `missing ${missing.map(([t]) => t).join(", ")}: install with \`apt-get install -y ${pkgs}\``,
    );
  }
}

function tool(cmd: string, args: string[]): string {
  const r = spawnSync(cmd, args, { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
  if (r.error) throw r.error;
  return r.stdout;
}

const BASE = "https://loomwright.example.test";
let n = 0;
function cuts(count: number, endB: string) {
  return Array.from({ length: count }, (_, i) => {
    const wireId = `HR3-${String(++n).padStart(3, "0")}`;
    return {
      wireId,
      traceCode: traceCodeFromSeed(`harrow-3/${wireId}`),
      cutLengthMm: 2400 - i * 15,
      endA: i % 2 ? "MC1:B+" : "BAT1:+",
      endB,
      endATermination: "ring",
      endBTermination: i % 3 ? "ferrule" : null,
      endAStripMm: 6,
      endBStripMm: i % 3 ? 8 : null,
      markerCount: 2 + (i % 3),
    };
  });
}

// Harrow-3 (invented): a shelf remnant, a long new put-up whose section spans pages, and a put-up without a price.
const INPUT: CutSheetInput = {
  projectName: "Harrow-3 orchard mower",
  planCreatedAt: "2026-12-01T14:05:00Z",
  pageSize: "A4",
  publicBaseUrl: BASE,
  currency: "USD",
  spools: [
    {
      wireTypeLabel: "4 AWG RD GXL",
      gauge: "4 AWG",
      colour: "RD",
      insulation: "GXL",
      source: { kind: "shelf", lot: "L-2211", location: "Rack B3", lengthMm: 6200 },
      cuts: cuts(4, "F1:1"),
      leftoverMm: 420,
      keep: false,
    },
    {
      wireTypeLabel: "18 AWG WH TXL",
      gauge: "18 AWG",
      colour: "WH",
      insulation: "TXL",
      source: {
        kind: "putup",
        nominalMm: 152_400,
        supplier: "Orchard Supply (example)",
        partNumber: "TXL18-WH-500",
        price: 61.2,
      },
      cuts: cuts(70, "LIDAR1:TX+"),
      leftoverMm: 31_000,
      keep: true,
    },
    {
      wireTypeLabel: "22 AWG OG TXL",
      gauge: "22 AWG",
      colour: "OG",
      insulation: "TXL",
      source: { kind: "putup", nominalMm: 30_480, supplier: null, partNumber: "TXL22-OG-100", price: null },
      cuts: cuts(9, "LED1:A"),
      leftoverMm: 12_000,
      keep: true,
    },
  ],
};
const ALL_CUTS = INPUT.spools.flatMap((s) => s.cuts);

let dir = "";
const rendered: { size: "A4" | "Letter"; file: string; vm: CutSheetViewModel; pages: string[] }[] = [];

beforeAll(async () => {
  requireTools();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "loomwright-cutsheet-"));
  for (const size of ["A4", "Letter"] as const) {
    const { pdf, viewModel } = await buildCutSheetPdf({ ...INPUT, pageSize: size });
    const file = path.join(dir, `cut-sheet-${size}.pdf`);
    fs.writeFileSync(file, pdf);
    const pages = Array.from({ length: viewModel.pageCount }, (_, i) =>
      tool("pdftotext", ["-f", String(i + 1), "-l", String(i + 1), "-layout", file, "-"]),
    );
    rendered.push({ size, file, vm: viewModel, pages });
  }
}, 60_000);

afterAll(() => {
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

describe("cut sheet view model", () => {
  const vm = buildCutSheet(INPUT, createBarcodeEngine());
  const body = {
    top: vm.headerBox.yMm + vm.headerBox.heightMm,
    bottom: vm.footerBox.yMm,
  };

  it("lists every cut once, in the plan's order", () => {
    const ids = vm.pages.flatMap((p) => p.blocks.flatMap((b) => (b.kind === "cut" ? [b.row.wireId] : [])));
    expect(ids).toEqual(ALL_CUTS.map((c) => c.wireId));
  });

  it("keeps every block between the header and the footer", () => {
    for (const p of vm.pages) {
      for (const b of p.blocks) {
        expect(b.yMm).toBeGreaterThanOrEqual(body.top);
        expect(b.yMm + b.heightMm).toBeLessThanOrEqual(body.bottom);
      }
    }
  });

  it("never leaves a spool header alone at the foot of a page", () => {
    for (const p of vm.pages) {
      const last = p.blocks.at(-1)!;
      expect(["spool-header", "table-header"]).not.toContain(last.kind);
    }
  });

  it("adds up the totals", () => {
    const t = cutSheetTotals(INPUT);
    expect(t.cuts).toBe(83);
    expect(t.lengthMm).toBe(ALL_CUTS.reduce((a, c) => a + c.cutLengthMm, 0));
    expect(t).toMatchObject({ spools: 3, shelfSpools: 1, newSpools: 2, cost: null });
    const priced = cutSheetTotals({ ...INPUT, spools: INPUT.spools.slice(0, 2) });
    expect(priced.cost).toBeCloseTo(61.2, 9);
  });

  it("puts a Data Matrix of the trace code on every row, in whole 300 dpi dots", () => {
    for (const p of vm.pages) {
      for (const b of p.blocks) {
        if (b.kind !== "cut") continue;
        const s = b.row.symbol!;
        expect(s.symbology).toBe("datamatrix");
        expect(s.payload).toBe(b.row.traceCode);
        expect(s.moduleMm).toBeGreaterThanOrEqual(0.25);
        // Whole dots of a 300 dpi printer, at least 0.25 mm: 3 dots = 0.254 mm (electrical.md §10).
        expect(Number.isInteger(s.dotsPerModule)).toBe(true);
        expect(s.dotsPerModule).toBeGreaterThanOrEqual(3);
        expect(s.moduleMm).toBeCloseTo((s.dotsPerModule * 25.4) / 300, 9);
        // quiet zone of 1X (ISO/IEC 16022) stays inside the row
        expect(s.box.yMm - s.moduleMm).toBeGreaterThanOrEqual(b.yMm - 1e-9);
        expect(s.box.yMm + s.box.heightMm + s.moduleMm).toBeLessThanOrEqual(
          b.yMm + CUT_SHEET_LAYOUT.rowMm + 1e-9,
        );
      }
    }
  });

  it("formats the plan date in UTC", () => {
    expect(formatPlanDate("2026-12-01T14:05:00Z")).toBe("2026-12-01 14:05 UTC");
  });
});

describe("cut sheet PDF", () => {
  it("has the page size asked for: ISO 216 A4 or ANSI Letter", () => {
    for (const r of rendered) {
      const info = tool("pdfinfo", [r.file]);
      expect(info).toMatch(new RegExp(`Pages:\\s+${r.vm.pageCount}\\b`));
      // 210 × 297 mm = 595.28 × 841.89 pt; 8.5 × 11 in = 612 × 792 pt
      if (r.size === "A4") expect(info).toMatch(/Page size:\s+595\.2\d* x 841\.8\d* pts/);
      else expect(info).toMatch(/Page size:\s+612 x 792 pts/);
    }
  });

  it("lists every cut exactly once", () => {
    for (const r of rendered) {
      const text = r.pages.join("\n");
      for (const c of ALL_CUTS) {
        const hits = text.match(new RegExp(`\\b${c.wireId}\\b`, "g")) ?? [];
        expect(hits, `${c.wireId} on ${r.size}`).toHaveLength(1);
        expect(text).toContain(c.traceCode);
      }
    }
  });

  it("numbers its pages 'page x of y' and repeats header and caution on each", () => {
    for (const r of rendered) {
      expect(r.vm.pageCount).toBeGreaterThan(2);
      r.pages.forEach((p, i) => {
        expect(p).toContain(`page ${i + 1} of ${r.vm.pageCount}`);
        expect(p).toContain("Cut sheet — Harrow-3 orchard mower");
        expect(p).toContain("Plan of 2026-12-01 14:05 UTC");
        expect(p.replace(/\s+/g, " ")).toContain("local codes and licensed practice take precedence");
      });
    }
  });

  it("continues a long section on the next page with its headers repeated", () => {
    const spool2 = INPUT.spools[1]!.cuts.map((c) => c.wireId);
    for (const r of rendered) {
      const pagesWith = r.pages
        .map((p, i) => [i, p] as const)
        .filter(([, p]) => spool2.some((id) => p.includes(id)));
      expect(pagesWith.length).toBeGreaterThan(1);
      pagesWith.forEach(([, p], k) => {
        expect(p).toContain("Spool 2 of 3: 18 AWG WH TXL");
        expect(p).toContain("Wire ID");
        expect(p.includes("Spool 2 of 3: 18 AWG WH TXL (continued)")).toBe(k > 0);
      });
    }
  });

  it("shows the bench steps in the trade's order, the spool sources, leftovers and totals", () => {
    for (const r of rendered) {
      const first = r.pages[0]!.replace(/\s+/g, " ");
      const order = [
        "Cut to length",
        "Slide the markers on",
        "Strip both ends",
        "Terminate",
        "Shrink the markers",
      ].map((s) => first.indexOf(s));
      expect(order.every((v) => v >= 0)).toBe(true);
      expect([...order].sort((a, b) => a - b)).toEqual(order);
      const all = r.pages.join("\n").replace(/\s+/g, " ");
      expect(all).toContain(
        "4 AWG, RD (red), GXL. From the shelf: 6200 mm on the spool, lot L-2211, at Rack B3",
      );
      expect(all).toContain(
        "New put-up: 152400 mm nominal (152.40 m), part TXL18-WH-500, from Orchard Supply (example)",
      );
      expect(all).toContain("Leftover 420 mm (0.42 m): scrap.");
      expect(all).toContain("Leftover 31000 mm (31.00 m): label it and put it back on the shelf.");
      expect(all).toContain("Cuts: 83");
      expect(all).toContain(`Cut length: ${ALL_CUTS.reduce((a, c) => a + c.cutLengthMm, 0)} mm`);
      expect(all).toContain("Cost of new put-ups: not known");
      expect(all).toContain("Spools: 3 (1 from the shelf, 2 new)");
    }
  });

  it("embeds all its fonts", () => {
    for (const r of rendered) {
      const rows = tool("pdffonts", [r.file])
        .split("\n")
        .slice(2)
        .filter((l) => l.trim());
      expect(rows.length).toBeGreaterThanOrEqual(2);
      for (const row of rows) expect(row).toMatch(/CID TrueType\s+Identity-H\s+yes\s+yes/);
    }
  });

  it("sets no text below 9 pt (legible at 100 % scale)", () => {
    // pdftotext's word box is the font's ascender-to-descender line at its size (pdfkit's line box).
    const perPt = Math.min(...(["regular", "bold", "mono"] as const).map((f) => lineHeightPt(f, 1)));
    for (const r of rendered) {
      const html = tool("pdftotext", ["-bbox", r.file, "-"]);
      const heights = [
        ...html.matchAll(/<word xMin="[\d.]+" yMin="([\d.]+)" xMax="[\d.]+" yMax="([\d.]+)">/g),
      ].map((m) => Number(m[2]) - Number(m[1]));
      expect(heights.length).toBeGreaterThan(500);
      expect(Math.min(...heights) / perPt).toBeGreaterThanOrEqual(9 - 0.01);
    }
  });

  it("prints Data Matrix symbols a reader decodes to the trace codes", () => {
    const r = rendered[0]!;
    const page = r.vm.pages[0]!;
    tool("pdftoppm", [
      "-r",
      "300",
      "-gray",
      "-f",
      "1",
      "-l",
      "1",
      "-singlefile",
      r.file,
      path.join(dir, "p1"),
    ]);
    const b = fs.readFileSync(path.join(dir, "p1.pgm"));
    const head = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(b.subarray(0, 40).toString("latin1"))!;
    const width = Number(head[1]);
    const px = b.subarray(head[0].length);
    const rows = page.blocks.flatMap((bl) => (bl.kind === "cut" ? [bl] : [])).slice(0, 6);
    expect(rows.length).toBe(6);
    for (const row of rows) {
      const s = row.row.symbol!;
      const toPx = (mm: number) => Math.round((mm / 25.4) * 300);
      const [x0, y0] = [toPx(s.box.xMm - 0.6), toPx(row.yMm)];
      const [w, h] = [toPx(s.box.widthMm + 1.2), toPx(CUT_SHEET_LAYOUT.rowMm)];
      const crop = Buffer.alloc(w * h);
      for (let y = 0; y < h; y++) px.copy(crop, y * w, (y0 + y) * width + x0, (y0 + y) * width + x0 + w);
      const file = path.join(dir, `${row.row.wireId}.pgm`);
      fs.writeFileSync(file, Buffer.concat([Buffer.from(`P5\n${w} ${h}\n255\n`), crop]));
      expect(tool("dmtxread", ["-n", "-N", "1", file]).trim()).toBe(row.row.traceCode);
    }
  });
});
