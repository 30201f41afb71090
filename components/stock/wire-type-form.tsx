"use client";
// The lead's form for a new or edited wire type; the same zod schema checks it here and on the server.
import { useState, type FormEvent } from "react";
import { sendJson } from "@/lib/client/fetcher";
import { errorMessage, fieldErrors, refreshStock } from "@/lib/client/use-stock";
import type { WireTypeListItem } from "@/lib/db/wire-types";
import { normaliseColour } from "@/lib/domain/colour";
import { typicalOuterDiameterMm } from "@/lib/domain/stock";
import { wireTypeCreateSchema, wireTypePatchSchema } from "@/lib/validation/stock";
import { Button } from "@/components/ui/button";
import { ColourSwatch } from "@/components/ui/colour-swatch";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SelectField } from "@/components/ui/select-field";
import { TextAreaField } from "@/components/ui/text-area-field";

export interface WireTypePrefill {
  gauge?: string;
  colour?: string;
  insulation?: string;
  insulationTempC?: string;
}

type Values = {
  gauge: string;
  colour: string;
  insulation: string;
  conductorMaterial: string;
  tinned: boolean;
  outerDiameterMm: string;
  insulationTempC: string;
  notes: string;
};

function initial(existing: WireTypeListItem | null, prefill: WireTypePrefill | null): Values {
  if (existing) {
    return {
      gauge: existing.gauge,
      colour: existing.colour,
      insulation: existing.insulation ?? "",
      conductorMaterial: existing.conductorMaterial,
      tinned: existing.tinned,
      outerDiameterMm: existing.outerDiameterMm === null ? "" : String(existing.outerDiameterMm),
      insulationTempC: existing.insulationTempC === null ? "" : String(existing.insulationTempC),
      notes: existing.notes ?? "",
    };
  }
  const od = prefill?.gauge ? typicalOuterDiameterMm(prefill.gauge, prefill.insulation ?? null) : null;
  return {
    gauge: prefill?.gauge ?? "",
    colour: prefill?.colour ?? "",
    insulation: prefill?.insulation ?? "",
    conductorMaterial: "copper",
    tinned: false,
    outerDiameterMm: od === null ? "" : String(od),
    insulationTempC: prefill?.insulationTempC ?? "",
    notes: "",
  };
}

export function WireTypeForm({
  existing,
  prefill,
  onDone,
}: {
  existing: WireTypeListItem | null;
  prefill: WireTypePrefill | null;
  onDone: (saved: WireTypeListItem) => void;
}) {
  const [v, setV] = useState<Values>(() => initial(existing, prefill));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const set = <K extends keyof Values>(k: K, value: Values[K]) => setV((o) => ({ ...o, [k]: value }));

  const typicalOd = typicalOuterDiameterMm(v.gauge, v.insulation || null);
  const colourCode = normaliseColour(v.colour);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFormError(null);
    const parsed = existing ? wireTypePatchSchema.safeParse(v) : wireTypeCreateSchema.safeParse(v);
    if (!parsed.success) {
      const errs: Record<string, string> = {};
      for (const i of parsed.error.issues) errs[i.path.join(".")] ??= i.message;
      setErrors(errs);
      return;
    }
    setErrors({});
    setPending(true);
    try {
      const saved = existing
        ? await sendJson<WireTypeListItem>(`/api/stock/wire-types/${existing.id}`, "PATCH", parsed.data)
        : await sendJson<WireTypeListItem>("/api/stock/wire-types", "POST", parsed.data);
      await refreshStock();
      onDone(saved);
    } catch (err) {
      setErrors(fieldErrors(err));
      setFormError(errorMessage(err));
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field
          id="wt-gauge"
          label="Gauge"
          value={v.gauge}
          onChange={(e) => set("gauge", e.target.value)}
          error={errors.gauge}
          hint="e.g. 18 AWG, 1/0 AWG or 0.75 mm²"
          autoComplete="off"
          required
        />
        <div className="flex flex-col gap-1">
          <Field
            id="wt-colour"
            label="Colour"
            value={v.colour}
            onChange={(e) => set("colour", e.target.value)}
            error={errors.colour}
            hint="IEC 60757 code (RD, GNYE, WHBU) or a name"
            autoComplete="off"
            required
          />
          {colourCode ? (
            <span className="text-xs text-ink-soft">
              Reads as <ColourSwatch code={colourCode} />
            </span>
          ) : null}
        </div>
      </div>
      <Field
        id="wt-insulation"
        label="Insulation spec"
        value={v.insulation}
        onChange={(e) => set("insulation", e.target.value)}
        error={errors.insulation}
        hint="e.g. UL 1007, SAE J1128 GXL; the same gauge and colour in another spec is another stock item"
        autoComplete="off"
      />
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <SelectField
          id="wt-conductor"
          label="Conductor"
          value={v.conductorMaterial}
          onChange={(e) => set("conductorMaterial", e.target.value)}
          error={errors.conductorMaterial}
          options={[
            { value: "copper", label: "Copper" },
            { value: "aluminium", label: "Aluminium" },
          ]}
        />
        <label className="flex items-center gap-3 self-end pb-2 text-sm font-semibold">
          <input
            type="checkbox"
            className="h-5 w-5 accent-copper"
            checked={v.tinned}
            onChange={(e) => set("tinned", e.target.checked)}
          />
          Tinned strands
        </label>
      </div>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <div className="flex flex-col gap-1">
          <Field
            id="wt-od"
            label="Outer diameter (mm)"
            inputMode="decimal"
            value={v.outerDiameterMm}
            onChange={(e) => set("outerDiameterMm", e.target.value)}
            error={errors.outerDiameterMm}
            hint="Sizes the marker sleeves"
          />
          {typicalOd !== null && v.outerDiameterMm !== String(typicalOd) ? (
            <button
              type="button"
              className="self-start text-xs font-semibold text-copper-dark underline"
              onClick={() => set("outerDiameterMm", String(typicalOd))}
            >
              Use the typical {typicalOd} mm for this spec (a default; the maker&apos;s sheet wins)
            </button>
          ) : null}
        </div>
        <Field
          id="wt-temp"
          label="Insulation rating (°C)"
          inputMode="numeric"
          value={v.insulationTempC}
          onChange={(e) => set("insulationTempC", e.target.value)}
          error={errors.insulationTempC}
        />
      </div>
      <TextAreaField
        id="wt-notes"
        label="Notes"
        value={v.notes}
        onChange={(e) => set("notes", e.target.value)}
        error={errors.notes}
      />
      <div className="flex justify-end gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : existing ? "Save wire type" : "Add wire type"}
        </Button>
      </div>
    </form>
  );
}
