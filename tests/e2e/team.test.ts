import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { openBrowser, signInAs, type Browser } from "../helpers/browser";

const baseUrl = inject("baseUrl");
const stamp = Date.now().toString(36);
let browser: Browser;

beforeAll(async () => {
  browser = await openBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("inviting a builder", () => {
  const email = `bench-builder-${stamp}@example.test`;
  const password = "bench-builder-pw-1";

  it("a lead invites a builder from the Team screen", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, "lead@example.test");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Team" }).click();
    await page.waitForURL(`${baseUrl}/team`);
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Role", { exact: true }).selectOption("builder");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText(`Invitation sent to ${email}.`).waitFor();
    const open = page.getByRole("list", { name: "Open invitations" });
    // The notice comes first; the list refreshes right after it.
    await open.getByText(email).waitFor();
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(`${baseUrl}/sign-in`);
  });

  it("the builder accepts from the Mailbox page, setting a name and password", async () => {
    const { page } = browser;
    await page.goto(`${baseUrl}/dev/mail`);
    await page
      .getByRole("button", { name: /You are invited to Cedar Flats Robotics/ })
      .first()
      .click();
    const message = page.getByRole("article", { name: "Message" });
    await message.getByText(`to join Cedar Flats Robotics on Loomwright as a builder`).waitFor();
    await message.getByRole("link", { name: /\/invitations\// }).click();
    await page.getByRole("heading", { name: "Join Cedar Flats Robotics" }).waitFor();
    await page.getByLabel("Your name").fill("Bram Bench");
    await page.getByLabel("Choose a password").fill(password);
    await page.getByRole("button", { name: "Join Cedar Flats Robotics" }).click();
    await page.waitForURL(`${baseUrl}/projects`);
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(`${baseUrl}/sign-in`);
  });

  it("signs in, sees the projects, and the Team screen shows no controls; the API refuses them", async () => {
    const { page } = browser;
    await signInAs(page, baseUrl, email, password);
    const banner = page.getByRole("banner");
    await expect(banner.getByText("Builder", { exact: true }).isVisible()).resolves.toBe(true);
    await page.getByRole("link", { name: /Harrow-3/ }).click();
    await page.getByRole("table", { name: "Runs" }).waitFor();

    const nav = page.getByRole("navigation", { name: "Main" });
    expect(await nav.getByRole("link", { name: "Audit" }).count()).toBe(0);
    await nav.getByRole("link", { name: "Team" }).click();
    await page.waitForURL(`${baseUrl}/team`);
    const members = page.getByRole("list", { name: "Members" });
    await members.getByText("Bram Bench").waitFor();
    await expect(members.getByText("Mara Quill").isVisible()).resolves.toBe(true);
    for (const name of ["Send invitation", "Remove…", "Resend", "Revoke"])
      expect(await page.getByRole("button", { name }).count()).toBe(0);
    expect(await page.getByRole("combobox").count()).toBe(0);
    expect(await page.getByLabel("E-mail").count()).toBe(0);

    const refused = await page.request.post(`${baseUrl}/api/team/invitations`, {
      data: { email: `sneaky-${stamp}@example.test`, role: "lead" },
    });
    expect(refused.status()).toBe(403);
    const demote = await page.request.patch(`${baseUrl}/api/team/members/demo-lead-0001`, {
      data: { role: "builder" },
    });
    expect(demote.status()).toBe(403);
    expect((await page.request.get(`${baseUrl}/api/audit`)).status()).toBe(403);
    // The page guard sends a builder back to the projects list (a streamed redirect, so wait for it).
    await page.goto(`${baseUrl}/audit`);
    await page.waitForURL(`${baseUrl}/projects?denied=1`);
    await page.getByText("That screen is not open to your role in this team.").waitFor();
  });
});

describe("sign-in limits in the form", () => {
  it("after 10 wrong passwords for one address the form says to wait", async () => {
    const { page } = browser;
    await browser.context.clearCookies();
    const email = `forgetful-${stamp}@example.test`;
    await page.goto(`${baseUrl}/sign-in`);
    const alert = page.locator("form").getByRole("alert");
    for (let i = 0; i < 11; i++) {
      await page.getByLabel("E-mail").fill(email);
      await page.getByLabel("Password").fill(`wrong-${i}`);
      await page.getByRole("button", { name: "Sign in" }).click();
      await alert.waitFor();
      await page.waitForFunction(() => !document.querySelector("form button[disabled]"));
    }
    expect(await alert.innerText()).toMatch(/Too many sign-in attempts\. Try again in 15 minutes\./);
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    await page.waitForURL(`${baseUrl}/forgot-password`);
  });
});
