"use client";
// The Bench screen: pick a committed plan and a spool, then take each cut through cut → marked → terminated with
// one big action; undo, skip, scan to jump; the spool's remaining length goes down as cuts are recorded; steps
// queue while the network is away and are sent in order when it returns.
import { useCallback, useEffect, useMemo, useState } from "react";
import useSWR from "swr";
import { ApiError, fetcher, sendJson } from "@/lib/client/fetcher";
import { usePlans } from "@/lib/client/use-plans";
import {
  isPending,
  newActionId,
  useBenchQueue,
  type BenchAction,
  type RunStamp,
} from "@/lib/client/use-bench-queue";
import type { BenchSpoolView, BenchView, BenchWireTypeView } from "@/lib/services/bench";
import type { BenchState } from "@/lib/domain/types";
import { normaliseTraceCode } from "@/lib/domain/trace-code";
import { Notice } from "@/components/ui/notice";
import { EmptyState } from "@/components/ui/empty-state";
import { SkeletonRows } from "@/components/ui/skeleton";
import { CurrentCut } from "@/components/bench/current-cut";
import { ActionQueue } from "@/components/bench/action-queue";
import { SpoolPicker, spoolKey } from "@/components/bench/spool-picker";

const RANK: Record<BenchState, number> = {
  planned: 0,
  cut: 1,
  marked: 2,
  terminated: 3,
  tested: 4,
  failed: 4,
};
const NEXT: Partial<Record<BenchState, BenchState>> = { planned: "cut", cut: "marked", marked: "terminated" };
const VERB: Partial<Record<BenchState, string>> = { cut: "Cut", marked: "Marked", terminated: "Terminated" };
const TARGETS = ["cut", "marked", "terminated"] as const;
type Target = (typeof TARGETS)[number];
const metres = (mm: number) => `${(mm / 1000).toFixed(2)} m`;

function isTyping(t: EventTarget | null): boolean {
  const el = t as HTMLElement | null;
  return (
    !!el &&
    (el.tagName === "INPUT" || el.tagName === "TEXTAREA" || el.tagName === "SELECT" || el.isContentEditable)
  );
}

