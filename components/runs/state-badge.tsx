// A run's bench state as a labelled badge (text first; the colour only supports it).
import type { BenchState } from "@/lib/domain/types";

const STYLES: Record<BenchState, string> = {
  planned: "bg-paper-deep text-ink-soft",
  cut: "bg-copper-light text-copper-dark",
  marked: "bg-copper-light text-copper-dark",
  terminated: "bg-ink/10 text-ink",
  tested: "bg-pass-light text-pass",
  failed: "bg-fail-light text-fail",
};

export function StateBadge({ state }: { state: BenchState }) {
  return (
    <span className={`inline-block rounded px-2 py-0.5 text-xs font-semibold capitalize ${STYLES[state]}`}>
      {state}
    </span>
  );
}
