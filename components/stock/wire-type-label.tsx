// A wire type in one line: gauge, colour swatch with its IEC 60757 code, and the insulation spec.
import { ColourSwatch } from "@/components/ui/colour-swatch";

export function WireTypeLabel({
  gauge,
  colour,
  insulation,
}: {
  gauge: string;
  colour: string;
  insulation: string | null;
}) {
  return (
    <span className="inline-flex flex-wrap items-center gap-x-2 gap-y-0.5">
      <span className="whitespace-nowrap font-semibold">{gauge}</span>
      <ColourSwatch code={colour} />
      <span className="text-ink-soft">{insulation ?? "insulation not stated"}</span>
    </span>
  );
}

/** The same as plain text, for select options and messages. */
export function wireTypeText(w: { gauge: string; colour: string; insulation: string | null }): string {
  return `${w.gauge} ${w.colour} · ${w.insulation ?? "insulation not stated"}`;
}
