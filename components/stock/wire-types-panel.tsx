"use client";
// The Wire types section of Stock: every wire type with what the shelf holds and what can be bought.
import { useMemo, useState, type ReactNode } from "react";
import Link from "next/link";
import { createColumnHelper } from "@tanstack/react-table";
import { sendJson } from "@/lib/client/fetcher";
import { errorMessage, refreshStock, useWireTypes } from "@/lib/client/use-stock";
import type { WireTypeListItem } from "@/lib/db/wire-types";
import { MM_PER_FOOT } from "@/lib/domain/stock";
import { Button } from "@/components/ui/button";
import { ColourSwatch } from "@/components/ui/colour-swatch";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";
import { SortableTable, type SortingFeatures } from "@/components/ui/sortable-table";
import { metres, putUpLength } from "@/components/stock/format";
import { WireTypeForm, type WireTypePrefill } from "@/components/stock/wire-type-form";
import { wireTypeText } from "@/components/stock/wire-type-label";

const col = createColumnHelper<SortingFeatures, WireTypeListItem>();
const EMPTY: WireTypeListItem[] = [];

function putUpLengths(mm: number[]): string {
  if (mm.length === 0) return "—";
  const allFeet = mm.every((m) => Math.abs(m / MM_PER_FOOT - Math.round(m / MM_PER_FOOT)) < 1e-6);
  if (allFeet) return `${mm.map((m) => Math.round(m / MM_PER_FOOT)).join(" · ")} ft`;
  return mm.map(putUpLength).join(" · ");
}

function conductorText(w: WireTypeListItem): string {
  const base = w.conductorMaterial === "aluminium" ? "Aluminium" : "Copper";
  return w.tinned ? `${base}, tinned` : base;
}

type DialogState =
  | { kind: "none" }
  | { kind: "new"; prefill: WireTypePrefill | null }
  | { kind: "edit"; wireType: WireTypeListItem }
  | { kind: "delete"; wireType: WireTypeListItem };

