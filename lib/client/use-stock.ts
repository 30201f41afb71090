"use client";
// SWR hooks for the stock screens (keys are the API URLs) and one refresh after any stock write.
import useSWR, { mutate } from "swr";
import { ApiError, fetcher } from "@/lib/client/fetcher";
import type { PutUpListItem } from "@/lib/db/put-ups";
import type { SpoolAdjustmentRecord, SpoolListItem } from "@/lib/db/spools";
import type { WireTypeListItem } from "@/lib/db/wire-types";
import type { UnmatchedCombination } from "@/lib/domain/wire-type-match";
import type { SpoolState } from "@/lib/domain/stock";
import type { Page } from "@/lib/validation/common";

function url(path: string, params: Record<string, string | number | undefined>): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== "") q.set(k, String(v));
  return `${path}?${q.toString()}`;
}

export function useWireTypes() {
  return useSWR<Page<WireTypeListItem>>(url("/api/stock/wire-types", { limit: 500 }), fetcher, {
    keepPreviousData: true,
  });
}

export function usePutUps(wireTypeId?: string) {
  return useSWR<Page<PutUpListItem>>(url("/api/stock/put-ups", { limit: 1000, wireTypeId }), fetcher, {
    keepPreviousData: true,
  });
}

export function useSpools(filter: { wireTypeId?: string; state?: SpoolState }) {
  return useSWR<Page<SpoolListItem>>(url("/api/stock/spools", { limit: 1000, ...filter }), fetcher, {
    keepPreviousData: true,
  });
}

export function useAdjustments(spoolId: string | null) {
  return useSWR<Page<SpoolAdjustmentRecord>>(
    spoolId ? url(`/api/stock/spools/${spoolId}/adjustments`, { limit: 100 }) : null,
    fetcher,
  );
}

export function useUnmatchedWireTypes(projectId: string) {
  return useSWR<Page<UnmatchedCombination>>(
    url(`/api/projects/${projectId}/unmatched-wire-types`, { limit: 500 }),
    fetcher,
  );
}

/** After a stock write every stock list may have changed (totals, put-up counts): revalidate them all. */
export function refreshStock(): Promise<unknown> {
  return mutate(
    (key) =>
      typeof key === "string" && (key.startsWith("/api/stock/") || key.includes("/unmatched-wire-types")),
  );
}

/** Field errors from a 422 answer, keyed by the field's path. */
export function fieldErrors(e: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (e instanceof ApiError && Array.isArray(e.details)) {
    for (const d of e.details as { path?: unknown; message?: unknown }[]) {
      if (typeof d.path === "string" && typeof d.message === "string" && !out[d.path])
        out[d.path] = d.message;
    }
  }
  return out;
}

export function errorMessage(e: unknown): string {
  return e instanceof Error ? e.message : "Something went wrong.";
}
