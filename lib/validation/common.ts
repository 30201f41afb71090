// Shared schema pieces: paging and ids.
import { z } from "zod";

export const uuidSchema = z.uuid({ message: "Not a valid id." });

export function pagingSchema(maxLimit: number, defaultLimit = 100) {
  return z.object({
    limit: z.coerce.number().int().min(1).max(maxLimit).default(defaultLimit),
    offset: z.coerce.number().int().min(0).default(0),
  });
}

export interface Page<T> {
  items: T[];
  total: number;
  limit: number;
  offset: number;
}
