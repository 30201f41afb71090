// Schemas for the runs API: list queries, creating runs, and versioned edits.
import { z } from "zod";
import { BENCH_STATES, DROP_CLASSES, RETURN_KINDS, TERMINATIONS } from "@/lib/domain/types";
import { normaliseGauge } from "@/lib/domain/gauge";
import { normaliseColour } from "@/lib/domain/colour";
import { pagingSchema } from "@/lib/validation/common";
import { TEST_KINDS } from "@/lib/domain/bench-state";

export const RUN_SORT_FIELDS = [
  "wireId",
  "endA",
  "endB",
  "circuit",
  "gauge",
  "colour",
  "routedLengthMm",
  "currentA",
  "state",
  "updatedAt",
] as const;

export const runListQuerySchema = pagingSchema(1000, 200).extend({
  sort: z.enum(RUN_SORT_FIELDS).default("wireId"),
  dir: z.enum(["asc", "desc"]).default("asc"),
  gauge: z.string().trim().max(40).optional(),
  colour: z.string().trim().max(12).optional(),
  state: z.enum(BENCH_STATES).optional(),
  q: z.string().trim().max(100).optional(),
});
export type RunListQuery = z.infer<typeof runListQuerySchema>;

const optText = (max: number) =>
  z
    .string()
    .trim()
    .max(max)
    .nullish()
    .transform((v) => (v ? v : null));
const optNumber = (min: number, max: number, what: string) =>
  z.coerce
    .number({ message: `${what} must be a number` })
    .min(min, { message: `${what} must be at least ${min}` })
    .max(max, { message: `${what} must be at most ${max}` })
    .nullish()
    .transform((v) => v ?? null);
const optInt = (min: number, max: number, what: string) =>
  z.coerce
    .number({ message: `${what} must be a whole number` })
    .int({ message: `${what} must be a whole number` })
    .min(min, { message: `${what} must be at least ${min}` })
    .max(max, { message: `${what} must be at most ${max}` })
    .nullish()
    .transform((v) => v ?? null);

export const wireIdSchema = z
  .string()
  .trim()
  .min(1)
  .max(40)
  .regex(/^[A-Za-z0-9][A-Za-z0-9._\-/+#]*$/, {
    message: "A wire ID uses letters, digits and . _ - / + # (e.g. HR3-041)",
  });

const referenceSchema = z.string().trim().min(1, { message: "Give the end's reference, e.g. MC1:3" }).max(60);

export const gaugeSchema = z
  .string()
  .trim()
  .transform((v, ctx) => {
    const g = normaliseGauge(v);
    if (!g) {
      ctx.addIssue({
        code: "custom",
        message: `"${v}" is not a wire size such as "18 AWG", "1/0 AWG" or "0.75 mm²"`,
      });
      return z.NEVER;
    }
    return g;
  });

export const colourSchema = z
  .string()
  .trim()
  .transform((v, ctx) => {
    const c = normaliseColour(v);
    if (!c) {
      ctx.addIssue({
        code: "custom",
        message: `"${v}" is not an IEC 60757 colour code such as RD, GNYE or RDBU`,
      });
      return z.NEVER;
    }
    return c;
  });

/** Every editable field of a run with its limits (lengths in mm, currents in A, voltages in V). */
export const runFieldsShape = {
  endA: referenceSchema,
  endB: referenceSchema,
  endATermination: z
    .enum(TERMINATIONS)
    .nullish()
    .transform((v) => v ?? null),
  endBTermination: z
    .enum(TERMINATIONS)
    .nullish()
    .transform((v) => v ?? null),
  endAStripMm: optInt(0, 100, "Strip length"),
  endBStripMm: optInt(0, 100, "Strip length"),
  circuit: optText(200),
  gauge: gaugeSchema,
  colour: colourSchema,
  insulation: optText(60),
  insulationTempC: optNumber(40, 260, "Insulation temperature rating"),
  bundleSize: optInt(1, 500, "Bundle size"),
  hotSpace: z.boolean(),
  routedLengthMm: z.coerce
    .number({ message: "Routed length must be a number of millimetres" })
    .int({ message: "Routed length is a whole number of millimetres" })
    .min(1, { message: "Routed length must be more than 0 mm" })
    .max(100_000, { message: "Routed length must be at most 100 m" }),
  currentA: optNumber(0, 2000, "Current"),
  peakCurrentA: optNumber(0, 10_000, "Peak current"),
  supplyV: optNumber(0.1, 60, "Supply voltage (low-voltage DC, up to 60 V)"),
  dropClass: z.enum(DROP_CLASSES),
  dropLimitPct: optNumber(0.1, 50, "Drop limit"),
  fuseA: optNumber(0.05, 2000, "Fuse rating"),
  returnKind: z.enum(RETURN_KINDS),
  returnRunWireId: wireIdSchema.nullish().transform((v) => v ?? null),
  returnResistanceOhm: optNumber(0, 100, "Return resistance"),
  ledForwardV: optNumber(0.5, 60, "LED forward voltage"),
  ledCurrentA: optNumber(0.0001, 2, "LED current"),
  notes: optText(2000),
};

