// Benchmark: import of a generated 10,000-row CSV (preview, commit) and listing a 5,000-run project through the API.
// Needs a build (`npx next build`) and the local PostgreSQL (`npm run db:up`). Usage: npx tsx bench/runs-api.ts
import { execFileSync } from "node:child_process";
import { resetDatabase } from "@/tests/helpers/db";
import { startServer } from "@/tests/helpers/server";
import { signedIn, type Client } from "@/tests/helpers/http";
import { generateRunsCsv } from "@/tests/helpers/generate-runs-csv";

const PORT = Number(process.env.BENCH_PORT ?? 3190);

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

async function upload(baseUrl: string, c: Client, projectId: string, csv: string) {
  const form = new FormData();
  form.append("file", new Blob([csv], { type: "text/csv" }), "bench.csv");
  const t0 = performance.now();
  const res = await fetch(`${baseUrl}/api/projects/${projectId}/imports`, {
    method: "POST",
    body: form,
    headers: { cookie: c.cookieHeader() },
  });
  const body = (await res.json()) as {
    id: string;
    preview: { canCommit: boolean; summary: { added: number } };
  };
  if (res.status !== 201 || !body.preview.canCommit) throw new Error(`preview failed: ${res.status}`);
  return { ms: performance.now() - t0, id: body.id, added: body.preview.summary.added };
}

async function main() {
  const line = execFileSync("bash", ["scripts/pg-up.sh", "loomwright_bench"])
    .toString()
    .trim()
    .split("\n")
    .pop()!;
  const url = line.replace(/^DATABASE_URL=/, "");
  await resetDatabase(url);
  const server = await startServer({ port: PORT, databaseUrl: url });
  try {
    const lead = await signedIn(server.baseUrl, "lead@example.test");
    const mk = async (name: string) =>
      (await lead.post<{ id: string }>("/api/projects", { name, wireIdPrefix: "B-" })).body.id;

    // 1. Import 10,000 rows: preview, then commit.
    const p10 = await mk("Bench 10k");
    const csv = generateRunsCsv(10_000, 42, "human");
    const prev = await upload(server.baseUrl, lead, p10, csv);
    const t1 = performance.now();
    const commit = await lead.post<{ added: number }>(`/api/projects/${p10}/imports/${prev.id}/commit`);
    const commitMs = performance.now() - t1;
    if (commit.status !== 200) throw new Error(`commit failed: ${commit.status}`);
    console.log(`import 10,000 rows (${(csv.length / 1e6).toFixed(2)} MB CSV)`);
    console.log(`  preview (upload, parse, check, store): ${prev.ms.toFixed(0)} ms`);
    console.log(`  commit (one transaction):              ${commitMs.toFixed(0)} ms`);
    console.log(
      `  total:                                 ${(prev.ms + commitMs).toFixed(0)} ms  (target < 3000 ms)`,
    );

    // 2. A 5,000-run project: pages of 200 from the API.
    const p5 = await mk("Bench 5k");
    const prev5 = await upload(server.baseUrl, lead, p5, generateRunsCsv(5_000, 7, "human"));
    await lead.post(`/api/projects/${p5}/imports/${prev5.id}/commit`);
    const times: Record<string, number[]> = {};
    const cases = {
      "first page, by wire ID": "limit=200&offset=0",
      "deep page, by wire ID": "limit=200&offset=4600",
      "sorted by length, desc": "limit=200&offset=1000&sort=routedLengthMm&dir=desc",
      "filtered by text": "limit=200&q=TB",
      "all 1,000 (max page)": "limit=1000&offset=2000",
    };
    for (let round = 0; round < 25; round++) {
      for (const [label, qs] of Object.entries(cases)) {
        const t = performance.now();
        const r = await lead.get<{ items: unknown[] }>(`/api/projects/${p5}/runs?${qs}`);
        const ms = performance.now() - t;
        if (r.status !== 200) throw new Error(`list failed: ${r.status}`);
        if (round >= 5) (times[label] ??= []).push(ms);
      }
    }
    console.log("runs API on a 5,000-run project (median of 20 after 5 warm-up rounds)");
    for (const [label, xs] of Object.entries(times)) {
      console.log(
        `  ${label.padEnd(26)} ${median(xs).toFixed(1)} ms  (p90 ${xs.sort((a, b) => a - b)[17]!.toFixed(1)} ms)`,
      );
    }
    console.log("  target: a page of 200 in < 50 ms");

    // 3. Electrical checks of all 5,000 runs through the endpoint (computed on every request).
    // The first call computes; later calls reuse the result until a run or a setting changes.
    const checkTimes: number[] = [];
    let coldMs = 0;
    for (let round = 0; round < 15; round++) {
      const t = performance.now();
      const r = await lead.get<{ total: number }>(`/api/projects/${p5}/checks`);
      if (r.status !== 200 || r.body.total !== 5000) throw new Error(`checks failed: ${r.status}`);
      if (round === 0) coldMs = performance.now() - t;
      if (round >= 3) checkTimes.push(performance.now() - t);
    }
    // A changed run makes the next call compute again.
    const one = (
      await lead.get<{ items: { id: string; version: number }[] }>(`/api/projects/${p5}/runs?limit=1`)
    ).body.items[0]!;
    await lead.patch(`/api/projects/${p5}/runs/${one.id}`, { version: one.version, notes: "bench" });
    const t2 = performance.now();
    await lead.get(`/api/projects/${p5}/checks`);
    const afterEditMs = performance.now() - t2;
    console.log(
      `checks endpoint, 5,000 runs: first ${coldMs.toFixed(0)} ms, after an edit ${afterEditMs.toFixed(0)} ms, unchanged median ${median(checkTimes).toFixed(0)} ms (target < 500 ms)`,
    );
  } finally {
    await server.stop();
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
