// A labelled select with its hint and error text tied to it, matching Field.
import type { SelectHTMLAttributes } from "react";

export function SelectField({
  label,
  error,
  hint,
  id,
  children,
  options,
  ...rest
}: SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  error?: string;
  hint?: string;
  id: string;
  /** The choices, when not given as <option> children. */
  options?: readonly { value: string; label: string }[];
}) {
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ");
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        className={`h-11 rounded-md border bg-white px-3 text-base text-ink shadow-sm focus:border-copper focus:outline-none ${error ? "border-fail" : "border-line-strong"}`}
        {...rest}
      >
        {options
          ? options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))
          : children}
      </select>
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm text-fail">
          {error}
        </p>
      ) : null}
    </div>
  );
}
