// A wire colour shown as a swatch beside its IEC 60757 code, never by colour alone.
import { colourName, colourSwatch } from "@/lib/domain/colour";

export function ColourSwatch({ code }: { code: string }) {
  const hex = colourSwatch(code);
  const base = hex[0] ?? "#ffffff";
  const tracer = hex[1];
  return (
    <span className="inline-flex items-center gap-1.5" title={colourName(code)}>
      <span
        aria-hidden="true"
        className="inline-block h-3.5 w-5 rounded-sm border border-ink/40"
        style={{
          background: tracer
            ? `linear-gradient(180deg, ${base} 0 35%, ${tracer} 35% 65%, ${base} 65% 100%)`
            : base,
        }}
      />
      <span className="font-mono text-xs font-semibold">{code}</span>
    </span>
  );
}
