"use client";
// The sections of one project; the current one is marked for screen readers and by an underline.
import Link from "next/link";
import { usePathname } from "next/navigation";

const SECTIONS = [
  { href: "", label: "Runs" },
  { href: "/checks", label: "Checks" },
  { href: "/plan", label: "Spool plan" },
  { href: "/print", label: "Print" },
  { href: "/bench", label: "Bench" },
  { href: "/progress", label: "Progress" },
  { href: "/settings", label: "Settings" },
];

export function ProjectNav({ projectId }: { projectId: string }) {
  const path = usePathname();
  return (
    <nav aria-label="Project sections" className="flex gap-1 overflow-x-auto border-b border-line">
      {SECTIONS.map((s) => {
        const href = `/projects/${projectId}${s.href}`;
        const current = s.href === "" ? path === href : path.startsWith(href);
        return (
          <Link
            key={s.href}
            href={href}
            aria-current={current ? "page" : undefined}
            className={`whitespace-nowrap border-b-2 px-4 py-2 text-sm font-semibold ${current ? "border-copper text-ink" : "border-transparent text-ink-soft hover:text-ink"}`}
          >
            {s.label}
          </Link>
        );
      })}
    </nav>
  );
}
