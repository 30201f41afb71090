"use client";
// A spool's length adjustments, newest first: when, who, from → to, and why.
import { errorMessage, useAdjustments } from "@/lib/client/use-stock";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";
import { dateTime, metres } from "@/components/stock/format";

export function AdjustmentHistory({ spoolId }: { spoolId: string }) {
  const { data, error, isLoading, mutate } = useAdjustments(spoolId);
  return (
    <section aria-labelledby={`history-${spoolId}`} className="flex flex-col gap-2">
      <h3 id={`history-${spoolId}`} className="text-sm font-bold uppercase tracking-wide text-ink-soft">
        Length history
      </h3>
      {error ? (
        <Notice tone="error" title="The history could not be loaded">
          <p>{errorMessage(error)}</p>
          <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
            Try again
          </Button>
        </Notice>
      ) : isLoading && !data ? (
        <SkeletonRows rows={2} label="Loading the history" />
      ) : !data || data.total === 0 ? (
        <p className="rounded-md border border-dashed border-line-strong bg-white/60 px-3 py-3 text-sm text-ink-soft">
          No adjustments yet: the length is as the spool came onto the shelf.
        </p>
      ) : (
        <ol
          className="flex flex-col divide-y divide-line rounded-md border border-line bg-white"
          aria-label="Adjustments"
        >
          {data.items.map((a) => {
            const delta = a.newLengthMm - a.oldLengthMm;
            return (
              <li key={a.id} className="flex flex-col gap-0.5 px-3 py-2 text-sm">
                <span className="flex flex-wrap items-baseline justify-between gap-x-3">
                  <span className="font-semibold tabular-nums">
                    {metres(a.oldLengthMm)} → {metres(a.newLengthMm)}{" "}
                    <span className={delta < 0 ? "text-ink-soft" : "text-pass"}>
                      ({delta >= 0 ? "+" : "−"}
                      {metres(Math.abs(delta))})
                    </span>
                  </span>
                  <span className="text-xs text-ink-faint">
                    {dateTime(a.adjustedAt)} · {a.userName ?? "a former member"}
                  </span>
                </span>
                <span className="text-ink">{a.reason}</span>
              </li>
            );
          })}
        </ol>
      )}
      {data && data.total > data.items.length ? (
        <p className="text-xs text-ink-faint">
          The latest {data.items.length} of {data.total} adjustments.
        </p>
      ) : null}
    </section>
  );
}
