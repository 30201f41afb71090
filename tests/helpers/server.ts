// Starts the built app (`next start`) on a loopback port against a given database, for integration and e2e tests.
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";

export interface RunningServer {
  baseUrl: string;
  stop: () => Promise<void>;
}

const ROOT = process.cwd();

export async function startServer(opts: {
  port: number;
  databaseUrl: string;
  env?: Record<string, string>;
}): Promise<RunningServer> {
  const baseUrl = `http://127.0.0.1:${opts.port}`;
  const child: ChildProcess = spawn(
    process.execPath,
    [path.join(ROOT, "node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(opts.port)],
    {
      cwd: ROOT,
      env: {
        ...process.env,
        NODE_ENV: "production",
        NEXT_TELEMETRY_DISABLED: "1",
        DATABASE_URL: opts.databaseUrl,
        PUBLIC_BASE_URL: baseUrl,
        ...opts.env,
      },
      stdio: ["ignore", "pipe", "pipe"],
    },
  );
  let log = "";
  child.stdout?.on("data", (d: Buffer) => (log += d.toString()));
  child.stderr?.on("data", (d: Buffer) => (log += d.toString()));
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the app exited early (${child.exitCode}):\n${log}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill("SIGKILL");
      throw new Error(`the app did not become healthy within 60 s:\n${log}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    baseUrl,
    stop: async () => {
      if (child.exitCode !== null) return;
      const exited = new Promise((r) => child.once("exit", r));
      child.kill("SIGTERM");
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
      if (child.exitCode === null) child.kill("SIGKILL");
    },
  };
}
