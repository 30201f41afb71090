// Schemas for projects and their settings (defaults are common practice and shown in the settings form).
import { z } from "zod";
import { DROP_CLASSES, GAUGE_SYSTEMS } from "@/lib/domain/types";

const settingsShape = {
  wireIdPrefix: z
    .string()
    .trim()
    .max(12)
    .regex(/^[A-Za-z0-9._\-/]*$/, { message: "Use letters, digits and . _ - / in the prefix" }),
  supplyV: z.coerce
    .number()
    .min(0.1)
    .max(60, { message: "Loomwright checks low-voltage DC systems up to 60 V" }),
  conductorTempC: z.coerce.number().min(-40).max(200),
  gaugeSystem: z.enum(GAUGE_SYSTEMS),
  slackPct: z.coerce.number().min(0).max(50),
  slackMinMm: z.coerce.number().int().min(0).max(2000),
  serviceLoopMm: z.coerce.number().int().min(0).max(2000),
  roundingMm: z.coerce.number().int().min(1).max(1000),
  endDiscardMm: z.coerce.number().int().min(0).max(5000),
  keepRemnantMm: z.coerce.number().int().min(0).max(100_000),
  markerRepeatMm: z.coerce.number().int().min(100).max(10_000).nullable(),
  defaultDropClass: z.enum(DROP_CLASSES),
};

export const projectCreateSchema = z
  .object({ name: z.string().trim().min(1, { message: "Name the project" }).max(100) })
  .extend(z.object(settingsShape).partial().shape);
export type ProjectCreateInput = z.infer<typeof projectCreateSchema>;

export const projectPatchSchema = z
  .object({
    version: z.coerce.number().int().min(1),
    name: z.string().trim().min(1).max(100).optional(),
    archived: z.boolean().optional(),
  })
  .extend(z.object(settingsShape).partial().shape);
export type ProjectPatchInput = z.infer<typeof projectPatchSchema>;
