"use client";
// A run's detail drawer: every field; the lead can edit them, checked by the same schema as the server.
import { useState } from "react";
import { sendJson } from "@/lib/client/fetcher";
import type { RunView as RunRecord } from "@/lib/services/runs";
import { DROP_CLASSES, RETURN_KINDS, TERMINATIONS } from "@/lib/domain/types";
import { runPatchSchema } from "@/lib/validation/runs";
import { Button } from "@/components/ui/button";
import { ColourSwatch } from "@/components/ui/colour-swatch";
import { StateBadge } from "@/components/runs/state-badge";

type Kind = "text" | "number" | "bool" | { options: readonly string[] };
const FIELDS: { key: keyof RunRecord; label: string; kind: Kind }[] = [
  { key: "wireId", label: "Wire ID", kind: "text" },
  { key: "circuit", label: "Circuit", kind: "text" },
  { key: "endA", label: "End A", kind: "text" },
  { key: "endATermination", label: "End A termination", kind: { options: TERMINATIONS } },
  { key: "endAStripMm", label: "End A strip (mm)", kind: "number" },
  { key: "endB", label: "End B", kind: "text" },
  { key: "endBTermination", label: "End B termination", kind: { options: TERMINATIONS } },
  { key: "endBStripMm", label: "End B strip (mm)", kind: "number" },
  { key: "gauge", label: "Gauge", kind: "text" },
  { key: "colour", label: "Colour (IEC 60757)", kind: "text" },
  { key: "insulation", label: "Insulation", kind: "text" },
  { key: "insulationTempC", label: "Insulation rating (°C)", kind: "number" },
  { key: "bundleSize", label: "Bundle size (wires)", kind: "number" },
  { key: "hotSpace", label: "Hot space (engine or motor bay)", kind: "bool" },
  { key: "routedLengthMm", label: "Routed length (mm)", kind: "number" },
  { key: "currentA", label: "Current (A)", kind: "number" },
  { key: "peakCurrentA", label: "Peak current (A)", kind: "number" },
  { key: "supplyV", label: "Supply (V)", kind: "number" },
  { key: "dropClass", label: "Drop class", kind: { options: DROP_CLASSES } },
  { key: "dropLimitPct", label: "Custom drop limit (%)", kind: "number" },
  { key: "fuseA", label: "Fuse (A)", kind: "number" },
  { key: "returnKind", label: "Return path", kind: { options: RETURN_KINDS } },
  { key: "returnRunWireId", label: "Return run (wire ID)", kind: "text" },
  { key: "returnResistanceOhm", label: "Chassis return (Ω)", kind: "number" },
  { key: "ledForwardV", label: "LED forward voltage (V)", kind: "number" },
  { key: "ledCurrentA", label: "LED current (A)", kind: "number" },
  { key: "notes", label: "Notes", kind: "text" },
];

function asText(v: unknown): string {
  return v === null || v === undefined ? "" : String(v);
}

