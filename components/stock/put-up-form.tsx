"use client";
// The lead's form for a put-up: length in ft, m or mm, price in the currency's main unit, supplier and part number.
import { useState, type FormEvent } from "react";
import { sendJson } from "@/lib/client/fetcher";
import { errorMessage, fieldErrors, refreshStock } from "@/lib/client/use-stock";
import type { PutUpListItem } from "@/lib/db/put-ups";
import type { WireTypeListItem } from "@/lib/db/wire-types";
import { DEFAULT_CURRENCY, MM_PER_FOOT } from "@/lib/domain/stock";
import { putUpCreateSchema, putUpPatchSchema } from "@/lib/validation/stock";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SelectField } from "@/components/ui/select-field";
import { LENGTH_UNITS, fromMm, money, toCents, toMm, type LengthUnit } from "@/components/stock/format";
import { wireTypeText } from "@/components/stock/wire-type-label";

function unitFor(mm: number): LengthUnit {
  return Math.abs(mm / MM_PER_FOOT - Math.round(mm / MM_PER_FOOT)) < 1e-6
    ? "ft"
    : mm % 1000 === 0
      ? "m"
      : "mm";
}

export function PutUpForm({
  existing,
  wireTypes,
  wireTypeId,
  suppliers,
  defaultCurrency,
  onDone,
}: {
  existing: PutUpListItem | null;
  wireTypes: WireTypeListItem[];
  /** Pre-selected wire type for a new put-up. */
  wireTypeId: string | null;
  /** Supplier names already in use, offered as suggestions. */
  suppliers: string[];
  defaultCurrency: string | null;
  onDone: (saved: PutUpListItem) => void;
}) {
  const startUnit: LengthUnit = existing ? unitFor(existing.nominalLengthMm) : "ft";
  const [wt, setWt] = useState(existing?.wireTypeId ?? wireTypeId ?? wireTypes[0]?.id ?? "");
  const [unit, setUnit] = useState<LengthUnit>(startUnit);
  const [length, setLength] = useState(existing ? fromMm(existing.nominalLengthMm, startUnit) : "");
  const [price, setPrice] = useState(existing ? (existing.priceCents / 100).toFixed(2) : "");
  const [currency, setCurrency] = useState(existing?.currency ?? defaultCurrency ?? DEFAULT_CURRENCY);
  const [supplier, setSupplier] = useState(existing?.supplierName ?? "");
  const [partNo, setPartNo] = useState(existing?.supplierPartNo ?? "");
  const [active, setActive] = useState(existing?.active ?? true);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  const lengthMm = toMm(length, unit);
  const priceCents = toCents(price);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFormError(null);
    const errs: Record<string, string> = {};
    if (lengthMm === null) errs.nominalLengthMm = "Give the length as a number.";
    if (priceCents === null) errs.priceCents = "Give the price as a number, e.g. 12.50.";
    const body = {
      ...(existing ? {} : { wireTypeId: wt }),
      nominalLengthMm: lengthMm ?? "",
      priceCents: priceCents ?? "",
      currency,
      supplierName: supplier,
      supplierPartNo: partNo,
      active,
    };
    const parsed = existing ? putUpPatchSchema.safeParse(body) : putUpCreateSchema.safeParse(body);
    if (!parsed.success) for (const i of parsed.error.issues) errs[i.path.join(".")] ??= i.message;
    setErrors(errs);
    if (Object.keys(errs).length > 0 || !parsed.success) return;
    setPending(true);
    try {
      const saved = existing
        ? await sendJson<PutUpListItem>(`/api/stock/put-ups/${existing.id}`, "PATCH", parsed.data)
        : await sendJson<PutUpListItem>("/api/stock/put-ups", "POST", parsed.data);
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
      {existing ? (
        <p className="text-sm text-ink-soft">
          Wire type: <strong className="text-ink">{wireTypeText(existing)}</strong>
        </p>
      ) : (
        <SelectField
          id="pu-wire-type"
          label="Wire type"
          value={wt}
          onChange={(e) => setWt(e.target.value)}
          error={errors.wireTypeId}
          options={wireTypes.map((w) => ({ value: w.id, label: wireTypeText(w) }))}
        />
      )}
      <div className="grid grid-cols-[minmax(0,1fr)_6rem] gap-3">
        <Field
          id="pu-length"
          label="Length"
          inputMode="decimal"
          value={length}
          onChange={(e) => setLength(e.target.value)}
          error={errors.nominalLengthMm}
          hint={
            lengthMm !== null && lengthMm > 0
              ? `${lengthMm.toLocaleString("en-GB")} mm`
              : "The nominal spool length"
          }
          required
        />
        <SelectField
          id="pu-length-unit"
          label="Unit"
          value={unit}
          onChange={(e) => setUnit(e.target.value as LengthUnit)}
          options={LENGTH_UNITS}
        />
      </div>
      <div className="grid grid-cols-[minmax(0,1fr)_6rem] gap-3">
        <Field
          id="pu-price"
          label="Price"
          inputMode="decimal"
          value={price}
          onChange={(e) => setPrice(e.target.value)}
          error={errors.priceCents}
          hint={
            priceCents !== null && lengthMm
              ? `${money((priceCents * 1000) / lengthMm, currency.length === 3 ? currency : DEFAULT_CURRENCY, 3)} per metre`
              : "For the whole spool"
          }
          required
        />
        <Field
          id="pu-currency"
          label="Currency"
          value={currency}
          maxLength={3}
          onChange={(e) => setCurrency(e.target.value.toUpperCase())}
          error={errors.currency}
          autoComplete="off"
        />
      </div>
      <Field
        id="pu-supplier"
        label="Supplier"
        list="pu-suppliers"
        value={supplier}
        onChange={(e) => setSupplier(e.target.value)}
        error={errors.supplierName}
        autoComplete="off"
        required
      />
      <datalist id="pu-suppliers">
        {suppliers.map((s) => (
          <option key={s} value={s} />
        ))}
      </datalist>
      <Field
        id="pu-part"
        label="Supplier part number"
        value={partNo}
        onChange={(e) => setPartNo(e.target.value)}
        error={errors.supplierPartNo}
        autoComplete="off"
      />
      <label className="flex items-center gap-3 text-sm font-semibold">
        <input
          type="checkbox"
          className="h-5 w-5 accent-copper"
          checked={active}
          onChange={(e) => setActive(e.target.checked)}
        />
        Active (offered when planning purchases)
      </label>
      <div className="flex justify-end gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : existing ? "Save put-up" : "Add put-up"}
        </Button>
      </div>
    </form>
  );
}
