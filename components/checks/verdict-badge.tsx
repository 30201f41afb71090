// A check verdict as a word with a symbol; colour only supports the text.
import type { Verdict } from "@/lib/domain/checks";

const STYLE: Record<Verdict, { cls: string; mark: string; label: string }> = {
  pass: { cls: "bg-pass-light text-pass", mark: "✓", label: "Pass" },
  warn: { cls: "bg-warn-light text-warn", mark: "!", label: "Warn" },
  fail: { cls: "bg-fail-light text-fail", mark: "✕", label: "Fail" },
};

export function VerdictBadge({ verdict }: { verdict: Verdict }) {
  const s = STYLE[verdict];
  return (
    <span className={`inline-flex items-center gap-1 rounded px-2 py-0.5 text-xs font-bold ${s.cls}`}>
      <span aria-hidden="true">{s.mark}</span>
      {s.label}
    </span>
  );
}
