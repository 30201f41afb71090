import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, signInAs, type Browser } from "../helpers/browser";
import { signedIn } from "../helpers/http";

const baseUrl = inject("baseUrl");
let browser: Browser;
let projectId = "";
let traceCodes: string[] = [];

beforeAll(async () => {
  browser = await openBrowser({ viewport: { width: 390, height: 844 } });
  // The lead sets up a project of three runs on a wire type of its own, a shelf spool for it, and a committed plan.
  const lead = await signedIn(baseUrl, "lead@example.test");
  const tag = `E2E-BENCH-${Date.now()}`;
  const wt = await lead.post<{ id: string }>("/api/stock/wire-types", {
    gauge: "20 AWG",
    colour: "OG",
    insulation: tag,
  });
  expect(wt.status).toBe(201);
  const sp = await lead.post("/api/stock/spools", {
    wireTypeId: wt.body.id,
    lengthMm: 20_000,
    lot: "LOT-E2E-9",
    location: "Rack 4",
  });
  expect(sp.status).toBe(201);
  const pr = await lead.post<{ id: string }>("/api/projects", {
    name: `Bench e2e ${tag}`,
    wireIdPrefix: "BE-",
  });
  projectId = pr.body.id;
  const made = await lead.post(`/api/projects/${projectId}/runs`, {
    runs: [1500, 1200, 900].map((routedLengthMm, i) => ({
      endA: `J1:${i + 1}`,
      endB: `M2:${i + 1}`,
      gauge: "20 AWG",
      colour: "OG",
      insulation: tag,
      routedLengthMm,
    })),
  });
  expect(made.status).toBe(201);
  const runs = await lead.get<{ items: { traceCode: string }[] }>(`/api/projects/${projectId}/runs?limit=10`);
  traceCodes = runs.body.items.map((r) => r.traceCode);
  const plan = await lead.post<{ id: string }>(`/api/projects/${projectId}/plans`);
  expect(plan.status).toBe(201);
  expect((await lead.post(`/api/plans/${plan.body.id}/commit`)).status).toBe(200);
});
afterAll(async () => {
  await browser?.close();
});

const metresIn = (text: string) => Number(/([\d.]+) m left/.exec(text)![1]);

describe("the Bench screen on a phone", () => {
  it("a builder records three cuts from a spool and sees its length go down; a technician sees the spool on the trace page and records a test", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, "builder@example.test");
    await page.goto(`${baseUrl}/projects/${projectId}/bench`);
    const remaining = page.getByTestId("spool-remaining");
    await remaining.waitFor();
    await page.getByRole("button", { name: /Spool 1: Shelf spool · lot LOT-E2E-9/ }).click();
    await page.getByRole("button", { name: "cut", exact: true }).click();
    let left = metresIn(await remaining.innerText());
    expect(left).toBe(20);
    for (let i = 0; i < 3; i++) {
      const wire = await page.getByTestId("current-wire-id").innerText();
      await page.getByRole("button", { name: /^Cut ✓/ }).click();
      await page.getByText(new RegExp(`${wire} planned → cut · Recorded`)).waitFor();
      await page.waitForFunction((prev) => {
        const t = document.querySelector('[data-testid="spool-remaining"]')?.textContent ?? "";
        const m = /([\d.]+) m left/.exec(t);
        return m && Number(m[1]) < prev;
      }, left);
      const now = metresIn(await remaining.innerText());
      expect(now).toBeLessThan(left);
      left = now;
    }
    await page.getByText(/Spool 1 is done to “cut”/).waitFor();
    expect(left).toBeLessThan(20 - 3.6);

    await browser.context.clearCookies();
    await signInAs(page, baseUrl, "technician@example.test");
    await page.goto(`${baseUrl}/r/${traceCodes[0]}`);
    const cutSection = page.getByRole("region", { name: "Cut from spool" });
    await cutSection.waitFor();
    const text = await cutSection.innerText();
    expect(text).toMatch(/Cut from spool lot LOT-E2E-9, location Rack 4 by .+ at /);

    // The technician records a continuity test on the same page and sees it there.
    const form = page.getByRole("region", { name: "Record a test" });
    await form.getByLabel(/^Reading/).fill("0.05");
    await form.getByRole("button", { name: "✓ Pass" }).click();
    await page
      .getByText(/tested/i)
      .first()
      .waitFor();
    await page.waitForFunction(() => document.body.textContent?.includes("0.05 Ω"));
  });
});
