"use client";
// A one-line link from a project to its wire types missing from Stock, with the count once it is known.
import Link from "next/link";
import { useUnmatchedWireTypes } from "@/lib/client/use-stock";

export function MissingWireTypesLink({ projectId }: { projectId: string }) {
  const { data } = useUnmatchedWireTypes(projectId);
  const n = data?.total;
  return (
    <Link
      href={`/projects/${projectId}/missing-wire-types`}
      className="inline-flex items-center gap-2 self-start text-sm font-semibold text-copper-dark underline-offset-2 hover:underline"
    >
      Wire types missing from Stock
      {n === undefined ? null : (
        <span
          className={`rounded px-1.5 py-0.5 text-xs font-bold ${n > 0 ? "bg-warn-light text-warn" : "bg-pass-light text-pass"}`}
        >
          {n > 0 ? `${n} missing` : "none missing"}
        </span>
      )}
    </Link>
  );
}
