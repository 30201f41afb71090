// Creating, editing and deleting runs: wire-ID generation, version checks, role limits on fields, audit events.
import { randomBytes } from "node:crypto";
import { db, type Tx } from "@/lib/db/knex";
import { recordAudit, recordAudits } from "@/lib/db/audit";
import {
  deleteRunRow,
  existingWireIds,
  getRunForUpdate,
  insertRuns,
  lockRuns,
  updateRunsBulk,
  touchProject,
  updateRunIfVersion,
  wireIdsWithPrefix,
  type RunInsert,
  type RunRecord,
} from "@/lib/db/runs";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { runCutLengthMm } from "@/lib/domain/cut-length";
import type { TeamMe } from "@/lib/auth/guards";
import type { Role } from "@/lib/auth/roles";
import { traceCodeFromBytes } from "@/lib/domain/trace-code";
import type { DropClass, RunData } from "@/lib/domain/types";
import { isTestState, stateChangeRefusal, statesRoleMaySet, TEST_UNITS } from "@/lib/domain/bench-state";
import { insertRunTest, latestRunTests, type RunTestRecord } from "@/lib/db/run-tests";
import { conflict, forbidden, invalid, notFound } from "@/lib/http/errors";
import {
  runRuleIssues,
  type RunBulkPatchInput,
  type RunCreateInput,
  type RunPatchInput,
} from "@/lib/validation/runs";
import { applyBenchEffects, benchReplay, BENCH_PATCH_FIELDS } from "@/lib/services/bench";

/** Next free wire IDs for a prefix: the highest number already used after the prefix, plus one, zero-padded. */
export function nextWireIds(prefix: string, taken: Iterable<string>, count: number): string[] {
  let max = 0;
  let width = 3;
  for (const id of taken) {
    if (!id.startsWith(prefix)) continue;
    const m = /^(\d+)$/.exec(id.slice(prefix.length));
    if (!m) continue;
    max = Math.max(max, Number(m[1]));
    width = Math.max(width, m[1]!.length);
  }
  return Array.from({ length: count }, (_, i) => `${prefix}${String(max + i + 1).padStart(width, "0")}`);
}

export async function createRuns(
  me: TeamMe,
  project: ProjectRecord,
  inputs: RunCreateInput[],
): Promise<RunRecord[]> {
  return db().transaction(async (tx) => {
    const withDefaults = inputs.map((r) => ({
      ...r,
      dropClass: r.dropClass ?? (project.defaultDropClass as DropClass),
    }));
    const created = await createRunsInTx(tx, me, project, withDefaults);
    await touchProject(tx, project.id);
    return created;
  });
}

/** Inserts runs inside the caller's transaction: wire IDs checked or generated, trace codes made, audited. */
export async function createRunsInTx(
  tx: Tx,
  me: TeamMe,
  project: ProjectRecord,
  inputs: (Omit<RunData, "wireId"> & { wireId: string | null })[],
): Promise<RunRecord[]> {
  const given = inputs.map((r) => r.wireId).filter((w): w is string => Boolean(w));
  const dupInBody = given.filter((w, i) => given.indexOf(w) !== i);
  if (dupInBody.length) {
    throw conflict(`Wire ID ${dupInBody[0]} appears more than once.`, { wireIds: [...new Set(dupInBody)] });
  }
  const clash = await existingWireIds(tx, project.id, given);
  if (clash.length)
    throw conflict(`Wire ID ${clash[0]} is already used in this project.`, { wireIds: clash });

  const blanks = inputs.filter((r) => !r.wireId).length;
  const taken = new Set([...(await wireIdsWithPrefix(tx, project.id, project.wireIdPrefix)), ...given]);
  const fresh = nextWireIds(project.wireIdPrefix, taken, blanks);
  let k = 0;
  const rows: RunInsert[] = inputs.map((r) => ({
    ...r,
    wireId: r.wireId || fresh[k++]!,
    traceCode: traceCodeFromBytes(randomBytes(5)),
  }));
  const created = await insertRuns(tx, project.id, rows);
  await recordAudits(
    tx,
    created.map((r) => ({
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "run.create",
      entityType: "run",
      entityId: r.id,
      detail: { projectId: project.id, wireId: r.wireId },
    })),
  );
  return created;
}

