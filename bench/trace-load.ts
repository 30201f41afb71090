// Benchmark: GET /api/trace/:code under a steady 200 requests per second for 30 s (autocannon, loopback), against
// the built app on its own database, for the demo project and for a 5,000-run project; and, for scale, the same
// load on GET /api/me (the sign-in check every signed-in request makes, and nothing else).
// Needs a build (`npx next build`). Usage: npx tsx bench/trace-load.ts
// Env: BENCH_DATABASE_URL (default: the local cluster's loomwright_bench), BENCH_PORT (3190), TRACE_RATE (200),
// TRACE_SECONDS (30), TRACE_CONNECTIONS (5). autocannon paces each connection with its own timer, and the timers
// fire together: 20 connections at 10 req/s each send bursts of 20 requests every 100 ms, which even /api/health
// cannot answer under 50 ms at p99 on a 2-CPU machine; 5 connections give bursts of 5 every 25 ms.
import { execFileSync } from "node:child_process";
import os from "node:os";
import autocannon from "autocannon";
import { resetDatabase } from "@/tests/helpers/db";
import { startServer } from "@/tests/helpers/server";
import { signedIn, type Client } from "@/tests/helpers/http";
import { generateRuns } from "@/tests/helpers/generate-runs-csv";

const PORT = Number(process.env.BENCH_PORT ?? 3190);
const RATE = Number(process.env.TRACE_RATE ?? 200);
const SECONDS = Number(process.env.TRACE_SECONDS ?? 30);
const CONNECTIONS = Number(process.env.TRACE_CONNECTIONS ?? 5);

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

async function load(baseUrl: string, cookie: string, label: string, paths: string[]) {
  // A short warm-up so the first compilations and connections are not measured.
  await autocannon({ url: baseUrl, connections: 4, duration: 3, headers: { cookie }, requests: req(paths) });
  const r = await autocannon({
    url: baseUrl,
    connections: CONNECTIONS,
    duration: SECONDS,
    overallRate: RATE,
    timeout: 10,
    headers: { cookie },
    requests: req(paths),
  });
  console.log(
    `${label} (${paths.length} paths, ${SECONDS} s at ${RATE} req/s over ${CONNECTIONS} connections)`,
  );
  console.log(`  requests/s: ${r.requests.average.toFixed(1)}  (${r["2xx"]} answered 2xx)`);
  console.log(`  latency p50 ${r.latency.p50} ms · p99 ${r.latency.p99} ms · max ${r.latency.max} ms`);
  console.log(`  errors ${r.errors} · timeouts ${r.timeouts} · non-2xx ${r.non2xx}`);
  // Met only when the rate was kept too (a connection waits for its answer, so slow answers lower the rate).
  const kept = r.requests.average >= RATE * 0.98;
  const ok = kept && r.latency.p99 < 50 && r.errors === 0 && r.non2xx === 0 && r.timeouts === 0;
  console.log(`  target ${RATE} req/s kept, p99 < 50 ms, zero errors: ${ok ? "met" : "NOT met"}`);
  return ok;
}

function req(paths: string[]) {
  let i = 0;
  return [
    { method: "GET", setupRequest: (r: { path?: string }) => ({ ...r, path: paths[i++ % paths.length] }) },
  ];
}

const trace = (codes: string[]) => codes.map((c) => `/api/trace/${c}`);

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
    const cpus = os.cpus().length;
    console.log(
      `load average before: ${os
        .loadavg()
        .map((x) => x.toFixed(2))
        .join(" ")} (${cpus} CPUs)`,
    );
    const a = await load(server.baseUrl, cookie, "trace, Harrow-3 demo", trace(await codesOf(lead, demo.id)));
    const big5k = trace(await codesOf(lead, big.body.id));
    const b = await load(server.baseUrl, cookie, "trace, 5,000-run project", big5k);
    await load(server.baseUrl, cookie, "for scale: GET /api/me (the sign-in check only)", ["/api/me"]);
    console.log(
      `load average after: ${os
        .loadavg()
        .map((x) => x.toFixed(2))
        .join(" ")}`,
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
