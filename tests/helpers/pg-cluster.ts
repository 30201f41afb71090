// A throwaway PostgreSQL cluster of its own (own data dir, own port) that a test may stop and start: never the
// shared cluster. Started through scripts/pg-up.sh, stopped with pg_ctl as the postgres user.
import { execFileSync } from "node:child_process";
import { existsSync, readFileSync, readdirSync, rmSync } from "node:fs";
import path from "node:path";

const ROOT = process.cwd();
const SHARED_PORT = 54329;

function pgBin(): string {
  const base = "/usr/lib/postgresql";
  const versions = readdirSync(base).sort((a, b) => Number(a) - Number(b));
  return path.join(base, versions.at(-1)!, "bin");
}

function asPostgres(cmd: string, args: string[]): string {
  const runAs = process.getuid?.() === 0 ? ["runuser", ["-u", "postgres", "--", cmd, ...args]] : [cmd, args];
  return execFileSync(runAs[0] as string, runAs[1] as string[], {
    stdio: ["ignore", "pipe", "pipe"],
  }).toString();
}

export interface ThrowawayCluster {
  port: number;
  dataDir: string;
  url: (database: string) => string;
  /** Stops the server (fast shutdown: open sessions are cut, committed data is kept). */
  stop: () => void;
  /** Starts it again and waits until it accepts connections. */
  start: () => void;
  /** Stops it and removes its data dir. */
  destroy: () => void;
}

export function throwawayCluster(opts: {
  port: number;
  dataDir: string;
  databases: string[];
}): ThrowawayCluster {
  const recorded = existsSync(path.join(ROOT, ".pgdata.path"))
    ? readFileSync(path.join(ROOT, ".pgdata.path"), "utf8").trim()
    : null;
  if (opts.port === SHARED_PORT || path.resolve(opts.dataDir) === recorded) {
    throw new Error("refusing to use the shared PostgreSQL cluster for a test that stops its database");
  }
  const up = () =>
    execFileSync("bash", ["scripts/pg-up.sh", ...opts.databases], {
      cwd: ROOT,
      env: {
        ...process.env,
        PGPORT_LOOMWRIGHT: String(opts.port),
        PGDATA_LOOMWRIGHT: opts.dataDir,
        PGDATA_RECORD: "0",
      },
      stdio: ["ignore", "pipe", "pipe"],
    });
  const stop = () => {
    if (existsSync(path.join(opts.dataDir, "postmaster.pid"))) {
      asPostgres(path.join(pgBin(), "pg_ctl"), ["-D", opts.dataDir, "-m", "fast", "-w", "stop"]);
    }
  };
  up();
  return {
    port: opts.port,
    dataDir: opts.dataDir,
    url: (database) => `postgres://postgres@127.0.0.1:${opts.port}/${database}`,
    stop,
    start: up,
    destroy: () => {
      stop();
      rmSync(opts.dataDir, { recursive: true, force: true });
    },
  };
}
