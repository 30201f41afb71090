"use client";
// Records a run's test at the bench: the test, its value and a note, then Pass or Fail (big targets for gloves).
// Every write carries the run's version; when someone else changed the run first, the page shows the newer state.
import { useId, useState } from "react";
import { useRouter } from "next/navigation";
import { ApiError, sendJson } from "@/lib/client/fetcher";
import { runPatchSchema } from "@/lib/validation/runs";
import {
  formatTestValue,
  TEST_KINDS,
  TEST_LABELS,
  TEST_UNITS,
  type TestKind,
} from "@/lib/domain/bench-state";
import type { BenchState } from "@/lib/domain/types";
import type { RunView } from "@/lib/services/runs";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

type Message = { tone: "ok" | "error" | "caution"; title: string; text: string };

const HINTS: Record<TestKind, string> = {
  continuity: "End-to-end conductor resistance in ohms (Ω)",
  insulation: "Insulation resistance in megohms (MΩ)",
};

export function TestResultForm(props: {
  projectId: string;
  runId: string;
  wireId: string;
  version: number;
  state: BenchState;
  /** The run's own conductor resistance from the checks, to compare a continuity reading with. */
  expectedOhm: number | null;
}) {
  const router = useRouter();
  const id = useId();
  const [kind, setKind] = useState<TestKind>("continuity");
  const [value, setValue] = useState("");
  const [note, setNote] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState<BenchState | null>(null);
  const [message, setMessage] = useState<Message | null>(null);

  async function send(state: BenchState) {
    const raw = value.trim().replace(",", ".");
    const testing = state === "tested" || state === "failed";
    const body = testing
      ? {
          version: props.version,
          state,
          testKind: kind,
          testValue: raw === "" ? null : raw,
          note: note || null,
        }
      : { version: props.version, state };
    const parsed = runPatchSchema.safeParse(body);
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? "Not a valid value");
      return;
    }
    setError(null);
    setBusy(state);
    try {
      const run = await sendJson<RunView>(
        `/api/projects/${props.projectId}/runs/${props.runId}`,
        "PATCH",
        parsed.data,
      );
      if (testing) {
        const v = parsed.data.testValue ?? null;
        setMessage({
          tone: "ok",
          title: state === "tested" ? "Pass recorded" : "Fail recorded",
          text: `${TEST_LABELS[kind]} ${state === "tested" ? "pass" : "fail"}, ${formatTestValue(kind, v)}. ${props.wireId} is now ${run.state}.`,
        });
        setValue("");
        setNote("");
      } else {
        setMessage({
          tone: "ok",
          title: "Sent back",
          text: `${props.wireId} is back on the bench as ${run.state}.`,
        });
      }
      router.refresh();
    } catch (e) {
      if (e instanceof ApiError && e.status === 409) {
        const current = (e.details as { current?: { state?: string; version?: number } } | undefined)
          ?.current;
        setMessage({
          tone: "caution",
          title: "Not saved: the run changed meanwhile",
          text: `Someone else changed ${props.wireId} first${current?.state ? `; it is now ${current.state}` : ""}. The page shows the newer state: check it, then record again if needed.`,
        });
        router.refresh();
      } else {
        setMessage({
          tone: "error",
          title: "Not saved",
          text: e instanceof Error ? e.message : "The result was not saved. Try again.",
        });
      }
    } finally {
      setBusy(null);
    }
  }

  const unit = TEST_UNITS[kind];
  return (
    <section className="rounded-lg border-2 border-ink bg-white p-4" aria-label="Record a test">
      <h2 className="mb-3 text-lg font-bold">Record a test</h2>
      <form
        className="flex flex-col gap-4"
        onSubmit={(e) => {
          // Enter in the value field records nothing: pass or fail is always a deliberate press.
          e.preventDefault();
        }}
      >
        <fieldset>
          <legend className="mb-2 text-sm font-semibold">Test</legend>
          <div className="grid grid-cols-2 gap-2" role="radiogroup" aria-label="Test">
            {TEST_KINDS.map((k) => (
              <label
                key={k}
                className={`flex h-14 cursor-pointer items-center justify-center gap-2 rounded-md border-2 text-base font-semibold ${kind === k ? "border-copper bg-copper-light text-ink" : "border-line-strong bg-white text-ink-soft"}`}
              >
                <input
                  type="radio"
                  name={`${id}-kind`}
                  value={k}
                  checked={kind === k}
                  onChange={() => setKind(k)}
                  className="h-5 w-5 accent-copper"
                />
                {TEST_LABELS[k]} ({TEST_UNITS[k]})
              </label>
            ))}
          </div>
        </fieldset>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-value`} className="text-sm font-semibold">
            Reading ({unit})
          </label>
          <div className="flex items-center gap-2">
            <input
              id={`${id}-value`}
              inputMode="decimal"
              autoComplete="off"
              value={value}
              onChange={(e) => setValue(e.target.value)}
              aria-invalid={error ? true : undefined}
              aria-describedby={`${id}-value-hint${error ? ` ${id}-value-error` : ""}`}
              className={`h-14 w-40 rounded-md border bg-white px-3 text-xl tabular-nums ${error ? "border-fail" : "border-line-strong"}`}
            />
            <span className="text-xl font-semibold">{unit}</span>
          </div>
          <p id={`${id}-value-hint`} className="text-xs text-ink-faint">
            {HINTS[kind]}; leave empty when only pass or fail was noted.
            {kind === "continuity" && props.expectedOhm !== null
              ? ` The conductor alone should read about ${Number(props.expectedOhm.toPrecision(2))} Ω (its cut length at 20 °C, from the conductor tables).`
              : ""}
          </p>
          {error ? (
            <p id={`${id}-value-error`} className="text-sm text-fail">
              {error}
            </p>
          ) : null}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-note`} className="text-sm font-semibold">
            Note <span className="font-normal text-ink-faint">(optional)</span>
          </label>
          <textarea
            id={`${id}-note`}
            value={note}
            maxLength={500}
            rows={2}
            onChange={(e) => setNote(e.target.value)}
            className="rounded-md border border-line-strong bg-white px-3 py-2 text-base"
            placeholder="e.g. re-crimped end B before the test"
          />
        </div>
        <div className="grid grid-cols-2 gap-3">
          <button
            type="button"
            disabled={busy !== null}
            onClick={() => void send("tested")}
            className="h-16 rounded-md bg-pass text-lg font-bold text-white hover:opacity-90 disabled:opacity-60"
          >
            {busy === "tested" ? "Saving…" : "✓ Pass"}
          </button>
          <button
            type="button"
            disabled={busy !== null}
            onClick={() => void send("failed")}
            className="h-16 rounded-md bg-fail text-lg font-bold text-white hover:opacity-90 disabled:opacity-60"
          >
            {busy === "failed" ? "Saving…" : "✗ Fail"}
          </button>
        </div>
      </form>
      {props.state === "failed" ? (
        <div className="mt-4 border-t border-line pt-4">
          <h3 className="mb-2 font-semibold">Send back to the bench</h3>
          <div className="flex flex-wrap gap-2">
            <Button
              variant="secondary"
              size="lg"
              disabled={busy !== null}
              onClick={() => void send("planned")}
            >
              Recut a new wire (planned)
            </Button>
            <Button variant="secondary" size="lg" disabled={busy !== null} onClick={() => void send("cut")}>
              Rework the ends (cut)
            </Button>
          </div>
        </div>
      ) : null}
      {message ? (
        <div className="mt-4" aria-live="polite">
          <Notice tone={message.tone} title={message.title}>
            {message.text}
          </Notice>
        </div>
      ) : null}
    </section>
  );
}
