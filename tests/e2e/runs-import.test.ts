import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, signInAs, type Browser } from "../helpers/browser";

const baseUrl = inject("baseUrl");
let a: Browser;
let b: Browser;

beforeAll(async () => {
  a = await openBrowser();
  b = await openBrowser();
});
afterAll(async () => {
  await a?.close();
  await b?.close();
});

// "Wire thickness" is not a header Loomwright knows, so the user maps it to the gauge field by hand.
const CSV = [
  "Wire ID,From,To,Wire thickness,Colour,Length (m),Amps,Circuit",
  "IMP-001,BAT2:+,F5:1,10 AWG,red,0.35,20,Aux battery feed",
  "IMP-002,F5:2,TB5:1,10 AWG,red,1.2,20,Aux fuse to terminal block",
  "IMP-003,TB5:2,LMP1:+,18,white/blue,2.4,1.5,Lamp feed",
].join("\n");

describe("importing and editing runs", () => {
  it("imports through the drop zone, fixes a mapping, commits, edits a cell, and refuses a stale edit", async () => {
    await signInAs(a.page, baseUrl, "lead@example.test");
    await a.page.getByRole("button", { name: "New project" }).click();
    await a.page.getByLabel("Project name").fill(`Import e2e ${Date.now()}`);
    await a.page.getByLabel("Wire-ID prefix").fill("IMP-");
    await a.page.getByRole("button", { name: "Create" }).click();
    await a.page.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
    const id = new URL(a.page.url()).pathname.split("/").pop()!;

    // The settings show the slack rule's defaults.
    await a.page.getByRole("link", { name: "Settings" }).click();
    expect(await a.page.getByLabel("Slack, percent of routed length").inputValue()).toBe("5");
    await a.page.getByRole("link", { name: "Runs" }).click();

    await a.page.getByRole("button", { name: "Import a run list" }).click();
    await a.page.getByLabel("Run list file").setInputFiles({
      name: "aux-runs.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(CSV),
    });
    const errors = a.page.getByRole("list", { name: "Import errors" });
    await errors.waitFor();
    expect(await errors.innerText()).toMatch(/gauge/i);
    expect(await a.page.getByRole("button", { name: /Commit/ }).isDisabled()).toBe(true);

    await a.page.getByLabel("Field for column Wire thickness").selectOption("gauge");
    await a.page.getByRole("button", { name: "Commit 3 runs" }).waitFor();
    await a.page.waitForFunction(() => !document.querySelector('[aria-label="Import errors"]'));
    await a.page.getByRole("button", { name: "Commit 3 runs" }).click();
    await a.page.getByText(/Imported aux-runs\.csv: 3 added/).waitFor();
    await a.page.locator('tr[data-run="IMP-003"]').waitFor();
    // 2.4 m routed → cut length under the default slack rule is longer than routed, in whole 5 mm steps.
    const row3 = a.page.locator('tr[data-run="IMP-003"]');
    expect(await row3.innerText()).toMatch(/2,400/);

    // Browser B opens the same project before A's edit.
    await signInAs(b.page, baseUrl, "lead@example.test");
    await b.page.goto(`${baseUrl}/projects/${id}`);
    await b.page.locator('tr[data-run="IMP-003"]').waitFor();

    // A edits the routed length in place.
    await row3.locator("td").nth(8).dblclick();
    const editor = a.page.getByLabel("Routed (mm) of IMP-003");
    await editor.fill("2600");
    await editor.press("Enter");
    await a.page.waitForFunction(() =>
      document.querySelector('tr[data-run="IMP-003"]')?.textContent?.includes("2,600"),
    );

    // B, still showing version 1, edits the circuit and is refused; its table then shows A's value.
    const bRow = b.page.locator('tr[data-run="IMP-003"]');
    await bRow.locator("td").nth(4).dblclick();
    const bEditor = b.page.getByLabel("Circuit of IMP-003");
    await bEditor.fill("Lamp feed (rev B)");
    await bEditor.press("Enter");
    await b.page.getByText(/Someone else changed this run/).waitFor();
    await b.page.waitForFunction(() =>
      document.querySelector('tr[data-run="IMP-003"]')?.textContent?.includes("2,600"),
    );
    expect(await bRow.innerText()).not.toMatch(/rev B/);
  });
});
