// Put-ups: the purchasable spool lengths of a team's wire types, with price and supplier; scoped through the wire type.
import type { Knex } from "knex";
import { db, type Db } from "@/lib/db/knex";
import { recordAudit } from "@/lib/db/audit";
import { changedFields, definedOnly, withTx } from "@/lib/db/stock-helpers";
import { pricePerMetreCents } from "@/lib/domain/stock";
import { invalid, notFound } from "@/lib/http/errors";
import type { Page } from "@/lib/validation/common";
import type { PutUpCreateInput, PutUpListQuery, PutUpPatchInput } from "@/lib/validation/stock";

export interface PutUpRecord {
  id: string;
  wireTypeId: string;
  nominalLengthMm: number;
  /** Integer cents (minor units) of `currency`. */
  priceCents: number;
  /** ISO 4217 code. */
  currency: string;
  supplierName: string;
  supplierPartNo: string | null;
  active: boolean;
  createdAt: string;
  updatedAt: string;
}

export interface PutUpListItem extends PutUpRecord {
  gauge: string;
  colour: string;
  insulation: string | null;
  /** Fractional cents per metre, for comparing put-ups of one currency. */
  pricePerMetreCents: number;
}

const COLUMNS = [
  "p.id",
  "p.wireTypeId",
  "p.nominalLengthMm",
  "p.priceCents",
  "p.currency",
  "p.supplierName",
  "p.supplierPartNo",
  "p.active",
  "p.createdAt",
  "p.updatedAt",
];

function scoped(q: Db, teamId: string): Knex.QueryBuilder {
  return q("putUp as p").join("wireType as w", "w.id", "p.wireTypeId").where("w.teamId", teamId);
}

function withWireType(b: Knex.QueryBuilder): Knex.QueryBuilder {
  return b.select(...COLUMNS, "w.gauge", "w.colour", "w.insulation");
}

function finish(rows: Omit<PutUpListItem, "pricePerMetreCents">[]): PutUpListItem[] {
  return rows.map((r) => ({ ...r, pricePerMetreCents: pricePerMetreCents(r.priceCents, r.nominalLengthMm) }));
}

export async function listPutUps(
  teamId: string,
  query: PutUpListQuery,
  q: Db = db(),
): Promise<Page<PutUpListItem>> {
  const base = scoped(q, teamId).modify((b) => {
    if (query.wireTypeId) b.where("p.wireTypeId", query.wireTypeId);
    if (query.active !== undefined) b.where("p.active", query.active);
  });
  const [countRow] = (await base.clone().count({ total: "*" })) as [{ total: number }];
  const rows = (await withWireType(base.clone())
    .orderBy("w.nominalAreaMm2", "desc")
    .orderBy("w.colour", "asc")
    .orderByRaw("lower(coalesce(w.insulation, '')) asc")
    .orderBy("p.nominalLengthMm", "asc")
    .orderBy("p.priceCents", "asc")
    .limit(query.limit)
    .offset(query.offset)) as Omit<PutUpListItem, "pricePerMetreCents">[];
  return { items: finish(rows), total: Number(countRow.total), limit: query.limit, offset: query.offset };
}

export async function getPutUp(teamId: string, putUpId: string, q: Db = db()): Promise<PutUpListItem | null> {
  const row = (await withWireType(scoped(q, teamId)).where("p.id", putUpId).first()) as
    Omit<PutUpListItem, "pricePerMetreCents"> | undefined;
  return row ? finish([row])[0]! : null;
}

/** Active put-ups of some wire types, cheapest per metre first (what a spool plan may buy). */
export async function listActivePutUps(
  teamId: string,
  wireTypeIds: readonly string[],
  q: Db = db(),
): Promise<PutUpListItem[]> {
  if (wireTypeIds.length === 0) return [];
  const rows = (await withWireType(scoped(q, teamId))
    .whereIn("p.wireTypeId", wireTypeIds)
    .where("p.active", true)
    .orderBy("p.wireTypeId")
    .orderBy("p.nominalLengthMm", "asc")) as Omit<PutUpListItem, "pricePerMetreCents">[];
  return finish(rows).sort(
    (a, b) => a.wireTypeId.localeCompare(b.wireTypeId) || a.pricePerMetreCents - b.pricePerMetreCents,
  );
}

export async function createPutUp(
  teamId: string,
  actorUserId: string,
  input: PutUpCreateInput,
  q: Db = db(),
): Promise<PutUpListItem> {
  return withTx(q, async (trx) => {
    const wt = await trx("wireType").select("id").where({ teamId, id: input.wireTypeId }).first();
    if (!wt) throw invalid("wireTypeId: there is no such wire type in this team.");
    const [row] = (await trx("putUp")
      .insert({
        wireTypeId: input.wireTypeId,
        nominalLengthMm: input.nominalLengthMm,
        priceCents: input.priceCents,
        currency: input.currency,
        supplierName: input.supplierName,
        supplierPartNo: input.supplierPartNo ?? null,
        active: input.active,
      })
      .returning("id")) as [{ id: string }];
    await recordAudit(trx, {
      teamId,
      actorUserId,
      action: "put_up.create",
      entityType: "put_up",
      entityId: row.id,
      detail: {
        wireTypeId: input.wireTypeId,
        nominalLengthMm: input.nominalLengthMm,
        priceCents: input.priceCents,
        currency: input.currency,
        supplierName: input.supplierName,
      },
    });
    return (await getPutUp(teamId, row.id, trx))!;
  });
}

export async function updatePutUp(
  teamId: string,
  actorUserId: string,
  putUpId: string,
  patch: PutUpPatchInput,
  q: Db = db(),
): Promise<PutUpListItem> {
  return withTx(q, async (trx) => {
    const before = await getPutUp(teamId, putUpId, trx);
    if (!before) throw notFound("That put-up");
    const values = definedOnly({ ...patch });
    const changes = changedFields(before as unknown as Record<string, unknown>, values);
    if (Object.keys(changes).length > 0) {
      await trx("putUp")
        .where({ id: putUpId })
        .update({ ...values, updatedAt: trx.fn.now() });
      await recordAudit(trx, {
        teamId,
        actorUserId,
        action: "put_up.update",
        entityType: "put_up",
        entityId: putUpId,
        detail: { wireTypeId: before.wireTypeId, changes },
      });
    }
    return (await getPutUp(teamId, putUpId, trx))!;
  });
}

/** Deletes a put-up; spools bought as it keep their record and forget the source. */
export async function deletePutUp(
  teamId: string,
  actorUserId: string,
  putUpId: string,
  q: Db = db(),
): Promise<void> {
  await withTx(q, async (trx) => {
    const before = await getPutUp(teamId, putUpId, trx);
    if (!before) throw notFound("That put-up");
    await trx("putUp").where({ id: putUpId }).delete();
    await recordAudit(trx, {
      teamId,
      actorUserId,
      action: "put_up.delete",
      entityType: "put_up",
      entityId: putUpId,
      detail: {
        wireTypeId: before.wireTypeId,
        nominalLengthMm: before.nominalLengthMm,
        priceCents: before.priceCents,
        currency: before.currency,
        supplierName: before.supplierName,
      },
    });
  });
}
