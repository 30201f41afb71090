"use client";
// The Spool plan screen: make a plan, see each wire type's spools to scale, the cost against the proven bound,
// what to buy, and commit it to the shelf.
import { useState } from "react";
import { ApiError, sendJson } from "@/lib/client/fetcher";
import { usePlan, usePlans } from "@/lib/client/use-plans";
import type { PlanResponse } from "@/lib/services/plans";
import type { Role } from "@/lib/auth/roles";
import { Button, buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { EmptyState } from "@/components/ui/empty-state";
import { SkeletonRows } from "@/components/ui/skeleton";
import { SpoolBar } from "@/components/plan/spool-bar";

const money = (cents: number, currency = "USD") =>
  new Intl.NumberFormat("en-GB", { style: "currency", currency }).format(cents / 100);
const metres = (mm: number) => `${(mm / 1000).toFixed(2)} m`;

export function PlanView({ projectId, role }: { projectId: string; role: Role }) {
  const plans = usePlans(projectId);
  const [chosen, setChosen] = useState<string | null>(null);
  const planId = chosen ?? plans.data?.items[0]?.id ?? null;
  const plan = usePlan(planId);
  const [busy, setBusy] = useState<string | null>(null);
  const [message, setMessage] = useState<{ tone: "ok" | "error" | "caution"; text: string } | null>(null);
  const [mailTo, setMailTo] = useState("");
  const isLead = role === "lead";

  async function act(label: string, fn: () => Promise<void>) {
    setBusy(label);
    setMessage(null);
    try {
      await fn();
    } catch (e) {
      setMessage({
        tone: e instanceof ApiError && e.status === 409 ? "caution" : "error",
        text: e instanceof Error ? e.message : "That did not work.",
      });
    } finally {
      setBusy(null);
    }
  }

  const make = () =>
    act("Planning… (up to a few seconds)", async () => {
      const p = await sendJson<PlanResponse>(`/api/projects/${projectId}/plans`, "POST");
      await plans.mutate();
      setChosen(p.id);
    });
  const commit = () =>
    act("Committing…", async () => {
      await sendJson(`/api/plans/${planId}/commit`, "POST");
      await Promise.all([plan.mutate(), plans.mutate()]);
      setMessage({
        tone: "ok",
        text: "Committed: the shelf spools are reserved and the kept remnants are listed in Stock.",
      });
    });
  const mail = () =>
    act("Sending…", async () => {
      await sendJson(`/api/plans/${planId}/purchase-mail`, "POST", { to: mailTo });
      setMessage({ tone: "ok", text: `Purchase list sent to ${mailTo}.` });
    });

  if (plans.error) return <Notice tone="error">The plans could not be loaded. Reload to try again.</Notice>;
  if (!plans.data) return <SkeletonRows rows={6} label="Loading plans" />;
  if (plans.data.items.length === 0) {
    return (
      <div className="flex flex-col gap-3">
        {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
        <EmptyState
          title="No spool plan yet"
          action={
            isLead ? (
              <Button onClick={() => void make()} disabled={Boolean(busy)}>
                {busy ?? "Make a spool plan"}
              </Button>
            ) : undefined
          }
        >
          A plan puts every run&apos;s cut onto the spools on the shelf first, then the cheapest spools to
          buy, and proves how close it is to the best possible.
        </EmptyState>
      </div>
    );
  }
  const r = plan.data;
  const p = r?.plan;
  const stale = r && (r.stale.changed.length || r.stale.added.length || r.stale.removed.length);
  const currency = p?.purchases[0]?.currency ?? "USD";
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
          Plan
          <select
            value={planId ?? ""}
            onChange={(e) => setChosen(e.target.value)}
            className="h-10 rounded-md border border-line-strong bg-white px-2 text-sm font-normal text-ink"
          >
            {plans.data.items.map((x) => (
              <option key={x.id} value={x.id}>
                {new Date(x.createdAt).toLocaleString("en-GB")} · {x.status} · {money(x.costCents, currency)}
              </option>
            ))}
          </select>
        </label>
        {isLead ? (
          <Button variant="secondary" onClick={() => void make()} disabled={Boolean(busy)}>
            Make a new plan
          </Button>
        ) : null}
        {r ? (
          <>
            <a className={buttonClass("secondary")} href={`/api/plans/${r.id}/cut-sheet.pdf`}>
              Cut sheet PDF
            </a>
            {isLead && r.status === "draft" ? (
              <Button onClick={() => void commit()} disabled={Boolean(busy) || Boolean(stale)}>
                Commit plan
              </Button>
            ) : null}
            {r.status === "committed" ? (
              <span className="rounded bg-pass-light px-2 py-1 text-sm font-semibold text-pass">
                Committed
              </span>
            ) : null}
          </>
        ) : null}
      </div>
      {busy ? (
        <p role="status" className="text-sm text-ink-soft">
          {busy}
        </p>
      ) : null}
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      {stale ? (
        <Notice tone="caution" title="This plan is out of date">
          Runs changed since it was made ({[...r!.stale.changed, ...r!.stale.added].slice(0, 8).join(", ")}
          {r!.stale.removed.length ? `; ${r!.stale.removed.length} removed` : ""}). Make a new plan before
          committing.
        </Notice>
      ) : null}
      {!p ? (
        <SkeletonRows rows={6} label="Loading the plan" />
      ) : (
        <>
          <section aria-label="Plan summary" className="grid grid-cols-2 gap-3 sm:grid-cols-5">
            <Card label="To buy" value={money(p.costCents, currency)} />
            <Card label="Proven lower bound" value={money(p.lowerBoundCents, currency)} />
            <Card label="Gap to the bound" value={p.gapPct === null ? "—" : `${p.gapPct.toFixed(2)} %`} />
            <Card label="Spools" value={`${p.spoolCount} for ${p.cutCount} cuts`} />
            <Card
              label="Scrap"
              value={metres(p.scrapMm)}
              hint={`${metres(p.keptRemnantMm)} back to the shelf`}
            />
          </section>

          {p.unplaced.length ? (
            <Notice tone="caution" title={`${p.unplaced.length} cuts are not in this plan`}>
              <ul className="list-disc pl-5">
                {p.unplaced.slice(0, 20).map((u) => (
                  <li key={u.runId}>
                    <span className="font-mono">{u.wireId}</span> ({u.cutLengthMm} mm): {u.reason}
                  </li>
                ))}
              </ul>
            </Notice>
          ) : null}

          <section aria-label="Spools by wire type" className="flex flex-col gap-4">
            {p.wireTypes.map((w) => {
              const scale = Math.max(...w.spools.map((s) => s.usableMm + s.endDiscardMm), 1);
              return (
                <div key={w.wireTypeId} className="rounded-lg border border-line bg-white p-4">
                  <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
                    <h3 className="font-semibold">{w.label}</h3>
                    <p className="text-xs text-ink-faint">
                      {money(w.costCents, currency)} · bound {money(w.lowerBoundCents, currency)}
                      {w.provenOptimal ? " · proven optimal" : ""} · first-fit decreasing would buy{" "}
                      {money(w.ffd.costCents, currency)} in {w.ffd.spoolCount} spools
                    </p>
                  </div>
                  <ol className="flex flex-col gap-3">
                    {w.spools.map((s) => (
                      <li key={s.index} className="flex flex-col gap-1">
                        <p className="text-sm">
                          <span className="font-semibold">Spool {s.index}</span>{" "}
                          {s.source.kind === "shelf"
                            ? `from the shelf — lot ${s.source.lot ?? "?"}, ${s.source.location ?? "no location"}, ${metres(s.source.lengthMm)}`
                            : `new ${metres(s.source.nominalMm)} put-up${s.source.supplier ? ` from ${s.source.supplier}` : ""}${s.source.partNumber ? ` (${s.source.partNumber})` : ""}`}{" "}
                          · {s.cuts.length} cuts · leftover {s.leftoverMm} mm {s.keep ? "(keep)" : "(scrap)"}
                        </p>
                        <SpoolBar spool={s} scaleMm={scale} />
                        <a
                          className="self-start text-xs font-semibold text-copper-dark underline"
                          href={`/projects/${projectId}/print?runs=${s.cuts.map((c) => c.wireId).join(",")}`}
                        >
                          Print markers for this spool
                        </a>
                        <p className="font-mono text-xs text-ink-soft">
                          {s.cuts.map((c) => `${c.wireId} ${c.cutLengthMm}`).join(" · ")}
                        </p>
                      </li>
                    ))}
                  </ol>
                </div>
              );
            })}
          </section>

          <section
            aria-labelledby="buy-h"
            className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4"
          >
            <h2 id="buy-h" className="font-semibold">
              Purchase list
            </h2>
            {p.purchases.length === 0 ? (
              <p className="text-sm text-ink-soft">Nothing to buy: the shelf covers every cut.</p>
            ) : (
              <table className="w-full text-sm" aria-label="Purchase list">
                <thead className="text-left text-ink-soft">
                  <tr>
                    <th className="py-1">Supplier</th>
                    <th>Part no.</th>
                    <th>Wire type</th>
                    <th>Put-up</th>
                    <th className="text-right">Qty</th>
                    <th className="text-right">Each</th>
                    <th className="text-right">Total</th>
                  </tr>
                </thead>
                <tbody>
                  {p.purchases.map((x) => (
                    <tr key={x.putUpId} className="border-t border-line/70">
                      <td className="py-1">{x.supplier ?? "—"}</td>
                      <td className="font-mono">{x.partNumber ?? "—"}</td>
                      <td>{x.wireTypeLabel}</td>
                      <td>
                        {metres(x.nominalMm)} ({Math.round(x.nominalMm / 304.8)} ft)
                      </td>
                      <td className="text-right tabular-nums">{x.count}</td>
                      <td className="text-right tabular-nums">{money(x.unitPriceCents, x.currency)}</td>
                      <td className="text-right tabular-nums">{money(x.totalCents, x.currency)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
            <div className="flex flex-wrap items-end gap-2">
              <a className={buttonClass("secondary", "sm")} href={`/api/plans/${r!.id}/purchases?format=csv`}>
                Download CSV
              </a>
              <a
                className={buttonClass("secondary", "sm")}
                href={`/api/plans/${r!.id}/purchases?format=xlsx`}
              >
                Download XLSX
              </a>
              {isLead ? (
                <form
                  className="flex items-end gap-2"
                  onSubmit={(e) => {
                    e.preventDefault();
                    void mail();
                  }}
                >
                  <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
                    Mail the list to
                    <input
                      type="email"
                      required
                      value={mailTo}
                      onChange={(e) => setMailTo(e.target.value)}
                      placeholder="purchasing@example.test"
                      className="h-8 w-64 rounded-md border border-line-strong px-2 text-sm font-normal text-ink"
                    />
                  </label>
                  <Button size="sm" type="submit" disabled={Boolean(busy)}>
                    Send purchase list
                  </Button>
                </form>
              ) : null}
            </div>
          </section>
        </>
      )}
    </div>
  );
}

function Card({ label, value, hint }: { label: string; value: string; hint?: string }) {
  return (
    <div className="rounded-lg border border-line bg-white p-4">
      <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">{label}</p>
      <p className="text-lg font-bold">{value}</p>
      {hint ? <p className="text-xs text-ink-faint">{hint}</p> : null}
    </div>
  );
}
