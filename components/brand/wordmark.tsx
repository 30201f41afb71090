// The Loomwright wordmark: three warp lines crossed by one copper weft, beside the name.
export function Wordmark({ size = 28, tone = "dark" }: { size?: number; tone?: "dark" | "light" }) {
  const ink = tone === "dark" ? "#1d2433" : "#f7f5f0";
  return (
    <span className="inline-flex items-center gap-2" aria-label="Loomwright">
      <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
        <rect x="1" y="1" width="30" height="30" rx="7" fill={tone === "dark" ? "#1d2433" : "#f7f5f0"} />
        <path d="M7 9h18M7 16h18M7 23h18" stroke={tone === "dark" ? "#7b8496" : "#4a5366"} strokeWidth="2" />
        <path
          d="M9 5c0 6 6 5 6 11s-6 5-6 11M17 5c0 6 6 5 6 11s-6 5-6 11"
          stroke="#d9752f"
          strokeWidth="2.6"
          fill="none"
          strokeLinecap="round"
        />
      </svg>
      <span className="text-lg font-bold tracking-tight" style={{ color: ink }}>
        Loom<span className="text-copper">wright</span>
      </span>
    </span>
  );
}
