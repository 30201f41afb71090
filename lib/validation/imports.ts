// Schemas for the import API: the user's edits to the column mapping.
import { z } from "zod";
import { RUN_FIELDS } from "@/lib/domain/run-fields";

const FIELD_KEYS = RUN_FIELDS.map((f) => f.key) as [string, ...string[]];

export const importMappingSchema = z.object({
  columns: z
    .array(
      z.object({
        index: z.number().int().min(0).max(500),
        field: z.enum(FIELD_KEYS).nullable(),
        unit: z.string().max(8).nullable().optional(),
      }),
    )
    .max(500),
});
export type ImportMappingInput = z.infer<typeof importMappingSchema>;
