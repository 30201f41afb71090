import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, signInAs, type Browser } from "../helpers/browser";

const baseUrl = inject("baseUrl");
let browser: Browser;

beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function pdfAt(href: string): Promise<Buffer> {
  const r = await browser.page.request.get(new URL(href, baseUrl).toString());
  expect(r.status()).toBe(200);
  expect(r.headers()["content-type"]).toBe("application/pdf");
  const body = await r.body();
  expect(body.subarray(0, 5).toString()).toBe("%PDF-");
  return body;
}

describe("the Print screen", () => {
  it("previews marker strips for chosen runs, downloads them, and downloads a plan's cut sheet", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, "builder@example.test");
    await page.getByRole("link", { name: /Harrow-3/ }).click();
    await page.getByRole("link", { name: "Print" }).click();
    await page.getByRole("form", { name: "Print options" }).waitFor();
    await page.getByLabel("these wire IDs (reprint)").check();
    await page.getByLabel("Wire IDs", { exact: true }).fill("HR3-001, HR3-027, HR3-049");
    await page.getByText("3 runs chosen").waitFor();
    await page.getByRole("button", { name: "Preview" }).click();
    await page.getByTitle("Marker preview").waitFor();

    const href = await page.getByRole("link", { name: "Download marker PDF" }).getAttribute("href");
    expect(href).toMatch(/markers\.pdf\?template=.*runs=HR3-001%2CHR3-027%2CHR3-049/);
    await pdfAt(href!);

    // A plan made by the lead; the builder downloads its cut sheet from the Spool plan screen.
    const projects = (await (await page.request.get(`${baseUrl}/api/projects`)).json()) as {
      items: { id: string; name: string }[];
    };
    const projectId = projects.items.find((p) => p.name === "Harrow-3")!.id;
    const lead = await openBrowser();
    try {
      await signInAs(lead.page, baseUrl, "lead@example.test");
      expect((await lead.page.request.post(`${baseUrl}/api/projects/${projectId}/plans`)).status()).toBe(201);
    } finally {
      await lead.close();
    }
    await page.getByRole("link", { name: "Spool plan" }).click();
    const sheet = page.getByRole("link", { name: "Cut sheet PDF" });
    await sheet.waitFor();
    await pdfAt((await sheet.getAttribute("href"))!);
  });
});
