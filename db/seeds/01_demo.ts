// Demo data: the invented Cedar Flats Robotics team and its Harrow-3 orchard mowing robot (PRODUCT.md §8).
import { randomBytes } from "node:crypto";
import type { Knex } from "knex";
import { hash } from "@node-rs/argon2";
import { traceCodeFromBytes } from "../../lib/domain/trace-code";

export const DEMO_PASSWORD = "harrow-bench-24";
export const DEMO_USERS = [
  { id: "demo-lead-0001", email: "lead@example.test", name: "Mara Quill", role: "lead" },
  { id: "demo-builder-01", email: "builder@example.test", name: "Tobin Ash", role: "builder" },
  { id: "demo-tech-00001", email: "technician@example.test", name: "Ines Farrow", role: "technician" },
] as const;

type T = "ring" | "fork" | "ferrule" | "pin" | "socket" | "spade" | "butt-splice" | "solder" | "lug" | "bare";
// [wireId suffix, endA, endB, termA, termB, circuit, gauge, colour, insulation, tempC, routedMm, currentA, peakA,
//  dropClass, fuseA, returnOf (wire suffix of the + run this one returns), notes]
type Row = [
  string,
  string,
  string,
  T,
  T,
  string,
  string,
  string,
  string,
  number,
  number,
  number | null,
  number | null,
  "critical" | "standard" | "motor",
  number | null,
  string | null,
  string | null,
];

const GXL = "SAE J1128 GXL";
const SGX = "SAE J1127 SGX";
const U1007 = "UL 1007";
const U1015 = "UL 1015";

