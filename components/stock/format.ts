// How stock quantities read on screen: lengths in metres with feet beside them, money in its currency.
import { MM_PER_FOOT, mmToFeet } from "@/lib/domain/stock";

const LOCALE = "en-GB";

export function metres(mm: number, digits = 2): string {
  return `${(mm / 1000).toLocaleString(LOCALE, { minimumFractionDigits: digits, maximumFractionDigits: digits })} m`;
}

export function feet(mm: number): string {
  const ft = mmToFeet(mm);
  const whole = Math.abs(ft - Math.round(ft)) < 0.005;
  return `${ft.toLocaleString(LOCALE, { maximumFractionDigits: whole ? 0 : 1 })} ft`;
}

/** A put-up's length as sold: "100 ft" when it is a whole number of feet, otherwise metres. */
export function putUpLength(mm: number): string {
  return Number.isInteger(mm / MM_PER_FOOT) ||
    Math.abs(mm / MM_PER_FOOT - Math.round(mm / MM_PER_FOOT)) < 1e-6
    ? feet(mm)
    : metres(mm, mm % 1000 === 0 ? 0 : 2);
}

export function money(cents: number, currency: string, digits = 2): string {
  try {
    return new Intl.NumberFormat(LOCALE, {
      style: "currency",
      currency,
      currencyDisplay: "narrowSymbol",
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    }).format(cents / 100);
  } catch {
    return `${(cents / 100).toFixed(digits)} ${currency}`;
  }
}

export function dateTime(iso: string): string {
  return new Date(iso).toLocaleString(LOCALE, { dateStyle: "medium", timeStyle: "short" });
}

export const STATE_LABELS = { open: "Open", reserved: "Reserved", used_up: "Used up" } as const;

export const LENGTH_UNITS = [
  { value: "m", label: "m" },
  { value: "ft", label: "ft" },
  { value: "mm", label: "mm" },
] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number]["value"];

/** Whole millimetres from what was typed in a unit; null when it is not a number. */
export function toMm(value: string, unit: LengthUnit): number | null {
  const v = value.trim().replace(",", ".");
  if (v === "") return null;
  const n = Number(v);
  if (!Number.isFinite(n)) return null;
  if (unit === "mm") return Math.round(n);
  if (unit === "ft") return Math.round(n * MM_PER_FOOT);
  return Math.round(n * 1000);
}

/** A length in a unit, for pre-filling an input. */
export function fromMm(mm: number, unit: LengthUnit): string {
  if (unit === "mm") return String(mm);
  if (unit === "ft") return String(Number((mm / MM_PER_FOOT).toFixed(2)));
  return String(Number((mm / 1000).toFixed(3)));
}

/** Whole cents from a price typed in the currency's main unit ("12.50"); null when it is not a number. */
export function toCents(value: string): number | null {
  const v = value.trim().replace(",", ".");
  if (v === "" || !/^-?\d*(\.\d*)?$/.test(v)) return null;
  return Math.round(Number(v) * 100);
}