export function RunDrawer(props: {
  projectId: string;
  run: RunRecord;
  canEdit: boolean;
  onClose: () => void;
  onSaved: (r: RunRecord) => void;
  onError: (e: unknown) => void;
}) {
  const { run } = props;
  const [draft, setDraft] = useState<Record<string, string | boolean>>({});
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saving, setSaving] = useState(false);

  async function save() {
    const body: Record<string, unknown> = { version: run.version };
    for (const [k, v] of Object.entries(draft)) body[k] = typeof v === "string" && v.trim() === "" ? null : v;
    const parsed = runPatchSchema.safeParse(body);
    if (!parsed.success) {
      const e: Record<string, string> = {};
      for (const i of parsed.error.issues) e[String(i.path[0])] ??= i.message;
      return setErrors(e);
    }
    setSaving(true);
    try {
      const updated = await sendJson<RunRecord>(
        `/api/projects/${props.projectId}/runs/${run.id}`,
        "PATCH",
        parsed.data,
      );
      props.onSaved(updated);
      setDraft({});
      setErrors({});
    } catch (e) {
      props.onError(e);
    } finally {
      setSaving(false);
    }
  }

  const dirty = Object.keys(draft).length > 0;
  return (
    <div className="fixed inset-0 z-40 flex justify-end bg-ink/30" onClick={props.onClose}>
      <aside
        role="dialog"
        aria-modal="true"
        aria-label={`Run ${run.wireId}`}
        className="flex h-full w-full max-w-md flex-col overflow-y-auto bg-white shadow-xl"
        onClick={(e) => e.stopPropagation()}
        onKeyDown={(e) => e.key === "Escape" && props.onClose()}
      >
        <header className="flex items-start justify-between gap-3 border-b border-line p-5">
          <div>
            <p className="font-mono text-xl font-bold">{run.wireId}</p>
            <p className="text-sm text-ink-soft">{run.circuit ?? "No circuit name"}</p>
            <div className="mt-2 flex items-center gap-3">
              <StateBadge state={run.state} />
              <ColourSwatch code={run.colour} />
              <span className="text-sm">{run.gauge}</span>
              <span className="text-xs text-ink-faint">version {run.version}</span>
            </div>
          </div>
          <Button variant="quiet" size="sm" onClick={props.onClose} aria-label="Close" autoFocus>
            ✕
          </Button>
        </header>
        <dl className="grid grid-cols-1 gap-3 p-5">
          {FIELDS.map((f) => {
            const id = `run-${f.key}`;
            const current = draft[f.key] ?? (f.kind === "bool" ? Boolean(run[f.key]) : asText(run[f.key]));
            return (
              <div key={f.key} className="grid grid-cols-[10rem_1fr] items-center gap-2">
                <dt>
                  <label htmlFor={id} className="text-xs font-semibold text-ink-soft">
                    {f.label}
                  </label>
                </dt>
                <dd>
                  {!props.canEdit ? (
                    <span id={id} className="text-sm">
                      {f.kind === "bool" ? (run[f.key] ? "yes" : "no") : asText(run[f.key]) || "—"}
                    </span>
                  ) : f.kind === "bool" ? (
                    <input
                      id={id}
                      type="checkbox"
                      checked={Boolean(current)}
                      onChange={(e) => setDraft({ ...draft, [f.key]: e.target.checked })}
                    />
                  ) : typeof f.kind === "object" ? (
                    <select
                      id={id}
                      value={String(current)}
                      onChange={(e) => setDraft({ ...draft, [f.key]: e.target.value })}
                      className="h-9 w-full rounded border border-line-strong px-2 text-sm"
                    >
                      <option value="">—</option>
                      {f.kind.options.map((o) => (
                        <option key={o}>{o}</option>
                      ))}
                    </select>
                  ) : (
                    <input
                      id={id}
                      value={String(current)}
                      inputMode={f.kind === "number" ? "decimal" : undefined}
                      onChange={(e) => setDraft({ ...draft, [f.key]: e.target.value })}
                      aria-invalid={errors[f.key] ? true : undefined}
                      className={`h-9 w-full rounded border px-2 text-sm ${errors[f.key] ? "border-fail" : "border-line-strong"}`}
                    />
                  )}
                  {errors[f.key] ? <p className="mt-1 text-xs text-fail">{errors[f.key]}</p> : null}
                </dd>
              </div>
            );
          })}
        </dl>
        {props.canEdit ? (
          <footer className="sticky bottom-0 mt-auto flex gap-2 border-t border-line bg-white p-4">
            <Button onClick={() => void save()} disabled={!dirty || saving}>
              {saving ? "Saving…" : "Save changes"}
            </Button>
            <Button variant="secondary" onClick={() => setDraft({})} disabled={!dirty}>
              Discard
            </Button>
          </footer>
        ) : null}
      </aside>
    </div>
  );
}
