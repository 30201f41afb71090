"use client";
// SWR hook for a project's runs (the key is the API URL).
import useSWR from "swr";
import { fetcher } from "@/lib/client/fetcher";
import type { RunRecord } from "@/lib/db/runs";
import type { Page } from "@/lib/validation/common";

export function runsUrl(projectId: string, limit = 1000, offset = 0): string {
  return `/api/projects/${projectId}/runs?limit=${limit}&offset=${offset}`;
}

export function useRuns(projectId: string) {
  return useSWR<Page<RunRecord>>(runsUrl(projectId), fetcher, { keepPreviousData: true });
}