const runFieldsObject = z.object(runFieldsShape);

/** Rules across fields; checked on a new run, and on an edited run after it is merged with the stored one. */
export function runRuleIssues(v: {
  dropClass?: string;
  dropLimitPct?: number | null;
  returnKind?: string;
  returnRunWireId?: string | null;
}): { path: string; message: string }[] {
  const issues: { path: string; message: string }[] = [];
  if (v.dropClass === "custom" && (v.dropLimitPct === null || v.dropLimitPct === undefined)) {
    issues.push({ path: "dropLimitPct", message: "A custom drop class needs a drop limit in %" });
  }
  if (v.returnKind === "run" && !v.returnRunWireId) {
    issues.push({ path: "returnRunWireId", message: "Name the run that carries the return" });
  }
  return issues;
}

function checkRunRules(v: Parameters<typeof runRuleIssues>[0], ctx: z.RefinementCtx) {
  for (const i of runRuleIssues(v)) ctx.addIssue({ code: "custom", path: [i.path], message: i.message });
}

export const runCreateSchema = runFieldsObject
  .extend({
    hotSpace: z.boolean().default(false),
    // Absent: the project's default drop class.
    dropClass: z.enum(DROP_CLASSES).optional(),
    returnKind: z.enum(RETURN_KINDS).default("same"),
    wireId: z
      .string()
      .trim()
      .max(40)
      .nullish()
      .transform((v) => (v ? v : null))
      .pipe(wireIdSchema.nullable()),
  })
  .superRefine(checkRunRules);
export type RunCreateInput = z.infer<typeof runCreateSchema>;

/** The body of POST …/runs: one run, or `{ runs: [...] }`; error paths name the field (`runs.3.gauge`). */
export const runCreateBodySchema = z.unknown().transform((body, ctx) => {
  const many = typeof body === "object" && body !== null && "runs" in body;
  const r = many
    ? z.object({ runs: z.array(runCreateSchema).min(1).max(5000) }).safeParse(body)
    : runCreateSchema.safeParse(body);
  if (!r.success) {
    for (const i of r.error.issues) ctx.addIssue({ code: "custom", path: i.path, message: i.message });
    return z.NEVER;
  }
  return { many, runs: "runs" in r.data ? r.data.runs : [r.data] };
});

/**
 * Edits: any subset of the fields, with the version the edit was made from (absent fields stay as they are).
 * Setting `tested` (pass) or `failed` records a test: `testKind`, and `testValue` in Ω (continuity) or MΩ
 * (insulation); `note` goes with a state change into the audit trail (and onto the test result).
 */
export const runPatchSchema = runFieldsObject.partial().extend({
  version: z.coerce.number().int().min(1),
  wireId: wireIdSchema.optional(),
  state: z.enum(BENCH_STATES).optional(),
  // Bench records sent with a state change: the spool a cut came from, and a client-made id against replays.
  spoolId: z.uuid({ message: "Not a valid id." }).optional(),
  actionId: z.uuid({ message: "Not a valid id." }).optional(),
  testKind: z.enum(TEST_KINDS, { message: "A test is continuity or insulation" }).optional(),
  testValue: optNumber(0, 1_000_000, "Test value").optional(),
  note: optText(500).optional(),
});
export type RunPatchInput = z.infer<typeof runPatchSchema>;

/** Bulk edit of selected runs: every run with the version it was seen at, and the same changes for all. */
export const runBulkPatchSchema = z.object({
  items: z
    .array(z.object({ id: z.uuid(), version: z.coerce.number().int().min(1) }))
    .min(1)
    .max(5000),
  changes: z
    .object({
      gauge: gaugeSchema.optional(),
      colour: colourSchema.optional(),
      insulation: optText(60).optional(),
      state: z.enum(BENCH_STATES).optional(),
    })
    .refine((c) => Object.keys(c).length > 0, { message: "Choose at least one field to change" }),
});
export type RunBulkPatchInput = z.infer<typeof runBulkPatchSchema>;
