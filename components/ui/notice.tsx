// Inline messages: errors, cautions and plain information, never by colour alone (each has a label).
import type { ReactNode } from "react";

type Tone = "error" | "caution" | "info" | "ok";

const TONES: Record<Tone, { box: string; label: string }> = {
  error: { box: "border-fail bg-fail-light text-fail", label: "Error" },
  caution: { box: "border-warn bg-warn-light text-ink", label: "Caution" },
  info: { box: "border-line-strong bg-white text-ink-soft", label: "Note" },
  ok: { box: "border-pass bg-pass-light text-ink", label: "Done" },
};

export function Notice({ tone, title, children }: { tone: Tone; title?: string; children: ReactNode }) {
  const t = TONES[tone];
  return (
    <div
      role={tone === "error" ? "alert" : "status"}
      className={`rounded-md border-l-4 px-4 py-3 text-sm ${t.box}`}
    >
      <p className="font-semibold">{title ?? t.label}</p>
      <div className="mt-0.5">{children}</div>
    </div>
  );
}