/**
 * Which fields each role may send (PRODUCT.md §2): the lead any; a builder a bench state, with a note; a
 * technician a state, and the test kind, value and note only together with a test state (tested or failed).
 */
function checkFieldsForRole(role: Role, input: RunPatchInput): void {
  if (role === "lead") return;
  const fields = Object.keys(input).filter((k) => k !== "version");
  const allowed =
    role === "builder"
      ? ["state", "note", ...BENCH_PATCH_FIELDS]
      : ["state", "testKind", "testValue", "note"];
  const extra = fields.filter((f) => !allowed.includes(f));
  if (extra.length) throw forbidden(`Your role may not change ${extra.join(", ")}.`);
  if (input.state && !statesRoleMaySet(role).includes(input.state)) {
    throw forbidden(`Your role may not set a run to "${input.state}".`);
  }
  const describing = fields.filter((f) => f !== "state");
  if (describing.length && !input.state) {
    throw forbidden(`Your role may send ${describing.join(", ")} only together with a state.`);
  }
  if (role === "technician" && describing.length && input.state && !isTestState(input.state)) {
    throw forbidden(
      `A technician sends ${describing.join(", ")} only with a test result (tested or failed).`,
    );
  }
}

/** A test state needs its kind; a test kind or value needs a test state (any role). */
function checkTestFields(input: RunPatchInput): void {
  const testing = input.state !== undefined && isTestState(input.state);
  if (testing && !input.testKind) {
    throw invalid("Invalid input: testKind: say which test was made (continuity or insulation)", [
      { path: "testKind", message: "Say which test was made (continuity or insulation)" },
    ]);
  }
  if (!testing && (input.testKind !== undefined || input.testValue !== undefined)) {
    throw invalid("Invalid input: state: a test result sets the state to tested (pass) or failed", [
      { path: "state", message: "A test result sets the state to tested (pass) or failed" },
    ]);
  }
}

export async function patchRun(
  me: TeamMe,
  project: ProjectRecord,
  runId: string,
  input: RunPatchInput,
): Promise<RunRecord> {
  checkFieldsForRole(me.role, input);
  checkTestFields(input);
  return db().transaction(async (tx) => {
    const current = await getRunForUpdate(tx, me.teamId, project.id, runId);
    if (!current) throw notFound("That run");
    const replayed = await benchReplay(tx, me, current, input);
    if (replayed) return replayed;
    if (current.version !== input.version) {
      throw conflict("Someone else changed this run since you opened it. Here is the current record.", {
        current,
      });
    }
    const { version, testKind, testValue, note, spoolId: _spoolId, actionId: _actionId, ...changes } = input;
    if (changes.state) {
      const refusal = stateChangeRefusal(me.role, current.state, changes.state);
      if (refusal) throw forbidden(refusal);
    }
    const merged = { ...current, ...changes };
    const issues = runRuleIssues(merged);
    if (issues.length) throw invalid(`Invalid input: ${issues[0]!.path}: ${issues[0]!.message}`, issues);
    if (changes.wireId && changes.wireId !== current.wireId) {
      const clash = await existingWireIds(tx, project.id, [changes.wireId]);
      if (clash.length) throw conflict(`Wire ID ${changes.wireId} is already used in this project.`);
    }
    const changed: Record<string, { from: unknown; to: unknown }> = {};
    for (const [k, v] of Object.entries(changes)) {
      const before = current[k as keyof RunRecord];
      if (before !== v) changed[k] = { from: before, to: v };
    }
    const updated = await updateRunIfVersion(tx, runId, version, changes as Partial<RunData>);
    if (!updated) {
      throw conflict("Someone else changed this run since you opened it.", { current });
    }
    const bench = await applyBenchEffects(tx, me, project, current, updated, input);
    const detail: Record<string, unknown> = {
      projectId: project.id,
      wireId: updated.wireId,
      changed,
      ...bench,
    };
    let action = changes.state && Object.keys(changed).length === 1 ? "run.state" : "run.update";
    if (testKind && changes.state) {
      const test = {
        kind: testKind,
        passed: changes.state === "tested",
        value: testValue ?? null,
        note: note ?? null,
      };
      const id = await insertRunTest(tx, {
        runId,
        ...test,
        testedBy: me.user.id,
        runVersion: updated.version,
      });
      detail.test = { id, ...test, unit: TEST_UNITS[testKind] };
      action = "run.test";
    } else if (note) {
      detail.note = note;
    }
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action,
      entityType: "run",
      entityId: runId,
      detail,
    });
    await touchProject(tx, project.id);
    return updated;
  });
}

