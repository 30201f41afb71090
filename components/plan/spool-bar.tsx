// One spool drawn to scale: the end discard, each cut in cutting order, and the leftover (kept or scrap).
import type { PlanSpoolView } from "@/lib/services/plan-view";

export function SpoolBar({ spool, scaleMm }: { spool: PlanSpoolView; scaleMm: number }) {
  const total = spool.usableMm + spool.endDiscardMm;
  const pct = (mm: number) => `${(100 * mm) / scaleMm}%`;
  return (
    <div className="flex flex-col gap-1">
      <div
        className="flex h-7 overflow-hidden rounded border border-line-strong bg-white"
        style={{ width: pct(total) }}
        role="img"
        aria-label={`${spool.cuts.length} cuts, ${spool.usedMm} mm used of ${spool.usableMm} mm, ${spool.leftoverMm} mm left ${spool.keep ? "to keep" : "as scrap"}`}
      >
        {spool.endDiscardMm > 0 ? (
          <div
            className="h-full bg-ink/30"
            style={{ width: pct(spool.endDiscardMm) }}
            title={`end discard ${spool.endDiscardMm} mm`}
          />
        ) : null}
        {spool.cuts.map((c, i) => (
          <div
            key={c.runId}
            title={`${c.wireId}: ${c.cutLengthMm} mm`}
            className={`h-full border-r border-white ${i % 2 ? "bg-copper" : "bg-copper-dark"}`}
            style={{ width: pct(c.cutLengthMm) }}
          />
        ))}
        <div
          className={`h-full ${spool.keep ? "bg-pass-light" : "bg-[repeating-linear-gradient(45deg,#f9dedb_0_4px,#fff_4px_8px)]"}`}
          style={{ width: pct(spool.leftoverMm) }}
          title={`${spool.keep ? "kept remnant" : "scrap"} ${spool.leftoverMm} mm`}
        />
      </div>
    </div>
  );
}
