// Test results of runs, always reached through a run of a project of the caller's team.
import { db, type Db, type Tx } from "@/lib/db/knex";
import type { TestKind } from "@/lib/domain/bench-state";

export interface RunTestRecord {
  id: number;
  runId: string;
  kind: TestKind;
  passed: boolean;
  /** Ω for continuity, MΩ for insulation; null when only pass/fail was noted. */
  value: number | null;
  note: string | null;
  testedBy: string | null;
  testedByName: string | null;
  testedAt: string;
  runVersion: number;
}

export interface RunTestInsert {
  runId: string;
  kind: TestKind;
  passed: boolean;
  value: number | null;
  note: string | null;
  testedBy: string;
  runVersion: number;
}

const COLUMNS = [
  "t.id",
  "t.runId",
  "t.kind",
  "t.passed",
  "t.value",
  "t.note",
  "t.testedBy",
  "u.name as testedByName",
  "t.testedAt",
  "t.runVersion",
];

function scoped(q: Db, teamId: string) {
  return q("runTest as t")
    .join("run as r", "r.id", "t.runId")
    .join("project as p", "p.id", "r.projectId")
    .leftJoin("appUser as u", "u.id", "t.testedBy")
    .where("p.teamId", teamId);
}

/** Stores one result inside the caller's transaction (the one that changes the run's state and audits it). */
export async function insertRunTest(tx: Tx, row: RunTestInsert): Promise<number> {
  const [r] = (await tx("runTest").insert(row).returning("id")) as [{ id: number }];
  return r.id;
}

/** The newest result of each of the given runs (runs without one are absent from the map). */
export async function latestRunTests(
  teamId: string,
  runIds: readonly string[],
  q: Db = db(),
): Promise<Map<string, RunTestRecord>> {
  const out = new Map<string, RunTestRecord>();
  if (runIds.length === 0) return out;
  for (let i = 0; i < runIds.length; i += 1000) {
    const rows = (await scoped(q, teamId)
      .whereIn("t.runId", runIds.slice(i, i + 1000))
      .distinctOn("t.runId")
      .orderBy([
        { column: "t.runId", order: "asc" },
        { column: "t.id", order: "desc" },
      ])
      .select(COLUMNS)) as RunTestRecord[];
    for (const r of rows) out.set(r.runId, r);
  }
  return out;
}
