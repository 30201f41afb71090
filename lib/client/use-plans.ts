"use client";
// SWR hooks for a project's spool plans.
import useSWR from "swr";
import { fetcher } from "@/lib/client/fetcher";
import type { PlanResponse } from "@/lib/services/plans";

export interface PlanListItem {
  id: string;
  status: "draft" | "committed";
  costCents: number;
  lowerBoundCents: number;
  gapPct: number | null;
  createdAt: string;
  committedAt: string | null;
}

export function usePlans(projectId: string) {
  return useSWR<{ items: PlanListItem[] }>(`/api/projects/${projectId}/plans`, fetcher);
}

export function usePlan(planId: string | null) {
  return useSWR<PlanResponse>(planId ? `/api/plans/${planId}` : null, fetcher);
}
