// The database goes away during a session and comes back: the app answers 503 JSON meanwhile (pages show the
// designed error page, never a stack), stays up, recovers by itself within 5 s, and loses nothing it committed.
// It runs on a throwaway PostgreSQL cluster of its own (own port and data dir), never the shared one.
import { createHash } from "node:crypto";
import { createServer } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { resetDatabase } from "../helpers/db";
import { startServer, type RunningServer } from "../helpers/server";
import { signedIn, type Client, type Reply } from "../helpers/http";
import { throwawayCluster, type ThrowawayCluster } from "../helpers/pg-cluster";
import { openBrowser, signInAs, type Browser } from "../helpers/browser";

// Own port and data dir per checkout, so two checkouts' test runs on one machine never share the cluster.
const PG_PORT = Number(process.env.FAULTS_PGPORT ?? Number(process.env.PGPORT_LOOMWRIGHT ?? 54329) + 10);
const CHECKOUT = createHash("sha1").update(process.cwd()).digest("hex").slice(0, 10);
const PG_DATA = process.env.FAULTS_PGDATA ?? `/tmp/lw-faults-pgdata-${CHECKOUT}-${PG_PORT}`;
const DB = "loomwright_faults";

type Run = { id: string; version: number; state: string; traceCode: string };
type ErrorBody = { error: { code: string; message: string } };

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });
}

let cluster: ThrowawayCluster;
let server: RunningServer;
let lead: Client;
let tech: Client;
let browser: Browser;
let projectId: string;
let runs: Run[];

beforeAll(async () => {
  cluster = throwawayCluster({ port: PG_PORT, dataDir: PG_DATA, databases: [DB] });
  await resetDatabase(cluster.url(DB));
  const port = Number(process.env.FAULTS_PORT ?? 0) || (await freePort());
  server = await startServer({ port, databaseUrl: cluster.url(DB) });
  lead = await signedIn(server.baseUrl, "lead@example.test");
  tech = await signedIn(server.baseUrl, "technician@example.test");
  browser = await openBrowser();
  await signInAs(browser.page, server.baseUrl, "technician@example.test");
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
  cluster?.destroy();
});