export function BenchScreen({ projectId }: { projectId: string }) {
  const plans = usePlans(projectId);
  const committed = (plans.data?.items ?? []).filter((p) => p.status === "committed");
  const [chosenPlan, setChosenPlan] = useState<string | null>(null);
  const planId = chosenPlan ?? committed[0]?.id ?? null;
  const bench = useSWR<BenchView>(planId ? `/api/plans/${planId}/bench` : null, fetcher);
  const data = bench.data;

  const [stamps, setStamps] = useState<Record<string, RunStamp>>({});
  const [selected, setSelected] = useState<string | null>(null);
  const [target, setTarget] = useState<Target>("terminated");
  const [skipped, setSkipped] = useState<string[]>([]);
  const [focusRun, setFocusRun] = useState<string | null>(null);
  const [history, setHistory] = useState<BenchAction[]>([]);
  const [message, setMessage] = useState<{ tone: "ok" | "error" | "caution" | "info"; text: string } | null>(
    null,
  );
  const [opening, setOpening] = useState<string | null>(null);
  const [scan, setScan] = useState("");

  const queue = useBenchQueue(projectId, {
    onApplied: (run) => {
      setStamps((s) => ({ ...s, [run.id]: { id: run.id, state: run.state, version: run.version } }));
      void bench.mutate();
    },
    onConflict: (a, current) => {
      if (current) setStamps((s) => ({ ...s, [current.id]: current }));
      setMessage({
        tone: "caution",
        text: current
          ? `${a.wireId} was changed by someone else: it is now ${current.state}. Your step "${a.to}" was not recorded; nothing was overwritten.`
          : `${a.wireId}: "${a.to}" was not recorded — ${a.message ?? "refused"}.`,
      });
      void bench.mutate();
    },
  });

  /** The run as the server last told us (bench view or a newer answer). */
  const known = useCallback(
    (runId: string): RunStamp | null => {
      const r = data?.runs[runId];
      const s = stamps[runId];
      if (!r) return s ?? null;
      return s && s.version > r.version ? s : { id: runId, state: r.state, version: r.version };
    },
    [data, stamps],
  );
  const pendingOf = useCallback(
    (runId: string) => queue.actions.filter((a) => a.runId === runId && isPending(a)),
    [queue.actions],
  );
  /** What the builder sees: the last queued step, or the known state. */
  const shown = useCallback(
    (runId: string): { state: BenchState; version: number } | null => {
      const p = pendingOf(runId).at(-1);
      if (p) return { state: p.to, version: p.version + 1 };
      return known(runId);
    },
    [pendingOf, known],
  );

  const allSpools = useMemo(
    () =>
      (data?.wireTypes ?? []).flatMap((wt) =>
        wt.spools.map((s) => ({ wt, s, key: spoolKey(wt.wireTypeId, s.index) })),
      ),
    [data],
  );
  const doneOf = (s: BenchSpoolView) =>
    s.cuts.filter((c) => RANK[shown(c.runId)?.state ?? "planned"] >= RANK[target]).length;
  const defaultKey =
    (
      allSpools.find(({ s }) => s.cuts.some((c) => RANK[shown(c.runId)?.state ?? "planned"] < 3)) ??
      allSpools[0]
    )?.key ?? null;
  const selectedKey = selected ?? defaultKey;
  const current = allSpools.find((x) => x.key === selectedKey) ?? null;

  const remainingOf = (s: BenchSpoolView): number | null => {
    if (!s.stock) return null;
    let mm = s.stock.lengthMm;
    for (const a of queue.actions) {
      if (!isPending(a)) continue;
      if (a.to === "cut" && a.from === "planned" && a.spoolId === s.stock.id) mm -= a.cutLengthMm;
      if (a.to === "planned" && data?.runs[a.runId]?.cutFromSpoolId === s.stock.id) mm += a.cutLengthMm;
    }
    return Math.max(0, mm);
  };

  const order = useMemo(() => {
    if (!current) return [];
    const ids = current.s.cuts.map((c) => c.runId).filter((id) => data?.runs[id]);
    return [...ids.filter((id) => !skipped.includes(id)), ...skipped.filter((id) => ids.includes(id))];
  }, [current, skipped, data]);
  const todo = order.filter((id) => RANK[shown(id)?.state ?? "planned"] < RANK[target]);
  const focusValid = focusRun && RANK[shown(focusRun)?.state ?? "terminated"] < RANK[target];
  const runId = (focusValid ? focusRun : todo[0]) ?? null;
  const cut = runId ? (allSpools.flatMap(({ s }) => s.cuts).find((c) => c.runId === runId) ?? null) : null;
  const state = runId ? (shown(runId)?.state ?? "planned") : null;
  const nextState = state ? NEXT[state] : undefined;
  const needsOpening = Boolean(current && !current.s.stock && state === "planned");

  const advance = () => {
    if (!runId || !cut || !state || !nextState || !data) return;
    if (nextState === "cut" && !current?.s.stock) {
      setMessage({ tone: "caution", text: "Open this new spool first: enter the lot printed on it." });
      return;
    }
    const v = shown(runId)!.version;
    const a = {
      id: newActionId(),
      runId,
      wireId: cut.wireId,
      from: state,
      to: nextState,
      version: v,
      cutLengthMm: data.runs[runId]?.cutLengthMm ?? cut.cutLengthMm,
      ...(nextState === "cut" && current?.s.stock ? { spoolId: current.s.stock.id } : {}),
    };
    queue.enqueue(a);
    setHistory((h) => [...h, { ...a, status: "queued", attempts: 0 }]);
    setMessage(null);
    if (RANK[nextState] >= RANK[target] && focusRun === runId) setFocusRun(null);
  };

  const undo = () => {
    const last = history.at(-1);
    if (!last) return;
    setHistory((h) => h.slice(0, -1));
    if (queue.cancel(last.id)) {
      setMessage({ tone: "info", text: `${last.wireId}: "${last.to}" taken back before it was sent.` });
      return;
    }
    const now = shown(last.runId);
    if (!now || now.state !== last.to) {
      setMessage({ tone: "caution", text: `${last.wireId} is no longer ${last.to}; nothing to undo.` });
      return;
    }
    queue.enqueue({
      id: newActionId(),
      runId: last.runId,
      wireId: last.wireId,
      from: last.to,
      to: last.from,
      version: now.version,
      cutLengthMm: last.cutLengthMm,
    });
    setFocusRun(last.runId);
    setMessage({ tone: "info", text: `Undo: ${last.wireId} back to ${last.from}.` });
  };

  const skip = () => {
    if (!runId) return;
    setSkipped((s) => [...s.filter((id) => id !== runId), runId]);
    if (focusRun === runId) setFocusRun(null);
  };

  const jump = (raw: string) => {
    const code = normaliseTraceCode(raw);
    const hit = code ? allSpools.find(({ s }) => s.cuts.some((c) => c.traceCode === code)) : undefined;
    if (!code || !hit) {
      setMessage({ tone: "caution", text: `No run of this plan has the code "${raw.trim()}".` });
      return;
    }
    const c = hit.s.cuts.find((x) => x.traceCode === code)!;
    setSelected(hit.key);
    setFocusRun(c.runId);
    setSkipped((s) => s.filter((id) => id !== c.runId));
    const st = shown(c.runId)?.state ?? "planned";
    setMessage({
      tone: "info",
      text: `${c.wireId}: now ${st}.${RANK[st] >= RANK[target] ? " Already done for this step." : ""}`,
    });
  };

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (isTyping(e.target) || e.ctrlKey || e.metaKey || e.altKey) return;
      if (e.key === "Enter") {
        e.preventDefault();
        advance();
      } else if (e.key === "Backspace" || e.key === "u" || e.key === "U") {
        e.preventDefault();
        undo();
      } else if (e.key === "s" || e.key === "S") {
        e.preventDefault();
        skip();
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  });

  const open = async (wt: BenchWireTypeView, s: BenchSpoolView, lot: string, location: string) => {
    const key = spoolKey(wt.wireTypeId, s.index);
    setOpening(key);
    try {
      await sendJson(`/api/plans/${planId}/spools/${s.index}/open`, "POST", {
        wireTypeId: wt.wireTypeId,
        lot,
        location,
      });
      await bench.mutate();
      setMessage({ tone: "ok", text: `Spool ${s.index} is open: lot ${lot}.` });
    } catch (e) {
      setMessage({
        tone: "error",
        text: e instanceof ApiError ? e.message : "The spool could not be opened.",
      });
    } finally {
      setOpening(null);
    }
  };

  if (plans.error) return <Notice tone="error">The plans could not be loaded. Reload to try again.</Notice>;
  if (!plans.data) return <SkeletonRows rows={6} label="Loading plans" />;
  if (committed.length === 0) {
    return (
      <EmptyState title="No committed spool plan yet">
        The bench works from a committed spool plan. Ask the lead to make and commit one on the Spool plan
        screen.
      </EmptyState>
    );
  }
  if (bench.error) return <Notice tone="error">This plan could not be loaded. Reload to try again.</Notice>;
  if (!data) return <SkeletonRows rows={6} label="Loading the plan" />;

  const rem = current ? remainingOf(current.s) : null;
  const total = current ? current.s.cuts.length : 0;
  const position =
    current && cut ? `Spool ${current.s.index} · cut ${order.indexOf(cut.runId) + 1} of ${total}` : "";

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col text-sm font-semibold">
          Plan
          <select
            value={planId ?? ""}
            onChange={(e) => {
              setChosenPlan(e.target.value);
              setSelected(null);
              setSkipped([]);
              setFocusRun(null);
            }}
            className="h-14 rounded-md border border-line-strong bg-white px-3 text-base"
          >
            {committed.map((p) => (
              <option key={p.id} value={p.id}>
                Committed {new Date(p.committedAt ?? p.createdAt).toLocaleString("en-GB")}
              </option>
            ))}
          </select>
        </label>
        <fieldset className="flex flex-col text-sm font-semibold">
          <legend>Take each wire to</legend>
          <div className="flex gap-1">
            {TARGETS.map((t) => (
              <button
                key={t}
                type="button"
                aria-pressed={target === t}
                onClick={() => setTarget(t)}
                className={`h-14 rounded-md border-2 px-4 text-base capitalize ${target === t ? "border-ink bg-ink text-paper" : "border-line-strong bg-white"}`}
              >
                {t}
              </button>
            ))}
          </div>
        </fieldset>
        <form
          className="flex min-w-0 flex-1 flex-col text-sm font-semibold"
          onSubmit={(e) => {
            e.preventDefault();
            if (scan.trim()) jump(scan);
            setScan("");
          }}
        >
          <label htmlFor="bench-scan">Scan or type a marker code</label>
          <input
            id="bench-scan"
            value={scan}
            onChange={(e) => setScan(e.target.value)}
            autoComplete="off"
            placeholder="code or trace URL, then Enter"
            className="h-14 rounded-md border border-line-strong bg-white px-3 font-mono text-lg"
          />
        </form>
      </div>

      {!queue.online ? (
        <Notice tone="caution" title="Offline">
          Steps are kept on this device and sent in order when the network returns.
        </Notice>
      ) : null}
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}

      <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="flex flex-col gap-3">
          {current ? (
            <p className="text-lg font-semibold" aria-live="polite" data-testid="spool-remaining">
              Spool {current.s.index}: {rem !== null ? `${metres(rem)} left` : "not opened yet"}
            </p>
          ) : null}
          {needsOpening ? (
            <Notice tone="caution" title="Open this spool first">
              This is a new spool. Enter the lot printed on it (and where it sits) under Spools to put it on
              the shelf.
            </Notice>
          ) : null}
          {cut && state ? (
            <>
              <CurrentCut
                cut={cut}
                state={state}
                cutLengthMm={data.runs[cut.runId]?.cutLengthMm ?? cut.cutLengthMm}
                position={position}
              />
              <button
                type="button"
                onClick={advance}
                disabled={!nextState || needsOpening}
                className="min-h-20 rounded-xl bg-copper px-6 text-2xl font-bold text-white hover:bg-copper-dark disabled:bg-ink-faint"
              >
                {nextState ? `${VERB[nextState]} ✓` : "Done"}
                <span className="sr-only"> (Enter)</span>
              </button>
              <div className="grid grid-cols-2 gap-3">
                <button
                  type="button"
                  onClick={undo}
                  disabled={history.length === 0}
                  className="min-h-14 rounded-lg border-2 border-ink bg-white text-lg font-semibold disabled:border-line disabled:text-ink-faint"
                >
                  Undo last step <span className="text-sm font-normal">(U)</span>
                </button>
                <button
                  type="button"
                  onClick={skip}
                  className="min-h-14 rounded-lg border-2 border-ink bg-white text-lg font-semibold"
                >
                  Skip for now <span className="text-sm font-normal">(S)</span>
                </button>
              </div>
            </>
          ) : current ? (
            <EmptyState title={`Spool ${current.s.index} is done to “${target}”`}>
              Every cut on this spool is {target} or further. Pick another spool, or take the wires on to the
              next step.
              {history.length ? (
                <button
                  type="button"
                  onClick={undo}
                  className="mt-3 block min-h-14 w-full rounded-lg border-2 border-ink bg-white font-semibold"
                >
                  Undo last step
                </button>
              ) : null}
            </EmptyState>
          ) : null}
          <ActionQueue
            actions={queue.actions}
            online={queue.online}
            onClear={queue.clearFinished}
            onRetry={queue.retryNow}
          />
        </div>
        <div>
          <h2 className="mb-2 text-lg font-semibold">Spools</h2>
          <SpoolPicker
            wireTypes={data.wireTypes}
            selected={selectedKey}
            remainingOf={remainingOf}
            doneOf={doneOf}
            onSelect={(k) => {
              setSelected(k);
              setFocusRun(null);
            }}
            onOpen={(wt, s, lot, location) => void open(wt, s, lot, location)}
            opening={opening}
          />
        </div>
      </div>
    </div>
  );
}
