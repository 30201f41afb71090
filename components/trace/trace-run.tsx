// The trace page's content: one wire's identity, ends, build, checks, history and neighbours, readable on a phone.
import Link from "next/link";
import type { TraceView } from "@/lib/services/trace";
import { ColourSwatch } from "@/components/ui/colour-swatch";
import { StateBadge } from "@/components/runs/state-badge";
import { VerdictBadge } from "@/components/checks/verdict-badge";
import { TraceCut } from "@/components/trace/trace-cut";

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
};

export function TraceRun({ view }: { view: TraceView }) {
  const { run, checks } = view;
  return (
    <article className="flex flex-col gap-4" aria-label={`Wire ${run.wireId}`}>
      <header className="rounded-lg bg-ink p-5 text-paper">
        <p className="font-mono text-3xl font-bold">{run.wireId}</p>
        <p className="text-lg">{run.circuit ?? "No circuit name"}</p>
        <div className="mt-3 flex flex-wrap items-center gap-3">
          <StateBadge state={run.state} />
          {checks ? <VerdictBadge verdict={checks.verdict} /> : null}
          <span className="rounded bg-white px-2 py-0.5 text-ink">
            <ColourSwatch code={run.colour} />
          </span>
          <span className="font-semibold">{run.gauge}</span>
          <span className="text-paper/70">code {run.traceCode}</span>
        </div>
      </header>

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
                {ACTIONS[h.action] ?? h.action}
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
