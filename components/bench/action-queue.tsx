// The bench's queued steps and how each went: waiting for the network, sent, already recorded, or refused.
import type { BenchAction } from "@/lib/client/use-bench-queue";

const LABEL: Record<BenchAction["status"], string> = {
  queued: "Waiting to send",
  sending: "Sending…",
  done: "Recorded",
  conflict: "Not recorded: changed by someone else",
  failed: "Not recorded",
};
const TONE: Record<BenchAction["status"], string> = {
  queued: "border-warn bg-warn-light",
  sending: "border-warn bg-warn-light",
  done: "border-pass bg-pass-light",
  conflict: "border-fail bg-fail-light",
  failed: "border-fail bg-fail-light",
};

export function ActionQueue({
  actions,
  online,
  onClear,
  onRetry,
}: {
  actions: BenchAction[];
  online: boolean;
  onClear: () => void;
  onRetry: () => void;
}) {
  const pending = actions.filter((a) => a.status === "queued" || a.status === "sending").length;
  return (
    <section aria-label="Recorded steps" className="rounded-lg border border-line bg-white p-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="font-semibold">
          Steps {online ? "" : "· offline"} {pending ? `· ${pending} waiting to send` : ""}
        </h2>
        <div className="flex gap-2">
          {pending ? (
            <button
              type="button"
              onClick={onRetry}
              className="min-h-14 rounded-md border border-line-strong px-4 font-semibold"
            >
              Send now
            </button>
          ) : null}
          {actions.some((a) => a.status !== "queued" && a.status !== "sending") ? (
            <button
              type="button"
              onClick={onClear}
              className="min-h-14 rounded-md px-4 font-semibold text-ink-soft"
            >
              Clear finished
            </button>
          ) : null}
        </div>
      </div>
      {actions.length === 0 ? (
        <p className="text-sm text-ink-soft">Nothing recorded in this session yet.</p>
      ) : (
        <ol className="mt-2 flex flex-col gap-1">
          {[...actions]
            .reverse()
            .slice(0, 12)
            .map((a) => (
              <li key={a.id} className={`rounded border-l-4 px-3 py-1 text-sm ${TONE[a.status]}`}>
                <span className="font-mono font-semibold">{a.wireId}</span> {a.from} →{" "}
                <span className="font-semibold">{a.to}</span> · {LABEL[a.status]}
                {a.message ? ` — ${a.message}` : ""}
              </li>
            ))}
        </ol>
      )}
    </section>
  );
}