describe("the database stops and starts during a session", () => {
  it("answers 503 while it is down, recovers by itself within 5 s, and keeps every committed change", async () => {
    projectId = (await lead.post<{ id: string }>("/api/projects", { name: "Faults", wireIdPrefix: "F-" }))
      .body.id;
    runs = (
      await lead.post<{ items: Run[] }>(`/api/projects/${projectId}/runs`, {
        runs: Array.from({ length: 6 }, (_, i) => ({
          endA: `K1:${i + 1}`,
          endB: `J1:${i + 1}`,
          gauge: "18 AWG",
          colour: "YE",
          routedLengthMm: 700,
        })),
      })
    ).body.items;
    const runUrl = (r: Run) => `/api/projects/${projectId}/runs/${r.id}`;
    // Committed before the outage: a test result on run 0.
    const tested = await tech.patch<Run>(runUrl(runs[0]!), {
      version: 1,
      state: "tested",
      testKind: "continuity",
      testValue: 0.025,
    });
    expect(tested.status).toBe(200);

    // Writers keep changing runs 1–5 through the outage; every change they are told succeeded must survive.
    const acked = new Map<string, { version: number; state: string }>();
    const unexpected: string[] = [];
    const seen: Record<string, number> = {};
    const count = (what: string) => (seen[what] = (seen[what] ?? 0) + 1);
    const writeOnce = async (run: Run) => {
      const got = await lead.get<Run>(runUrl(run));
      if (got.status === 503) {
        count("GET 503");
        return new Promise((r) => setTimeout(r, 50));
      }
      if (got.status !== 200) return unexpected.push(`GET ${got.status}`);
      const state = got.body.state === "cut" ? "marked" : "cut";
      const r = await lead.patch<Run>(runUrl(run), { version: got.body.version, state });
      count(`PATCH ${r.status}`);
      if (r.status === 200) acked.set(run.id, { version: r.body.version, state: r.body.state });
      else if (r.status !== 503 && r.status !== 409) unexpected.push(`PATCH ${r.status}`);
    };
    let writing = true;
    // One writer per run, all at once, so transactions are in flight when the server stops.
    const writer = Promise.all(
      runs.slice(1).map(async (run) => {
        while (writing) {
          await writeOnce(run).catch((e: unknown) => unexpected.push(`network: ${String(e)}`));
        }
      }),
    );

    let recoveredMs = -1;
    try {
      await new Promise((r) => setTimeout(r, 500));
      // The page the technician has open, and the outage.
      await browser.page.goto(`${server.baseUrl}/r/${runs[0]!.traceCode}`);
      await browser.page.getByText("Latest test").waitFor();
      cluster.stop();

      const timed = async <T>(f: () => Promise<Reply<T>>) => {
        const t0 = Date.now();
        const r = await f();
        return { ...r, ms: Date.now() - t0 };
      };
      const health = await timed(() => tech.get<{ db: string }>("/api/health"));
      expect(health.status).toBe(503);
      expect(health.body.db).toBe("down");
      for (const call of [
        () => tech.get<ErrorBody>("/api/projects"),
        () => tech.get<ErrorBody>(`/api/trace/${runs[0]!.traceCode}`),
        () => tech.get<ErrorBody>(`/api/projects/${projectId}/progress`),
        () =>
          tech.patch<ErrorBody>(runUrl(runs[0]!), { version: 2, state: "failed", testKind: "insulation" }),
        () =>
          tech.post<ErrorBody>("/api/auth/sign-in", {
            email: "lead@example.test",
            password: "whatever-it-is",
          }),
      ]) {
        const r = await timed(call);
        expect(r.status).toBe(503);
        expect(r.headers.get("content-type")).toMatch(/application\/json/);
        expect(r.headers.get("retry-after")).toBe("5");
        expect(r.body.error.code).toBe("db_unavailable");
        expect(r.ms).toBeLessThan(10_000);
      }
      // Pages: our own error document (status 500), never a stack or a driver message.
      for (const path of [
        "/projects",
        `/r/${runs[0]!.traceCode}`,
        "/scan",
        `/projects/${projectId}/progress`,
      ]) {
        const r = await tech.get<string>(path);
        expect(r.status, path).toBe(500);
        expect(r.headers.get("content-type")).toMatch(/text\/html/);
        expect(r.body).not.toMatch(/\n\s+at |node_modules|ECONNREFUSED|knex|Error:/);
      }
      // In the browser that page shows the designed error state.
      const res = await browser.page.goto(`${server.baseUrl}/r/${runs[0]!.traceCode}`);
      expect(res?.status()).toBe(500);
      await browser.page.getByRole("heading", { name: "Loomwright is not answering right now" }).waitFor();
      await browser.page.getByText(/Nothing you saved is lost/).waitFor();

      await new Promise((r) => setTimeout(r, 1500));
      cluster.start();
      const back = Date.now();
      for (;;) {
        const r = await tech.get("/api/projects");
        if (r.status === 200) break;
        expect(Date.now() - back, "recovered within 5 s").toBeLessThan(5000);
        await new Promise((res) => setTimeout(res, 100));
      }
      recoveredMs = Date.now() - back;
      expect(recoveredMs).toBeLessThan(5000);
      // The open page comes back by itself (it retries every 3 s).
      await browser.page.getByText("Latest test").waitFor({ timeout: 8000 });
      await new Promise((r) => setTimeout(r, 500));
    } finally {
      writing = false;
      await writer;
    }
    expect(unexpected).toEqual([]);
    expect(acked.size).toBeGreaterThan(0);

    // Nothing committed was lost: the acknowledged test, and every acknowledged change (or a later one).
    const t = await tech.get<{ run: Run; tests: { passed: boolean; value: number }[] }>(
      `/api/trace/${runs[0]!.traceCode}`,
    );
    expect(t.status, JSON.stringify(t.body)).toBe(200);
    expect(t.body.run).toMatchObject({ state: "tested", version: 2 });
    expect(t.body.tests).toEqual([expect.objectContaining({ passed: true, value: 0.025 })]);
    for (const [id, a] of acked) {
      const r = (await lead.get<Run>(`/api/projects/${projectId}/runs/${id}`)).body;
      expect(r.version).toBeGreaterThanOrEqual(a.version);
      if (r.version === a.version) expect(r.state).toBe(a.state);
      const trace = await lead.get<{ history: { action: string }[] }>(`/api/trace/${r.traceCode}`);
      // One audit event per committed change, also for changes whose answer was lost in the outage.
      expect(trace.body.history.length).toBe(r.version);
    }
    console.log(`faults: API answered again ${recoveredMs} ms after PostgreSQL was back; writers saw`, seen);
  }, 120_000);
});
