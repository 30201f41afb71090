"use client";
// The Put-ups section of Stock: the purchasable spool lengths per wire type, with price per metre and supplier.
import { useMemo, useState, type ReactNode } from "react";
import Link from "next/link";
import { createColumnHelper } from "@tanstack/react-table";
import { sendJson } from "@/lib/client/fetcher";
import { errorMessage, refreshStock, usePutUps, useWireTypes } from "@/lib/client/use-stock";
import type { PutUpListItem } from "@/lib/db/put-ups";
import { Button, buttonClass } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { SelectField } from "@/components/ui/select-field";
import { SkeletonRows } from "@/components/ui/skeleton";
import { SortableTable, type SortingFeatures } from "@/components/ui/sortable-table";
import { feet, metres, money } from "@/components/stock/format";
import { PutUpForm } from "@/components/stock/put-up-form";
import { WireTypeLabel, wireTypeText } from "@/components/stock/wire-type-label";

const col = createColumnHelper<SortingFeatures, PutUpListItem>();
const EMPTY: PutUpListItem[] = [];

type DialogState =
  | { kind: "none" }
  | { kind: "new" }
  | { kind: "edit"; putUp: PutUpListItem }
  | { kind: "delete"; putUp: PutUpListItem };

function setUrlFilter(wireTypeId: string) {
  const u = new URL(window.location.href);
  if (wireTypeId) u.searchParams.set("wireTypeId", wireTypeId);
  else u.searchParams.delete("wireTypeId");
  window.history.replaceState(null, "", u.toString());
}

