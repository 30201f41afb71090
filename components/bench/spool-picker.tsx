// Choosing the spool to cut from: per wire type, the plan's shelf spools (lot, location, what is left) and its new
// put-ups, each with an "Open this spool" step that puts it on the shelf with the lot read off it.
import { useState } from "react";
import type { BenchSpoolView, BenchWireTypeView } from "@/lib/services/bench";
import { ColourSwatch } from "@/components/ui/colour-swatch";

const metres = (mm: number) => `${(mm / 1000).toFixed(2)} m`;
export const spoolKey = (wireTypeId: string, index: number) => `${wireTypeId}:${index}`;

function OpenForm({ onOpen, busy }: { onOpen: (lot: string, location: string) => void; busy: boolean }) {
  const [lot, setLot] = useState("");
  const [location, setLocation] = useState("");
  return (
    <form
      className="mt-2 flex flex-col gap-2 rounded-md border border-line-strong bg-paper p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (lot.trim()) onOpen(lot.trim(), location.trim());
      }}
    >
      <label className="flex flex-col text-sm font-semibold">
        Lot on the spool
        <input
          value={lot}
          onChange={(e) => setLot(e.target.value)}
          required
          className="h-14 rounded-md border border-line-strong px-3 text-lg"
        />
      </label>
      <label className="flex flex-col text-sm font-semibold">
        Location
        <input
          value={location}
          onChange={(e) => setLocation(e.target.value)}
          className="h-14 rounded-md border border-line-strong px-3 text-lg"
        />
      </label>
      <button
        type="submit"
        disabled={busy || !lot.trim()}
        className="h-14 rounded-md bg-ink px-4 text-lg font-semibold text-paper disabled:bg-ink-faint"
      >
        {busy ? "Opening…" : "Open this spool"}
      </button>
    </form>
  );
}

export function SpoolPicker({
  wireTypes,
  selected,
  remainingOf,
  doneOf,
  onSelect,
  onOpen,
  opening,
}: {
  wireTypes: BenchWireTypeView[];
  selected: string | null;
  remainingOf: (s: BenchSpoolView) => number | null;
  doneOf: (s: BenchSpoolView) => number;
  onSelect: (key: string) => void;
  onOpen: (wt: BenchWireTypeView, s: BenchSpoolView, lot: string, location: string) => void;
  opening: string | null;
}) {
  return (
    <section aria-label="Spools" className="flex flex-col gap-4">
      {wireTypes.map((wt) => (
        <div key={wt.wireTypeId}>
          <h3 className="mb-1 flex items-center gap-2 font-semibold">
            <ColourSwatch code={wt.colour} /> {wt.label}
          </h3>
          <ul className="flex flex-col gap-2">
            {wt.spools.map((s) => {
              const key = spoolKey(wt.wireTypeId, s.index);
              const isSel = key === selected;
              const rem = remainingOf(s);
              const title =
                s.source.kind === "shelf"
                  ? `Shelf spool · lot ${s.source.lot ?? "—"} · ${s.source.location ?? "no location"}`
                  : s.stock
                    ? `New spool · lot ${s.stock.lot ?? "—"} · ${s.stock.location ?? "no location"}`
                    : `New spool to open · ${metres(s.source.nominalMm)} · ${s.source.supplier ?? ""} ${s.source.partNumber ?? ""}`;
              return (
                <li key={key}>
                  <button
                    type="button"
                    aria-pressed={isSel}
                    onClick={() => onSelect(key)}
                    className={`flex min-h-14 w-full flex-col items-start rounded-lg border-2 px-4 py-2 text-left ${isSel ? "border-copper bg-copper-light" : "border-line-strong bg-white"}`}
                  >
                    <span className="font-semibold">
                      Spool {s.index}: {title}
                    </span>
                    <span className="text-sm text-ink-soft">
                      {doneOf(s)} of {s.cuts.length} cuts done
                      {rem !== null ? ` · ${metres(rem)} left` : ""}
                    </span>
                  </button>
                  {isSel && s.source.kind === "putup" && !s.stock ? (
                    <OpenForm
                      busy={opening === key}
                      onOpen={(lot, location) => onOpen(wt, s, lot, location)}
                    />
                  ) : null}
                </li>
              );
            })}
          </ul>
        </div>
      ))}
    </section>
  );
}
