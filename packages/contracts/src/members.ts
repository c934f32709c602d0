import { z } from "zod";
import { shopNameSchema } from "./auth.js";
import { pageOf } from "./pagination.js";
import { roleSchema } from "./roles.js";

/** PATCH /api/shops/:shopId (owner only). */
export const updateShopBodySchema = z.object({ name: shopNameSchema });
export type UpdateShopBody = z.infer<typeof updateShopBodySchema>;

/** One person in a shop, as GET /api/shops/:shopId/members lists them. */
export const memberSchema = z.object({
  userId: z.string().uuid(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
});
export type Member = z.infer<typeof memberSchema>;

export const memberPageSchema = pageOf(memberSchema);
export type MemberPage = z.infer<typeof memberPageSchema>;