// prettier-ignore
const RUNS: Row[] = [
  // Battery, main fuse, disconnect and bus bars
  ["001", "BAT1:+", "F1:1", "lug", "lug", "Battery positive to main fuse", "4 AWG", "RD", SGX, 105, 180, 62, 240, "critical", null, null, "Main fuse within 178 mm of the pack terminal"],
  ["002", "F1:2", "SW1:1", "lug", "lug", "Main fuse to disconnect", "4 AWG", "RD", SGX, 105, 320, 62, 240, "critical", 150, null, null],
  ["003", "SW1:2", "PB1:1", "lug", "lug", "Disconnect to positive bus", "4 AWG", "RD", SGX, 105, 410, 62, 240, "critical", 150, null, null],
  ["004", "BAT1:-", "NB1:1", "lug", "lug", "Battery negative to negative bus", "4 AWG", "BK", SGX, 105, 560, 62, 240, "critical", null, "001", null],
  // Drive controllers
  ["005", "PB1:2", "MC1:B+", "ring", "ring", "Left drive controller feed", "10 AWG", "RD", GXL, 125, 640, 22, 60, "motor", 40, null, null],
  ["006", "NB1:2", "MC1:B-", "ring", "ring", "Left drive controller return", "10 AWG", "BK", GXL, 125, 660, 22, 60, "motor", null, "005", null],
  ["007", "PB1:3", "MC2:B+", "ring", "ring", "Right drive controller feed", "10 AWG", "RD", GXL, 125, 1180, 22, 60, "motor", 40, null, null],
  ["008", "NB1:3", "MC2:B-", "ring", "ring", "Right drive controller return", "10 AWG", "BK", GXL, 125, 1200, 22, 60, "motor", null, "007", null],
  ["009", "MC1:M+", "M1:+", "ring", "ring", "Left drive motor +", "10 AWG", "BU", GXL, 125, 520, 22, 60, "motor", null, null, null],
  ["010", "MC1:M-", "M1:-", "ring", "ring", "Left drive motor -", "10 AWG", "BN", GXL, 125, 520, 22, 60, "motor", null, "009", null],
  ["011", "MC2:M+", "M2:+", "ring", "ring", "Right drive motor +", "10 AWG", "BU", GXL, 125, 540, 22, 60, "motor", null, null, null],
  ["012", "MC2:M-", "M2:-", "ring", "ring", "Right drive motor -", "10 AWG", "BN", GXL, 125, 540, 22, 60, "motor", null, "011", null],
  // Mower deck
  ["013", "PB1:4", "MC3:B+", "ring", "ring", "Deck controller feed", "12 AWG", "RD", GXL, 125, 900, 18, 45, "motor", 30, null, null],
  ["014", "NB1:4", "MC3:B-", "ring", "ring", "Deck controller return", "12 AWG", "BK", GXL, 125, 920, 18, 45, "motor", null, "013", null],
  ["015", "MC3:M+", "M3:+", "ring", "ring", "Deck motor +", "12 AWG", "BU", GXL, 125, 1450, 18, 45, "motor", null, null, "Runs under the deck guard; hot space near the motor"],
  ["016", "MC3:M-", "M3:-", "ring", "ring", "Deck motor -", "12 AWG", "BN", GXL, 125, 1450, 18, 45, "motor", null, "015", null],
  // Fuse block and low-power distribution
  ["017", "PB1:5", "FB1:IN", "ring", "ring", "Fuse block feed", "10 AWG", "RD", GXL, 125, 260, 20, null, "critical", 30, null, null],
  ["018", "NB1:5", "GB1:IN", "ring", "ring", "Ground block feed", "10 AWG", "BK", GXL, 125, 270, 20, null, "critical", null, "017", null],
  ["019", "FB1:1", "DC1:VIN+", "ring", "ferrule", "12 V converter input", "16 AWG", "RD", GXL, 125, 380, 6, 9, "critical", 10, null, null],
  ["020", "GB1:1", "DC1:VIN-", "ring", "ferrule", "12 V converter input return", "16 AWG", "BK", GXL, 125, 380, 6, 9, "critical", null, "019", null],
  ["021", "FB1:2", "DC2:VIN+", "ring", "ferrule", "5 V converter input", "18 AWG", "RD", U1007, 80, 390, 2.5, null, "critical", 5, null, null],
  ["022", "GB1:2", "DC2:VIN-", "ring", "ferrule", "5 V converter input return", "18 AWG", "BK", U1007, 80, 390, 2.5, null, "critical", null, "021", null],
  ["023", "FB1:3", "CPU1:PWR+", "ring", "socket", "Compute module power", "16 AWG", "RD", GXL, 125, 720, 4, 7, "critical", 7.5, null, null],
  ["024", "GB1:3", "CPU1:PWR-", "ring", "socket", "Compute module power return", "16 AWG", "BK", GXL, 125, 720, 4, 7, "critical", null, "023", null],
  // Sensor mast (12 V from DC1)
  ["025", "DC1:VOUT+", "TB1:1", "ferrule", "ferrule", "12 V sensor rail", "16 AWG", "OG", GXL, 125, 300, 5, null, "critical", null, null, null],
  ["026", "DC1:VOUT-", "TB1:2", "ferrule", "ferrule", "12 V sensor rail return", "16 AWG", "BK", GXL, 125, 300, 5, null, "critical", null, "025", null],
  ["027", "TB1:3", "LID1:1", "ferrule", "pin", "Lidar power", "22 AWG", "OG", U1007, 80, 2350, 1.6, 2.2, "critical", null, null, "Up the mast; long run on thin wire"],
  ["028", "TB1:4", "LID1:2", "ferrule", "pin", "Lidar power return", "22 AWG", "BK", U1007, 80, 2350, 1.6, 2.2, "critical", null, "027", null],
  ["029", "TB1:5", "CAM1:1", "ferrule", "pin", "Camera power", "20 AWG", "OG", U1007, 80, 2200, 0.6, null, "critical", null, null, null],
  ["030", "TB1:6", "CAM1:2", "ferrule", "pin", "Camera power return", "20 AWG", "BK", U1007, 80, 2200, 0.6, null, "critical", null, "029", null],
  ["031", "TB1:7", "GNSS1:1", "ferrule", "pin", "GNSS receiver power", "22 AWG", "OG", U1007, 80, 2400, 0.3, null, "critical", null, null, null],
  ["032", "TB1:8", "GNSS1:2", "ferrule", "pin", "GNSS receiver power return", "22 AWG", "BK", U1007, 80, 2400, 0.3, null, "critical", null, "031", null],
  ["033", "CPU1:CAN-H", "MC1:CANH", "pin", "pin", "CAN bus high, compute to left controller", "22 AWG", "YE", U1007, 80, 760, 0.05, null, "standard", null, null, "Twist with HR3-034"],
  ["034", "CPU1:CAN-L", "MC1:CANL", "pin", "pin", "CAN bus low, compute to left controller", "22 AWG", "GN", U1007, 80, 760, 0.05, null, "standard", null, null, null],
  ["035", "MC1:CANH2", "MC2:CANH", "pin", "pin", "CAN bus high, left to right controller", "22 AWG", "YE", U1007, 80, 980, 0.05, null, "standard", null, null, null],
  ["036", "MC1:CANL2", "MC2:CANL", "pin", "pin", "CAN bus low, left to right controller", "22 AWG", "GN", U1007, 80, 980, 0.05, null, "standard", null, null, null],
  ["037", "MC2:CANH2", "MC3:CANH", "pin", "pin", "CAN bus high, right to deck controller", "22 AWG", "YE", U1007, 80, 1100, 0.05, null, "standard", null, null, null],
  ["038", "MC2:CANL2", "MC3:CANL", "pin", "pin", "CAN bus low, right to deck controller", "22 AWG", "GN", U1007, 80, 1100, 0.05, null, "standard", null, null, null],
  // E-stop loop
  ["039", "FB1:4", "ES1:11", "ring", "fork", "E-stop loop supply", "18 AWG", "RD", U1007, 80, 850, 0.8, null, "critical", 3, null, null],
  ["040", "ES1:12", "ES2:11", "fork", "fork", "E-stop loop, front to rear button", "18 AWG", "RDWH", U1007, 80, 1650, 0.8, null, "critical", null, null, null],
  ["041", "ES2:12", "K1:A1", "fork", "ferrule", "E-stop loop to safety relay coil", "18 AWG", "RDWH", U1007, 80, 1300, 0.8, null, "critical", null, null, null],
  ["042", "K1:A2", "GB1:4", "ferrule", "ring", "Safety relay coil return", "18 AWG", "BK", U1007, 80, 420, 0.8, null, "critical", null, null, null],
  ["043", "K1:13", "MC1:EN", "ferrule", "pin", "Drive enable, left", "20 AWG", "VT", U1007, 80, 700, 0.1, null, "standard", null, null, null],
  ["044", "K1:23", "MC2:EN", "ferrule", "pin", "Drive enable, right", "20 AWG", "VT", U1007, 80, 1250, 0.1, null, "standard", null, null, null],
  ["045", "K1:33", "MC3:EN", "ferrule", "pin", "Deck enable", "20 AWG", "VT", U1007, 80, 1400, 0.1, null, "standard", null, null, null],
  ["046", "ES1:21", "CPU1:ESTOP", "fork", "pin", "E-stop state to compute", "22 AWG", "VTWH", U1007, 80, 880, 0.01, null, "standard", null, null, null],
  // Status beacon with LED indicators on series resistors
  ["047", "FB1:5", "BCN1:+", "ring", "solder", "Beacon supply", "18 AWG", "RD", U1007, 80, 1900, 0.9, null, "standard", 25, null, "Fuse larger than this wire can carry: check"],
  ["048", "BCN1:-", "GB1:5", "solder", "ring", "Beacon return", "18 AWG", "BK", U1007, 80, 1900, 0.9, null, "standard", null, "047", null],
  ["049", "CPU1:LED1", "DS1:A", "pin", "solder", "Status LED green, via series resistor", "22 AWG", "GN", U1007, 80, 650, 0.02, null, "standard", null, null, null],
  ["050", "CPU1:LED2", "DS2:A", "pin", "solder", "Status LED amber, via series resistor", "22 AWG", "YE", U1007, 80, 650, 0.02, null, "standard", null, null, null],
  ["051", "CPU1:LED3", "DS3:A", "pin", "solder", "Status LED red, via series resistor", "22 AWG", "RD", U1007, 80, 650, 0.02, null, "standard", null, null, null],
  ["052", "DS1:K", "GB1:6", "solder", "ring", "Status LEDs common return", "22 AWG", "BK", U1007, 80, 700, 0.06, null, "standard", null, null, null],
  // Charge port
  ["053", "CP1:+", "F2:1", "lug", "lug", "Charge port positive to charge fuse", "8 AWG", "RD", GXL, 125, 950, 30, null, "critical", null, null, null],
  ["054", "F2:2", "BAT1:+", "lug", "lug", "Charge fuse to battery positive", "8 AWG", "RD", GXL, 125, 160, 30, null, "critical", 40, null, "Charge fuse sits at the pack"],
  ["055", "CP1:-", "BAT1:-", "lug", "lug", "Charge port negative to battery", "8 AWG", "BK", GXL, 125, 1120, 30, null, "critical", null, "053", null],
  ["056", "CP1:PP", "CPU1:CHG", "pin", "pin", "Charger plug-present signal", "22 AWG", "WH", U1007, 80, 1050, 0.01, null, "standard", null, null, null],
  // Mast lights and cooling fan
  ["057", "FB1:6", "FAN1:+", "ring", "socket", "Controller bay fan", "20 AWG", "RD", U1007, 80, 540, 0.35, 1.2, "standard", 2, null, null],
  ["058", "FAN1:-", "GB1:7", "socket", "ring", "Controller bay fan return", "20 AWG", "BK", U1007, 80, 540, 0.35, 1.2, "standard", null, "057", null],
  ["059", "FB1:7", "WL1:+", "ring", "butt-splice", "Work light", "16 AWG", "RD", U1015, 105, 2100, 3.5, null, "standard", 7.5, null, null],
  ["060", "WL1:-", "GB1:8", "butt-splice", "ring", "Work light return", "16 AWG", "BK", U1015, 105, 2100, 3.5, null, "standard", null, "059", null],
  ["061", "BAT1:T", "CPU1:BATT-T", "pin", "pin", "Pack temperature sensor", "22 AWG", "WHBU", U1007, 80, 620, 0.001, null, "standard", null, null, null],
  ["062", "GB1:9", "CHS1:GND", "ring", "ring", "Chassis bond", "10 AWG", "GNYE", GXL, 125, 230, null, null, "standard", null, null, "Bonds the negative bus to the frame"],
];

