// Demo stock for Cedar Flats Robotics: a wire type for every wire the Harrow-3 runs use, an invented supplier price
// list, and a shelf of partly used spools and remnants with a little adjustment history. All names are invented.
import type { Knex } from "knex";
import { feetToMm, typicalOuterDiameterMm } from "../../lib/domain/stock";
import { gaugeSortKey, parseGauge } from "../../lib/domain/gauge";
import { insulationKey } from "../../lib/domain/wire-type-match";
import { DEMO_PROJECT_NAME, DEMO_TEAM_NAME, DEMO_USERS } from "./01_demo";

export const DEMO_SUPPLIERS = { northgate: "Northgate Wire Supply", bramble: "Bramble Cable Co." } as const;

const CURRENCY = "USD";
const HOOK_UP_FT = [25, 50, 100, 500, 1000] as const;
const BATTERY_FT = [10, 25, 50] as const;
// Price per foot relative to the shortest put-up: bigger spools cost less per foot (invented price list).
const HOOK_UP_FACTOR: Record<number, number> = { 25: 1, 50: 0.88, 100: 0.76, 500: 0.6, 1000: 0.52 };
const BATTERY_FACTOR: Record<number, number> = { 10: 1, 25: 0.9, 50: 0.82 };
// Bramble sells primary wire on the bigger spools only, a little dearer at 100 ft and cheaper in bulk.
const BRAMBLE_FT = [100, 500, 1000] as const;
const BRAMBLE_FACTOR: Record<number, number> = { 100: 1.04, 500: 0.97, 1000: 0.95 };

/** Invented list price in cents per foot on the shortest put-up, by insulation family and gauge. */
const BASE_CENTS_PER_FT: Record<string, Record<string, number>> = {
  "UL 1007": { "22 AWG": 9, "20 AWG": 11, "18 AWG": 14 },
  "UL 1015": { "16 AWG": 24 },
  "SAE J1128 GXL": { "16 AWG": 21, "12 AWG": 38, "10 AWG": 55, "8 AWG": 88 },
  "SAE J1127 SGX": { "4 AWG": 260 },
};

/**
 * Outer diameters the electrical reference §8 has no row for. SGX 4 AWG is an estimate: the 5.89 mm stranded
 * conductor of NEC Chapter 9 Table 8 plus twice a 1.0 mm wall (the wall from memory). Defaults only.
 */
const ESTIMATED_OD_MM: Record<string, number> = { "SAE J1127 SGX|4 AWG": 7.9 };

const PART_PREFIX: Record<string, string> = {
  "UL 1007": "1007",
  "UL 1015": "1015",
  "SAE J1128 GXL": "GXL",
  "SAE J1127 SGX": "SGX",
};

type ShelfSpool = {
  gauge: string;
  colour: string;
  insulation: string;
  lengthMm: number;
  lot: string;
  location: string;
  /** The put-up it was bought as; null for a remnant whose source is not known. */
  from: { supplier: string; ft: number } | null;
  originNote?: string;
  state?: "open" | "used_up";
  /** Earlier measurements, oldest first: [old, new, reason, days ago]; the last new is the current length. */
  history?: [number, number, string, number][];
};

const NG = DEMO_SUPPLIERS.northgate;
const BC = DEMO_SUPPLIERS.bramble;
const HARROW2 = "Remnant kept from the Harrow-2 prototype harness";

