"use client";
// SWR hooks for the Team and Audit screens (keys are the API URLs).
import useSWR from "swr";
import { fetcher } from "@/lib/client/fetcher";
import type { TeamView } from "@/lib/services/team";
import type { AuditEventRecord } from "@/lib/db/audit";
import type { Page } from "@/lib/validation/common";

export const TEAM_URL = "/api/team";

export function useTeam() {
  return useSWR<TeamView>(TEAM_URL, fetcher);
}

export interface AuditPage extends Page<AuditEventRecord> {
  facets: { actions: string[]; actors: { id: string; name: string; email: string }[] };
}

export function useAudit(url: string) {
  return useSWR<AuditPage>(url, fetcher, { keepPreviousData: true });
}
