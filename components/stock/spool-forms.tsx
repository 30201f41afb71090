"use client";
// The lead's spool forms: put a spool on the shelf, edit lot/location/state, and record a measured length.
import { useState, type FormEvent } from "react";
import { ApiError, sendJson } from "@/lib/client/fetcher";
import { errorMessage, fieldErrors, refreshStock, usePutUps } from "@/lib/client/use-stock";
import type { SpoolAdjustmentRecord, SpoolListItem } from "@/lib/db/spools";
import type { WireTypeListItem } from "@/lib/db/wire-types";
import { SPOOL_STATES } from "@/lib/domain/stock";
import { spoolAdjustmentSchema, spoolCreateSchema, spoolPatchSchema } from "@/lib/validation/stock";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SelectField } from "@/components/ui/select-field";
import { TextAreaField } from "@/components/ui/text-area-field";
import { LENGTH_UNITS, STATE_LABELS, feet, metres, toMm, type LengthUnit } from "@/components/stock/format";
import { wireTypeText } from "@/components/stock/wire-type-label";

const STATE_OPTIONS = SPOOL_STATES.map((s) => ({ value: s, label: STATE_LABELS[s] }));

function issues(parsed: {
  success: boolean;
  error?: { issues: { path: PropertyKey[]; message: string }[] };
}) {
  const errs: Record<string, string> = {};
  for (const i of parsed.error?.issues ?? []) errs[i.path.map(String).join(".")] ??= i.message;
  return errs;
}

/** The current record a 409 answer carries, if any. */
function currentOf(e: unknown): SpoolListItem | null {
  if (e instanceof ApiError && e.status === 409) {
    const d = e.details as { current?: SpoolListItem } | undefined;
    return d?.current ?? null;
  }
  return null;
}

function LengthInput({
  id,
  label,
  value,
  unit,
  onValue,
  onUnit,
  error,
  hint,
}: {
  id: string;
  label: string;
  value: string;
  unit: LengthUnit;
  onValue: (v: string) => void;
  onUnit: (u: LengthUnit) => void;
  error?: string;
  hint?: string;
}) {
  const mm = toMm(value, unit);
  return (
    <div className="grid grid-cols-[minmax(0,1fr)_6rem] gap-3">
      <Field
        id={id}
        label={label}
        inputMode="decimal"
        value={value}
        onChange={(e) => onValue(e.target.value)}
        error={error}
        hint={mm !== null ? `${mm.toLocaleString("en-GB")} mm · ${feet(mm)}` : hint}
      />
      <SelectField
        id={`${id}-unit`}
        label="Unit"
        value={unit}
        onChange={(e) => onUnit(e.target.value as LengthUnit)}
        options={LENGTH_UNITS}
      />
    </div>
  );
}

export function SpoolCreateForm({
  wireTypes,
  wireTypeId,
  onDone,
}: {
  wireTypes: WireTypeListItem[];
  wireTypeId: string | null;
  onDone: (s: SpoolListItem) => void;
}) {
  const [wt, setWt] = useState(wireTypeId ?? wireTypes[0]?.id ?? "");
  const putUps = usePutUps(wt || undefined);
  const [source, setSource] = useState("");
  const [unit, setUnit] = useState<LengthUnit>("m");
  const [length, setLength] = useState("");
  const [lot, setLot] = useState("");
  const [location, setLocation] = useState("");
  const [originNote, setOriginNote] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  const chosen = putUps.data?.items.find((p) => p.id === source) ?? null;

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFormError(null);
    const lengthMm = toMm(length, unit);
    const body = {
      wireTypeId: wt,
      lengthMm: lengthMm ?? (chosen ? chosen.nominalLengthMm : ""),
      initialLengthMm: chosen ? Math.max(chosen.nominalLengthMm, lengthMm ?? 0) : undefined,
      lot,
      location,
      sourcePutUpId: source || null,
      originNote,
    };
    const parsed = spoolCreateSchema.safeParse(body);
    if (!parsed.success) return setErrors(issues(parsed));
    setErrors({});
    setPending(true);
    try {
      const saved = await sendJson<SpoolListItem>("/api/stock/spools", "POST", parsed.data);
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
      <SelectField
        id="sp-wire-type"
        label="Wire type"
        value={wt}
        onChange={(e) => {
          setWt(e.target.value);
          setSource("");
        }}
        error={errors.wireTypeId}
        options={wireTypes.map((w) => ({ value: w.id, label: wireTypeText(w) }))}
      />
      <SelectField
        id="sp-source"
        label="Bought as"
        value={source}
        onChange={(e) => setSource(e.target.value)}
        error={errors.sourcePutUpId}
        hint="Leave as a remnant when it is an offcut or its source is not known"
        options={[
          { value: "", label: "A remnant, or not known" },
          ...(putUps.data?.items ?? []).map((p) => ({
            value: p.id,
            label: `${metres(p.nominalLengthMm)} (${feet(p.nominalLengthMm)}) from ${p.supplierName}`,
          })),
        ]}
      />
      <LengthInput
        id="sp-length"
        label="Measured remaining length"
        value={length}
        unit={unit}
        onValue={setLength}
        onUnit={setUnit}
        error={errors.lengthMm}
        hint={chosen ? `Empty means a full ${metres(chosen.nominalLengthMm)} spool` : "What is on it now"}
      />
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field
          id="sp-lot"
          label="Lot"
          value={lot}
          onChange={(e) => setLot(e.target.value)}
          error={errors.lot}
        />
        <Field
          id="sp-location"
          label="Location"
          value={location}
          onChange={(e) => setLocation(e.target.value)}
          error={errors.location}
          hint="e.g. Rack B2"
        />
      </div>
      <Field
        id="sp-origin"
        label="Origin note"
        value={originNote}
        onChange={(e) => setOriginNote(e.target.value)}
        error={errors.originNote}
        hint="e.g. remnant of an earlier build"
      />
      <div className="flex justify-end">
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Add spool"}
        </Button>
      </div>
    </form>
  );
}

