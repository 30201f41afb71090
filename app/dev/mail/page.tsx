import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Wordmark } from "@/components/brand/wordmark";
import { MailboxScreen } from "@/components/mail/mailbox-screen";
import { mailboxEnabled } from "@/lib/env";

export const metadata: Metadata = { title: "Mailbox", referrer: "no-referrer", robots: { index: false } };
export const dynamic = "force-dynamic";

// Development only and open to anyone (a person who forgot their password must read the reset mail here): it does
// not exist unless the mailbox is on (DEV_MAILBOX=1; off by default under NODE_ENV=production).
export default async function MailboxPage() {
  if (!mailboxEnabled()) notFound();
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-ink/10 bg-ink text-paper">
        <div className="mx-auto flex max-w-screen-2xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
          <Link href="/" className="shrink-0">
            <Wordmark size={28} tone="light" />
          </Link>
          <span className="rounded bg-copper px-2 py-0.5 text-xs font-bold uppercase tracking-wide text-white">
            Development
          </span>
          <Link href="/" className="ml-auto rounded px-3 py-1.5 text-sm font-semibold hover:bg-white/10">
            Back to Loomwright
          </Link>
        </div>
      </header>
      <main className="mx-auto w-full max-w-screen-2xl flex-1 px-4 py-6">
        <MailboxScreen />
      </main>
    </div>
  );
}
