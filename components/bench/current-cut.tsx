// The cut in hand, large enough to read at arm's length: wire ID, cut length, both ends with strip lengths.
import type { BenchCutView } from "@/lib/services/bench";
import type { BenchState } from "@/lib/domain/types";
import { StateBadge } from "@/components/runs/state-badge";

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
    <div className="rounded-lg border-2 border-ink/20 bg-white p-3">
      <p className="text-sm font-bold uppercase tracking-wide text-ink-soft">{label}</p>
      <p className="break-all font-mono text-2xl font-bold">{reference}</p>
      <p className="text-lg">{termination ?? "termination not given"}</p>
      <p className="text-lg font-semibold">strip {stripMm !== null ? `${stripMm} mm` : "—"}</p>
    </div>
  );
}

export function CurrentCut({
  cut,
  state,
  cutLengthMm,
  position,
}: {
  cut: BenchCutView;
  state: BenchState;
  cutLengthMm: number;
  position: string;
}) {
  return (
    <section
      aria-label={`Current cut ${cut.wireId}`}
      className="flex flex-col gap-3 rounded-xl bg-ink p-4 text-paper sm:p-6"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm text-paper/80">{position}</p>
        <span className="rounded bg-white px-1">
          <StateBadge state={state} />
        </span>
      </div>
      <p className="font-mono text-5xl font-bold leading-none sm:text-6xl" data-testid="current-wire-id">
        {cut.wireId}
      </p>
      <p className="text-4xl font-bold sm:text-5xl">
        <span className="sr-only">Cut length </span>
        {cutLengthMm.toLocaleString("en-GB")} mm
      </p>
      <p className="text-lg text-paper/90">
        {cut.markerCount} marker{cut.markerCount === 1 ? "" : "s"} · routed{" "}
        {cut.routedLengthMm.toLocaleString("en-GB")} mm
      </p>
      <div className="grid gap-3 text-ink sm:grid-cols-2">
        <End label="End A" reference={cut.endA} termination={cut.endATermination} stripMm={cut.endAStripMm} />
        <End label="End B" reference={cut.endB} termination={cut.endBTermination} stripMm={cut.endBStripMm} />
      </div>
    </section>
  );
}
