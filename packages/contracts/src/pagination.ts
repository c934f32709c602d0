import { z } from "zod";

export const paginationQuerySchema = z.object({
  page: z.coerce.number<string>().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number<string>().int().min(1).max(200).default(25),
});
export type PaginationQuery = z.infer<typeof paginationQuerySchema>;

/** Wraps an item schema in the list envelope every list route returns. */
export function pageOf<T extends z.ZodType>(item: T) {
  return z.object({
    items: z.array(item),
    page: z.number().int().min(1),
    pageSize: z.number().int().min(1),
    total: z.number().int().min(0),
  });
}