export function PutUpsPanel({
  canEdit,
  initialWireTypeId,
}: {
  canEdit: boolean;
  initialWireTypeId: string | null;
}) {
  const [wireTypeId, setWireTypeId] = useState(initialWireTypeId ?? "");
  const wireTypes = useWireTypes();
  const { data, error, isLoading, mutate } = usePutUps(wireTypeId || undefined);
  const [dialog, setDialog] = useState<DialogState>({ kind: "none" });
  const [saved, setSaved] = useState<string | null>(null);

  const columns = useMemo(
    () =>
      col.columns([
        col.accessor((p) => `${p.gauge} ${p.colour} ${p.insulation ?? ""}`, {
          id: "wireType",
          header: "Wire type",
          sortFn: "alphanumeric",
          cell: (c) => <WireTypeLabel {...c.row.original} />,
        }),
        col.accessor("nominalLengthMm", {
          header: "Length",
          sortFn: "basic",
          sortDescFirst: false,
          cell: (c) => (
            <span className="whitespace-nowrap tabular-nums">
              <span className="font-semibold">{metres(c.getValue())}</span>
              <span className="text-ink-soft"> · {feet(c.getValue())}</span>
            </span>
          ),
        }),
        col.accessor("priceCents", {
          header: "Price",
          sortFn: "basic",
          sortDescFirst: false,
          cell: (c) => <span className="tabular-nums">{money(c.getValue(), c.row.original.currency)}</span>,
        }),
        col.accessor("pricePerMetreCents", {
          header: "Per metre",
          sortFn: "basic",
          sortDescFirst: false,
          cell: (c) => (
            <span className="tabular-nums">
              {money(c.getValue(), c.row.original.currency, c.getValue() < 100 ? 3 : 2)}
            </span>
          ),
        }),
        col.accessor("supplierName", { header: "Supplier", sortFn: "text" }),
        col.accessor((p) => p.supplierPartNo ?? "", {
          id: "partNo",
          header: "Part no.",
          sortFn: "alphanumeric",
          cell: (c) => <span className="font-mono text-xs">{c.getValue() || "—"}</span>,
        }),
        col.accessor((p) => (p.active ? "Active" : "Retired"), {
          id: "active",
          header: "Status",
          sortFn: "text",
          cell: (c) => (
            <span className={c.row.original.active ? "text-pass" : "text-ink-faint"}>{c.getValue()}</span>
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
                      aria-label={`Edit put-up ${c.row.original.supplierPartNo ?? c.row.original.id}`}
                      onClick={() => setDialog({ kind: "edit", putUp: c.row.original })}
                    >
                      Edit
                    </Button>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Delete put-up ${c.row.original.supplierPartNo ?? c.row.original.id}`}
                      onClick={() => setDialog({ kind: "delete", putUp: c.row.original })}
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

  const wtItems = wireTypes.data?.items;
  const suppliers = useMemo(
    () => [...new Set((data?.items ?? EMPTY).map((p) => p.supplierName))].sort(),
    [data],
  );
  const close = () => setDialog({ kind: "none" });
  const selected = wtItems?.find((w) => w.id === wireTypeId) ?? null;

  let body: ReactNode;
  if (error) {
    body = (
      <Notice tone="error" title="The put-ups could not be loaded">
        <p>{errorMessage(error)}</p>
        <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
          Try again
        </Button>
      </Notice>
    );
  } else if (isLoading && !data) {
    body = <SkeletonRows rows={8} label="Loading put-ups" />;
  } else if (data && data.total === 0) {
    body = (
      <EmptyState
        title={selected ? `No put-ups for ${wireTypeText(selected)}` : "No put-ups yet"}
        action={
          !canEdit ? null : (wtItems?.length ?? 0) > 0 ? (
            <Button onClick={() => setDialog({ kind: "new" })}>Add put-up</Button>
          ) : wtItems ? (
            <Link href="/stock?tab=wire-types" className={buttonClass("secondary")}>
              Add a wire type first
            </Link>
          ) : null
        }
      >
        A put-up is a spool length you can buy, with its price and supplier. Spool plans buy the cheapest
        put-ups that cover what the shelf cannot.
      </EmptyState>
    );
  } else {
    body = (
      <SortableTable
        label="Put-ups"
        columns={columns}
        data={data?.items ?? EMPTY}
        getRowId={(p) => p.id}
        minWidthPx={canEdit ? 1080 : 960}
        footer={
          <>
            {data?.total ?? 0} put-ups
            {data && data.total > data.items.length ? ` (showing ${data.items.length})` : ""}. Prices per
            metre compare put-ups of one currency only.
          </>
        }
      />
    );
  }

  return (
    <section aria-labelledby="put-ups-heading" className="flex flex-col gap-3">
      <h2 id="put-ups-heading" className="sr-only">
        Put-ups
      </h2>
      {saved ? <Notice tone="ok">{saved}</Notice> : null}
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="w-full max-w-sm">
          <SelectField
            id="pu-filter"
            label="Wire type"
            value={wireTypeId}
            onChange={(e) => {
              setWireTypeId(e.target.value);
              setUrlFilter(e.target.value);
            }}
            options={[
              { value: "", label: "All wire types" },
              ...(wtItems ?? []).map((w) => ({ value: w.id, label: wireTypeText(w) })),
            ]}
          />
        </div>
        {canEdit && (wtItems?.length ?? 0) > 0 ? (
          <Button onClick={() => setDialog({ kind: "new" })}>Add put-up</Button>
        ) : null}
      </div>
      {body}
      <Dialog
        open={dialog.kind === "new" || dialog.kind === "edit"}
        title={dialog.kind === "edit" ? "Edit put-up" : "New put-up"}
        onClose={close}
      >
        {(dialog.kind === "new" || dialog.kind === "edit") && wtItems ? (
          <PutUpForm
            key={dialog.kind === "edit" ? dialog.putUp.id : "new"}
            existing={dialog.kind === "edit" ? dialog.putUp : null}
            wireTypes={wtItems}
            wireTypeId={wireTypeId || null}
            suppliers={suppliers}
            defaultCurrency={data?.items[0]?.currency ?? null}
            onDone={(p) => {
              setSaved(
                `Saved the ${metres(p.nominalLengthMm)} put-up of ${wireTypeText(p)} from ${p.supplierName}.`,
              );
              close();
            }}
          />
        ) : null}
      </Dialog>
      <Dialog open={dialog.kind === "delete"} title="Delete put-up" onClose={close}>
        {dialog.kind === "delete" ? (
          <DeletePutUp
            putUp={dialog.putUp}
            onCancel={close}
            onDone={() => {
              setSaved("Deleted the put-up.");
              close();
            }}
          />
        ) : null}
      </Dialog>
    </section>
  );
}

function DeletePutUp({
  putUp,
  onDone,
  onCancel,
}: {
  putUp: PutUpListItem;
  onDone: () => void;
  onCancel: () => void;
}) {
  const [err, setErr] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  return (
    <div className="flex flex-col gap-4">
      {err ? <Notice tone="error">{err}</Notice> : null}
      <p className="text-sm">
        Delete the {metres(putUp.nominalLengthMm)} ({feet(putUp.nominalLengthMm)}) put-up of{" "}
        <strong>{wireTypeText(putUp)}</strong> from {putUp.supplierName}? Spools bought as it stay on the
        shelf. To stop offering it but keep the record, edit it and clear “Active” instead.
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
              await sendJson(`/api/stock/put-ups/${putUp.id}`, "DELETE");
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
