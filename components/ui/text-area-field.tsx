// A labelled multi-line text input with its hint and error text tied to it for screen readers.
import type { TextareaHTMLAttributes } from "react";

export function TextAreaField({
  label,
  error,
  hint,
  id,
  ...rest
}: TextareaHTMLAttributes<HTMLTextAreaElement> & {
  label: string;
  error?: string;
  hint?: string;
  id: string;
}) {
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ");
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <textarea
        id={id}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        className={`rounded-md border bg-white px-3 py-2 text-base text-ink shadow-sm placeholder:text-ink-faint focus:border-copper focus:outline-none ${error ? "border-fail" : "border-line-strong"}`}
        {...rest}
      />
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
