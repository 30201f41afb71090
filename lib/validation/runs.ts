// Schemas for the runs API.
import { z } from "zod";
import { BENCH_STATES } from "@/lib/domain/types";
import { pagingSchema } from "@/lib/validation/common";

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
