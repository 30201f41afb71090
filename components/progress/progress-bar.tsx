// A stacked bar of runs per bench state, in bench order; each part is labelled, the colours only support the text.
import { BENCH_STATES, type BenchState } from "@/lib/domain/types";
import type { StateCounts } from "@/lib/domain/progress";

export const STATE_FILLS: Record<BenchState, string> = {
  planned: "bg-paper-deep",
  cut: "bg-copper-light",
  marked: "bg-copper",
  terminated: "bg-ink-soft",
  tested: "bg-pass",
  failed: "bg-fail",
};

export function ProgressBar({
  byState,
  total,
  label,
  tall = false,
}: {
  byState: StateCounts;
  total: number;
  label: string;
  tall?: boolean;
}) {
  const parts = BENCH_STATES.filter((s) => byState[s] > 0);
  const summary = parts.map((s) => `${byState[s]} ${s}`).join(", ");
  return (
    <div
      role="img"
      aria-label={`${label}: ${total} runs${summary ? `, ${summary}` : ""}`}
      className={`flex w-full overflow-hidden rounded border border-line-strong bg-white ${tall ? "h-8" : "h-5"}`}
    >
      {parts.map((s) => (
        <div
          key={s}
          title={`${byState[s]} ${s}`}
          className={`${STATE_FILLS[s]} h-full border-r border-white/70 last:border-r-0`}
          style={{ width: `${(byState[s] / total) * 100}%` }}
        />
      ))}
    </div>
  );
}