export function SpoolEditForm({
  spool,
  onDone,
}: {
  spool: SpoolListItem;
  onDone: (s: SpoolListItem) => void;
}) {
  const [base, setBase] = useState(spool);
  const [lot, setLot] = useState(spool.lot ?? "");
  const [location, setLocation] = useState(spool.location ?? "");
  const [state, setState] = useState<string>(spool.state);
  const [originNote, setOriginNote] = useState(spool.originNote ?? "");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFormError(null);
    const parsed = spoolPatchSchema.safeParse({ version: base.version, lot, location, state, originNote });
    if (!parsed.success) return setErrors(issues(parsed));
    setErrors({});
    setPending(true);
    try {
      const saved = await sendJson<SpoolListItem>(`/api/stock/spools/${spool.id}`, "PATCH", parsed.data);
      await refreshStock();
      onDone(saved);
    } catch (err) {
      const current = currentOf(err);
      if (current) {
        // Show what is stored now; the lead decides again on fresh values.
        setBase(current);
        setLot(current.lot ?? "");
        setLocation(current.location ?? "");
        setState(current.state);
        setOriginNote(current.originNote ?? "");
        await refreshStock();
      }
      setErrors(fieldErrors(err));
      setFormError(
        current
          ? "Someone changed this spool while you were editing. The form now shows the stored values; make your change again."
          : errorMessage(err),
      );
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <p className="text-sm text-ink-soft">
        {wireTypeText(base)} · {metres(base.lengthMm)} left. To change the length, use “Adjust length”, which
        records the reason.
      </p>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field
          id="se-lot"
          label="Lot"
          value={lot}
          onChange={(e) => setLot(e.target.value)}
          error={errors.lot}
        />
        <Field
          id="se-location"
          label="Location"
          value={location}
          onChange={(e) => setLocation(e.target.value)}
          error={errors.location}
        />
      </div>
      <SelectField
        id="se-state"
        label="State"
        value={state}
        onChange={(e) => setState(e.target.value)}
        error={errors.state}
        hint="Reserved spools are held for a spool plan"
        options={STATE_OPTIONS}
      />
      <Field
        id="se-origin"
        label="Origin note"
        value={originNote}
        onChange={(e) => setOriginNote(e.target.value)}
        error={errors.originNote}
      />
      <div className="flex justify-end">
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Save spool"}
        </Button>
      </div>
    </form>
  );
}

export function AdjustLengthForm({
  spool,
  onDone,
}: {
  spool: SpoolListItem;
  onDone: (r: { spool: SpoolListItem; adjustment: SpoolAdjustmentRecord }) => void;
}) {
  const [base, setBase] = useState(spool);
  const [done, setDone] = useState<string | null>(null);
  const [unit, setUnit] = useState<LengthUnit>("m");
  const [length, setLength] = useState("");
  const [reason, setReason] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFormError(null);
    setDone(null);
    const mm = toMm(length, unit);
    const errs: Record<string, string> = {};
    if (mm === null) errs.lengthMm = "Give the measured length as a number.";
    const parsed = spoolAdjustmentSchema.safeParse({ lengthMm: mm ?? "", reason, version: base.version });
    if (!parsed.success) Object.assign(errs, { ...issues(parsed), ...errs });
    setErrors(errs);
    if (Object.keys(errs).length > 0 || !parsed.success) return;
    setPending(true);
    try {
      const r = await sendJson<{ spool: SpoolListItem; adjustment: SpoolAdjustmentRecord }>(
        `/api/stock/spools/${spool.id}/adjustments`,
        "POST",
        parsed.data,
      );
      await refreshStock();
      setLength("");
      setReason("");
      setBase(r.spool);
      setDone(`Recorded ${metres(r.spool.lengthMm)}: “${r.adjustment.reason}”.`);
      onDone(r);
    } catch (err) {
      const current = currentOf(err);
      if (current) {
        setBase(current);
        await refreshStock();
      }
      setErrors(fieldErrors(err));
      setFormError(
        current
          ? `Someone changed this spool meanwhile: it now has ${metres(current.lengthMm)}. Check and save again.`
          : errorMessage(err),
      );
    } finally {
      setPending(false);
    }
  }

  const mm = toMm(length, unit);
  const delta = mm === null ? null : mm - base.lengthMm;

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      {done ? <Notice tone="ok">{done}</Notice> : null}
      <p className="text-sm">
        Recorded now: <strong className="tabular-nums">{metres(base.lengthMm)}</strong>{" "}
        <span className="text-ink-soft">({feet(base.lengthMm)})</span>
      </p>
      <LengthInput
        id="adj-length"
        label="Measured length"
        value={length}
        unit={unit}
        onValue={setLength}
        onUnit={setUnit}
        error={errors.lengthMm}
        hint="What is on the spool now; 0 marks it used up"
      />
      {delta !== null && delta !== 0 ? (
        <p className="text-sm text-ink-soft">
          Change: <span className="tabular-nums">{`${delta > 0 ? "+" : "−"}${metres(Math.abs(delta))}`}</span>
        </p>
      ) : null}
      <TextAreaField
        id="adj-reason"
        label="Reason"
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        error={errors.reason}
        hint="Required: who reads the history later needs to know why, e.g. “Re-measured after test cuts”"
        required
      />
      <div className="flex justify-end">
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Save length"}
        </Button>
      </div>
    </form>
  );
}
