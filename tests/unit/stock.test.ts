import { describe, expect, it } from "vitest";
import { feetToMm, mmToFeet, pricePerMetreCents, typicalOuterDiameterMm } from "@/lib/domain/stock";
import {
  putUpCreateSchema,
  spoolAdjustmentSchema,
  spoolPatchSchema,
  wireTypeCreateSchema,
  wireTypePatchSchema,
} from "@/lib/validation/stock";

describe("put-up lengths and prices", () => {
  it.each([
    // The international foot is exactly 0.3048 m (1959 international yard and pound agreement).
    [10, 3048],
    [25, 7620],
    [50, 15240],
    [100, 30480],
    [500, 152400],
    [1000, 304800],
  ])("%d ft = %d mm", (ft, mm) => {
    expect(feetToMm(ft)).toBe(mm);
    expect(mmToFeet(mm)).toBeCloseTo(ft, 9);
  });

  it("prices per metre in fractional cents", () => {
    expect(pricePerMetreCents(4680, 304800)).toBeCloseTo(15.354, 3); // $46.80 for 1000 ft
    expect(pricePerMetreCents(100, 1000)).toBe(100);
    expect(() => pricePerMetreCents(100, 0)).toThrow();
  });
});

describe("typical outer diameters (defaults from electrical.md §8)", () => {
  it.each([
    ["22 AWG", "UL 1007", 1.6],
    ["18", "ul1007", 2.1],
    ["16 AWG", "UL 1015", 3.1],
    ["10 AWG", "SAE J1128 GXL", 4.5],
    ["12 AWG", "SAE J1128 TXL", 3.2],
  ])("%s %s → %d mm", (gauge, insulation, od) => {
    expect(typicalOuterDiameterMm(gauge, insulation)).toBe(od);
  });

  it.each([
    ["4 AWG", "SAE J1127 SGX"], // not in the table
    ["14 AWG", "UL 1007"], // the table has no row
    ["0.75 mm²", "UL 1007"], // metric sizes are not tabulated
    ["22 AWG", null],
  ])("%s %j has no default", (gauge, insulation) => {
    expect(typicalOuterDiameterMm(gauge, insulation)).toBeNull();
  });
});

describe("stock schemas", () => {
  it("normalises a wire type and coerces form numbers", () => {
    expect(
      wireTypeCreateSchema.parse({
        gauge: "1/0",
        colour: "red",
        insulation: "  SAE   J1127 SGX ",
        outerDiameterMm: "",
      }),
    ).toEqual({
      gauge: "1/0 AWG",
      colour: "RD",
      insulation: "SAE J1127 SGX",
      conductorMaterial: "copper",
      tinned: false,
      outerDiameterMm: null,
    });
    expect(
      wireTypeCreateSchema.parse({ gauge: "0,75 mm2", colour: "BU", insulationTempC: "90" }),
    ).toMatchObject({
      gauge: "0.75 mm²",
      insulationTempC: 90,
    });
  });

  it("an empty patch is refused; a patch never fills defaults", () => {
    expect(wireTypePatchSchema.safeParse({}).success).toBe(false);
    expect(wireTypePatchSchema.parse({ notes: "x" })).toEqual({ notes: "x" });
    expect(spoolPatchSchema.safeParse({ version: 1 }).success).toBe(false);
  });

  it("a put-up defaults to USD and active; an empty required number is missing, never 0", () => {
    const id = "00000000-0000-4000-8000-000000000000";
    expect(
      putUpCreateSchema.parse({
        wireTypeId: id,
        nominalLengthMm: "30480",
        priceCents: 1999,
        supplierName: "A",
      }),
    ).toMatchObject({ currency: "USD", active: true, nominalLengthMm: 30480 });
    const empty = putUpCreateSchema.safeParse({
      wireTypeId: id,
      nominalLengthMm: "",
      priceCents: 1,
      supplierName: "A",
    });
    expect(empty.success).toBe(false);
    expect(spoolAdjustmentSchema.safeParse({ lengthMm: "", reason: "Measured" }).success).toBe(false);
    expect(spoolAdjustmentSchema.safeParse({ lengthMm: null, reason: "Measured" }).success).toBe(false);
    expect(spoolAdjustmentSchema.parse({ lengthMm: "0", reason: " Measured " })).toEqual({
      lengthMm: 0,
      reason: "Measured",
    });
  });
});
