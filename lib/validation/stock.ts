// Schemas for the stock API (wire types, put-ups, shelf spools, length adjustments), shared by forms and handlers.
import { z } from "zod";
import { parseColour } from "@/lib/domain/colour";
import { formatGauge, parseGauge } from "@/lib/domain/gauge";
import { CONDUCTOR_MATERIALS, DEFAULT_CURRENCY, SPOOL_STATES } from "@/lib/domain/stock";
import { pagingSchema, uuidSchema } from "@/lib/validation/common";

/** The longest length a spool or put-up may carry: 5 km, well above a 1000 m reel. */
export const MAX_LENGTH_MM = 5_000_000;
/** The highest price of one put-up: one million in the currency's main unit. */
export const MAX_PRICE_CENTS = 100_000_000;

export const gaugeField = z
  .string({ message: "Give the gauge, e.g. 18 AWG or 0.75 mm²." })
  .trim()
  .max(40)
  .transform((v, ctx) => {
    const p = parseGauge(v);
    if (!p.ok) {
      ctx.addIssue({ code: "custom", message: p.message });
      return z.NEVER;
    }
    return formatGauge(p.gauge);
  });

export const colourField = z
  .string({ message: "Give the colour as an IEC 60757 code, e.g. RD or GNYE." })
  .trim()
  .max(40)
  .transform((v, ctx) => {
    const p = parseColour(v);
    if (!p.ok) {
      ctx.addIssue({ code: "custom", message: p.message });
      return z.NEVER;
    }
    return p.code;
  });

/** Optional free text: trimmed, inner runs of spaces collapsed, empty → null. */
function optionalText(max: number, what: string) {
  return z
    .string()
    .max(max, { message: `${what} is limited to ${max} characters.` })
    .nullable()
    .optional()
    .transform((v) => {
      if (v === undefined) return undefined;
      const t = (v ?? "").trim().replace(/\s+/g, " ");
      return t === "" ? null : t;
    });
}

/** A number from JSON or from a form field ("" means none); undefined means "not given". */
function optionalNumber(schema: z.ZodNumber) {
  return z
    .preprocess(
      (v) => (typeof v === "string" ? (v.trim() === "" ? null : Number(v.trim())) : v),
      schema.nullable(),
    )
    .optional();
}

/** A required number from JSON or a form field; an empty field is missing, never 0. */
function requiredNumber(schema: z.ZodNumber) {
  return z.preprocess(
    (v) => (typeof v === "string" ? (v.trim() === "" ? undefined : Number(v.trim())) : v),
    schema,
  );
}

function wholeMm(what: string, min: number) {
  return requiredNumber(
    z
      .number({ message: `Give ${what} in millimetres.` })
      .int({ message: `Give ${what} as a whole number of millimetres.` })
      .min(min, { message: `${what[0]!.toUpperCase()}${what.slice(1)} must be at least ${min} mm.` })
      .max(MAX_LENGTH_MM, { message: `${what[0]!.toUpperCase()}${what.slice(1)} must be at most 5 km.` }),
  );
}

const insulationField = optionalText(80, "The insulation spec");
const outerDiameterField = optionalNumber(
  z
    .number({ message: "Give the outer diameter in mm." })
    .gt(0, { message: "The outer diameter must be more than 0 mm." })
    .max(60, { message: "The outer diameter must be at most 60 mm." }),
);
const tempField = optionalNumber(
  z
    .number({ message: "Give the temperature rating in °C." })
    .min(-60, { message: "The temperature rating must be at least −60 °C." })
    .max(300, { message: "The temperature rating must be at most 300 °C." }),
);
const notesField = optionalText(2000, "Notes");

const wireTypeFields = {
  gauge: gaugeField,
  colour: colourField,
  insulation: insulationField,
  conductorMaterial: z.enum(CONDUCTOR_MATERIALS, { message: "The conductor is copper or aluminium." }),
  tinned: z.boolean(),
  outerDiameterMm: outerDiameterField,
  insulationTempC: tempField,
  notes: notesField,
};

export const wireTypeCreateSchema = z.object({
  ...wireTypeFields,
  conductorMaterial: wireTypeFields.conductorMaterial.default("copper"),
  tinned: wireTypeFields.tinned.default(false),
});
export type WireTypeCreateInput = z.infer<typeof wireTypeCreateSchema>;

export const wireTypePatchSchema = z
  .object({
    gauge: gaugeField.optional(),
    colour: colourField.optional(),
    insulation: insulationField,
    conductorMaterial: wireTypeFields.conductorMaterial.optional(),
    tinned: wireTypeFields.tinned.optional(),
    outerDiameterMm: outerDiameterField,
    insulationTempC: tempField,
    notes: notesField,
  })
  .refine((o) => Object.values(o).some((v) => v !== undefined), { message: "Nothing to change." });
