"use client";
// The bench's action queue: each step is kept in memory and in localStorage and sent in order, so a dropped
// network loses nothing; retried with back-off and on the browser's "online" event; each step carries the run
// version it was made against and a client-made action id, so nothing is recorded twice.
import { useCallback, useEffect, useRef, useState } from "react";
import { ApiError, sendJson } from "@/lib/client/fetcher";
import type { BenchState } from "@/lib/domain/types";

export type BenchActionStatus = "queued" | "sending" | "done" | "conflict" | "failed";

export interface BenchAction {
  id: string;
  runId: string;
  wireId: string;
  from: BenchState;
  to: BenchState;
  version: number;
  spoolId?: string;
  cutLengthMm: number;
  status: BenchActionStatus;
  message?: string;
  attempts: number;
}

export interface RunStamp {
  id: string;
  state: BenchState;
  version: number;
}

const MAX_BACKOFF_MS = 30_000;
const storageKey = (projectId: string) => `loomwright.bench.${projectId}`;

function load(projectId: string): BenchAction[] {
  try {
    const raw = window.localStorage.getItem(storageKey(projectId));
    const list = raw ? (JSON.parse(raw) as BenchAction[]) : [];
    return list.map((a) => (a.status === "sending" ? { ...a, status: "queued" } : a));
  } catch {
    return [];
  }
}

/** A v4 uuid; crypto.randomUUID is missing outside secure contexts (a tablet reaching the app over plain http). */
export function newActionId(): string {
  if (typeof crypto.randomUUID === "function") return crypto.randomUUID();
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, "0")).join("");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

export const isPending = (a: BenchAction) => a.status === "queued" || a.status === "sending";

export function useBenchQueue(
  projectId: string,
  handlers: {
    onApplied: (run: RunStamp) => void;
    onConflict: (a: BenchAction, current: RunStamp | null) => void;
  },
) {
  const [actions, setActions] = useState<BenchAction[]>([]);
  const [online, setOnline] = useState(true);
  const [retryAt, setRetryAt] = useState<number | null>(null);
  const busy = useRef(false);
  const loaded = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const [tick, setTick] = useState(0);
  const handlersRef = useRef(handlers);
  const actionsRef = useRef(actions);
  useEffect(() => {
    handlersRef.current = handlers;
    actionsRef.current = actions;
  });

  useEffect(() => {
    // After the first paint, so the server-rendered page and the first client render agree.
    const start = setTimeout(() => {
      setActions(load(projectId));
      loaded.current = true;
      setOnline(navigator.onLine);
    }, 0);
    const up = () => {
      setOnline(true);
      setRetryAt(null);
      setTick((t) => t + 1);
    };
    const down = () => setOnline(false);
    window.addEventListener("online", up);
    window.addEventListener("offline", down);
    return () => {
      clearTimeout(start);
      window.removeEventListener("online", up);
      window.removeEventListener("offline", down);
    };
  }, [projectId]);

  useEffect(() => {
    if (!loaded.current) return;
    // Keep what is still to send or needs a look, and the last few done, across reloads.
    const keep = [
      ...actions.filter((a) => a.status !== "done"),
      ...actions.filter((a) => a.status === "done").slice(-10),
    ];
    try {
      window.localStorage.setItem(storageKey(projectId), JSON.stringify(keep));
    } catch {
      // storage full or blocked: the queue still lives in memory
    }
  }, [actions, projectId]);

  const update = (id: string, patch: Partial<BenchAction>) =>
    setActions((list) => list.map((a) => (a.id === id ? { ...a, ...patch } : a)));

  /** Marks the later pending steps of the same run: they were made against a version that no longer holds. */
  const dropLater = (a: BenchAction, status: BenchActionStatus, message: string) =>
    setActions((list) => {
      const at = list.findIndex((x) => x.id === a.id);
      return list.map((x, i) =>
        i > at && x.runId === a.runId && isPending(x) ? { ...x, status, message } : x,
      );
    });

  useEffect(() => {
    if (busy.current || !online) return;
    if (retryAt && Date.now() < retryAt) return;
    const next = actions.find(isPending);
    if (!next) return;
    busy.current = true;
    void (async () => {
      update(next.id, { status: "sending" });
      try {
        const run = await sendJson<RunStamp>(`/api/projects/${projectId}/runs/${next.runId}`, "PATCH", {
          version: next.version,
          state: next.to,
          ...(next.spoolId ? { spoolId: next.spoolId } : {}),
          actionId: next.id,
        });
        update(next.id, { status: "done", message: undefined });
        setRetryAt(null);
        handlersRef.current.onApplied(run);
      } catch (e) {
        const err = e instanceof ApiError ? e : new ApiError(0, "network", "The network is not answering.");
        if (err.status === 0 || err.status >= 500 || err.status === 429) {
          const attempts = next.attempts + 1;
          const wait = Math.min(MAX_BACKOFF_MS, 1000 * 2 ** (attempts - 1));
          update(next.id, {
            status: "queued",
            attempts,
            message: `Waiting for the network; retry in ${Math.round(wait / 1000)} s`,
          });
          setRetryAt(Date.now() + wait);
          if (timer.current) clearTimeout(timer.current);
          timer.current = setTimeout(() => {
            setRetryAt(null);
            setTick((t) => t + 1);
          }, wait);
        } else if (err.status === 409) {
          const current = ((err.details as { current?: RunStamp } | undefined)?.current ??
            null) as RunStamp | null;
          if (current && current.state === next.to && current.version === next.version + 1) {
            // Already recorded (the answer to an earlier try was lost): done, not recorded again.
            update(next.id, { status: "done", message: "already recorded" });
            handlersRef.current.onApplied(current);
          } else {
            const msg = current
              ? `Changed by someone else: now ${current.state} (version ${current.version}). Not overwritten.`
              : err.message;
            update(next.id, { status: "conflict", message: msg });
            dropLater(next, "conflict", "An earlier step of this run was refused; not sent.");
            handlersRef.current.onConflict(next, current);
          }
        } else {
          update(next.id, { status: "failed", message: err.message });
          dropLater(next, "failed", "An earlier step of this run failed; not sent.");
          handlersRef.current.onConflict(next, null);
        }
      } finally {
        busy.current = false;
        setTick((t) => t + 1);
      }
    })();
  }, [actions, online, retryAt, tick, projectId]);

  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  const enqueue = useCallback((a: Omit<BenchAction, "status" | "attempts">) => {
    setActions((list) => [...list, { ...a, status: "queued", attempts: 0 }]);
  }, []);
  /** Takes back a step not sent yet; false when it already went (then undo sends the reverse step). */
  const cancel = useCallback((id: string): boolean => {
    const a = actionsRef.current.find((x) => x.id === id);
    if (!a || a.status !== "queued" || busy.current) return false;
    setActions((list) => list.filter((x) => x.id !== id || x.status !== "queued"));
    return true;
  }, []);
  const clearFinished = useCallback(() => setActions((list) => list.filter(isPending)), []);
  const retryNow = useCallback(() => {
    setRetryAt(null);
    setTick((t) => t + 1);
  }, []);

  return { actions, online, enqueue, cancel, clearFinished, retryNow };
}
