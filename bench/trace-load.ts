// Benchmark: GET /api/trace/:code under a steady 200 requests per second for 30 s (autocannon, loopback), against
// the built app on its own database, for the demo project and for a 5,000-run project.
// Needs a build (`npx next build`). Usage: npx tsx bench/trace-load.ts
// Env: BENCH_DATABASE_URL (default: the local cluster's loomwright_bench), BENCH_PORT (3190), TRACE_RATE (200),
// TRACE_SECONDS (30).
import { execFileSync } from "node:child_process";
import autocannon from "autocannon";
import { resetDatabase } from "@/tests/helpers/db";
import { startServer } from "@/tests/helpers/server";
import { signedIn, type Client } from "@/tests/helpers/http";
import { generateRuns } from "@/tests/helpers/generate-runs-csv";

const PORT = Number(process.env.BENCH_PORT ?? 3190);
const RATE = Number(process.env.TRACE_RATE ?? 200);
const SECONDS = Number(process.env.TRACE_SECONDS ?? 30);

function databaseUrl(): string {
  if (process.env.BENCH_DATABASE_URL) return process.env.BENCH_DATABASE_URL;
  const line = execFileSync("bash", ["scripts/pg-up.sh", "loomwright_bench"])
    .toString()
    .trim()
    .split("\n")
    .pop()!;
  return line.replace(/^DATABASE_URL=/, "");
}

async function codesOf(c: Client, projectId: string): Promise<string[]> {
  const codes: string[] = [];
  for (let offset = 0; ; offset += 1000) {
    const r = await c.get<{ items: { traceCode: string }[]; total: number }>(
      `/api/projects/${projectId}/runs?limit=1000&offset=${offset}`,
    );
    codes.push(...r.body.items.map((x) => x.traceCode));
    if (codes.length >= r.body.total) return codes;
  }
}

async function load(baseUrl: string, cookie: string, label: string, codes: string[]) {
  // A short warm-up so the first compilations and connections are not measured.
  await autocannon({ url: baseUrl, connections: 4, duration: 3, headers: { cookie }, requests: req(codes) });
  const r = await autocannon({
    url: baseUrl,
    connections: 20,
    duration: SECONDS,
    overallRate: RATE,
    timeout: 10,
    headers: { cookie },
    requests: req(codes),
  });
  console.log(`${label} (${codes.length} codes, ${SECONDS} s at ${RATE} req/s)`);
  console.log(`  requests/s: ${r.requests.average.toFixed(1)}  (${r["2xx"]} answered 2xx)`);
  console.log(`  latency p50 ${r.latency.p50} ms · p99 ${r.latency.p99} ms · max ${r.latency.max} ms`);
  console.log(`  errors ${r.errors} · timeouts ${r.timeouts} · non-2xx ${r.non2xx}`);
  const ok = r.latency.p99 < 50 && r.errors === 0 && r.non2xx === 0 && r.timeouts === 0;
  console.log(`  target p99 < 50 ms with zero errors: ${ok ? "met" : "NOT met"}`);
  return ok;
}

function req(codes: string[]) {
  let i = 0;
  return [
    {
      method: "GET",
      setupRequest: (r: { path?: string }) => ({ ...r, path: `/api/trace/${codes[i++ % codes.length]}` }),
    },
  ];
}

async function main() {
  const url = databaseUrl();
  await resetDatabase(url);
  const server = await startServer({ port: PORT, databaseUrl: url });
  try {
    const lead = await signedIn(server.baseUrl, "lead@example.test");
    const tech = await signedIn(server.baseUrl, "technician@example.test");
    const projects = await lead.get<{ items: { id: string; name: string }[] }>("/api/projects");
    const demo = projects.body.items.find((p) => p.name === "Harrow-3")!;
    const big = await lead.post<{ id: string }>("/api/projects", {
      name: "Trace bench 5k",
      wireIdPrefix: "TB-",
    });
    const runs = generateRuns(5000, 11);
    for (let i = 0; i < runs.length; i += 1000) {
      // Bodies are limited to 2 MB: five requests of 1,000 runs.
      const made = await lead.post(`/api/projects/${big.body.id}/runs`, { runs: runs.slice(i, i + 1000) });
      if (made.status !== 201) throw new Error(`could not make the 5,000 runs: ${made.status}`);
    }
    const cookie = tech.cookieHeader();
    const a = await load(server.baseUrl, cookie, "trace, Harrow-3 demo", await codesOf(lead, demo.id));
    const b = await load(
      server.baseUrl,
      cookie,
      "trace, 5,000-run project",
      await codesOf(lead, big.body.id),
    );
    if (!a || !b) process.exitCode = 1;
  } finally {
    await server.stop();
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