export type WireTypePatchInput = z.infer<typeof wireTypePatchSchema>;

export const currencyField = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{3}$/, { message: "Give the currency as a three-letter ISO 4217 code, e.g. USD or EUR." });

const putUpFields = {
  nominalLengthMm: wholeMm("the put-up length", 1),
  priceCents: requiredNumber(
    z
      .number({ message: "Give the price in cents." })
      .int({ message: "Give the price as a whole number of cents." })
      .min(0, { message: "The price cannot be negative." })
      .max(MAX_PRICE_CENTS, { message: "The price is too large." }),
  ),
  currency: currencyField,
  supplierName: z
    .string({ message: "Name the supplier." })
    .trim()
    .min(1, { message: "Name the supplier." })
    .max(120, { message: "The supplier name is limited to 120 characters." }),
  supplierPartNo: optionalText(80, "The part number"),
  active: z.boolean(),
};

export const putUpCreateSchema = z.object({
  wireTypeId: uuidSchema,
  ...putUpFields,
  currency: currencyField.default(DEFAULT_CURRENCY),
  active: z.boolean().default(true),
});
export type PutUpCreateInput = z.infer<typeof putUpCreateSchema>;

export const putUpPatchSchema = z
  .object({
    nominalLengthMm: putUpFields.nominalLengthMm.optional(),
    priceCents: putUpFields.priceCents.optional(),
    currency: currencyField.optional(),
    supplierName: putUpFields.supplierName.optional(),
    supplierPartNo: putUpFields.supplierPartNo,
    active: z.boolean().optional(),
  })
  .refine((o) => Object.values(o).some((v) => v !== undefined), { message: "Nothing to change." });
export type PutUpPatchInput = z.infer<typeof putUpPatchSchema>;

const spoolStateField = z.enum(SPOOL_STATES, { message: "The state is open, reserved or used_up." });

export const spoolCreateSchema = z.object({
  wireTypeId: uuidSchema,
  lengthMm: wholeMm("the remaining length", 0),
  /** The length when it came onto the shelf; defaults to the remaining length. */
  initialLengthMm: wholeMm("the starting length", 0).optional(),
  lot: optionalText(80, "The lot"),
  location: optionalText(80, "The location"),
  state: spoolStateField.default("open"),
  sourcePutUpId: uuidSchema.nullable().optional(),
  originNote: optionalText(500, "The origin note"),
});
export type SpoolCreateInput = z.infer<typeof spoolCreateSchema>;

export const versionField = requiredNumber(
  z.number({ message: "Send the spool's version." }).int().min(1, { message: "Send the spool's version." }),
);

export const spoolPatchSchema = z
  .object({
    version: versionField,
    lot: optionalText(80, "The lot"),
    location: optionalText(80, "The location"),
    state: spoolStateField.optional(),
    originNote: optionalText(500, "The origin note"),
  })
  .refine((o) => [o.lot, o.location, o.state, o.originNote].some((v) => v !== undefined), {
    message: "Nothing to change.",
  });
export type SpoolPatchInput = z.infer<typeof spoolPatchSchema>;

export const spoolAdjustmentSchema = z.object({
  lengthMm: wholeMm("the measured length", 0),
  reason: z
    .string({ message: "Say why the length changed." })
    .trim()
    .min(3, { message: "Say why the length changed (at least 3 characters)." })
    .max(500, { message: "The reason is limited to 500 characters." }),
  /** When given, a stale version answers 409 instead of overwriting a newer measurement. */
  version: versionField.optional(),
});
export type SpoolAdjustmentInput = z.infer<typeof spoolAdjustmentSchema>;

const boolQuery = z.enum(["true", "false"]).transform((v) => v === "true");

export const wireTypeListQuerySchema = pagingSchema(500, 100).extend({
  gauge: gaugeField.optional(),
  colour: colourField.optional(),
  q: z.string().trim().max(100).optional(),
});
export type WireTypeListQuery = z.infer<typeof wireTypeListQuerySchema>;

export const putUpListQuerySchema = pagingSchema(1000, 200).extend({
  wireTypeId: uuidSchema.optional(),
  active: boolQuery.optional(),
});
export type PutUpListQuery = z.infer<typeof putUpListQuerySchema>;

export const spoolListQuerySchema = pagingSchema(1000, 200).extend({
  wireTypeId: uuidSchema.optional(),
  state: spoolStateField.optional(),
});
export type SpoolListQuery = z.infer<typeof spoolListQuerySchema>;

export const adjustmentListQuerySchema = pagingSchema(500, 100);
export type AdjustmentListQuery = z.infer<typeof adjustmentListQuerySchema>;

export const unmatchedListQuerySchema = pagingSchema(500, 100);
export type UnmatchedListQuery = z.infer<typeof unmatchedListQuerySchema>;
