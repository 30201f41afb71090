// A technician opens a run's trace page through the Scan screen and records a test result, which the trace page
// and the runs table then show; a stale form is refused and shows the newer state; the camera reads markers.
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, signInAs, type Browser } from "../helpers/browser";
import { writeFakeCamera } from "../helpers/fake-camera";

const baseUrl = inject("baseUrl");
let browser: Browser;
const opened: Browser[] = [];
const tmp = mkdtempSync(path.join(os.tmpdir(), "loomwright-camera-"));

type Run = { id: string; wireId: string; traceCode: string; version: number };

beforeAll(async () => {
  browser = await openBrowser({ viewport: { width: 390, height: 844 } });
});
afterAll(async () => {
  await browser?.close();
  for (const b of opened) await b.close();
  rmSync(tmp, { recursive: true, force: true });
});

async function demoRun(b: Browser, wireId: string): Promise<Run & { projectId: string }> {
  const projects = await (await b.page.request.get(`${baseUrl}/api/projects`)).json();
  const p = (projects as { items: { id: string; name: string }[] }).items.find((x) => x.name === "Harrow-3")!;
  const runs = (await (
    await b.page.request.get(`${baseUrl}/api/projects/${p.id}/runs?limit=1000`)
  ).json()) as {
    items: Run[];
  };
  return { ...runs.items.find((r) => r.wireId === wireId)!, projectId: p.id };
}

describe("scan a marker, then record its test", () => {
  it("opens the run by its typed code, records a pass, and shows it on the trace page and in the runs table", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, "technician@example.test");
    const run = await demoRun(browser, "HR3-021");

    await page.getByRole("link", { name: "Scan" }).click();
    await page.waitForURL(`${baseUrl}/scan`);
    await page.getByRole("button", { name: "Start camera" }).waitFor();
    // Unknown and malformed codes get a clear message and stay on the screen.
    const field = page.getByLabel("Marker code or trace link");
    await field.fill("hello");
    await field.press("Enter");
    await page.getByText(/A marker code is 8 letters and digits/).waitFor();
    await field.fill("ZZZZ-ZZZZ");
    await field.press("Enter");
    await page.getByText("No run with that code").waitFor();
    expect(page.url()).toBe(`${baseUrl}/scan`);

    // As a handheld scanner would: the code, then Enter.
    await field.fill(run.traceCode.toLowerCase());
    await field.press("Enter");
    await page.waitForURL(`${baseUrl}/r/${run.traceCode}`);
    await page.getByRole("article", { name: `Wire ${run.wireId}` }).waitFor();
    expect(await page.getByText("Not tested yet.").isVisible()).toBe(true);

    const form = page.getByRole("region", { name: "Record a test" });
    await form.getByLabel("Continuity (Ω)").check();
    await form.getByLabel("Reading (Ω)").fill("0,042");
    await form.getByLabel(/Note/).fill("both crimps pulled");
    await form.getByRole("button", { name: "✓ Pass" }).click();
    await page.getByText("Pass recorded").waitFor();
    const latest = page.getByRole("group", { name: "Latest test" });
    await latest.waitFor();
    expect(await latest.innerText()).toMatch(/Pass · Continuity[\s\S]*0\.042 Ω[\s\S]*both crimps pulled/);
    expect(await page.getByRole("article").innerText()).toMatch(/recorded a continuity test: pass, 0\.042 Ω/);

    await page.getByRole("link", { name: /Harrow-3/ }).click();
    await page.getByRole("table", { name: "Runs" }).waitFor();
    await page.getByRole("searchbox").fill(run.wireId);
    const row = page.locator(`tr[data-run="${run.wireId}"]`);
    await row.waitFor();
    expect(await row.innerText()).toMatch(/tested[\s\S]*Pass[\s\S]*cont\. 0\.042 Ω/i);
  });

  it("refuses a result from a stale page with the newer state shown, and sends a failed run back", async () => {
    const { page } = browser;
    const run = await demoRun(browser, "HR3-022");
    await page.goto(`${baseUrl}/r/${run.traceCode}`);
    const form = page.getByRole("region", { name: "Record a test" });
    await form.waitFor();
    // Meanwhile someone else records an insulation fail on the same run.
    const other = await page.request.patch(`${baseUrl}/api/projects/${run.projectId}/runs/${run.id}`, {
      data: { version: run.version, state: "failed", testKind: "insulation", testValue: 0.2 },
    });
    expect(other.status()).toBe(200);
    await form.getByRole("button", { name: "✓ Pass" }).click();
    await page.getByText("Not saved: the run changed meanwhile").waitFor();
    expect(await page.getByText(/it is now failed/).isVisible()).toBe(true);
    const latest = page.getByRole("group", { name: "Latest test" });
    await latest.getByText(/Fail · Insulation/).waitFor();

    await page.getByRole("button", { name: "Rework the ends (cut)" }).click();
    await page.getByText("Sent back").waitFor();
    await page.getByRole("article").getByText("cut", { exact: true }).first().waitFor();
  });
});

describe("the camera", () => {
  for (const [symbol, what] of [
    ["datamatrix", "a trace link in a Data Matrix"],
    ["code128", "a bare code in Code 128"],
    ["qrcode", "a trace link in a QR code"],
  ] as const) {
    it(`reads ${what} and opens the run`, async () => {
      const run = await demoRun(browser, symbol === "datamatrix" ? "HR3-030" : "HR3-031");
      const file = path.join(tmp, `${symbol}.y4m`);
      writeFakeCamera(
        file,
        symbol,
        symbol === "datamatrix" ? `${baseUrl}/r/${run.traceCode}` : run.traceCode,
      );
      const cam = await openBrowser({
        args: [
          "--use-fake-device-for-media-stream",
          "--use-fake-ui-for-media-stream",
          `--use-file-for-fake-video-capture=${file}`,
        ],
      });
      opened.push(cam);
      await signInAs(cam.page, baseUrl, "technician@example.test");
      await cam.page.goto(`${baseUrl}/scan`);
      // Allowed before (the fake permission UI grants it), the camera starts by itself; otherwise press Start.
      const deadline = Date.now() + 20_000;
      while (!cam.page.url().endsWith(`/r/${run.traceCode}`)) {
        const start = cam.page.getByRole("button", { name: "Start camera" });
        // The button may go away between the check and the click once the camera starts: do not wait for it.
        if (await start.isVisible()) await start.click({ timeout: 1000 }).catch(() => undefined);
        expect(Date.now(), "read the barcode within 20 s").toBeLessThan(deadline);
        await cam.page.waitForTimeout(200);
      }
      await cam.page.getByRole("article", { name: `Wire ${run.wireId}` }).waitFor();
    });
  }

  it("says so when there is no camera", async () => {
    const none = await openBrowser();
    opened.push(none);
    await signInAs(none.page, baseUrl, "builder@example.test");
    await none.page.goto(`${baseUrl}/scan`);
    await none.page.getByRole("button", { name: "Start camera" }).click();
    await none.page.getByText(/No camera found|Camera permission denied/).waitFor();
    // The typed code still works for every role.
    expect(await none.page.getByLabel("Marker code or trace link").isEditable()).toBe(true);
  });
});
