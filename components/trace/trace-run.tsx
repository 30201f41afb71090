// The trace page's content: one wire's identity, ends, build, checks, history and neighbours, readable on a phone.
import Link from "next/link";
import type { TraceView } from "@/lib/services/trace";
import { ColourSwatch } from "@/components/ui/colour-swatch";
import { StateBadge } from "@/components/runs/state-badge";
import { VerdictBadge } from "@/components/checks/verdict-badge";
import { TraceCut } from "@/components/trace/trace-cut";
import { TestResultForm } from "@/components/trace/test-result-form";
import { expectedContinuityOhm, formatTestValue, TEST_LABELS, type TestKind } from "@/lib/domain/bench-state";
import type { RunTestRecord } from "@/lib/db/run-tests";

function End({
  label,
  reference,
  termination,
  stripMm,
}: {
  label: string;
  reference: string;
  termination: string | null;
  stripMm: number | null;
}) {
  return (
    <div className="rounded-lg border border-line bg-white p-4">
      <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">{label}</p>
      <p className="font-mono text-xl font-bold">{reference}</p>
      <p className="text-sm text-ink-soft">
        {termination ?? "termination not given"}
        {stripMm !== null ? ` · strip ${stripMm} mm` : ""}
      </p>
    </div>
  );
}

const ACTIONS: Record<string, string> = {
  "run.create": "added the run",
  "run.update": "edited the run",
  "run.state": "changed the bench state",
  "run.bulk-update": "changed the run with others",
  "run.test": "recorded a test",
};

type EventDetail = {
  changed?: { state?: { from: unknown; to: unknown } };
  test?: { kind: TestKind; passed: boolean; value: number | null };
  note?: string;
};

/** One line of the history: who did what, with the state change, the test or the note it carried. */
function describe(action: string, raw: Record<string, unknown>): string {
  const d = raw as EventDetail;
  if (action === "run.test" && d.test) {
    const t = d.test;
    return `recorded a ${TEST_LABELS[t.kind].toLowerCase()} test: ${t.passed ? "pass" : "fail"}, ${formatTestValue(t.kind, t.value)}`;
  }
  const st = d.changed?.state;
  const base =
    action === "run.state" && st
      ? `set the state ${String(st.from)} → ${String(st.to)}`
      : (ACTIONS[action] ?? action);
  return d.note ? `${base} · “${d.note}”` : base;
}

function LatestTest({ test }: { test: RunTestRecord }) {
  return (
    <div
      className={`rounded-lg border-2 p-4 ${test.passed ? "border-pass bg-pass-light" : "border-fail bg-fail-light"}`}
      aria-label="Latest test"
      role="group"
    >
      <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Latest test</p>
      <p className={`text-2xl font-bold ${test.passed ? "text-pass" : "text-fail"}`}>
        {test.passed ? "✓ Pass" : "✗ Fail"} · {TEST_LABELS[test.kind]}
      </p>
      <p className="text-lg font-semibold tabular-nums">{formatTestValue(test.kind, test.value)}</p>
      <p className="text-sm text-ink-soft">
        {test.testedByName ?? "someone"} · {new Date(test.testedAt).toLocaleString("en-GB")}
      </p>
      {test.note ? <p className="mt-1 whitespace-pre-line text-sm">{test.note}</p> : null}
    </div>
  );
}

