// Schemas for printing: which runs get markers, and with which template.
import { z } from "zod";
import { BENCH_STATES } from "@/lib/domain/types";

export const markersQuerySchema = z.object({
  /** Comma-separated run ids or wire IDs; absent: every run that passes the filters. */
  runs: z.string().max(200_000).optional(),
  template: z.string().max(60).default("a4-proof-mixed"),
  state: z.enum(BENCH_STATES).optional(),
  gauge: z.string().max(40).optional(),
  colour: z.string().max(12).optional(),
  outlines: z.enum(["0", "1"]).default("0"),
});
export type MarkersQuery = z.infer<typeof markersQuerySchema>;

const mm = (min: number, max: number) => z.coerce.number().min(min).max(max);

/** A team template: every layout field, in mm (printer offset may be negative). */
export const markerTemplateBodySchema = z.object({
  name: z.string().trim().min(1, { message: "Name the template" }).max(80),
  kind: z.enum(["sheet", "continuous"]),
  media: z.enum(["heat-shrink", "flat-label"]),
  pageSize: z.enum(["A4", "Letter", "custom"]),
  pageWidthMm: mm(10, 1000),
  pageHeightMm: mm(5, 2000),
  markerWidthMm: mm(5, 300),
  markerHeightMm: mm(2, 200),
  columns: z.coerce.number().int().min(1).max(50),
  rows: z.coerce.number().int().min(1).max(200),
  pitchXMm: mm(0, 300),
  pitchYMm: mm(0, 200),
  marginLeftMm: mm(0, 200),
  marginTopMm: mm(0, 200),
  insetAlongMm: mm(0, 20),
  insetAcrossMm: mm(0, 20),
  printerOffsetXMm: mm(-10, 10),
  printerOffsetYMm: mm(-10, 10),
  printerDpi: z.coerce.number().int().min(100).max(1200),
  cutMarks: z.boolean(),
});
export type MarkerTemplateBodyInput = z.infer<typeof markerTemplateBodySchema>;

export const markerTemplatePatchSchema = markerTemplateBodySchema.extend({
  version: z.coerce.number().int().min(1),
});

export const pageSizeSchema = z.object({ pageSize: z.enum(["A4", "Letter"]) });
