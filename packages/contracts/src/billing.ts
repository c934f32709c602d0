import { z } from "zod";

/** free: 1 paid seat and 1 machine · team: billed per paid seat per month, machines unlimited. */
export const planSchema = z.enum(["free", "team"]);
export type Plan = z.infer<typeof planSchema>;

export const FREE_PLAN_SEATS = 1;
export const FREE_PLAN_MACHINES = 1;
/** Upper bound of seats bought online (larger shops talk to us). */
export const MAX_SEATS = 500;

/** The payment provider's subscription states, plus "none" before the first subscription. */
export const subscriptionStatusSchema = z.enum([
  "none",
  "incomplete",
  "incomplete_expired",
  "trialing",
  "active",
  "past_due",
  "unpaid",
  "canceled",
  "paused",
]);
export type SubscriptionStatus = z.infer<typeof subscriptionStatusSchema>;

export const seatUsageSchema = z.object({
  /** Paid seats taken: owners, tooling managers, programmers and pending invitations for those roles. */
  used: z.number().int().min(0),
  /** Paid seats available: 1 on the free plan, the number bought on the team plan. */
  paid: z.number().int().min(0),
  owners: z.number().int().min(0),
  toolingManagers: z.number().int().min(0),
  programmers: z.number().int().min(0),
  pendingInvitations: z.number().int().min(0),
  /** Free and unlimited. */
  operators: z.number().int().min(0),
});
export type SeatUsage = z.infer<typeof seatUsageSchema>;

/** GET /api/shops/:shopId/plan (any member): what the shop may do right now. */
export const shopPlanSchema = z.object({
  plan: planSchema,
  /** True when a team plan lapsed and the shop holds more than the free plan allows. */
  readOnly: z.boolean(),
  /** Why the shop is read-only, in words; null when it is not. */
  readOnlyReason: z.string().nullable(),
  seats: seatUsageSchema,
  machines: z.object({ used: z.number().int().min(0), limit: z.number().int().min(1).nullable() }),
});
export type ShopPlan = z.infer<typeof shopPlanSchema>;

export const seatPriceSchema = z.object({
  /** Per seat per interval, in the currency's minor unit (cents). */
  unitAmountMinor: z.number().int().min(0),
  /** ISO 4217, lower-case as the provider sends it. */
  currency: z.string(),
  interval: z.enum(["day", "week", "month", "year"]),
});
export type SeatPrice = z.infer<typeof seatPriceSchema>;

/** GET /api/shops/:shopId/billing (owners). */
export const billingStatusSchema = shopPlanSchema.extend({
  subscriptionStatus: subscriptionStatusSchema,
  /** End of the paid period: the next renewal, or the end when cancelling (ISO 8601). */
  currentPeriodEnd: z.string().nullable(),
  cancelAtPeriodEnd: z.boolean(),
  /** The team plan's price per seat; null when the payment provider is not configured or unreachable. */
  seatPrice: seatPriceSchema.nullable(),
  /** Whether payments are configured on this server. */
  billingAvailable: z.boolean(),
});
export type BillingStatus = z.infer<typeof billingStatusSchema>;

const seatsSchema = z
  .number({ error: "Enter a whole number of seats" })
  .int("Enter a whole number of seats")
  .min(1, "At least 1 seat")
  .max(MAX_SEATS, `At most ${MAX_SEATS} seats online; write to us for more`);

/** POST /api/shops/:shopId/billing/checkout: start the team plan with this many seats. */
export const checkoutBodySchema = z.object({ seats: seatsSchema });
export type CheckoutBody = z.infer<typeof checkoutBodySchema>;

/** The payment provider's hosted checkout page to send the owner to. */
export const checkoutStartedSchema = z.object({ url: z.string().url(), sessionId: z.string() });
export type CheckoutStarted = z.infer<typeof checkoutStartedSchema>;

/** POST /api/shops/:shopId/billing/checkout/confirm: after the provider sent the owner back. */
export const confirmCheckoutBodySchema = z.object({
  sessionId: z.string().min(1).max(255).regex(/^[A-Za-z0-9_]+$/, "This is not a checkout id"),
});
export type ConfirmCheckoutBody = z.infer<typeof confirmCheckoutBodySchema>;

/** POST /api/shops/:shopId/billing/seats: the new number of paid seats. */
export const changeSeatsBodySchema = z.object({ seats: seatsSchema });
export type ChangeSeatsBody = z.infer<typeof changeSeatsBodySchema>;
