// Loading placeholders shaped like the content that is coming.
export function SkeletonRows({ rows = 8, label = "Loading" }: { rows?: number; label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex flex-col gap-2">
      <span className="sr-only">{label}…</span>
      {Array.from({ length: rows }, (_, i) => (
        <div key={i} className="h-9 animate-pulse rounded bg-paper-deep" style={{ opacity: 1 - i * 0.08 }} />
      ))}
    </div>
  );
}
