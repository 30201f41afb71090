// Parsing one inline edit of a run with the same schema the server uses.
import type { RunView as RunRecord } from "@/lib/services/runs";
import { runPatchSchema } from "@/lib/validation/runs";

export const NUMERIC_FIELDS = ["routedLengthMm", "currentA", "fuseA"] as const;
const NUMERIC: ReadonlySet<string> = new Set(NUMERIC_FIELDS);

/** Parses one edited cell with the same schema the server uses; "" clears a nullable field. */
export function parseCellEdit(
  run: RunRecord,
  id: keyof RunRecord,
  raw: string,
): { ok: true; body: Record<string, unknown> } | { ok: false; message: string } {
  const trimmed = raw.trim();
  const value = trimmed === "" ? null : NUMERIC.has(id) ? trimmed.replace(/,/g, "") : trimmed;
  const r = runPatchSchema.safeParse({ version: run.version, [id]: value });
  if (!r.success) return { ok: false, message: r.error.issues[0]?.message ?? "Not a valid value" };
  return { ok: true, body: r.data };
}
