"use client";
// The development mailbox: mail caught by the local fake mail server, newest first, with its links clickable.
import { Fragment, useState } from "react";
import useSWR from "swr";
import { fetcher } from "@/lib/client/fetcher";
import type { DevMailRecord } from "@/lib/db/dev-mail";
import type { Page } from "@/lib/validation/common";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";

const URL_RE = /(https?:\/\/[^\s<>"']+)/g;

/** Plain text with its web addresses as links (opened in this tab, like a mail client hands them to a browser). */
function Linkified({ text }: { text: string }) {
  const parts = text.split(URL_RE);
  return (
    <>
      {parts.map((p, i) =>
        i % 2 === 1 ? (
          <a key={i} href={p} className="break-all font-semibold text-copper-dark underline">
            {p}
          </a>
        ) : (
          <Fragment key={i}>{p}</Fragment>
        ),
      )}
    </>
  );
}

function when(iso: string): string {
  return new Date(iso).toLocaleString("en-GB", {
    day: "numeric",
    month: "short",
    hour: "2-digit",
    minute: "2-digit",
    second: "2-digit",
  });
}

export function MailboxScreen() {
  const [to, setTo] = useState("");
  const [openId, setOpenId] = useState<number | null>(null);
  const key = `/api/dev/mail?limit=100${to.trim() ? `&to=${encodeURIComponent(to.trim())}` : ""}`;
  const { data, error, isLoading, mutate } = useSWR<Page<DevMailRecord>>(key, fetcher, {
    refreshInterval: 3000,
    keepPreviousData: true,
  });
  const open = data?.items.find((m) => m.id === openId) ?? data?.items[0] ?? null;

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Mailbox</h1>
          <p className="max-w-2xl text-sm text-ink-soft">
            Mail caught by the local fake mail server instead of being delivered: invitations and
            password-reset links land here. It exists only in development and demos; a real deployment sends
            through its mail service.
          </p>
        </div>
        <div className="w-full sm:w-72">
          <Field
            id="mail-to"
            label="To"
            type="search"
            placeholder="any address"
            value={to}
            onChange={(e) => setTo(e.target.value)}
          />
        </div>
      </div>
      {error && !data ? (
        <Notice tone="error" title="The mailbox could not be loaded">
          <p>{error instanceof Error ? error.message : "Unknown error."}</p>
          <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
            Try again
          </Button>
        </Notice>
      ) : isLoading && !data ? (
        <SkeletonRows rows={5} label="Loading the mailbox" />
      ) : !data || data.total === 0 ? (
        <EmptyState title={to.trim() ? "No mail to that address" : "No mail yet"}>
          Invite someone from the Team screen or ask for a password reset; the mail appears here within
          seconds.
        </EmptyState>
      ) : (
        <div className="grid gap-4 lg:grid-cols-[22rem_1fr]">
          <ul
            className="flex flex-col self-start divide-y divide-line overflow-hidden rounded-lg border border-line bg-white shadow-sm"
            aria-label="Messages"
          >
            {data.items.map((m) => (
              <li key={m.id}>
                <button
                  type="button"
                  onClick={() => setOpenId(m.id)}
                  aria-current={open?.id === m.id ? "true" : undefined}
                  className={`flex w-full flex-col gap-0.5 px-4 py-3 text-left hover:bg-paper ${open?.id === m.id ? "bg-copper-light/50" : ""}`}
                >
                  <span className="truncate text-sm font-semibold">{m.subject}</span>
                  <span className="truncate text-xs text-ink-soft">to {m.toAddresses.join(", ")}</span>
                  <span className="text-xs text-ink-faint">{when(m.receivedAt)}</span>
                </button>
              </li>
            ))}
          </ul>
          {open ? (
            <article
              className="min-w-0 rounded-lg border border-line bg-white p-5 shadow-sm"
              aria-label="Message"
            >
              <h2 className="text-lg font-bold">{open.subject}</h2>
              <dl className="mt-1 grid grid-cols-[4rem_1fr] gap-x-2 text-sm text-ink-soft">
                <dt>From</dt>
                <dd className="break-all">{open.fromAddress}</dd>
                <dt>To</dt>
                <dd className="break-all">{open.toAddresses.join(", ")}</dd>
                <dt>Received</dt>
                <dd>{when(open.receivedAt)}</dd>
              </dl>
              <div className="mt-4 whitespace-pre-wrap border-t border-line pt-4 text-base leading-relaxed">
                <Linkified text={open.text} />
              </div>
              {open.html ? (
                <details className="mt-4 border-t border-line pt-3 text-sm">
                  <summary className="cursor-pointer font-semibold text-ink-soft">HTML version</summary>
                  {/* sandbox="" : no scripts, no navigation from the caught mail */}
                  <iframe
                    title={`HTML version of ${open.subject}`}
                    sandbox=""
                    srcDoc={open.html}
                    className="mt-2 h-[28rem] w-full rounded border border-line bg-white"
                  />
                </details>
              ) : null}
            </article>
          ) : null}
        </div>
      )}
    </div>
  );
}