// prettier-ignore
const SHELF: ShelfSpool[] = [
  { gauge: "22 AWG", colour: "BK", insulation: "UL 1007", lengthMm: 18420, lot: "NG-2608-1142", location: "Rack B2", from: { supplier: NG, ft: 100 },
    history: [[19500, 18420, "Re-measured on the bench after the sensor-mast test cuts", 9]] },
  { gauge: "22 AWG", colour: "RD", insulation: "UL 1007", lengthMm: 6150, lot: "NG-2608-1139", location: "Rack B2", from: { supplier: NG, ft: 100 },
    history: [[7000, 6150, "Tape-measured; the label count was off after a re-cut", 4]] },
  { gauge: "22 AWG", colour: "YE", insulation: "UL 1007", lengthMm: 25900, lot: "NG-2609-0217", location: "Rack B2", from: { supplier: NG, ft: 100 } },
  { gauge: "22 AWG", colour: "GN", insulation: "UL 1007", lengthMm: 850, lot: "NG-2603-0871", location: "Remnant bin R1", from: null, originNote: HARROW2 },
  { gauge: "20 AWG", colour: "BK", insulation: "UL 1007", lengthMm: 97500, lot: "NG-2607-3305", location: "Rack B3", from: { supplier: NG, ft: 500 } },
  { gauge: "20 AWG", colour: "OG", insulation: "UL 1007", lengthMm: 0, lot: "NG-2605-0410", location: "Rack B3", from: { supplier: NG, ft: 100 }, state: "used_up",
    history: [[1200, 0, "Last piece was kinked at the spool core; scrapped", 12]] },
  { gauge: "18 AWG", colour: "RD", insulation: "UL 1007", lengthMm: 11000, lot: "NG-2609-0555", location: "Rack B3", from: { supplier: NG, ft: 100 } },
  { gauge: "16 AWG", colour: "RD", insulation: "SAE J1128 GXL", lengthMm: 22300, lot: "NG-2610-1020", location: "Rack B4", from: { supplier: NG, ft: 100 } },
  { gauge: "16 AWG", colour: "BK", insulation: "SAE J1128 GXL", lengthMm: 4100, lot: "NG-2610-1021", location: "Rack B4", from: { supplier: NG, ft: 50 } },
  { gauge: "12 AWG", colour: "BU", insulation: "SAE J1128 GXL", lengthMm: 3200, lot: "NG-2606-0733", location: "Rack B4", from: { supplier: NG, ft: 25 } },
  { gauge: "10 AWG", colour: "RD", insulation: "SAE J1128 GXL", lengthMm: 2350, lot: "BC-25-90412", location: "Remnant bin R1", from: null, originNote: HARROW2 },
  { gauge: "10 AWG", colour: "BK", insulation: "SAE J1128 GXL", lengthMm: 1400, lot: "BC-25-90413", location: "Remnant bin R1", from: null, originNote: HARROW2 },
  { gauge: "4 AWG", colour: "RD", insulation: "SAE J1127 SGX", lengthMm: 1900, lot: "BC-26-11870", location: "Cable rack C1", from: { supplier: BC, ft: 10 } },
  { gauge: "4 AWG", colour: "BK", insulation: "SAE J1127 SGX", lengthMm: 5200, lot: "BC-26-11871", location: "Cable rack C1", from: { supplier: BC, ft: 25 } },
];

function specKey(gauge: string, colour: string, insulation: string | null): string {
  return `${gauge}|${colour}|${insulationKey(insulation)}`;
}

function daysAgo(days: number): Date {
  return new Date(Date.now() - days * 86_400_000);
}

/** Seeds the demo team's stock when that team exists and has no wire types yet; returns whether it seeded. */
export async function seedStockIfEmpty(knex: Knex): Promise<boolean> {
  const team = (await knex("team")
    .select("id")
    .where({ name: DEMO_TEAM_NAME })
    .orderBy("created_at")
    .first()) as { id: string } | undefined;
  if (!team) return false;
  const [{ n }] = (await knex("wire_type").where({ team_id: team.id }).count({ n: "*" })) as [
    { n: string | number },
  ];
  if (Number(n) > 0) return false;
  await seedStock(knex, team.id);
  return true;
}