export async function deleteRun(me: TeamMe, project: ProjectRecord, runId: string): Promise<void> {
  await db().transaction(async (tx) => {
    const current = await getRunForUpdate(tx, me.teamId, project.id, runId);
    if (!current) throw notFound("That run");
    await deleteRunRow(tx, runId);
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "run.delete",
      entityType: "run",
      entityId: runId,
      detail: { projectId: project.id, wireId: current.wireId, run: current },
    });
    await touchProject(tx, project.id);
  });
}

/** Applies the same changes to many runs at once: all or none, refused with 409 if any run changed meanwhile. */
export async function bulkPatchRuns(
  me: TeamMe,
  project: ProjectRecord,
  input: RunBulkPatchInput,
): Promise<RunRecord[]> {
  checkFieldsForRole(me.role, { version: 1, ...input.changes } as RunPatchInput);
  const target = input.changes.state;
  if (target && isTestState(target)) {
    throw invalid(
      "A test result is recorded one run at a time, with its test and value, on the run's trace page.",
      [{ path: "changes.state", message: "Record tested or failed one run at a time" }],
    );
  }
  return db().transaction(async (tx) => {
    const ids = [...new Set(input.items.map((i) => i.id))];
    const current = await lockRuns(tx, me.teamId, project.id, ids);
    if (current.length !== ids.length) throw notFound("One of the selected runs");
    const seen = new Map(input.items.map((i) => [i.id, i.version]));
    const stale = current.filter((r) => seen.get(r.id) !== r.version);
    if (stale.length) {
      throw conflict(
        `${stale.length} of the selected runs changed since you loaded them; nothing was changed.`,
        {
          current: stale,
        },
      );
    }
    if (target) {
      for (const r of current) {
        const refusal = stateChangeRefusal(me.role, r.state, target);
        if (refusal) throw forbidden(`${r.wireId}: ${refusal}`);
      }
    }
    const updated = await updateRunsBulk(tx, ids, input.changes as Partial<RunData>);
    await recordAudits(
      tx,
      updated.map((r) => ({
        teamId: me.teamId,
        actorUserId: me.user.id,
        action: "run.bulk-update",
        entityType: "run",
        entityId: r.id,
        detail: { projectId: project.id, wireId: r.wireId, changes: input.changes },
      })),
    );
    await touchProject(tx, project.id);
    return updated;
  });
}

export type RunView = RunRecord & {
  cutLengthMm: number;
  /** The run's newest test result, where the response carries it (lists, single runs, edits). */
  lastTest?: RunTestRecord | null;
};

/** Adds the cut length under the project's slack rule to each run (computed, never stored). */
export function withCutLength(project: ProjectRecord, runs: RunRecord[]): RunView[] {
  const settings = settingsOf(project);
  return runs.map((r) => ({ ...r, cutLengthMm: runCutLengthMm(r, settings) }));
}

/** Adds each run's newest test result (null when it has none). */
export async function withLastTests(teamId: string, runs: RunView[]): Promise<RunView[]> {
  const latest = await latestRunTests(
    teamId,
    runs.map((r) => r.id),
  );
  return runs.map((r) => ({ ...r, lastTest: latest.get(r.id) ?? null }));
}
