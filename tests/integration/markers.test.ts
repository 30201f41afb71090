import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { signedIn, type Client } from "../helpers/http";

// Round trip through the app: marker PDF for demo runs → 300 dpi raster (poppler's pdftoppm) → independent
// decoders (zbar for Code 128 and QR, libdmtx for Data Matrix) → every decoded value opens its run via the API.
const baseUrl = inject("baseUrl");
const WIRES = ["HR3-001", "HR3-005", "HR3-019", "HR3-021", "HR3-031", "HR3-053", "HR3-062"];
let dir = "";
let tech: Client;
let projectId = "";

function tool(cmd: string, args: string[]): string {
  const r = spawnSync(cmd, args, { encoding: "utf8", maxBuffer: 64 * 1024 * 1024, timeout: 120_000 });
  if (r.error)
    throw new Error(
      `${cmd} failed: ${r.error.message} (npm test installs poppler-utils, zbar-tools, dmtx-utils)`,
    );
  return r.stdout;
}

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "loomwright-markers-api-"));
  tech = await signedIn(baseUrl, "technician@example.test");
  const list = await tech.get<{ items: { id: string; name: string }[] }>("/api/projects");
  projectId = list.body.items.find((p) => p.name === "Harrow-3")!.id;
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe("marker PDF round trip", () => {
  it("prints both ends of every chosen run, and every barcode leads back to its run", async () => {
    const res = await fetch(
      `${baseUrl}/api/projects/${projectId}/markers.pdf?template=a4-proof-mixed&runs=${WIRES.join(",")}`,
      { headers: { cookie: tech.cookieHeader() } },
    );
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    // One marker at each end of each run (the demo project repeats none along the run).
    expect(Number(res.headers.get("x-marker-count"))).toBe(WIRES.length * 2);
    const pdfPath = path.join(dir, "markers.pdf");
    fs.writeFileSync(pdfPath, Buffer.from(await res.arrayBuffer()));
    expect(tool("pdffonts", [pdfPath])).toMatch(/yes\s+yes/); // embedded, subset

    tool("pdftoppm", ["-r", "300", "-gray", "-png", pdfPath, path.join(dir, "page")]);
    const pages = fs.readdirSync(dir).filter((f) => f.startsWith("page") && f.endsWith(".png"));
    expect(pages.length).toBeGreaterThan(0);
    const values: string[] = [];
    for (const p of pages) {
      const file = path.join(dir, p);
      const zbar = tool("zbarimg", ["--raw", "--nodbus", "-q", file]);
      values.push(...zbar.split("\n").filter(Boolean));
      const dmtx = tool("dmtxread", ["-n", "-m", "8000", file]);
      values.push(...dmtx.split("\n").filter(Boolean));
    }

    // Both markers of a run carry the same value, and a whole-page decode reports a value once; the unit
    // round trip (tests/unit/pdf-markers.test.ts) decodes each marker cell on its own.
    const found = new Set<string>();
    for (const v of new Set(values)) {
      const r = await tech.get<{ run: { wireId: string } }>(`/api/trace/${encodeURIComponent(v)}`);
      expect(r.status, `decoded "${v}" does not open a run`).toBe(200);
      found.add(r.body.run.wireId);
    }
    expect([...found].sort()).toEqual([...WIRES].sort());
  }, 180_000);

  it("refuses an unknown template or an empty choice with clear errors", async () => {
    expect((await tech.get(`/api/projects/${projectId}/markers.pdf?template=nope`)).status).toBe(404);
    const r = await tech.get<{ error: { message: string } }>(
      `/api/projects/${projectId}/markers.pdf?runs=NO-SUCH`,
    );
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/nothing to print/);
  });
});
