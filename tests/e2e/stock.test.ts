import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from "vitest";
import { openBrowser, signInAs, type Browser } from "../helpers/browser";

const baseUrl = inject("baseUrl");
let browser: Browser;

beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => {
  await browser?.close();
});
beforeEach(async () => {
  await browser.context.clearCookies();
});

describe("Stock as the lead", () => {
  it("adds a put-up, adjusts a shelf spool's length with a reason and sees the history", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, "lead@example.test");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Stock" }).click();
    await page.waitForURL(`${baseUrl}/stock`);
    const wireTypes = page.getByRole("table", { name: "Wire types" });
    await wireTypes.waitFor();
    expect(await wireTypes.locator("tbody tr").count()).toBeGreaterThanOrEqual(30);

    // Put-ups: add a 250 ft spool of 18 AWG red UL 1007 from a new supplier.
    await page.getByRole("link", { name: "Put-ups" }).click();
    await page.getByRole("table", { name: "Put-ups" }).waitFor();
    await page.getByRole("button", { name: "Add put-up" }).click();
    const dialog = page.getByRole("dialog", { name: "New put-up" });
    await dialog.waitFor();
    await dialog.getByLabel("Wire type").selectOption({ label: "18 AWG RD · UL 1007" });
    await dialog.getByLabel("Length").fill("250");
    expect(await dialog.getByLabel("Unit").inputValue()).toBe("ft");
    await dialog.getByLabel("Price").fill("31.99");
    await dialog.getByLabel("Supplier", { exact: true }).fill("Larkfield Electrical");
    await dialog.getByLabel("Supplier part number").fill("LF-18RD-250");
    await dialog.getByText("76,200 mm").waitFor(); // 250 ft × 304.8 mm
    await dialog.getByRole("button", { name: "Add put-up" }).click();
    await dialog.waitFor({ state: "hidden" });
    await page.getByText(/Saved the 76\.20 m put-up of 18 AWG RD/).waitFor();
    const row = page.getByRole("row").filter({ hasText: "LF-18RD-250" });
    await row.waitFor();
    expect(await row.innerText()).toMatch(
      /76\.20 m · 250 ft[\s\S]*\$31\.99[\s\S]*\$0\.420[\s\S]*Larkfield Electrical/,
    );

    // Shelf spools: a reason is required, then the new length and its history show.
    await page.getByRole("link", { name: "Shelf spools" }).click();
    await page.getByRole("table", { name: "Shelf spools" }).waitFor();
    await page.getByRole("button", { name: "Adjust length of spool NG-2608-1139" }).click();
    const adjust = page.getByRole("dialog", { name: "Adjust the length of spool NG-2608-1139" });
    await adjust.waitFor();
    await adjust.getByText("Tape-measured; the label count was off after a re-cut").waitFor(); // the seeded history
    await adjust.getByLabel("Measured length").fill("5.8");
    await adjust.getByRole("button", { name: "Save length" }).click();
    await adjust.getByText(/Say why the length changed/).waitFor();
    await adjust.getByLabel("Reason").fill("Re-measured after the beacon test cuts");
    await adjust.getByRole("button", { name: "Save length" }).click();
    await adjust.getByText(/Recorded 5\.80 m/).waitFor();
    const history = adjust.getByRole("list", { name: "Adjustments" });
    const latest = history.getByRole("listitem").first();
    await latest.getByText("Re-measured after the beacon test cuts").waitFor();
    expect(await latest.innerText()).toMatch(/6\.15 m → 5\.80 m[\s\S]*Mara Quill/);
    expect(await history.getByRole("listitem").count()).toBe(2);
    await adjust.getByRole("button", { name: "Close" }).click();
    const spoolRow = page.getByRole("row").filter({ hasText: "NG-2608-1139" });
    await spoolRow.getByText("5.80 m").waitFor();

    // The project page links to its missing wire types; the demo has none missing.
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Projects" }).click();
    await page.getByRole("link", { name: /Harrow-3/ }).click();
    await page.getByRole("link", { name: /Wire types missing from Stock/ }).click();
    await page.getByRole("heading", { name: "Wire types missing for project Harrow-3" }).waitFor();
    await page.getByText("Every run has its wire type").waitFor();
  });
});

describe("Stock as a builder", () => {
  it("is read-only: no add, edit or adjust controls, the history can be read, and writes are refused", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, "builder@example.test");
    await page.goto(`${baseUrl}/stock`);
    await page.getByRole("table", { name: "Wire types" }).waitFor();
    await page.getByText("Only the team's lead adds or changes it.").waitFor();
    expect(await page.getByRole("button", { name: /Add wire type|Edit|Delete/ }).count()).toBe(0);

    await page.getByRole("link", { name: "Put-ups" }).click();
    await page.getByRole("table", { name: "Put-ups" }).waitFor();
    expect(await page.getByRole("button", { name: /Add put-up|Edit|Delete/ }).count()).toBe(0);

    await page.getByRole("link", { name: "Shelf spools" }).click();
    await page.getByRole("table", { name: "Shelf spools" }).waitFor();
    expect(await page.getByRole("button", { name: /Add spool|Adjust length|Edit/ }).count()).toBe(0);
    await page.getByRole("button", { name: "History of spool NG-2608-1142" }).click();
    const dialog = page.getByRole("dialog", { name: "History of spool NG-2608-1142" });
    await dialog.getByText("Re-measured on the bench after the sensor-mast test cuts").waitFor();
    expect(await dialog.getByRole("button", { name: "Save length" }).count()).toBe(0);

    const spools = (await (await page.request.get(`${baseUrl}/api/stock/spools?limit=1`)).json()) as {
      items: { id: string; version: number }[];
    };
    const r = await page.request.post(`${baseUrl}/api/stock/spools/${spools.items[0]!.id}/adjustments`, {
      data: { lengthMm: 1, reason: "Not allowed" },
    });
    expect(r.status()).toBe(403);
  });
});
