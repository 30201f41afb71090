import type { Metadata } from "next";
import Link from "next/link";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { SPOOL_STATES, type SpoolState } from "@/lib/domain/stock";
import { uuidSchema } from "@/lib/validation/common";
import { Notice } from "@/components/ui/notice";
import { PutUpsPanel } from "@/components/stock/put-ups-panel";
import { SpoolsPanel } from "@/components/stock/spools-panel";
import { WireTypesPanel } from "@/components/stock/wire-types-panel";

export const metadata: Metadata = { title: "Stock" };

const TABS = [
  { id: "wire-types", label: "Wire types" },
  { id: "put-ups", label: "Put-ups" },
  { id: "spools", label: "Shelf spools" },
] as const;
type Tab = (typeof TABS)[number]["id"];

type Search = {
  tab?: string;
  wireTypeId?: string;
  state?: string;
  new?: string;
  gauge?: string;
  colour?: string;
  insulation?: string;
  tempC?: string;
};

export default async function StockPage({ searchParams }: { searchParams: Promise<Search> }) {
  const me = await requirePageRole(ALL_ROLES, "/stock");
  const sp = await searchParams;
  const tab: Tab = TABS.some((t) => t.id === sp.tab) ? (sp.tab as Tab) : "wire-types";
  const canEdit = me.role === "lead";
  const wireTypeId = sp.wireTypeId && uuidSchema.safeParse(sp.wireTypeId).success ? sp.wireTypeId : null;
  const state = (SPOOL_STATES as readonly string[]).includes(sp.state ?? "")
    ? (sp.state as SpoolState)
    : null;
  // The unmatched-wire-types list links here with the combination to pre-fill the new wire type.
  const prefill =
    sp.new === "1"
      ? { gauge: sp.gauge, colour: sp.colour, insulation: sp.insulation, insulationTempC: sp.tempC }
      : null;

  return (
    <div className="flex flex-col gap-5">
      <div>
        <p className="text-sm font-semibold uppercase tracking-wide text-copper-dark">{me.teamName}</p>
        <h1 className="text-2xl font-bold">Stock</h1>
        <p className="text-sm text-ink-soft">
          What the team stocks, what it can buy, and what is on the shelf. Spool plans cut from shelf spools
          first.
        </p>
      </div>
      {!canEdit ? (
        <Notice tone="info">You can read the stock. Only the team&apos;s lead adds or changes it.</Notice>
      ) : null}
      <nav aria-label="Stock sections" className="-mb-px flex gap-1 overflow-x-auto border-b border-line">
        {TABS.map((t) => (
          <Link
            key={t.id}
            href={`/stock?tab=${t.id}`}
            aria-current={t.id === tab ? "page" : undefined}
            className={`whitespace-nowrap rounded-t-md border border-b-0 px-4 py-2 text-sm font-semibold ${
              t.id === tab
                ? "border-line bg-white text-ink"
                : "border-transparent text-ink-soft hover:bg-paper-deep hover:text-ink"
            }`}
          >
            {t.label}
          </Link>
        ))}
      </nav>
      {tab === "wire-types" ? <WireTypesPanel canEdit={canEdit} prefill={prefill} /> : null}
      {tab === "put-ups" ? (
        <PutUpsPanel key={wireTypeId ?? "all"} canEdit={canEdit} initialWireTypeId={wireTypeId} />
      ) : null}
      {tab === "spools" ? (
        <SpoolsPanel
          key={`${wireTypeId ?? "all"}-${state ?? "any"}`}
          canEdit={canEdit}
          initialWireTypeId={wireTypeId}
          initialState={state}
        />
      ) : null}
    </div>
  );
}
