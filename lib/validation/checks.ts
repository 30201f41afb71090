// Schemas for the checks API.
import { z } from "zod";
import { pagingSchema } from "@/lib/validation/common";

export const checksQuerySchema = pagingSchema(5000, 5000).extend({
  verdict: z.enum(["pass", "warn", "fail"]).optional(),
});
