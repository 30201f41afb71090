// Shelf spools and remnants (measured remaining length, lot, location, state, version) and their length adjustments.
import type { Knex } from "knex";
import { db, type Db } from "@/lib/db/knex";
import { recordAudit } from "@/lib/db/audit";
import { changedFields, definedOnly, withTx } from "@/lib/db/stock-helpers";
import type { SpoolState } from "@/lib/domain/stock";
import { conflict, invalid, notFound } from "@/lib/http/errors";
import type { Page } from "@/lib/validation/common";
import type {
  AdjustmentListQuery,
  SpoolAdjustmentInput,
  SpoolCreateInput,
  SpoolListQuery,
  SpoolPatchInput,
} from "@/lib/validation/stock";

export interface SpoolRecord {
  id: string;
  teamId: string;
  wireTypeId: string;
  /** Measured remaining length. */
  lengthMm: number;
  /** The length when it came onto the shelf (a new spool's nominal length, or a remnant's length). */
  initialLengthMm: number;
  lot: string | null;
  location: string | null;
  state: SpoolState;
  sourcePutUpId: string | null;
  originNote: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface SpoolListItem extends SpoolRecord {
  gauge: string;
  colour: string;
  insulation: string | null;
  sourceSupplierName: string | null;
  sourceNominalLengthMm: number | null;
  adjustmentCount: number;
  lastAdjustedAt: string | null;
}

export interface SpoolAdjustmentRecord {
  id: number;
  spoolId: string;
  userId: string | null;
  userName: string | null;
  oldLengthMm: number;
  newLengthMm: number;
  reason: string;
  adjustedAt: string;
}

const COLUMNS = [
  "s.id",
  "s.teamId",
  "s.wireTypeId",
  "s.lengthMm",
  "s.initialLengthMm",
  "s.lot",
  "s.location",
  "s.state",
  "s.sourcePutUpId",
  "s.originNote",
  "s.version",
  "s.createdAt",
  "s.updatedAt",
];

function withDetails(q: Db, b: Knex.QueryBuilder): Knex.QueryBuilder {
  return b
    .leftJoin("putUp as p", "p.id", "s.sourcePutUpId")
    .select(
      ...COLUMNS,
      "w.gauge",
      "w.colour",
      "w.insulation",
      "p.supplierName as sourceSupplierName",
      "p.nominalLengthMm as sourceNominalLengthMm",
    )
    .select(
      q.raw(`(select count(*) from spool_adjustment a where a.spool_id = s.id)::int as adjustment_count`),
      q.raw(
        `(select max(a.adjusted_at) from spool_adjustment a where a.spool_id = s.id) as last_adjusted_at`,
      ),
    );
}

function scoped(q: Db, teamId: string): Knex.QueryBuilder {
  return q("spool as s").join("wireType as w", "w.id", "s.wireTypeId").where("s.teamId", teamId);
}

export async function listSpools(
  teamId: string,
  query: SpoolListQuery,
  q: Db = db(),
): Promise<Page<SpoolListItem>> {
  const base = scoped(q, teamId).modify((b) => {
    if (query.wireTypeId) b.where("s.wireTypeId", query.wireTypeId);
    if (query.state) b.where("s.state", query.state);
  });
  const [countRow] = (await base.clone().count({ total: "*" })) as [{ total: number }];
  const items = (await withDetails(q, base.clone())
    .orderBy("w.nominalAreaMm2", "desc")
    .orderBy("w.colour", "asc")
    .orderByRaw("lower(coalesce(w.insulation, '')) asc")
    .orderByRaw("case s.state when 'open' then 0 when 'reserved' then 1 else 2 end")
    .orderBy("s.lengthMm", "desc")
    .orderBy("s.id", "asc")
    .limit(query.limit)
    .offset(query.offset)) as SpoolListItem[];
  return { items, total: Number(countRow.total), limit: query.limit, offset: query.offset };
}

export async function getSpool(teamId: string, spoolId: string, q: Db = db()): Promise<SpoolListItem | null> {
  const row = (await withDetails(q, scoped(q, teamId)).where("s.id", spoolId).first()) as
    SpoolListItem | undefined;
  return row ?? null;
}

/** Open spools of some wire types, longest first (what a spool plan may cut from before buying). */
export async function listOpenSpools(
  teamId: string,
  wireTypeIds: readonly string[],
  q: Db = db(),
): Promise<SpoolRecord[]> {
  if (wireTypeIds.length === 0) return [];
  return (await q("spool as s")
    .select(...COLUMNS)
    .where({ "s.teamId": teamId, "s.state": "open" })
    .whereIn("s.wireTypeId", wireTypeIds)
    .where("s.lengthMm", ">", 0)
    .orderBy("s.wireTypeId")
    .orderBy("s.lengthMm", "desc")) as SpoolRecord[];
}

/**
 * Puts a spool on the shelf: a new one bought as a put-up, or a remnant (say where it came from in `originNote`,
 * e.g. "remnant of plan …"). Pass a plan commit's transaction as `q` to write it together with the plan.
 */
export async function createSpool(
  teamId: string,
  actorUserId: string | null,
  input: SpoolCreateInput,
  q: Db = db(),
): Promise<SpoolListItem> {
  return withTx(q, async (trx) => {
    const wt = await trx("wireType").select("id").where({ teamId, id: input.wireTypeId }).first();
    if (!wt) throw invalid("wireTypeId: there is no such wire type in this team.");
    if (input.sourcePutUpId) {
      const pu = await trx("putUp")
        .select("id")
        .where({ id: input.sourcePutUpId, wireTypeId: input.wireTypeId })
        .first();
      if (!pu) throw invalid("sourcePutUpId: that put-up is not one of this wire type's.");
    }
    const [row] = (await trx("spool")
      .insert({
        teamId,
        wireTypeId: input.wireTypeId,
        lengthMm: input.lengthMm,
        initialLengthMm: input.initialLengthMm ?? input.lengthMm,
        lot: input.lot ?? null,
        location: input.location ?? null,
        state: input.state,
        sourcePutUpId: input.sourcePutUpId ?? null,
        originNote: input.originNote ?? null,
      })
      .returning("id")) as [{ id: string }];
    await recordAudit(trx, {
      teamId,
      actorUserId,
      action: "spool.create",
      entityType: "spool",
      entityId: row.id,
      detail: {
        wireTypeId: input.wireTypeId,
        lengthMm: input.lengthMm,
        lot: input.lot ?? null,
        location: input.location ?? null,
        state: input.state,
        originNote: input.originNote ?? null,
      },
    });
    return (await getSpool(teamId, row.id, trx))!;
  });
}

async function lockSpool(trx: Knex.Transaction, teamId: string, spoolId: string): Promise<SpoolRecord> {
  const row = (await trx("spool as s")
    .select(...COLUMNS)
    .where({ "s.teamId": teamId, "s.id": spoolId })
    .forUpdate()
    .first()) as SpoolRecord | undefined;
  if (!row) throw notFound("That spool");
  return row;
}

async function staleError(teamId: string, spoolId: string, trx: Knex.Transaction) {
  const current = await getSpool(teamId, spoolId, trx);
  return conflict("Someone changed this spool since you loaded it. Check the current values and try again.", {
    current,
  });
}

/** Changes lot, location, state or origin note; 409 with the current record when `version` is stale. */
export async function updateSpool(
  teamId: string,
  actorUserId: string | null,
  spoolId: string,
  patch: SpoolPatchInput,
  q: Db = db(),
): Promise<SpoolListItem> {
  return withTx(q, async (trx) => {
    const before = await lockSpool(trx, teamId, spoolId);
    if (before.version !== patch.version) throw await staleError(teamId, spoolId, trx);
    const { version: _v, ...rest } = patch;
    const values = definedOnly(rest);
    const changes = changedFields(before as unknown as Record<string, unknown>, values);
    if (Object.keys(changes).length > 0) {
      await trx("spool")
        .where({ teamId, id: spoolId })
        .update({ ...values, version: before.version + 1, updatedAt: trx.fn.now() });
      await recordAudit(trx, {
        teamId,
        actorUserId,
        action: "spool.update",
        entityType: "spool",
        entityId: spoolId,
        detail: { changes, version: before.version + 1 },
      });
    }
    return (await getSpool(teamId, spoolId, trx))!;
  });
}

/**
 * Records a measured length with who and why, in one transaction with the change. A spool measured at 0 mm is
 * used up; a used-up spool measured above 0 is open again; a reserved spool stays reserved otherwise.
 */
export async function adjustSpoolLength(
  teamId: string,
  actorUserId: string,
  spoolId: string,
  input: SpoolAdjustmentInput,
  q: Db = db(),
): Promise<{ spool: SpoolListItem; adjustment: SpoolAdjustmentRecord }> {
  return withTx(q, async (trx) => {
    const before = await lockSpool(trx, teamId, spoolId);
    if (input.version !== undefined && before.version !== input.version) {
      throw await staleError(teamId, spoolId, trx);
    }
    const state: SpoolState =
      input.lengthMm === 0 ? "used_up" : before.state === "used_up" ? "open" : before.state;
    await trx("spool")
      .where({ teamId, id: spoolId })
      .update({ lengthMm: input.lengthMm, state, version: before.version + 1, updatedAt: trx.fn.now() });
    const [adj] = (await trx("spoolAdjustment")
      .insert({
        spoolId,
        userId: actorUserId,
        oldLengthMm: before.lengthMm,
        newLengthMm: input.lengthMm,
        reason: input.reason,
      })
      .returning("id")) as [{ id: number }];
    await recordAudit(trx, {
      teamId,
      actorUserId,
      action: "spool.adjust",
      entityType: "spool",
      entityId: spoolId,
      detail: {
        adjustmentId: adj.id,
        oldLengthMm: before.lengthMm,
        newLengthMm: input.lengthMm,
        reason: input.reason,
        ...(state !== before.state ? { state: { from: before.state, to: state } } : {}),
        version: before.version + 1,
      },
    });
    const adjustment = (await adjustmentsQuery(trx, teamId, spoolId)
      .where("a.id", adj.id)
      .first()) as SpoolAdjustmentRecord;
    return { spool: (await getSpool(teamId, spoolId, trx))!, adjustment };
  });
}

/**
 * Reserves open spools for a plan, all or none: each must still be open and at the version the plan read.
 * For the plan commit, inside its transaction.
 */
export async function reserveSpools(
  trx: Knex.Transaction,
  teamId: string,
  actorUserId: string | null,
  spools: readonly { id: string; version: number }[],
  detail: Record<string, unknown> = {},
): Promise<void> {
  for (const s of spools) {
    const before = await lockSpool(trx, teamId, s.id);
    if (before.version !== s.version || before.state !== "open") throw await staleError(teamId, s.id, trx);
    await trx("spool")
      .where({ teamId, id: s.id })
      .update({ state: "reserved", version: before.version + 1, updatedAt: trx.fn.now() });
    await recordAudit(trx, {
      teamId,
      actorUserId,
      action: "spool.reserve",
      entityType: "spool",
      entityId: s.id,
      detail: { ...detail, version: before.version + 1 },
    });
  }
}

function adjustmentsQuery(q: Db, teamId: string, spoolId: string): Knex.QueryBuilder {
  return q("spoolAdjustment as a")
    .join("spool as s", "s.id", "a.spoolId")
    .leftJoin("appUser as u", "u.id", "a.userId")
    .where({ "s.teamId": teamId, "a.spoolId": spoolId })
    .select(
      "a.id",
      "a.spoolId",
      "a.userId",
      "u.name as userName",
      "a.oldLengthMm",
      "a.newLengthMm",
      "a.reason",
      "a.adjustedAt",
    );
}

/** A spool's adjustment history, newest first; 404 for a spool of another team. */
export async function listAdjustments(
  teamId: string,
  spoolId: string,
  query: AdjustmentListQuery,
  q: Db = db(),
): Promise<Page<SpoolAdjustmentRecord>> {
  const spool = await q("spool").select("id").where({ teamId, id: spoolId }).first();
  if (!spool) throw notFound("That spool");
  const [countRow] = (await q("spoolAdjustment").where({ spoolId }).count({ total: "*" })) as [
    { total: number },
  ];
  const items = (await adjustmentsQuery(q, teamId, spoolId)
    .orderBy("a.adjustedAt", "desc")
    .orderBy("a.id", "desc")
    .limit(query.limit)
    .offset(query.offset)) as SpoolAdjustmentRecord[];
  return { items, total: Number(countRow.total), limit: query.limit, offset: query.offset };
}
