"use client";
// SWR hook for a project's bench progress (refreshed every 15 s while the screen is open).
import useSWR from "swr";
import { fetcher } from "@/lib/client/fetcher";
import type { ProgressView } from "@/lib/services/progress";

export function progressKey(projectId: string): string {
  return `/api/projects/${projectId}/progress`;
}

export function useProgress(projectId: string) {
  return useSWR<ProgressView>(progressKey(projectId), fetcher, {
    keepPreviousData: true,
    refreshInterval: 15_000,
  });
}
