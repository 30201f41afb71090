// Voltage drop of each run as a share of its limit: a bar per run, the limit as a line at 100 %.
import type { RunChecks } from "@/lib/domain/checks";

const COLOUR = { pass: "#1f7a4d", warn: "#9a6400", fail: "#b42318" } as const;

export function DropChart({ runs, max = 30 }: { runs: RunChecks[]; max?: number }) {
  const rows = runs
    .filter((r) => r.dropOfLimitPct !== null)
    .sort((a, b) => (b.dropOfLimitPct ?? 0) - (a.dropOfLimitPct ?? 0))
    .slice(0, max);
  if (rows.length === 0)
    return <p className="text-sm text-ink-soft">No run has a current, so no drop to chart.</p>;
  const top = Math.max(150, ...rows.map((r) => r.dropOfLimitPct ?? 0));
  const W = 640;
  const label = 90;
  const barH = 16;
  const gap = 6;
  const H = rows.length * (barH + gap) + 28;
  const x = (pct: number) => label + ((W - label - 60) * pct) / top;
  return (
    <figure className="flex flex-col gap-2">
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="w-full max-w-3xl"
        role="img"
        aria-label={`Voltage drop as a share of each run's limit, ${rows.length} highest runs`}
      >
        <line x1={x(100)} x2={x(100)} y1={0} y2={H - 20} stroke="#1d2433" strokeDasharray="4 3" />
        <text x={x(100) + 4} y={H - 6} fontSize="11" fill="#1d2433">
          limit (100 %)
        </text>
        {rows.map((r, i) => {
          const y = i * (barH + gap) + 4;
          const pct = r.dropOfLimitPct ?? 0;
          return (
            <g key={`${r.wireId}-${i}`}>
              <text x={0} y={y + 12} fontSize="11" fontFamily="monospace" fill="#1d2433">
                {r.wireId}
              </text>
              <rect
                x={label}
                y={y}
                width={Math.max(1, x(pct) - label)}
                height={barH}
                rx={2}
                fill={COLOUR[r.verdict]}
              />
              <text x={x(pct) + 4} y={y + 12} fontSize="11" fill="#4a5366">
                {r.dropPct?.toFixed(2)} % of {r.dropLimitPct} %
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="text-xs text-ink-faint">
        Bars past the dashed line exceed the run&apos;s drop limit (critical 3 %, standard 10 % per ABYC E-11;
        motor 5 % common practice).
      </figcaption>
    </figure>
  );
}