export function TraceRun({ view, canTest = false }: { view: TraceView; canTest?: boolean }) {
  const { run, checks } = view;
  const latest = view.tests[0] ?? null;
  return (
    <article className="flex flex-col gap-4" aria-label={`Wire ${run.wireId}`}>
      <header className="rounded-lg bg-ink p-5 text-paper">
        <p className="font-mono text-3xl font-bold">{run.wireId}</p>
        <p className="text-lg">{run.circuit ?? "No circuit name"}</p>
        <div className="mt-3 flex flex-wrap items-center gap-3">
          <StateBadge state={run.state} />
          {checks ? (
            // Labelled: the checks' verdict must not be read as a test result.
            <span className="inline-flex items-center gap-1 text-xs text-paper/80">
              Checks <VerdictBadge verdict={checks.verdict} />
            </span>
          ) : null}
          <span className="rounded bg-white px-2 py-0.5 text-ink">
            <ColourSwatch code={run.colour} />
          </span>
          <span className="font-semibold">{run.gauge}</span>
          <span className="text-paper/70">code {run.traceCode}</span>
        </div>
      </header>

      <section className="flex flex-col gap-3" aria-label="Tests">
        {latest ? (
          <LatestTest test={latest} />
        ) : (
          <p className="rounded-lg border border-dashed border-line-strong bg-white/60 p-4 text-sm text-ink-soft">
            Not tested yet.
          </p>
        )}
        {canTest ? (
          <TestResultForm
            projectId={view.project.id}
            runId={run.id}
            wireId={run.wireId}
            version={run.version}
            state={run.state}
            expectedOhm={expectedContinuityOhm(run.gauge, run.cutLengthMm)}
          />
        ) : null}
        {view.tests.length > 1 ? (
          <div className="rounded-lg border border-line bg-white p-4">
            <h2 className="mb-2 font-semibold">Test history</h2>
            <ol className="flex flex-col divide-y divide-line/70 text-sm" aria-label="Test history">
              {view.tests.map((t) => (
                <li key={t.id} className="flex flex-wrap items-baseline gap-x-3 py-1.5">
                  <span className={`font-semibold ${t.passed ? "text-pass" : "text-fail"}`}>
                    {t.passed ? "Pass" : "Fail"}
                  </span>
                  <span>{TEST_LABELS[t.kind]}</span>
                  <span className="tabular-nums">{formatTestValue(t.kind, t.value)}</span>
                  <span className="text-ink-faint">
                    {t.testedByName ?? "someone"} · {new Date(t.testedAt).toLocaleString("en-GB")}
                  </span>
                  {t.note ? <span className="w-full text-ink-soft">{t.note}</span> : null}
                </li>
              ))}
            </ol>
          </div>
        ) : null}
      </section>

      <section className="grid gap-3 sm:grid-cols-2" aria-label="Ends">
        <End label="End A" reference={run.endA} termination={run.endATermination} stripMm={run.endAStripMm} />
        <End label="End B" reference={run.endB} termination={run.endBTermination} stripMm={run.endBStripMm} />
      </section>

      <section className="rounded-lg border border-line bg-white p-4" aria-label="Build">
        <h2 className="mb-2 font-semibold">Build</h2>
        <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm sm:grid-cols-3">
          <Item k="Insulation" v={run.insulation ?? "—"} />
          <Item k="Rating" v={run.insulationTempC !== null ? `${run.insulationTempC} °C` : "—"} />
          <Item k="Routed length" v={`${run.routedLengthMm.toLocaleString("en-GB")} mm`} />
          <Item k="Cut length" v={`${run.cutLengthMm.toLocaleString("en-GB")} mm`} />
          <Item k="Current" v={run.currentA !== null ? `${run.currentA} A` : "—"} />
          <Item k="Fuse" v={run.fuseA !== null ? `${run.fuseA} A` : "none listed"} />
        </dl>
      </section>

      <TraceCut cut={view.cut} />

      {checks ? (
        <section className="rounded-lg border border-line bg-white p-4" aria-label="Checks">
          <h2 className="mb-2 font-semibold">Checks</h2>
          <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm sm:grid-cols-3">
            <Item
              k="Drop"
              v={checks.dropPct !== null ? `${checks.dropPct.toFixed(2)} % of ${checks.dropLimitPct} %` : "—"}
            />
            <Item k="Ampacity" v={checks.ampacityA !== null ? `${checks.ampacityA.toFixed(1)} A` : "—"} />
            <Item k="Fuse verdict" v={checks.fuseVerdict} />
          </dl>
          <ul className="mt-3 list-disc pl-5 text-sm">
            {checks.reasons.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
          <p className="mt-3 text-xs text-ink-faint">
            Guidance under the rules named; local codes and licensed practice take precedence.
          </p>
        </section>
      ) : null}

      {run.notes ? (
        <section className="rounded-lg border border-line bg-white p-4" aria-label="Notes">
          <h2 className="mb-1 font-semibold">Notes</h2>
          <p className="whitespace-pre-line text-sm">{run.notes}</p>
        </section>
      ) : null}

      <section className="rounded-lg border border-line bg-white p-4" aria-label="History">
        <h2 className="mb-2 font-semibold">History</h2>
        {view.history.length === 0 ? (
          <p className="text-sm text-ink-soft">No recorded changes yet.</p>
        ) : (
          <ol className="flex flex-col gap-1 text-sm">
            {view.history.map((h) => (
              <li key={h.id}>
                <time className="text-ink-faint">{new Date(h.createdAt).toLocaleString("en-GB")}</time> ·{" "}
                <span className="font-semibold">{h.actorName ?? "someone"}</span>{" "}
                {describe(h.action, h.detail)}
              </li>
            ))}
          </ol>
        )}
      </section>

      <section className="rounded-lg border border-line bg-white p-4" aria-label="Runs on the same devices">
        <h2 className="mb-2 font-semibold">Other runs on the same devices</h2>
        {view.related.length === 0 ? (
          <p className="text-sm text-ink-soft">None.</p>
        ) : (
          <ul className="flex flex-col divide-y divide-line/70 text-sm">
            {view.related.map((r) => (
              <li key={r.id} className="py-2">
                <Link
                  href={`/r/${r.traceCode}`}
                  className="font-mono font-semibold text-copper-dark underline"
                >
                  {r.wireId}
                </Link>{" "}
                <span className="font-mono">
                  {r.endA} → {r.endB}
                </span>{" "}
                <span className="text-ink-soft">{r.circuit}</span>
              </li>
            ))}
          </ul>
        )}
      </section>
    </article>
  );
}

function Item({ k, v }: { k: string; v: string }) {
  return (
    <div>
      <dt className="text-xs font-semibold text-ink-soft">{k}</dt>
      <dd>{v}</dd>
    </div>
  );
}