const STRIP_MM: Record<T, number> = {
  lug: 12,
  ring: 7,
  fork: 7,
  ferrule: 10,
  pin: 4,
  socket: 4,
  spade: 6,
  "butt-splice": 7,
  solder: 5,
  bare: 10,
};

function ledFor(suffix: string): { ledForwardV: number; ledCurrentA: number } | null {
  // Indicator LEDs driven from the 24 V rail by the compute module's open-drain outputs (typical data-sheet values).
  if (suffix === "049") return { ledForwardV: 2.1, ledCurrentA: 0.02 };
  if (suffix === "050") return { ledForwardV: 2.0, ledCurrentA: 0.02 };
  if (suffix === "051") return { ledForwardV: 1.9, ledCurrentA: 0.02 };
  return null;
}

export const DEMO_TEAM_NAME = "Cedar Flats Robotics";
export const DEMO_PROJECT_NAME = "Harrow-3";

export async function seedIfEmpty(knex: Knex): Promise<boolean> {
  const [{ count }] = (await knex("app_user").count({ count: "*" })) as [{ count: string | number }];
  if (Number(count) > 0) return false;
  await seed(knex);
  return true;
}

export async function seed(knex: Knex): Promise<void> {
  const passwordHash = await hash(DEMO_PASSWORD, { memoryCost: 19456, timeCost: 2, parallelism: 1 });
  await knex.transaction(async (trx) => {
    const [team] = (await trx("team").insert({ name: DEMO_TEAM_NAME }).returning("id")) as [{ id: string }];
    for (const u of DEMO_USERS) {
      await trx("app_user").insert({ id: u.id, email: u.email, name: u.name, password_hash: passwordHash });
      await trx("membership").insert({ team_id: team.id, user_id: u.id, role: u.role });
    }
    const [project] = (await trx("project")
      .insert({
        team_id: team.id,
        name: DEMO_PROJECT_NAME,
        wire_id_prefix: "HR3-",
        supply_v: 24,
        conductor_temp_c: 60,
        gauge_system: "awg",
      })
      .returning("id")) as [{ id: string }];
    // A row names the feed it returns; both runs of a pair point at each other as their return path.
    const pairOf = new Map<string, string>();
    for (const r of RUNS) {
      if (r[15]) {
        pairOf.set(r[0], r[15]);
        pairOf.set(r[15], r[0]);
      }
    }
    const rows = RUNS.map((r) => {
      const [suffix, endA, endB, termA, termB, circuit, gauge, colour, insulation, tempC, routed, currentA] =
        r;
      const [, , , , , , , , , , , , peakA, dropClass, fuseA, , notes] = r;
      const returnOf = pairOf.get(suffix) ?? null;
      const led = ledFor(suffix);
      return {
        project_id: project.id,
        wire_id: `HR3-${suffix}`,
        end_a: endA,
        end_b: endB,
        end_a_termination: termA,
        end_b_termination: termB,
        end_a_strip_mm: STRIP_MM[termA],
        end_b_strip_mm: STRIP_MM[termB],
        circuit,
        gauge,
        colour,
        insulation,
        insulation_temp_c: tempC,
        bundle_size: gauge === "22 AWG" || gauge === "20 AWG" ? 8 : null,
        hot_space: suffix === "015" || suffix === "016",
        routed_length_mm: routed,
        current_a: currentA,
        peak_current_a: peakA,
        supply_v: suffix >= "025" && suffix <= "032" ? 12 : 24,
        drop_class: dropClass,
        fuse_a: fuseA,
        return_kind: returnOf ? "run" : "same",
        return_run_wire_id: returnOf ? `HR3-${returnOf}` : null,
        led_forward_v: led?.ledForwardV ?? null,
        led_current_a: led?.ledCurrentA ?? null,
        notes,
        trace_code: traceCodeFromBytes(randomBytes(5)),
      };
    });
    await trx("run").insert(rows);
  });
}