async function seedStock(knex: Knex, teamId: string): Promise<void> {
  await knex.transaction(async (trx) => {
    const lead = (await trx("app_user").select("id").where({ id: DEMO_USERS[0].id }).first()) as
      { id: string } | undefined;
    const combos = (await trx("run as r")
      .join("project as p", "p.id", "r.project_id")
      .where({ "p.team_id": teamId, "p.name": DEMO_PROJECT_NAME })
      .groupBy("r.gauge", "r.colour", "r.insulation")
      .select("r.gauge", "r.colour", "r.insulation")
      .max({ temp_c: "r.insulation_temp_c" })
      .orderBy(["r.insulation", "r.gauge", "r.colour"])) as {
      gauge: string;
      colour: string;
      insulation: string | null;
      temp_c: number | null;
    }[];

    const wireTypeIds = new Map<string, string>();
    for (const c of combos) {
      const g = parseGauge(c.gauge);
      if (!g.ok) continue;
      const od =
        typicalOuterDiameterMm(c.gauge, c.insulation) ??
        ESTIMATED_OD_MM[`${c.insulation}|${c.gauge}`] ??
        null;
      const [row] = (await trx("wire_type")
        .insert({
          team_id: teamId,
          gauge: c.gauge,
          nominal_area_mm2: gaugeSortKey(g.gauge),
          colour: c.colour,
          insulation: c.insulation,
          conductor_material: "copper",
          tinned: false,
          outer_diameter_mm: od,
          insulation_temp_c: c.temp_c,
          notes: c.insulation === "SAE J1127 SGX" ? "Battery cable" : null,
        })
        .returning("id")) as [{ id: string }];
      wireTypeIds.set(specKey(c.gauge, c.colour, c.insulation), row.id);
    }

    const putUpIds = new Map<string, string>();
    const addPutUp = async (
      wireTypeId: string,
      key: string,
      supplier: string,
      ft: number,
      cents: number,
      part: string,
    ) => {
      const [row] = (await trx("put_up")
        .insert({
          wire_type_id: wireTypeId,
          nominal_length_mm: feetToMm(ft),
          price_cents: cents,
          currency: CURRENCY,
          supplier_name: supplier,
          supplier_part_no: part,
          active: true,
        })
        .returning("id")) as [{ id: string }];
      putUpIds.set(`${key}|${supplier}|${ft}`, row.id);
    };
    for (const c of combos) {
      const key = specKey(c.gauge, c.colour, c.insulation);
      const wireTypeId = wireTypeIds.get(key);
      const base = c.insulation ? BASE_CENTS_PER_FT[c.insulation]?.[c.gauge] : undefined;
      if (!wireTypeId || base === undefined || !c.insulation) continue;
      const prefix = PART_PREFIX[c.insulation] ?? "W";
      const awg = c.gauge.replace(" AWG", "");
      if (c.insulation === "SAE J1127 SGX") {
        for (const ft of BATTERY_FT) {
          const cents = Math.round(base * BATTERY_FACTOR[ft]! * ft);
          await addPutUp(
            wireTypeId,
            key,
            BC,
            ft,
            cents,
            `BC-${prefix}${awg}${c.colour}-${String(ft).padStart(4, "0")}`,
          );
        }
        continue;
      }
      for (const ft of HOOK_UP_FT) {
        const cents = Math.round(base * HOOK_UP_FACTOR[ft]! * ft);
        await addPutUp(wireTypeId, key, NG, ft, cents, `NG-${prefix}-${awg}${c.colour}-${ft}`);
      }
      if (c.insulation === "SAE J1128 GXL") {
        for (const ft of BRAMBLE_FT) {
          const cents = Math.round(base * HOOK_UP_FACTOR[ft]! * BRAMBLE_FACTOR[ft]! * ft);
          await addPutUp(
            wireTypeId,
            key,
            BC,
            ft,
            cents,
            `BC-${prefix}${awg}${c.colour}-${String(ft).padStart(4, "0")}`,
          );
        }
      }
    }

    for (const s of SHELF) {
      const key = specKey(s.gauge, s.colour, s.insulation);
      const wireTypeId = wireTypeIds.get(key);
      if (!wireTypeId) continue; // the run list no longer uses this wire
      const sourcePutUpId = s.from ? (putUpIds.get(`${key}|${s.from.supplier}|${s.from.ft}`) ?? null) : null;
      const history = s.history ?? [];
      const firstDay = Math.max(30, ...history.map((h) => h[3] + 5));
      const initial = s.from ? feetToMm(s.from.ft) : (history[0]?.[0] ?? s.lengthMm);
      const [row] = (await trx("spool")
        .insert({
          team_id: teamId,
          wire_type_id: wireTypeId,
          length_mm: s.lengthMm,
          initial_length_mm: Math.max(initial, s.lengthMm),
          lot: s.lot,
          location: s.location,
          state: s.state ?? "open",
          source_put_up_id: sourcePutUpId,
          origin_note: s.originNote ?? null,
          version: 1 + history.length,
          created_at: daysAgo(firstDay),
          updated_at: daysAgo(history.at(-1)?.[3] ?? firstDay),
        })
        .returning("id")) as [{ id: string }];
      for (const [i, [oldMm, newMm, reason, days]] of history.entries()) {
        const [adj] = (await trx("spool_adjustment")
          .insert({
            spool_id: row.id,
            user_id: lead?.id ?? null,
            old_length_mm: oldMm,
            new_length_mm: newMm,
            reason,
            adjusted_at: daysAgo(days),
          })
          .returning("id")) as [{ id: number }];
        await trx("audit_events").insert({
          team_id: teamId,
          actor_user_id: lead?.id ?? null,
          action: "spool.adjust",
          entity_type: "spool",
          entity_id: row.id,
          detail: JSON.stringify({
            adjustmentId: adj.id,
            oldLengthMm: oldMm,
            newLengthMm: newMm,
            reason,
            version: i + 2,
          }),
          created_at: daysAgo(days),
        });
      }
    }
  });
}
