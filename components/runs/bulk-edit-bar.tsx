"use client";
// Applies one change to every selected run in one request (all or none).
import { useState } from "react";
import { sendJson } from "@/lib/client/fetcher";
import type { RunView as RunRecord } from "@/lib/services/runs";
import type { Role } from "@/lib/auth/roles";
import { BENCH_STATES } from "@/lib/domain/types";
// Test results (tested, failed) are recorded one run at a time, with their value, on the trace page.
import { isTestState, statesRoleMaySet } from "@/lib/domain/bench-state";
import { runBulkPatchSchema } from "@/lib/validation/runs";
import { Button, buttonClass } from "@/components/ui/button";

const FIELDS = [
  { key: "gauge", label: "Gauge", leadOnly: true },
  { key: "colour", label: "Colour", leadOnly: true },
  { key: "insulation", label: "Insulation", leadOnly: true },
  { key: "state", label: "State", leadOnly: false },
] as const;

export function BulkEditBar(props: {
  projectId: string;
  role: Role;
  runs: RunRecord[];
  onDone: (updated: RunRecord[]) => void;
  onError: (e: unknown) => void;
  onClear: () => void;
}) {
  const fields = FIELDS.filter((f) => props.role === "lead" || !f.leadOnly);
  const [field, setField] = useState<(typeof FIELDS)[number]["key"]>(fields[0]!.key);
  const [value, setValue] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function apply() {
    const parsed = runBulkPatchSchema.safeParse({
      items: props.runs.map((r) => ({ id: r.id, version: r.version })),
      changes: { [field]: value.trim() === "" && field === "insulation" ? null : value },
    });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? "Not a valid value");
    setBusy(true);
    try {
      const res = await sendJson<{ items: RunRecord[] }>(
        `/api/projects/${props.projectId}/runs/bulk`,
        "POST",
        parsed.data,
      );
      props.onDone(res.items);
      setValue("");
      setError(null);
    } catch (e) {
      props.onError(e);
    } finally {
      setBusy(false);
    }
  }

  return (
    <div
      role="region"
      aria-label="Change selected runs"
      className="flex flex-wrap items-end gap-3 rounded-lg border border-copper bg-copper-light/40 px-4 py-3"
    >
      <p className="self-center text-sm font-semibold">{props.runs.length} selected</p>
      <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
        Field
        <select
          value={field}
          onChange={(e) => {
            setField(e.target.value as typeof field);
            setValue("");
            setError(null);
          }}
          className="h-9 rounded-md border border-line-strong bg-white px-2 text-sm"
        >
          {fields.map((f) => (
            <option key={f.key} value={f.key}>
              {f.label}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
        New value
        {field === "state" ? (
          <select
            value={value}
            onChange={(e) => setValue(e.target.value)}
            className="h-9 rounded-md border border-line-strong bg-white px-2 text-sm capitalize"
          >
            <option value="">Choose…</option>
            {BENCH_STATES.filter((s) => statesRoleMaySet(props.role).includes(s) && !isTestState(s)).map(
              (s) => (
                <option key={s}>{s}</option>
              ),
            )}
          </select>
        ) : (
          <input
            value={value}
            onChange={(e) => setValue(e.target.value)}
            placeholder={
              field === "gauge" ? "e.g. 16 AWG" : field === "colour" ? "e.g. RD or red" : "e.g. SAE J1128 GXL"
            }
            className="h-9 w-48 rounded-md border border-line-strong bg-white px-2 text-sm"
          />
        )}
      </label>
      <Button size="sm" onClick={() => void apply()} disabled={busy}>
        {busy ? "Applying…" : `Apply to ${props.runs.length}`}
      </Button>
      <a
        className={buttonClass("secondary", "sm")}
        href={`/projects/${props.projectId}/print?runs=${props.runs.map((r) => r.wireId).join(",")}`}
      >
        Print markers
      </a>
      <Button size="sm" variant="quiet" onClick={props.onClear}>
        Clear selection
      </Button>
      {error ? (
        <p role="alert" className="w-full text-sm text-fail">
          {error}
        </p>
      ) : null}
    </div>
  );
}
