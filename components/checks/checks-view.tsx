"use client";
// The Checks screen: summary, cautions, a chart of drop against limit, and every run's verdict with its reasons.
import { useMemo, useState } from "react";
import { useChecks } from "@/lib/client/use-checks";
import type { RunChecks, Verdict } from "@/lib/domain/checks";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";
import { EmptyState } from "@/components/ui/empty-state";
import { Button } from "@/components/ui/button";
import { VerdictBadge } from "@/components/checks/verdict-badge";
import { DropChart } from "@/components/checks/drop-chart";

function n(v: number | null, digits = 2, unit = ""): string {
  return v === null ? "—" : `${v.toFixed(digits)}${unit}`;
}

export function ChecksView({ projectId }: { projectId: string }) {
  const { data, error, isLoading, mutate } = useChecks(projectId);
  const [filter, setFilter] = useState<Verdict | "all">("all");
  const [open, setOpen] = useState<string | null>(null);
  const shown = useMemo(
    () => (data ? (filter === "all" ? data.items : data.items.filter((r) => r.verdict === filter)) : []),
    [data, filter],
  );

  if (error && !data) {
    return (
      <Notice tone="error" title="The checks could not be computed">
        <p>{error instanceof Error ? error.message : "Unknown error."}</p>
        <Button size="sm" variant="secondary" className="mt-2" onClick={() => void mutate()}>
          Try again
        </Button>
      </Notice>
    );
  }
  if (isLoading || !data) return <SkeletonRows rows={8} label="Computing checks" />;
  if (data.summary.runCount === 0) {
    return (
      <EmptyState title="Nothing to check yet">
        Add or import runs; each is checked as soon as it exists.
      </EmptyState>
    );
  }
  const s = data.summary;
  return (
    <div className="flex flex-col gap-5">
      <section
        aria-label="Cautions"
        className="rounded-md border-l-4 border-warn bg-warn-light px-4 py-3 text-sm"
      >
        <p className="font-bold">Caution: guidance, not approval</p>
        <ul className="mt-1 list-disc pl-5">
          {data.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </section>

      <section aria-label="Summary" className="grid grid-cols-2 gap-3 sm:grid-cols-5">
        <Card label="Runs checked" value={String(s.runCount)} />
        <Card label="Fail" value={String(s.fail)} tone={s.fail ? "fail" : undefined} />
        <Card label="Warn" value={String(s.warn)} tone={s.warn ? "warn" : undefined} />
        <Card label="Pass" value={String(s.pass)} />
        <Card
          label="Conductor loss"
          value={`${s.totalLossW.toFixed(1)} W`}
          hint={`${s.noCurrent} runs without a current`}
        />
      </section>

      <section aria-labelledby="chart-h" className="rounded-lg border border-line bg-white p-4">
        <h2 id="chart-h" className="mb-2 font-semibold">
          Voltage drop against each run&apos;s limit
        </h2>
        <DropChart runs={data.items} />
      </section>

      <section aria-labelledby="runs-h" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center gap-2">
          <h2 id="runs-h" className="mr-auto font-semibold">
            Every run
          </h2>
          {(["all", "fail", "warn", "pass"] as const).map((f) => (
            <Button
              key={f}
              size="sm"
              variant={filter === f ? "primary" : "secondary"}
              aria-pressed={filter === f}
              onClick={() => setFilter(f)}
            >
              {f === "all" ? `All (${s.runCount})` : `${f[0]!.toUpperCase()}${f.slice(1)} (${s[f]})`}
            </Button>
          ))}
        </div>
        <div className="overflow-x-auto rounded-lg border border-line bg-white shadow-sm">
          <table className="w-full min-w-[1400px] text-sm" aria-label="Checks">
            <thead className="bg-paper-deep text-left text-ink-soft">
              <tr>
                {[
                  "Wire ID",
                  "Verdict",
                  "Gauge",
                  "Current (A)",
                  "Loop (Ω)",
                  "Drop (V)",
                  "Drop (%)",
                  "Peak drop (%)",
                  "Ampacity (A)",
                  "Margin",
                  "Fuse",
                  "Loss (W)",
                  "Suggested",
                  "Why",
                ].map((h) => (
                  <th key={h} scope="col" className="px-3 py-2 font-semibold">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {shown.map((r, i) => (
                <Row
                  key={`${r.wireId}-${i}`}
                  r={r}
                  open={open === r.wireId}
                  onToggle={() => setOpen(open === r.wireId ? null : r.wireId)}
                />
              ))}
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}

function Row({ r, open, onToggle }: { r: RunChecks; open: boolean; onToggle: () => void }) {
  const first = r.reasons[0] ?? "";
  return (
    <>
      <tr className="whitespace-nowrap border-t border-line/70 align-top" data-run={r.wireId}>
        <td className="px-3 py-2 font-mono font-semibold">{r.wireId}</td>
        <td className="px-3 py-2">
          <VerdictBadge verdict={r.verdict} />
        </td>
        <td className="px-3 py-2">{r.gauge ?? "—"}</td>
        <td className="px-3 py-2 tabular-nums">{n(r.currentA, 2)}</td>
        <td className="px-3 py-2 tabular-nums">{n(r.loopResistanceOhm, 4)}</td>
        <td className="px-3 py-2 tabular-nums">{n(r.dropV, 3)}</td>
        <td className="px-3 py-2 tabular-nums">
          {n(r.dropPct, 2)} <span className="text-xs text-ink-faint">/ {r.dropLimitPct}</span>
        </td>
        <td className="px-3 py-2 tabular-nums">{n(r.peakDropPct, 2)}</td>
        <td className="px-3 py-2 tabular-nums">{n(r.ampacityA, 1)}</td>
        <td className="px-3 py-2 tabular-nums">{n(r.ampacityMarginPct, 0, " %")}</td>
        <td className="px-3 py-2">{r.fuseVerdict}</td>
        <td className="px-3 py-2 tabular-nums">{n(r.lossW, 2)}</td>
        <td className="px-3 py-2">{r.suggestedGauge ?? "—"}</td>
        <td className="min-w-[26rem] whitespace-normal px-3 py-2">
          <button
            type="button"
            onClick={onToggle}
            aria-expanded={open}
            className="text-left hover:text-copper-dark"
          >
            {first}
            {r.reasons.length > 1 ? (
              <span className="text-xs text-ink-faint"> (+{r.reasons.length - 1} more)</span>
            ) : null}
          </button>
        </td>
      </tr>
      {open ? (
        <tr className="bg-paper">
          <td colSpan={14} className="px-6 py-3">
            <ul className="list-disc pl-5 text-sm">
              {r.reasons.map((x) => (
                <li key={x}>{x}</li>
              ))}
            </ul>
            {r.seriesResistorOhm !== null ? (
              <p className="mt-2 text-sm">
                Series resistor: {r.seriesResistorOhm} Ω, dissipating {n(r.seriesResistorDissipationW, 3)} W —
                fit a {r.seriesResistorW} W part (at least 2× margin, common practice).
              </p>
            ) : null}
          </td>
        </tr>
      ) : null}
    </>
  );
}

function Card({
  label,
  value,
  tone,
  hint,
}: {
  label: string;
  value: string;
  tone?: "fail" | "warn";
  hint?: string;
}) {
  const cls =
    tone === "fail" ? "border-fail text-fail" : tone === "warn" ? "border-warn text-warn" : "border-line";
  return (
    <div className={`rounded-lg border bg-white p-4 ${cls}`}>
      <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">{label}</p>
      <p className="text-xl font-bold">{value}</p>
      {hint ? <p className="text-xs text-ink-faint">{hint}</p> : null}
    </div>
  );
}
