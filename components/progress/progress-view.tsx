"use client";
// The Progress section: how far the bench has got, overall and per wire type, as counts and stacked bars.
import Link from "next/link";
import { useProgress } from "@/lib/client/use-progress";
import { BENCH_STATES } from "@/lib/domain/types";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";
import { EmptyState } from "@/components/ui/empty-state";
import { Button } from "@/components/ui/button";
import { ColourSwatch } from "@/components/ui/colour-swatch";
import { ProgressBar, STATE_FILLS } from "@/components/progress/progress-bar";

const pct = (v: number) => `${v.toFixed(0)} %`;

export function ProgressView({ projectId }: { projectId: string }) {
  const { data, error, isLoading, mutate } = useProgress(projectId);

  if (error && !data) {
    return (
      <Notice tone="error" title="The progress could not be loaded">
        <p>{error instanceof Error ? error.message : "Unknown error."}</p>
        <Button size="sm" variant="secondary" className="mt-2" onClick={() => void mutate()}>
          Try again
        </Button>
      </Notice>
    );
  }
  if (isLoading || !data) return <SkeletonRows rows={6} label="Counting runs" />;
  if (data.total === 0) {
    return (
      <EmptyState
        title="No runs to build yet"
        action={
          <Link href={`/projects/${projectId}`} className="font-semibold text-copper-dark underline">
            Go to the runs
          </Link>
        }
      >
        Progress counts each run&apos;s bench state, from planned to tested. Import or add runs first.
      </EmptyState>
    );
  }

  return (
    <div className="flex flex-col gap-5">
      {error ? <Notice tone="caution">Showing the last counts: {error.message}</Notice> : null}
      <section
        aria-label="Overall"
        className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4"
      >
        <div className="flex flex-wrap items-baseline gap-x-6 gap-y-1">
          <h2 className="text-lg font-semibold">Overall</h2>
          <p className="text-sm">
            <span className="text-xl font-bold tabular-nums">{pct(data.builtPct)}</span> built (terminated,
            tested or failed)
          </p>
          <p className="text-sm">
            <span className="text-xl font-bold tabular-nums">{pct(data.testedPct)}</span> tested and passed
          </p>
          {data.byState.failed ? (
            <p className="text-sm font-semibold text-fail">{data.byState.failed} failed a test</p>
          ) : null}
        </div>
        <ProgressBar byState={data.byState} total={data.total} label="All runs" tall />
        <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Runs per state">
          {BENCH_STATES.map((s) => (
            <li key={s} className="flex items-center gap-1.5">
              <span
                aria-hidden="true"
                className={`inline-block h-3 w-3 rounded-sm border border-ink/30 ${STATE_FILLS[s]}`}
              />
              <span className="capitalize">{s}</span>
              <span className="font-semibold tabular-nums">{data.byState[s]}</span>
            </li>
          ))}
          <li className="ml-auto text-ink-soft">{data.total} runs</li>
        </ul>
      </section>

      <section
        aria-labelledby="types-h"
        className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4"
      >
        <h2 id="types-h" className="text-lg font-semibold">
          Per wire type
        </h2>
        <ul className="flex flex-col gap-3">
          {data.wireTypes.map((t) => (
            <li key={t.label} className="grid gap-1 sm:grid-cols-[16rem_1fr_10rem] sm:items-center sm:gap-3">
              <span className="flex flex-wrap items-center gap-2 text-sm">
                <span className="font-semibold">{t.gauge}</span>
                <ColourSwatch code={t.colour} />
                <span className="text-ink-soft">{t.insulation ?? "insulation not given"}</span>
              </span>
              <ProgressBar byState={t.byState} total={t.total} label={t.label} />
              <span className="text-xs text-ink-soft tabular-nums sm:text-right">
                {pct(t.builtPct)} built · {t.byState.tested}/{t.total} tested
              </span>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="table-h" className="flex flex-col gap-2">
        <h2 id="table-h" className="font-semibold">
          Counts
        </h2>
        <div className="overflow-x-auto rounded-lg border border-line bg-white">
          <table className="w-full border-collapse text-sm" aria-labelledby="table-h">
            <thead className="bg-paper-deep text-left">
              <tr>
                <th scope="col" className="px-3 py-2">
                  Wire type
                </th>
                {BENCH_STATES.map((s) => (
                  <th key={s} scope="col" className="px-3 py-2 text-right capitalize">
                    {s}
                  </th>
                ))}
                <th scope="col" className="px-3 py-2 text-right">
                  Total
                </th>
              </tr>
            </thead>
            <tbody>
              {data.wireTypes.map((t) => (
                <tr key={t.label} className="border-t border-line/70">
                  <th scope="row" className="whitespace-nowrap px-3 py-1.5 text-left font-normal">
                    <span className="font-semibold">{t.gauge}</span> <ColourSwatch code={t.colour} />{" "}
                    <span className="text-ink-soft">{t.insulation ?? ""}</span>
                  </th>
                  {BENCH_STATES.map((s) => (
                    <td key={s} className="px-3 py-1.5 text-right tabular-nums">
                      {t.byState[s] || <span className="text-ink-faint">0</span>}
                    </td>
                  ))}
                  <td className="px-3 py-1.5 text-right font-semibold tabular-nums">{t.total}</td>
                </tr>
              ))}
              <tr className="border-t-2 border-line-strong font-semibold">
                <th scope="row" className="px-3 py-1.5 text-left">
                  All runs
                </th>
                {BENCH_STATES.map((s) => (
                  <td key={s} className="px-3 py-1.5 text-right tabular-nums">
                    {data.byState[s]}
                  </td>
                ))}
                <td className="px-3 py-1.5 text-right tabular-nums">{data.total}</td>
              </tr>
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}
