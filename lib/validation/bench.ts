// Schemas for bench actions: opening a plan's new put-up as a shelf spool.
import { z } from "zod";
import { uuidSchema } from "@/lib/validation/common";

export const planSpoolOpenSchema = z.object({
  wireTypeId: uuidSchema,
  lot: z
    .string({ message: "Give the lot printed on the spool." })
    .trim()
    .min(1, { message: "Give the lot printed on the spool." })
    .max(80, { message: "The lot is limited to 80 characters." }),
  location: z
    .string()
    .trim()
    .max(80, { message: "The location is limited to 80 characters." })
    .nullish()
    .transform((v) => (v ? v : null)),
});
export type PlanSpoolOpenInput = z.infer<typeof planSpoolOpenSchema>;
