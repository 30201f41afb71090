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

describe("the Spool plan screen", () => {
  it("plans the demo project, commits it, sends the purchase list and finds the mail in the Mailbox", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, "lead@example.test");
    await page.getByRole("link", { name: /Harrow-3/ }).click();
    await page.getByRole("link", { name: "Spool plan" }).click();
    // Another test may have made a plan already: then the button reads "Make a new plan".
    await page.getByRole("button", { name: /^Make a (spool|new) plan$/ }).click();
    const summary = page.getByRole("region", { name: "Plan summary" });
    await summary.waitFor({ timeout: 30_000 });
    expect(await summary.innerText()).toMatch(/Proven lower bound/i);
    // The new plan's spools are drawn once it has loaded (another test's plan may show first).
    const bars = page.getByRole("img", { name: /cuts, \d+ mm used of/ });
    await page.waitForFunction(
      () => document.querySelectorAll('[role="img"][aria-label*="mm used of"]').length > 5,
      undefined,
      { timeout: 30_000 },
    );
    expect(await bars.count()).toBeGreaterThan(5);

    await page.getByRole("button", { name: "Commit plan" }).click();
    await page.getByText(/Committed: the shelf spools are reserved/).waitFor();

    const to = `purchasing-${Date.now()}@example.test`;
    await page.getByLabel("Mail the list to").fill(to);
    await page.getByRole("button", { name: "Send purchase list" }).click();
    await page.getByText(`Purchase list sent to ${to}.`).waitFor();

    await page.getByRole("link", { name: "Mailbox" }).click();
    await page
      .getByText(/Purchase list — Harrow-3/)
      .first()
      .waitFor();
    expect(await page.getByText(to).first().isVisible()).toBe(true);
  });
});
