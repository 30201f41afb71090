"use client";
// A project's wire combinations that no wire type covers, each with a button that pre-fills a new wire type.
import Link from "next/link";
import { errorMessage, useUnmatchedWireTypes } from "@/lib/client/use-stock";
import type { UnmatchedCombination } from "@/lib/domain/wire-type-match";
import { buttonClass, Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";
import { WireTypeLabel } from "@/components/stock/wire-type-label";
import { feet, metres } from "@/components/stock/format";

function newWireTypeHref(u: UnmatchedCombination): string {
  const q = new URLSearchParams({ tab: "wire-types", new: "1", gauge: u.gauge, colour: u.colour });
  if (u.insulation) q.set("insulation", u.insulation);
  if (u.insulationTempC !== null) q.set("tempC", String(u.insulationTempC));
  return `/stock?${q.toString()}`;
}

export function UnmatchedWireTypes({ projectId, canEdit }: { projectId: string; canEdit: boolean }) {
  const { data, error, isLoading, mutate } = useUnmatchedWireTypes(projectId);
  if (error) {
    return (
      <Notice tone="error" title="The list could not be loaded">
        <p>{errorMessage(error)}</p>
        <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
          Try again
        </Button>
      </Notice>
    );
  }
  if (isLoading && !data) return <SkeletonRows rows={4} label="Checking the runs against the stock" />;
  if (!data || data.total === 0) {
    return (
      <EmptyState
        title="Every run has its wire type"
        action={
          <Link href="/stock" className={buttonClass("secondary")}>
            Open Stock
          </Link>
        }
      >
        Each gauge, colour and insulation used by this project&apos;s runs is a wire type in Stock, so spool
        plans can use the shelf and the price list.
      </EmptyState>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink-soft">
        {data.total} combination{data.total === 1 ? "" : "s"} of gauge, colour and insulation{" "}
        {data.total === 1 ? "has" : "have"} no wire type. Runs are matched on all three (insulation without
        regard to case); a run that names no insulation matches when its gauge and colour have exactly one
        wire type.
      </p>
      <ul className="flex flex-col gap-3" aria-label="Missing wire types">
        {data.items.map((u) => (
          <li
            key={`${u.gauge}|${u.colour}|${u.insulation ?? ""}`}
            className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4 shadow-sm sm:flex-row sm:items-center sm:justify-between"
          >
            <div className="flex flex-col gap-1">
              <WireTypeLabel gauge={u.gauge} colour={u.colour} insulation={u.insulation} />
              <span className="text-sm text-ink-soft">
                {u.runCount} run{u.runCount === 1 ? "" : "s"} · {metres(u.routedLengthMm)} routed (
                {feet(u.routedLengthMm)}) · <span className="font-mono text-xs">{u.wireIds.join(", ")}</span>
                {u.runCount > u.wireIds.length ? " …" : ""}
              </span>
              {u.reason === "ambiguous" ? (
                <span className="text-sm text-warn">
                  These runs name no insulation and {u.candidateCount} wire types of this gauge and colour
                  exist: give the runs their insulation, or add a wire type with none stated.
                </span>
              ) : u.candidateCount > 0 ? (
                <span className="text-xs text-ink-faint">
                  {u.candidateCount} wire type{u.candidateCount === 1 ? "" : "s"} of this gauge and colour in
                  another spec.
                </span>
              ) : null}
            </div>
            {canEdit ? (
              <Link href={newWireTypeHref(u)} className={`${buttonClass("primary", "md")} shrink-0`}>
                Add wire type
              </Link>
            ) : null}
          </li>
        ))}
      </ul>
    </div>
  );
}
