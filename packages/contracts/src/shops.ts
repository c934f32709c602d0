import { z } from "zod";
import { shopNameSchema } from "./auth.js";
import { roleSchema } from "./roles.js";

export const shopIdParamsSchema = z.object({ shopId: z.string().uuid("Unknown shop") });

export const createShopBodySchema = z.object({ name: shopNameSchema });
export type CreateShopBody = z.infer<typeof createShopBodySchema>;

export const shopSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  role: roleSchema,
  createdAt: z.string(),
});
export type Shop = z.infer<typeof shopSchema>;

export const healthSchema = z.object({
  status: z.enum(["ok", "degraded"]),
  database: z.enum(["up", "down"]),
  version: z.string(),
});
export type Health = z.infer<typeof healthSchema>;
