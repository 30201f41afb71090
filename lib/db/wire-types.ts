// Wire types of a team (gauge + colour + insulation spec), with what the shelf holds of each; always scoped by team.
import type { Knex } from "knex";
import { db, type Db } from "@/lib/db/knex";
import { recordAudit } from "@/lib/db/audit";
import { changedFields, definedOnly, isUniqueViolation, likePattern, withTx } from "@/lib/db/stock-helpers";
import { gaugeSortKey, parseGauge } from "@/lib/domain/gauge";
import type { ConductorMaterial } from "@/lib/domain/stock";
import { conflict, invalid, notFound } from "@/lib/http/errors";
import type { Page } from "@/lib/validation/common";
import type { WireTypeCreateInput, WireTypeListQuery, WireTypePatchInput } from "@/lib/validation/stock";

export interface WireTypeRecord {
  id: string;
  teamId: string;
  /** Canonical label: "18 AWG", "0.75 mm²". */
  gauge: string;
  nominalAreaMm2: number;
  /** IEC 60757 code. */
  colour: string;
  insulation: string | null;
  conductorMaterial: ConductorMaterial;
  tinned: boolean;
  outerDiameterMm: number | null;
  insulationTempC: number | null;
  notes: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface WireTypeListItem extends WireTypeRecord {
  /** Spools on the shelf: open or reserved. */
  shelfSpoolCount: number;
  shelfLengthMm: number;
  /** Of that, open (not reserved by a plan). */
  openLengthMm: number;
  putUpCount: number;
  /** Nominal lengths of the active put-ups, shortest first. */
  activePutUpLengthsMm: number[];
}

const SPEC_INDEX = "wire_type_team_spec_idx";

const COLUMNS = [
  "w.id",
  "w.teamId",
  "w.gauge",
  "w.nominalAreaMm2",
  "w.colour",
  "w.insulation",
  "w.conductorMaterial",
  "w.tinned",
  "w.outerDiameterMm",
  "w.insulationTempC",
  "w.notes",
  "w.createdAt",
  "w.updatedAt",
];

/** Adds the shelf and put-up totals to a query over "wire_type as w". */
function withTotals(q: Db, b: Knex.QueryBuilder = q("wireType as w")): Knex.QueryBuilder {
  return b.select(...COLUMNS).select(
    q.raw(`(select count(*) from spool s where s.wire_type_id = w.id and s.state in ('open','reserved'))::int
               as shelf_spool_count`),
    q.raw(`(select coalesce(sum(s.length_mm), 0) from spool s
                where s.wire_type_id = w.id and s.state in ('open','reserved'))::int as shelf_length_mm`),
    q.raw(`(select coalesce(sum(s.length_mm), 0) from spool s
                where s.wire_type_id = w.id and s.state = 'open')::int as open_length_mm`),
    q.raw(`(select count(*) from put_up p where p.wire_type_id = w.id)::int as put_up_count`),
    q.raw(`coalesce((select array_agg(distinct p.nominal_length_mm order by p.nominal_length_mm) from put_up p
                where p.wire_type_id = w.id and p.active), '{}') as active_put_up_lengths_mm`),
  );
}

function ordered(b: Knex.QueryBuilder): Knex.QueryBuilder {
  return b
    .orderBy("w.nominalAreaMm2", "desc")
    .orderBy("w.colour", "asc")
    .orderByRaw("lower(coalesce(w.insulation, '')) asc");
}

export async function listWireTypes(
  teamId: string,
  query: WireTypeListQuery,
  q: Db = db(),
): Promise<Page<WireTypeListItem>> {
  const base = q("wireType as w")
    .where("w.teamId", teamId)
    .modify((m) => {
      if (query.gauge) m.where("w.gauge", query.gauge);
      if (query.colour) m.where("w.colour", query.colour);
      if (query.q) {
        const like = likePattern(query.q);
        m.where((w) =>
          w.whereILike("w.insulation", like).orWhereILike("w.notes", like).orWhereILike("w.gauge", like),
        );
      }
    });
  const [countRow] = (await base.clone().count({ total: "*" })) as [{ total: number }];
  const items = (await ordered(withTotals(q, base.clone()))
    .limit(query.limit)
    .offset(query.offset)) as WireTypeListItem[];
  return { items, total: Number(countRow.total), limit: query.limit, offset: query.offset };
}

/** Every wire type of the team, without shelf totals (for matching runs and for the planner). */
export async function listAllWireTypes(teamId: string, q: Db = db()): Promise<WireTypeRecord[]> {
  return (await ordered(
    q("wireType as w")
      .select(...COLUMNS)
      .where("w.teamId", teamId),
  )) as WireTypeRecord[];
}

export async function getWireType(
  teamId: string,
  wireTypeId: string,
  q: Db = db(),
): Promise<WireTypeListItem | null> {
  const row = (await withTotals(q).where({ "w.teamId": teamId, "w.id": wireTypeId }).first()) as
    WireTypeListItem | undefined;
  return row ?? null;
}

function areaOf(gauge: string): number {
  const g = parseGauge(gauge);
  if (!g.ok) throw invalid(`gauge: ${g.message}`);
  return gaugeSortKey(g.gauge);
}

async function duplicateError(
  teamId: string,
  spec: { gauge: string; colour: string; insulation: string | null },
) {
  const existing = (await db()("wireType")
    .select("id", "gauge", "colour", "insulation")
    .where({ teamId, gauge: spec.gauge, colour: spec.colour })
    .whereRaw("lower(coalesce(insulation, '')) = lower(?)", [spec.insulation ?? ""])
    .first()) as Pick<WireTypeRecord, "id" | "gauge" | "colour" | "insulation"> | undefined;
  const shown = existing ?? spec;
  const label = `${shown.gauge} ${shown.colour} ${shown.insulation ?? "(insulation not stated)"}`;
  return conflict(`A wire type ${label} already exists in this team.`, { existingId: existing?.id ?? null });
}

export async function createWireType(
  teamId: string,
  actorUserId: string,
  input: WireTypeCreateInput,
  q: Db = db(),
): Promise<WireTypeListItem> {
  try {
    return await withTx(q, async (trx) => {
      const [row] = (await trx("wireType")
        .insert({
          teamId,
          gauge: input.gauge,
          nominalAreaMm2: areaOf(input.gauge),
          colour: input.colour,
          insulation: input.insulation ?? null,
          conductorMaterial: input.conductorMaterial,
          tinned: input.tinned,
          outerDiameterMm: input.outerDiameterMm ?? null,
          insulationTempC: input.insulationTempC ?? null,
          notes: input.notes ?? null,
        })
        .returning("id")) as [{ id: string }];
      await recordAudit(trx, {
        teamId,
        actorUserId,
        action: "wire_type.create",
        entityType: "wire_type",
        entityId: row.id,
        detail: { gauge: input.gauge, colour: input.colour, insulation: input.insulation ?? null },
      });
      return (await getWireType(teamId, row.id, trx))!;
    });
  } catch (e) {
    if (isUniqueViolation(e, SPEC_INDEX))
      throw await duplicateError(teamId, { ...input, insulation: input.insulation ?? null });
    throw e;
  }
}

export async function updateWireType(
  teamId: string,
  actorUserId: string,
  wireTypeId: string,
  patch: WireTypePatchInput,
  q: Db = db(),
): Promise<WireTypeListItem> {
  const seen: { spec?: { gauge: string; colour: string; insulation: string | null } } = {};
  try {
    return await withTx(q, async (trx) => {
      const before = (await trx("wireType")
        .select(...COLUMNS.map((c) => c.slice(2)))
        .where({ teamId, id: wireTypeId })
        .forUpdate()
        .first()) as WireTypeRecord | undefined;
      if (!before) throw notFound("That wire type");
      seen.spec = {
        gauge: patch.gauge ?? before.gauge,
        colour: patch.colour ?? before.colour,
        insulation: patch.insulation !== undefined ? patch.insulation : before.insulation,
      };
      const values = definedOnly({ ...patch });
      const changes = changedFields(before as unknown as Record<string, unknown>, values);
      if (Object.keys(changes).length > 0) {
        await trx("wireType")
          .where({ teamId, id: wireTypeId })
          .update({
            ...values,
            ...(patch.gauge ? { nominalAreaMm2: areaOf(patch.gauge) } : {}),
            updatedAt: trx.fn.now(),
          });
        await recordAudit(trx, {
          teamId,
          actorUserId,
          action: "wire_type.update",
          entityType: "wire_type",
          entityId: wireTypeId,
          detail: { changes },
        });
      }
      return (await getWireType(teamId, wireTypeId, trx))!;
    });
  } catch (e) {
    if (seen.spec && isUniqueViolation(e, SPEC_INDEX)) throw await duplicateError(teamId, seen.spec);
    throw e;
  }
}

/** Deletes a wire type and its put-ups; refused (409) while any spool of it exists, used up or not. */
export async function deleteWireType(
  teamId: string,
  actorUserId: string,
  wireTypeId: string,
  q: Db = db(),
): Promise<void> {
  await withTx(q, async (trx) => {
    const before = (await trx("wireType")
      .select("id", "gauge", "colour", "insulation")
      .where({ teamId, id: wireTypeId })
      .forUpdate()
      .first()) as Pick<WireTypeRecord, "id" | "gauge" | "colour" | "insulation"> | undefined;
    if (!before) throw notFound("That wire type");
    const [{ n }] = (await trx("spool").where({ teamId, wireTypeId }).count({ n: "*" })) as [{ n: number }];
    if (Number(n) > 0) {
      throw conflict(
        `This wire type still has ${n} spool record${Number(n) === 1 ? "" : "s"}; it cannot be deleted.`,
        { spoolCount: Number(n) },
      );
    }
    await trx("wireType").where({ teamId, id: wireTypeId }).delete();
    await recordAudit(trx, {
      teamId,
      actorUserId,
      action: "wire_type.delete",
      entityType: "wire_type",
      entityId: wireTypeId,
      detail: { gauge: before.gauge, colour: before.colour, insulation: before.insulation },
    });
  });
}
