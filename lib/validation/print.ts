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
