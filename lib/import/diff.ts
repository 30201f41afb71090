// Compares imported runs with a project's existing runs by wire ID: added, changed field by field, unchanged, missing.

import { RUN_FIELDS } from "../domain/run-fields";
import type { RunData } from "../domain/types";
import type { FieldChange, RunDiff } from "./types";

/** Wire IDs match ignoring case and surrounding spaces, so "hr3-041" in a file is the run HR3-041. */
export function wireIdKey(wireId: string): string {
  return wireId.trim().toUpperCase();
}

/** CRLF and LF line breaks count as the same text (an import writes "\n"). */
function sameText(a: string, b: string): boolean {
  return a.replace(/\r\n?/g, "\n") === b.replace(/\r\n?/g, "\n");
}

/** Fields that differ between an existing run and its imported version, in catalogue order. */
export function runChanges(existing: RunData, incoming: RunData): FieldChange[] {
  const changes: FieldChange[] = [];
  for (const { key } of RUN_FIELDS) {
    const a = existing[key] ?? null;
    const b = incoming[key] ?? null;
    if (a !== b && !(typeof a === "string" && typeof b === "string" && sameText(a, b))) {
      changes.push({ field: key, old: a, new: b });
    }
  }
  return changes;
}

export interface IncomingRun {
  rowNumber: number;
  run: RunData;
}

/**
 * Diffs complete imported runs against the existing ones. `mentioned` holds the wire IDs of rows that did not
 * parse: they are not diffed, but their runs are not "missing" either. Runs with a blank wire ID are always added.
 */
export function diffRuns(
  incoming: readonly IncomingRun[],
  existing: readonly RunData[],
  mentioned: Iterable<string> = [],
): RunDiff {
  const byKey = new Map<string, RunData>();
  for (const r of existing) byKey.set(wireIdKey(r.wireId), r);
  const seen = new Set<string>([...mentioned].map(wireIdKey));
  const diff: RunDiff = { added: [], changed: [], unchanged: [], missing: [] };
  for (const { rowNumber, run } of incoming) {
    const key = wireIdKey(run.wireId);
    if (key === "") {
      diff.added.push({ rowNumber, wireId: null });
      continue;
    }
    seen.add(key);
    const old = byKey.get(key);
    if (!old) {
      diff.added.push({ rowNumber, wireId: run.wireId });
      continue;
    }
    const changes = runChanges(old, run);
    if (changes.length === 0) diff.unchanged.push({ rowNumber, wireId: run.wireId });
    else diff.changed.push({ rowNumber, wireId: run.wireId, changes });
  }
  for (const r of existing) if (!seen.has(wireIdKey(r.wireId))) diff.missing.push(r.wireId);
  return diff;
}
