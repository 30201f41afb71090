// A spool's state as a labelled badge (the word first; the colour only supports it).
import type { SpoolState } from "@/lib/domain/stock";
import { STATE_LABELS } from "@/components/stock/format";

const STYLES: Record<SpoolState, string> = {
  open: "bg-pass-light text-pass",
  reserved: "bg-warn-light text-warn",
  used_up: "bg-paper-deep text-ink-faint",
};

export function SpoolStateBadge({ state }: { state: SpoolState }) {
  return (
    <span
      className={`inline-block whitespace-nowrap rounded px-2 py-0.5 text-xs font-semibold ${STYLES[state]}`}
    >
      {STATE_LABELS[state]}
    </span>
  );
}
