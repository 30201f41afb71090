// Developer aid: screenshots of given pages as a demo role (`npx tsx tests/helpers/shoot.ts URL EMAIL OUT path…`).
import { openBrowser, signInAs } from "./browser";

async function main() {
  const [baseUrl, email, outDir, ...paths] = process.argv.slice(2);
  if (!baseUrl || !outDir) throw new Error("usage: shoot.ts BASE_URL EMAIL|- OUT_DIR path…");
  for (const [w, h, tag] of [
    [1280, 800, "desk"],
    [390, 844, "phone"],
  ] as const) {
    const b = await openBrowser({ viewport: { width: w, height: h } });
    try {
      if (email && email !== "-") await signInAs(b.page, baseUrl, email);
      for (const p of paths) {
        await b.page.goto(`${baseUrl}${p}`);
        await b.page.waitForLoadState("networkidle");
        const name = `${tag}-${p.replace(/[^a-z0-9]+/gi, "_").replace(/^_|_$/g, "") || "root"}.png`;
        await b.page.screenshot({ path: `${outDir}/${name}`, fullPage: true });
        console.log(`${outDir}/${name}`);
      }
    } finally {
      await b.close();
    }
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
