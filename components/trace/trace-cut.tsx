// On the trace page: which spool the run was cut from, by whom and when.
import type { TraceCutView } from "@/lib/services/bench";

export function TraceCut({ cut }: { cut: TraceCutView | null }) {
  if (!cut) return null;
  const when = cut.cutAt ? new Date(cut.cutAt).toLocaleString("en-GB") : null;
  return (
    <section className="rounded-lg border border-line bg-white p-4" aria-label="Cut from spool">
      <h2 className="mb-1 font-semibold">Cut</h2>
      <p className="text-sm">
        {cut.spoolId ? (
          <>
            Cut from spool lot <span className="font-mono font-semibold">{cut.lot ?? "(no lot)"}</span>,
            location <span className="font-semibold">{cut.location ?? "(not given)"}</span>
          </>
        ) : (
          <>Cut (no spool recorded)</>
        )}
        {cut.cutByName ? ` by ${cut.cutByName}` : ""}
        {when ? ` at ${when}` : ""}
        {cut.takenMm !== null ? ` · ${cut.takenMm.toLocaleString("en-GB")} mm taken off the spool` : ""}.
      </p>
    </section>
  );
}
