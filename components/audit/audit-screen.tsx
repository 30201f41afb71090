"use client";
// The Audit screen for leads: the team's trail of changes, newest first, filtered by action, person and date.
import { useState } from "react";
import { useAudit } from "@/lib/client/use-team";
import type { AuditEventRecord } from "@/lib/db/audit";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SelectField } from "@/components/ui/select-field";
import { SkeletonRows } from "@/components/ui/skeleton";

const PAGE = 50;

const ACTION_LABELS: Record<string, string> = {
  "team.create": "Created the team",
  "invitation.create": "Invited",
  "invitation.resend": "Resent an invitation",
  "invitation.revoke": "Revoked an invitation",
  "invitation.accept": "Accepted an invitation",
  "member.role": "Changed a role",
  "member.remove": "Removed a member",
};

function actionLabel(action: string): string {
  return ACTION_LABELS[action] ?? action;
}

function str(v: unknown): string {
  return typeof v === "string" || typeof v === "number" ? String(v) : "";
}

/** One line saying what changed, from the event's detail. */
function summary(e: AuditEventRecord): string {
  const d = e.detail;
  switch (e.action) {
    case "team.create":
      return str(d.teamName);
    case "invitation.create":
    case "invitation.resend":
    case "invitation.revoke":
      return `${str(d.email)} as ${str(d.role)}`;
    case "invitation.accept":
      return `${str(d.email)} joined as ${str(d.role)}${d.newAccount ? " (new account)" : ""}`;
    case "member.role":
      return `${str(d.name) || str(d.email)}: ${str(d.from)} → ${str(d.to)}`;
    case "member.remove":
      return `${str(d.name) || str(d.email)} (${str(d.role)})`;
    default: {
      const parts = Object.entries(d)
        .slice(0, 4)
        .map(([k, v]) => `${k}: ${typeof v === "object" ? JSON.stringify(v) : String(v)}`);
      return [e.entityType, parts.join(", ")].filter(Boolean).join(" · ");
    }
  }
}

function when(iso: string): string {
  return new Date(iso).toLocaleString("en-GB", {
    day: "numeric",
    month: "short",
    year: "numeric",
    hour: "2-digit",
    minute: "2-digit",
  });
}

export function AuditScreen() {
  const [action, setAction] = useState("");
  const [actor, setActor] = useState("");
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const [offset, setOffset] = useState(0);
  const qs = new URLSearchParams({ limit: String(PAGE), offset: String(offset) });
  if (action) qs.set("action", action);
  if (actor) qs.set("actorUserId", actor);
  if (from) qs.set("from", from);
  if (to) qs.set("to", to);
  const { data, error, isLoading, mutate } = useAudit(`/api/audit?${qs.toString()}`);
  const filtered = Boolean(action || actor || from || to);
  const reset = (f: () => void) => {
    f();
    setOffset(0);
  };

  return (
    <div className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Audit</h1>
        <p className="text-sm text-ink-soft">
          Every change to the team&apos;s members and invitations, with who made it and when. Newest first.
        </p>
      </div>
      <form
        className="grid gap-3 rounded-lg border border-line bg-white p-4 shadow-sm sm:grid-cols-2 lg:grid-cols-[1fr_1fr_11rem_11rem_auto] lg:items-end"
        onSubmit={(e) => e.preventDefault()}
        aria-label="Filters"
      >
        <SelectField
          id="f-action"
          label="Action"
          value={action}
          onChange={(e) => reset(() => setAction(e.target.value))}
        >
          <option value="">All actions</option>
          {(data?.facets.actions ?? []).map((a) => (
            <option key={a} value={a}>
              {actionLabel(a)}
            </option>
          ))}
        </SelectField>
        <SelectField
          id="f-actor"
          label="Person"
          value={actor}
          onChange={(e) => reset(() => setActor(e.target.value))}
        >
          <option value="">Everyone</option>
          {(data?.facets.actors ?? []).map((p) => (
            <option key={p.id} value={p.id}>
              {p.name} ({p.email})
            </option>
          ))}
        </SelectField>
        <Field
          id="f-from"
          label="From"
          type="date"
          value={from}
          onChange={(e) => reset(() => setFrom(e.target.value))}
        />
        <Field
          id="f-to"
          label="To"
          type="date"
          value={to}
          onChange={(e) => reset(() => setTo(e.target.value))}
        />
        <Button
          type="button"
          variant="quiet"
          disabled={!filtered}
          onClick={() =>
            reset(() => {
              setAction("");
              setActor("");
              setFrom("");
              setTo("");
            })
          }
        >
          Clear filters
        </Button>
      </form>

      {error ? (
        <Notice tone="error" title="The audit trail could not be loaded">
          <p>{error instanceof Error ? error.message : "Unknown error."}</p>
          <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
            Try again
          </Button>
        </Notice>
      ) : isLoading && !data ? (
        <SkeletonRows rows={8} label="Loading the audit trail" />
      ) : data && data.total === 0 ? (
        <EmptyState title={filtered ? "Nothing matches these filters" : "No changes recorded yet"}>
          {filtered
            ? "Try a wider date range or clear the filters."
            : "Invitations, role changes and removals appear here as they happen."}
        </EmptyState>
      ) : data ? (
        <div className="overflow-x-auto rounded-lg border border-line bg-white shadow-sm">
          <table className="w-full min-w-[640px] border-collapse text-sm" aria-label="Audit trail">
            <thead className="bg-paper-deep text-left text-ink-soft">
              <tr>
                <th scope="col" className="border-b border-line px-3 py-2 font-semibold">
                  When
                </th>
                <th scope="col" className="border-b border-line px-3 py-2 font-semibold">
                  Who
                </th>
                <th scope="col" className="border-b border-line px-3 py-2 font-semibold">
                  What
                </th>
                <th scope="col" className="border-b border-line px-3 py-2 font-semibold">
                  Details
                </th>
              </tr>
            </thead>
            <tbody>
              {data.items.map((e) => (
                <tr key={e.id} className="border-b border-line/70 last:border-0 align-top">
                  <td className="whitespace-nowrap px-3 py-2 tabular-nums">{when(e.createdAt)}</td>
                  <td className="px-3 py-2">
                    {e.actorName ?? <span className="text-ink-faint">(former member)</span>}
                  </td>
                  <td className="px-3 py-2 font-semibold">{actionLabel(e.action)}</td>
                  <td className="px-3 py-2 text-ink-soft">{summary(e)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <div className="flex items-center justify-between gap-3 border-t border-line px-3 py-2 text-xs text-ink-faint">
            <span>
              {data.offset + 1}–{data.offset + data.items.length} of {data.total}
            </span>
            <span className="flex gap-2">
              <Button
                variant="secondary"
                size="sm"
                disabled={offset === 0}
                onClick={() => setOffset(Math.max(0, offset - PAGE))}
              >
                Newer
              </Button>
              <Button
                variant="secondary"
                size="sm"
                disabled={data.offset + data.items.length >= data.total}
                onClick={() => setOffset(offset + PAGE)}
              >
                Older
              </Button>
            </span>
          </div>
        </div>
      ) : null}
    </div>
  );
}
