import { z } from "zod";
import { roleSchema } from "./roles.js";

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .min(3, "Enter an e-mail address")
  .max(254, "E-mail addresses are at most 254 characters")
  .pipe(z.email("Enter a valid e-mail address"));

export const passwordSchema = z
  .string()
  .min(10, "Use at least 10 characters")
  .max(200, "Use at most 200 characters");

export const personNameSchema = z.string().trim().min(1, "Enter your name").max(120, "Use at most 120 characters");
export const shopNameSchema = z.string().trim().min(2, "Enter the shop's name").max(120, "Use at most 120 characters");

export const signupBodySchema = z.object({
  email: emailSchema,
  password: passwordSchema,
  name: personNameSchema,
  shopName: shopNameSchema,
});
export type SignupBody = z.infer<typeof signupBodySchema>;

export const loginBodySchema = z.object({
  email: emailSchema,
  password: z.string().min(1, "Enter your password").max(200, "Use at most 200 characters"),
});
export type LoginBody = z.infer<typeof loginBodySchema>;

export const unitSystemSchema = z.enum(["metric", "imperial"]);
export type UnitSystem = z.infer<typeof unitSystemSchema>;

export const userSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  name: z.string(),
  unitSystem: unitSystemSchema,
});
export type User = z.infer<typeof userSchema>;

export const membershipSchema = z.object({
  shopId: z.string().uuid(),
  shopName: z.string(),
  role: roleSchema,
});
export type Membership = z.infer<typeof membershipSchema>;

export const meSchema = z.object({
  user: userSchema,
  memberships: z.array(membershipSchema),
  activeShopId: z.string().uuid().nullable(),
});
export type Me = z.infer<typeof meSchema>;

export const updateMeBodySchema = z
  .object({
    name: personNameSchema.optional(),
    unitSystem: unitSystemSchema.optional(),
    activeShopId: z.string().uuid().optional(),
  })
  .refine((b) => Object.keys(b).length > 0, { message: "Send at least one field to change" });
export type UpdateMeBody = z.infer<typeof updateMeBodySchema>;
