"use client";
// SWR hook for a project's electrical checks.
import useSWR from "swr";
import { fetcher } from "@/lib/client/fetcher";
import type { ChecksSummary, RunChecks } from "@/lib/domain/checks";

export interface ChecksPage {
  summary: ChecksSummary;
  cautions: string[];
  items: RunChecks[];
  total: number;
}

export function checksKey(projectId: string): string {
  return `/api/projects/${projectId}/checks`;
}

export function useChecks(projectId: string) {
  return useSWR<ChecksPage>(checksKey(projectId), fetcher, { keepPreviousData: true });
}
