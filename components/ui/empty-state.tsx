// The designed empty state: a drawing of an empty spool, a sentence and what to do next.
import type { ReactNode } from "react";

export function EmptyState({
  title,
  children,
  action,
}: {
  title: string;
  children?: ReactNode;
  action?: ReactNode;
}) {
  return (
    <div className="flex flex-col items-center gap-3 rounded-lg border border-dashed border-line-strong bg-white/60 px-6 py-12 text-center">
      <svg width="56" height="56" viewBox="0 0 56 56" aria-hidden="true">
        <ellipse cx="28" cy="12" rx="20" ry="6" fill="none" stroke="#b9b2a3" strokeWidth="2.5" />
        <ellipse cx="28" cy="44" rx="20" ry="6" fill="none" stroke="#b9b2a3" strokeWidth="2.5" />
        <path d="M16 14v28M40 14v28" stroke="#b9b2a3" strokeWidth="2.5" />
        <path d="M18 26c6 3 14 3 20 0" stroke="#d9752f" strokeWidth="2.5" fill="none" strokeLinecap="round" />
      </svg>
      <h2 className="text-lg font-semibold text-ink">{title}</h2>
      {children ? <div className="max-w-md text-sm text-ink-soft">{children}</div> : null}
      {action}
    </div>
  );
}
