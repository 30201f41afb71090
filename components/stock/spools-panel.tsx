"use client";
// The Shelf spools section of Stock: spools and remnants with their measured length, lot, location and state.
import { useMemo, useState, type ReactNode } from "react";
import Link from "next/link";
import { createColumnHelper } from "@tanstack/react-table";
import { errorMessage, useSpools, useWireTypes } from "@/lib/client/use-stock";
import type { SpoolListItem } from "@/lib/db/spools";
import { SPOOL_STATES, type SpoolState } from "@/lib/domain/stock";
import { Button, buttonClass } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { SelectField } from "@/components/ui/select-field";
import { SkeletonRows } from "@/components/ui/skeleton";
import { SortableTable, type SortingFeatures } from "@/components/ui/sortable-table";
import { AdjustmentHistory } from "@/components/stock/adjustment-history";
import { STATE_LABELS, dateTime, feet, metres, putUpLength } from "@/components/stock/format";
import { AdjustLengthForm, SpoolCreateForm, SpoolEditForm } from "@/components/stock/spool-forms";
import { SpoolStateBadge } from "@/components/stock/spool-state-badge";
import { WireTypeLabel, wireTypeText } from "@/components/stock/wire-type-label";

const col = createColumnHelper<SortingFeatures, SpoolListItem>();
const EMPTY: SpoolListItem[] = [];

type DialogState =
  | { kind: "none" }
  | { kind: "new" }
  | { kind: "edit"; spool: SpoolListItem }
  | { kind: "adjust"; spool: SpoolListItem }
  | { kind: "history"; spool: SpoolListItem };

/** How a spool is named in buttons and titles: its lot, or its wire type when it has none. */
export function spoolName(s: SpoolListItem): string {
  return s.lot ? `spool ${s.lot}` : `spool of ${wireTypeText(s)}`;
}

function setUrlFilter(name: string, value: string) {
  const u = new URL(window.location.href);
  if (value) u.searchParams.set(name, value);
  else u.searchParams.delete(name);
  window.history.replaceState(null, "", u.toString());
}

