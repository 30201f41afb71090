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

describe("signing in as each demo role", () => {
  it.each([
    ["lead@example.test", "Lead"],
    ["builder@example.test", "Builder"],
    ["technician@example.test", "Technician"],
  ])("%s opens the Harrow-3 runs table and signs out", async (email, roleLabel) => {
    const { page } = browser;
    await signInAs(page, baseUrl, email);
    await expect(page.getByRole("banner").getByText(roleLabel, { exact: true }).isVisible()).resolves.toBe(
      true,
    );
    await page.getByRole("link", { name: /Harrow-3/ }).click();
    await page.getByRole("table", { name: "Runs" }).waitFor();
    await expect(page.getByRole("cell", { name: "HR3-001", exact: true }).isVisible()).resolves.toBe(true);
    expect(await page.getByText("62 runs", { exact: true }).isVisible()).toBe(true);

    // Sorting by routed length puts the shortest demo run (HR3-054, 160 mm) first.
    await page.getByRole("button", { name: /Routed \(mm\)/ }).click();
    expect(await page.locator("tbody tr[data-run]").first().getAttribute("data-run")).toBe("HR3-054");

    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(`${baseUrl}/sign-in`);
  });

  it("a wrong password shows an error and keeps the e-mail typed", async () => {
    const { page } = browser;
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel("E-mail").fill("lead@example.test");
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    // Next adds its own role=alert route announcer; the form's alert is the one inside the form.
    const alert = page.locator("form").getByRole("alert");
    await alert.waitFor();
    expect(await alert.innerText()).toMatch(/do not match/);
    expect(await page.getByLabel("E-mail").inputValue()).toBe("lead@example.test");
  });
});

describe("anonymous visitors", () => {
  it.each(["/projects", "/projects/00000000-0000-0000-0000-000000000000", "/"])(
    "%s redirects to sign-in",
    async (path) => {
      const { page } = browser;
      await browser.context.clearCookies();
      await page.goto(`${baseUrl}${path}`);
      expect(new URL(page.url()).pathname).toBe("/sign-in");
    },
  );

  it("API calls get 401 JSON", async () => {
    await browser.context.clearCookies();
    const r = await browser.page.request.get(`${baseUrl}/api/projects`);
    expect(r.status()).toBe(401);
    expect(await r.json()).toEqual({ error: { code: "unauthorized", message: expect.any(String) } });
  });
});
