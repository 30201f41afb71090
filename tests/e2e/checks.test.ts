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

describe("the Checks screen", () => {
  it("shows the cautions and a failing run explained by its rule", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, "technician@example.test");
    await page.getByRole("link", { name: /Harrow-3/ }).click();
    await page.getByRole("link", { name: "Checks" }).click();
    await page.getByRole("table", { name: "Checks" }).waitFor();
    expect(await page.getByRole("region", { name: "Cautions" }).innerText()).toMatch(/local codes/i);
    expect(await page.getByRole("img", { name: /Voltage drop as a share/ }).isVisible()).toBe(true);

    await page.getByRole("button", { name: /^Fail \(\d+\)$/ }).click();
    const row = page.locator('tr[data-run="HR3-047"]');
    await row.waitFor();
    expect(await row.innerText()).toMatch(/Fail/);
    await row.getByRole("button").click();
    const detail = page.locator('tr[data-run="HR3-047"] + tr');
    expect(await detail.innerText()).toMatch(/fuse/i);
    expect(await detail.innerText()).toMatch(/ABYC|183\.425/);
  });
});