export function SpoolsPanel({
  canEdit,
  initialWireTypeId,
  initialState,
}: {
  canEdit: boolean;
  initialWireTypeId: string | null;
  initialState: SpoolState | null;
}) {
  const [wireTypeId, setWireTypeId] = useState(initialWireTypeId ?? "");
  const [state, setState] = useState<SpoolState | "">(initialState ?? "");
  const wireTypes = useWireTypes();
  const { data, error, isLoading, mutate } = useSpools({
    wireTypeId: wireTypeId || undefined,
    state: state || undefined,
  });
  const [dialog, setDialog] = useState<DialogState>({ kind: "none" });
  const [saved, setSaved] = useState<string | null>(null);

  const columns = useMemo(
    () =>
      col.columns([
        col.accessor((s) => `${s.gauge} ${s.colour} ${s.insulation ?? ""}`, {
          id: "wireType",
          header: "Wire type",
          sortFn: "alphanumeric",
          cell: (c) => <WireTypeLabel {...c.row.original} />,
        }),
        col.accessor("lengthMm", {
          header: "Remaining",
          sortFn: "basic",
          cell: (c) => {
            const s = c.row.original;
            return (
              <span className="whitespace-nowrap tabular-nums">
                <span className="font-semibold">{metres(s.lengthMm)}</span>
                <span className="text-ink-soft"> · {feet(s.lengthMm)}</span>
                {s.initialLengthMm > s.lengthMm ? (
                  <span className="block text-xs text-ink-faint">of {metres(s.initialLengthMm)}</span>
                ) : null}
              </span>
            );
          },
        }),
        col.accessor((s) => s.lot ?? "", {
          id: "lot",
          header: "Lot",
          sortFn: "alphanumeric",
          cell: (c) => <span className="whitespace-nowrap font-mono text-xs">{c.getValue() || "—"}</span>,
        }),
        col.accessor((s) => s.location ?? "", {
          id: "location",
          header: "Location",
          sortFn: "alphanumeric",
          cell: (c) => <span className="whitespace-nowrap">{c.getValue() || "—"}</span>,
        }),
        col.accessor("state", {
          header: "State",
          sortFn: "text",
          cell: (c) => <SpoolStateBadge state={c.getValue()} />,
        }),
        col.accessor((s) => s.originNote ?? s.sourceSupplierName ?? "", {
          id: "origin",
          header: "Origin",
          sortFn: "text",
          cell: (c) => {
            const s = c.row.original;
            const bought =
              s.sourceNominalLengthMm !== null && s.sourceSupplierName
                ? `${putUpLength(s.sourceNominalLengthMm)} spool from ${s.sourceSupplierName}`
                : null;
            return (
              <span className="text-xs text-ink-soft">
                {bought}
                {bought && s.originNote ? <br /> : null}
                {s.originNote}
                {!bought && !s.originNote ? "—" : null}
              </span>
            );
          },
        }),
        col.accessor((s) => s.lastAdjustedAt ?? "", {
          id: "measured",
          header: "Last measured",
          sortFn: "text",
          cell: (c) => (
            <span className="whitespace-nowrap text-xs text-ink-soft">
              {c.row.original.lastAdjustedAt ? dateTime(c.row.original.lastAdjustedAt) : "as received"}
            </span>
          ),
        }),
        col.display({
          id: "actions",
          header: () => <span className="sr-only">Actions</span>,
          cell: (c) => {
            const s = c.row.original;
            return (
              <span className="flex justify-end gap-1 whitespace-nowrap">
                {canEdit ? (
                  <>
                    <Button
                      size="sm"
                      variant="secondary"
                      aria-label={`Adjust length of ${spoolName(s)}`}
                      onClick={() => setDialog({ kind: "adjust", spool: s })}
                    >
                      Adjust length
                    </Button>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Edit ${spoolName(s)}`}
                      onClick={() => setDialog({ kind: "edit", spool: s })}
                    >
                      Edit
                    </Button>
                  </>
                ) : (
                  <Button
                    size="sm"
                    variant="secondary"
                    aria-label={`History of ${spoolName(s)}`}
                    onClick={() => setDialog({ kind: "history", spool: s })}
                  >
                    History
                  </Button>
                )}
              </span>
            );
          },
        }),
      ]),
    [canEdit],
  );

  const wtItems = wireTypes.data?.items;
  const close = () => setDialog({ kind: "none" });
  const filtered = Boolean(wireTypeId || state);
  const shelfMm = (data?.items ?? EMPTY)
    .filter((s) => s.state !== "used_up")
    .reduce((a, s) => a + s.lengthMm, 0);

  let body: ReactNode;
  if (error) {
    body = (
      <Notice tone="error" title="The shelf could not be loaded">
        <p>{errorMessage(error)}</p>
        <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
          Try again
        </Button>
      </Notice>
    );
  } else if (isLoading && !data) {
    body = <SkeletonRows rows={8} label="Loading the shelf" />;
  } else if (data && data.total === 0) {
    body = (
      <EmptyState
        title={filtered ? "No spools match these filters" : "The shelf is empty"}
        action={
          !canEdit || filtered ? null : (wtItems?.length ?? 0) > 0 ? (
            <Button onClick={() => setDialog({ kind: "new" })}>Add spool</Button>
          ) : wtItems ? (
            <Link href="/stock?tab=wire-types" className={buttonClass("secondary")}>
              Add a wire type first
            </Link>
          ) : null
        }
      >
        {filtered
          ? "Choose another wire type or state."
          : "Add the spools and remnants you have, with their measured length, lot and location. Spool plans cut from them before buying."}
      </EmptyState>
    );
  } else {
    body = (
      <SortableTable
        label="Shelf spools"
        columns={columns}
        data={data?.items ?? EMPTY}
        getRowId={(s) => s.id}
        minWidthPx={canEdit ? 1180 : 1080}
        footer={
          <>
            {data?.total ?? 0} spools
            {data && data.total > data.items.length ? ` (showing ${data.items.length})` : ""} ·{" "}
            {metres(shelfMm, 1)} open or reserved
          </>
        }
      />
    );
  }

  const title =
    dialog.kind === "new"
      ? "New spool on the shelf"
      : dialog.kind === "edit"
        ? `Edit ${spoolName(dialog.spool)}`
        : dialog.kind === "adjust"
          ? `Adjust the length of ${spoolName(dialog.spool)}`
          : dialog.kind === "history"
            ? `History of ${spoolName(dialog.spool)}`
            : "";

  return (
    <section aria-labelledby="spools-heading" className="flex flex-col gap-3">
      <h2 id="spools-heading" className="sr-only">
        Shelf spools
      </h2>
      {saved ? <Notice tone="ok">{saved}</Notice> : null}
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="grid w-full max-w-2xl grid-cols-1 gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
          <SelectField
            id="sp-filter-wire-type"
            label="Wire type"
            value={wireTypeId}
            onChange={(e) => {
              setWireTypeId(e.target.value);
              setUrlFilter("wireTypeId", e.target.value);
            }}
            options={[
              { value: "", label: "All wire types" },
              ...(wtItems ?? []).map((w) => ({ value: w.id, label: wireTypeText(w) })),
            ]}
          />
          <SelectField
            id="sp-filter-state"
            label="State"
            value={state}
            onChange={(e) => {
              setState(e.target.value as SpoolState | "");
              setUrlFilter("state", e.target.value);
            }}
            options={[
              { value: "", label: "Any state" },
              ...SPOOL_STATES.map((s) => ({ value: s, label: STATE_LABELS[s] })),
            ]}
          />
        </div>
        {canEdit && (wtItems?.length ?? 0) > 0 ? (
          <Button onClick={() => setDialog({ kind: "new" })}>Add spool</Button>
        ) : null}
      </div>
      {body}
      <Dialog open={dialog.kind !== "none"} title={title} onClose={close} wide={dialog.kind === "adjust"}>
        {dialog.kind === "new" && wtItems ? (
          <SpoolCreateForm
            wireTypes={wtItems}
            wireTypeId={wireTypeId || null}
            onDone={(s) => {
              setSaved(`Put ${spoolName(s)} on the shelf with ${metres(s.lengthMm)}.`);
              close();
            }}
          />
        ) : null}
        {dialog.kind === "edit" ? (
          <SpoolEditForm
            key={dialog.spool.id}
            spool={dialog.spool}
            onDone={(s) => {
              setSaved(`Saved ${spoolName(s)}.`);
              close();
            }}
          />
        ) : null}
        {dialog.kind === "adjust" ? (
          <div className="grid grid-cols-1 gap-6 md:grid-cols-2">
            <AdjustLengthForm
              key={dialog.spool.id}
              spool={dialog.spool}
              onDone={(r) => setSaved(`Recorded ${metres(r.spool.lengthMm)} for ${spoolName(r.spool)}.`)}
            />
            <AdjustmentHistory spoolId={dialog.spool.id} />
          </div>
        ) : null}
        {dialog.kind === "history" ? <AdjustmentHistory spoolId={dialog.spool.id} /> : null}
      </Dialog>
    </section>
  );
}
