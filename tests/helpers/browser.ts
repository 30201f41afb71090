// Headless Debian Chromium through playwright-core (never a downloaded browser).
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { execFileSync } from "node:child_process";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seeds/01_demo";

function chromiumPath(): string {
  if (process.env.CHROMIUM_PATH) return process.env.CHROMIUM_PATH;
  try {
    return execFileSync("sh", ["-c", "command -v chromium"]).toString().trim();
  } catch {
    throw new Error("Debian's chromium is not installed (apt-get install chromium); npm test installs it");
  }
}

export interface Browser {
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}

export async function openBrowser(
  opts: { viewport?: { width: number; height: number }; args?: string[] } = {},
): Promise<Browser> {
  const dir = mkdtempSync(path.join(os.tmpdir(), "loomwright-chromium-"));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: chromiumPath(),
    headless: true,
    viewport: opts.viewport ?? { width: 1280, height: 800 },
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      ...(opts.args ?? []),
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export async function signInAs(
  page: Page,
  baseUrl: string,
  email: string,
  password = DEMO_PASSWORD,
): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${baseUrl}/projects`);
}
