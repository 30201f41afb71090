"use client";
// SWR hook for all runs of a project: the API pages at 1,000, so this loads every page in parallel.
import useSWR from "swr";
import { fetcher } from "@/lib/client/fetcher";
import type { RunView as RunRecord } from "@/lib/services/runs";
import type { Page } from "@/lib/validation/common";

const PAGE = 1000;

export function runsUrl(projectId: string, limit = PAGE, offset = 0): string {
  return `/api/projects/${projectId}/runs?limit=${limit}&offset=${offset}`;
}

export function allRunsKey(projectId: string): string {
  return runsUrl(projectId);
}

async function fetchAll(url: string): Promise<Page<RunRecord>> {
  const first = await fetcher<Page<RunRecord>>(url);
  if (first.total <= first.items.length) return first;
  const base = url.replace(/offset=\d+/, "");
  const rest = await Promise.all(
    Array.from({ length: Math.ceil(first.total / PAGE) - 1 }, (_, i) =>
      fetcher<Page<RunRecord>>(`${base}offset=${(i + 1) * PAGE}`),
    ),
  );
  const items = [...first.items, ...rest.flatMap((p) => p.items)];
  return { items, total: first.total, limit: items.length, offset: 0 };
}

export function useRuns(projectId: string) {
  return useSWR<Page<RunRecord>>(allRunsKey(projectId), fetchAll, { keepPreviousData: true });
}
