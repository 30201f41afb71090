"use client";
// The lead's form to save a marker template of the team's own, starting from the one chosen (e.g. after
// measuring the printer's offset on the calibration page).
import { useState } from "react";
import { sendJson } from "@/lib/client/fetcher";
import type { TemplateView } from "@/lib/services/print";
import { markerTemplateBodySchema } from "@/lib/validation/print";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

const FIELDS = [
  ["markerWidthMm", "Marker length along the wire (mm)"],
  ["markerHeightMm", "Marker height, flat sleeve width (mm)"],
  ["columns", "Columns"],
  ["rows", "Rows"],
  ["pitchXMm", "Horizontal pitch (mm)"],
  ["pitchYMm", "Vertical pitch (mm)"],
  ["marginLeftMm", "Left margin (mm)"],
  ["marginTopMm", "Top margin (mm)"],
  ["printerOffsetXMm", "Printer offset across (mm)"],
  ["printerOffsetYMm", "Printer offset down (mm)"],
] as const;

export function TemplateEditor({
  base,
  onSaved,
}: {
  base: TemplateView;
  onSaved: (t: TemplateView) => void;
}) {
  const [name, setName] = useState(`${base.name} (ours)`);
  const [values, setValues] = useState<Record<string, string>>(
    () => Object.fromEntries(FIELDS.map(([k]) => [k, String(base[k])])) as Record<string, string>,
  );
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function save() {
    const { id: _id, builtIn: _b, version: _v, ...rest } = base;
    const parsed = markerTemplateBodySchema.safeParse({ ...rest, ...values, name });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? "Check the values.");
    setBusy(true);
    try {
      onSaved(await sendJson<TemplateView>("/api/print/templates", "POST", parsed.data));
      setError(null);
    } catch (e) {
      setError(e instanceof Error ? e.message : "Not saved.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <form
      aria-label="Save a template"
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
        Template name
        <input
          value={name}
          onChange={(e) => setName(e.target.value)}
          className="h-9 rounded border border-line-strong px-2 text-sm font-normal text-ink"
        />
      </label>
      <div className="grid grid-cols-2 gap-2">
        {FIELDS.map(([k, label]) => (
          <label key={k} className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
            {label}
            <input
              inputMode="decimal"
              value={values[k]}
              onChange={(e) => setValues({ ...values, [k]: e.target.value })}
              className="h-9 rounded border border-line-strong px-2 text-sm font-normal text-ink"
            />
          </label>
        ))}
      </div>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Button size="sm" type="submit" disabled={busy}>
        {busy ? "Saving…" : "Save as team template"}
      </Button>
    </form>
  );
}
