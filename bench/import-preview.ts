// Times the run-list import on a generated 10,000-row file: read, header matching and preview, CSV and XLSX.
// Run: npx tsx bench/import-preview.ts [rows] [repeats]

import { DEFAULT_PROJECT_SETTINGS } from "@/lib/domain/types";
import { runsToXlsx } from "@/lib/export/runs";
import { buildPreview, matchHeaders, readTable } from "@/lib/import";
import { generateRuns, runsToHumanCsv } from "@/tests/helpers/generate-runs-csv";

async function time<T>(fn: () => Promise<T> | T): Promise<{ ms: number; cpuMs: number; value: T }> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = await fn();
  const c = process.cpuUsage(c0);
  return { ms: performance.now() - t0, cpuMs: (c.user + c.system) / 1000, value };
}

async function main(): Promise<void> {
  const rows = Number(process.argv[2] ?? 10_000);
  const repeats = Number(process.argv[3] ?? 5);
  const runs = generateRuns(rows, 42);
  const existing = runs.slice(0, Math.floor(rows / 2));
  const files: [string, Buffer][] = [
    ["runs.csv", Buffer.from(runsToHumanCsv(runs), "utf8")],
    ["runs.xlsx", await runsToXlsx(runs)],
  ];
  for (const [name, buffer] of files) {
    const read = await time(() => readTable(buffer, name));
    const match = await time(() => matchHeaders(read.value.headers));
    const previews: { ms: number; cpuMs: number }[] = [];
    for (let i = 0; i < repeats; i++) {
      const p = await time(() => buildPreview(read.value, match.value, existing, DEFAULT_PROJECT_SETTINGS));
      if (!p.value.canCommit) throw new Error(`${name}: the generated file should import cleanly`);
      previews.push(p);
    }
    const ms = previews.map((p) => p.ms).sort((a, b) => a - b);
    console.log(
      `${name}: ${rows} rows, ${(buffer.length / 1024).toFixed(0)} KiB — readTable ${read.ms.toFixed(0)} ms; ` +
        `buildPreview (vs ${existing.length} existing) min ${ms[0]!.toFixed(0)} / median ${ms[Math.floor(ms.length / 2)]!.toFixed(0)} / max ${ms.at(-1)!.toFixed(0)} ms wall`,
    );
  }
}

void main();
