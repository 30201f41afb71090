// The header of every signed-in screen: wordmark, the team being worked in, the person and their role.
import Link from "next/link";
import { Wordmark } from "@/components/brand/wordmark";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { signOutAction } from "@/app/(app)/actions";

export function AppHeader({
  name,
  teamName,
  role,
  mailbox = false,
}: {
  name: string;
  teamName: string | null;
  role: Role | null;
  /** Show the development mailbox (only when it is enabled). */
  mailbox?: boolean;
}) {
  const link = "rounded px-3 py-1.5 font-semibold hover:bg-white/10";
  return (
    <header className="border-b border-ink/10 bg-ink text-paper">
      <div className="mx-auto flex max-w-screen-2xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/projects" className="shrink-0">
          <Wordmark size={28} tone="light" />
        </Link>
        <nav aria-label="Main" className="flex items-center gap-1 text-sm">
          <Link href="/projects" className="rounded px-3 py-1.5 font-semibold hover:bg-white/10">
            Projects
          </Link>
          <Link href="/stock" className={link}>
            Stock
          </Link>
          {role ? (
            <Link href="/team" className={link}>
              Team
            </Link>
          ) : null}
          {role === "lead" ? (
            <Link href="/audit" className={link}>
              Audit
            </Link>
          ) : null}
          {mailbox ? (
            <Link href="/dev/mail" className={link}>
              Mailbox
            </Link>
          ) : null}
          <Link href="/scan" className={link}>
            Scan
          </Link>
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <span className="hidden text-paper/80 sm:inline">{teamName ?? "No team"}</span>
          <span className="flex items-center gap-2">
            <span className="font-semibold">{name}</span>
            {role ? (
              <span className="rounded bg-copper px-2 py-0.5 text-xs font-bold uppercase tracking-wide text-white">
                {ROLE_LABELS[role]}
              </span>
            ) : null}
          </span>
          <form action={signOutAction}>
            <button
              type="submit"
              className="rounded border border-white/30 px-3 py-1.5 font-semibold hover:bg-white/10"
            >
              Sign out
            </button>
          </form>
        </div>
      </div>
    </header>
  );
}