export function WireTypesPanel({ canEdit, prefill }: { canEdit: boolean; prefill: WireTypePrefill | null }) {
  const { data, error, isLoading, mutate } = useWireTypes();
  const [dialog, setDialog] = useState<DialogState>(
    canEdit && prefill ? { kind: "new", prefill } : { kind: "none" },
  );
  const [filter, setFilter] = useState("");
  const [saved, setSaved] = useState<string | null>(null);

  const columns = useMemo(
    () =>
      col.columns([
        col.accessor("nominalAreaMm2", {
          id: "gauge",
          header: "Gauge",
          sortFn: "basic",
          cell: (c) => <span className="whitespace-nowrap font-semibold">{c.row.original.gauge}</span>,
        }),
        col.accessor("colour", {
          header: "Colour",
          sortFn: "text",
          cell: (c) => <ColourSwatch code={c.getValue()} />,
        }),
        col.accessor((w) => w.insulation ?? "", {
          id: "insulation",
          header: "Insulation",
          sortFn: "text",
          cell: (c) => c.getValue() || <span className="text-ink-faint">not stated</span>,
        }),
        col.accessor(conductorText, { id: "conductor", header: "Conductor", sortFn: "text" }),
        col.accessor((w) => w.outerDiameterMm ?? -1, {
          id: "od",
          header: "OD (mm)",
          sortFn: "basic",
          sortDescFirst: false,
          cell: (c) => <span className="tabular-nums">{c.row.original.outerDiameterMm ?? "—"}</span>,
        }),
        col.accessor((w) => w.insulationTempC ?? -1, {
          id: "temp",
          header: "Rating",
          sortFn: "basic",
          cell: (c) => {
            const t = c.row.original.insulationTempC;
            return <span className="whitespace-nowrap tabular-nums">{t === null ? "—" : `${t} °C`}</span>;
          },
        }),
        col.accessor("shelfSpoolCount", {
          header: "Shelf spools",
          sortFn: "basic",
          cell: (c) =>
            c.getValue() === 0 ? (
              <span className="tabular-nums text-ink-faint">0</span>
            ) : (
              <Link
                href={`/stock?tab=spools&wireTypeId=${c.row.original.id}`}
                className="tabular-nums text-copper-dark underline-offset-2 hover:underline"
              >
                {c.getValue()}
              </Link>
            ),
        }),
        col.accessor("shelfLengthMm", {
          header: "On the shelf",
          sortFn: "basic",
          cell: (c) => {
            const w = c.row.original;
            const reserved = w.shelfLengthMm - w.openLengthMm;
            return (
              <span className="whitespace-nowrap tabular-nums">
                {w.shelfLengthMm === 0 ? "—" : metres(w.shelfLengthMm, 1)}
                {reserved > 0 ? (
                  <span className="block text-xs text-warn">{metres(reserved, 1)} reserved</span>
                ) : null}
              </span>
            );
          },
        }),
        col.accessor((w) => w.putUpCount, {
          id: "putUps",
          header: "Put-ups",
          sortFn: "basic",
          cell: (c) => (
            <Link
              href={`/stock?tab=put-ups&wireTypeId=${c.row.original.id}`}
              className="whitespace-nowrap text-copper-dark underline-offset-2 hover:underline"
            >
              {putUpLengths(c.row.original.activePutUpLengthsMm)}
            </Link>
          ),
        }),
        ...(canEdit
          ? [
              col.display({
                id: "actions",
                header: () => <span className="sr-only">Actions</span>,
                cell: (c) => (
                  <span className="flex justify-end gap-1 whitespace-nowrap">
                    <Button
                      size="sm"
                      variant="secondary"
                      aria-label={`Edit ${wireTypeText(c.row.original)}`}
                      onClick={() => setDialog({ kind: "edit", wireType: c.row.original })}
                    >
                      Edit
                    </Button>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Delete ${wireTypeText(c.row.original)}`}
                      onClick={() => setDialog({ kind: "delete", wireType: c.row.original })}
                    >
                      Delete
                    </Button>
                  </span>
                ),
              }),
            ]
          : []),
      ]),
    [canEdit],
  );

  const items = data?.items ?? EMPTY;
  const shown = useMemo(() => {
    const f = filter.trim().toLowerCase();
    if (!f) return items;
    return items.filter((w) =>
      `${w.gauge} ${w.colour} ${w.insulation ?? ""} ${w.notes ?? ""}`.toLowerCase().includes(f),
    );
  }, [items, filter]);

  const close = () => {
    // A pre-filled form came from a link; once it is closed, a reload should not open it again.
    if (dialog.kind === "new" && dialog.prefill)
      window.history.replaceState(null, "", "/stock?tab=wire-types");
    setDialog({ kind: "none" });
  };

  let body: ReactNode;
  if (error) {
    body = (
      <Notice tone="error" title="The wire types could not be loaded">
        <p>{errorMessage(error)}</p>
        <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
          Try again
        </Button>
      </Notice>
    );
  } else if (isLoading && !data) {
    body = <SkeletonRows rows={8} label="Loading wire types" />;
  } else if (data && data.total === 0) {
    body = (
      <EmptyState
        title="No wire types yet"
        action={
          canEdit ? (
            <Button onClick={() => setDialog({ kind: "new", prefill: null })}>Add wire type</Button>
          ) : null
        }
      >
        A wire type is one stock item: gauge, colour and insulation spec. Runs are matched to wire types to
        plan spools and buy wire.
      </EmptyState>
    );
  } else {
    body = (
      <>
        <div className="flex flex-wrap items-end justify-between gap-3">
          <label className="flex flex-col gap-1 text-sm font-semibold">
            Find
            <input
              type="search"
              value={filter}
              onChange={(e) => setFilter(e.target.value)}
              placeholder="gauge, colour or spec"
              className="h-10 w-64 max-w-full rounded-md border border-line-strong bg-white px-3 text-base font-normal shadow-sm focus:border-copper focus:outline-none"
            />
          </label>
          {canEdit ? (
            <Button onClick={() => setDialog({ kind: "new", prefill: null })}>Add wire type</Button>
          ) : null}
        </div>
        {shown.length === 0 ? (
          <Notice tone="info">No wire type matches “{filter}”.</Notice>
        ) : (
          <SortableTable
            label="Wire types"
            columns={columns}
            data={shown}
            getRowId={(w) => w.id}
            minWidthPx={canEdit ? 1060 : 940}
            footer={
              <>
                {shown.length} of {data?.total ?? 0} wire types
                {data && data.total > data.items.length ? ` (the first ${data.items.length} loaded)` : ""}
              </>
            }
          />
        )}
      </>
    );
  }

  return (
    <section aria-labelledby="wire-types-heading" className="flex flex-col gap-3">
      <h2 id="wire-types-heading" className="sr-only">
        Wire types
      </h2>
      {saved ? <Notice tone="ok">{saved}</Notice> : null}
      {body}
      <Dialog
        open={dialog.kind === "new" || dialog.kind === "edit"}
        title={dialog.kind === "edit" ? `Edit ${wireTypeText(dialog.wireType)}` : "New wire type"}
        onClose={close}
      >
        {dialog.kind === "new" || dialog.kind === "edit" ? (
          <WireTypeForm
            key={dialog.kind === "edit" ? dialog.wireType.id : "new"}
            existing={dialog.kind === "edit" ? dialog.wireType : null}
            prefill={dialog.kind === "new" ? dialog.prefill : null}
            onDone={(w) => {
              setSaved(`Saved ${wireTypeText(w)}.`);
              close();
            }}
          />
        ) : null}
      </Dialog>
      <Dialog open={dialog.kind === "delete"} title="Delete wire type" onClose={close}>
        {dialog.kind === "delete" ? (
          <DeleteWireType
            wireType={dialog.wireType}
            onDone={() => {
              setSaved(`Deleted ${wireTypeText(dialog.wireType)}.`);
              close();
            }}
            onCancel={close}
          />
        ) : null}
      </Dialog>
    </section>
  );
}

function DeleteWireType({
  wireType,
  onDone,
  onCancel,
}: {
  wireType: WireTypeListItem;
  onDone: () => void;
  onCancel: () => void;
}) {
  const [err, setErr] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  return (
    <div className="flex flex-col gap-4">
      {err ? <Notice tone="error">{err}</Notice> : null}
      <p className="text-sm">
        Delete <strong>{wireTypeText(wireType)}</strong>
        {wireType.putUpCount > 0
          ? ` and its ${wireType.putUpCount} put-up${wireType.putUpCount === 1 ? "" : "s"}`
          : ""}
        ? Runs of this gauge, colour and insulation will show as missing a wire type. A wire type with spool
        records cannot be deleted.
      </p>
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel}>
          Keep it
        </Button>
        <Button
          variant="danger"
          disabled={pending}
          onClick={async () => {
            setPending(true);
            setErr(null);
            try {
              await sendJson(`/api/stock/wire-types/${wireType.id}`, "DELETE");
              await refreshStock();
              onDone();
            } catch (e) {
              setErr(errorMessage(e));
            } finally {
              setPending(false);
            }
          }}
        >
          {pending ? "Deleting…" : "Delete"}
        </Button>
      </div>
    </div>
  );
}
