import type Stripe from "stripe";
import {
  MAX_SEATS,
  type BillingStatus,
  type CheckoutStarted,
  type Role,
  type ShopPlan,
} from "@ringdown/contracts";
import type { AppConfig } from "../../config/env.js";
import { inTransaction, type Tx } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import {
  countUsage,
  findShopIdByCustomer,
  findShopIdBySubscription,
  findSubscription,
  lockShop,
  recordEvent,
  saveSubscription,
  setEventShop,
  shopName,
} from "./billing.repository.js";
import { paymentProvider, type ProviderSubscription } from "./payment-provider.js";
import { recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { paymentProviderActor } from "../audit/audit-actor.js";
import { PAID_STATUSES, computePlan, isTeamPlan, machineLimitMessage, seatLimitMessage } from "./plan.js";

/** The shop's plan and usage right now (inside `tx` when given, e.g. after `lockShop`). */
export async function getPlan(shopId: string, tx?: Tx): Promise<ShopPlan> {
  const [sub, usage] = await Promise.all([findSubscription(shopId, tx), countUsage(shopId, tx)]);
  return computePlan(sub, usage);
}

/**
 * Refuses one more paid seat (an invitation, a role change, an acceptance) when every paid seat
 * is taken. Call inside a transaction that holds `lockShop(shopId)`, so two owners inviting at
 * once cannot both take the last seat. `alreadyCounted` seats of the change are in `used` already
 * (a pending invitation being accepted).
 */
export async function assertSeatAvailable(shopId: string, tx: Tx, alreadyCounted = 0): Promise<void> {
  const plan = await getPlan(shopId, tx);
  if (plan.seats.used - alreadyCounted + 1 > plan.seats.paid) throw AppError.conflict(seatLimitMessage(plan));
}

/**
 * For the machines module: refuses a new machine when the shop's plan allows no more (the free
 * plan allows 1). Call before creating the machine, inside its transaction when there is one.
 */
export async function assertCanAddMachine(shopId: string, tx?: Tx): Promise<void> {
  const plan = await getPlan(shopId, tx);
  if (plan.machines.limit !== null && plan.machines.used >= plan.machines.limit) throw AppError.conflict(machineLimitMessage());
}

/** Whether `role` may change anything in the shop now (owners always may). */
export async function readOnlyReasonFor(shopId: string, role: Role): Promise<string | null> {
  if (role === "owner") return null;
  const plan = await getPlan(shopId);
  return plan.readOnly ? plan.readOnlyReason : null;
}

export async function getBillingStatus(shopId: string, config: AppConfig): Promise<BillingStatus> {
  const [plan, sub] = await Promise.all([getPlan(shopId), findSubscription(shopId)]);
  let seatPrice: BillingStatus["seatPrice"] = null;
  if (config.billing.enabled) {
    try {
      const { id: _id, ...price } = await paymentProvider(config.billing).seatPrice();
      seatPrice = price;
    } catch {
      // The page still shows the plan; it says the price is unavailable.
    }
  }
  return {
    ...plan,
    subscriptionStatus: sub?.status ?? "none",
    currentPeriodEnd: sub?.currentPeriodEnd?.toISOString() ?? null,
    cancelAtPeriodEnd: sub?.cancelAtPeriodEnd ?? false,
    seatPrice,
    billingAvailable: config.billing.enabled,
  };
}

/** Who the audit log names for a plan the demo set-up grants. */
const planGrantActor: AuditActor = { userId: null, name: "Invoiced plan set-up", ip: null };

/**
 * Stores the provider's view of a subscription as the shop's plan state, and records in the audit
 * log what changed for the shop (status, seats, cancellation at the period's end), naming `actor`.
 */
async function syncSubscription(shopId: string, sub: ProviderSubscription, tx: Tx, actor: AuditActor): Promise<void> {
  const current = await findSubscription(shopId, tx);
  // An old subscription's news must not replace the paid one the shop moved on to.
  if (
    current?.providerSubscriptionId &&
    current.providerSubscriptionId !== sub.id &&
    PAID_STATUSES.includes(current.status) &&
    !PAID_STATUSES.includes(sub.status)
  ) {
    return;
  }
  const before = { status: current?.status ?? "none", seats: current?.seats ?? 0, cancelAtPeriodEnd: current?.cancelAtPeriodEnd ?? false };
  const after = { status: sub.status, seats: sub.seats, cancelAtPeriodEnd: sub.cancelAtPeriodEnd };
  await saveSubscription(
    shopId,
    {
      providerCustomerId: sub.customerId,
      providerSubscriptionId: sub.id,
      providerSubscriptionItemId: sub.itemId,
      status: sub.status,
      seats: sub.seats,
      currentPeriodEnd: sub.currentPeriodEnd,
      cancelAtPeriodEnd: sub.cancelAtPeriodEnd,
    },
    tx,
  );
  if (JSON.stringify(before) !== JSON.stringify(after)) {
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "billing.plan_changed",
      subject: { type: "subscription", id: sub.id, label: "Team plan" },
      detail: { before, after },
    });
  }
}

export async function startCheckout(
  shopId: string,
  owner: { name: string; email: string; actor: AuditActor },
  seats: number,
  config: AppConfig,
): Promise<CheckoutStarted> {
  const provider = paymentProvider(config.billing);
  return inTransaction(async (tx) => {
    if (!(await lockShop(shopId, tx))) throw AppError.notFound("Shop not found.");
    const [sub, plan] = await Promise.all([findSubscription(shopId, tx), getPlan(shopId, tx)]);
    if (isTeamPlan(sub)) {
      throw AppError.conflict("This shop is already on the team plan. Change the number of seats instead.");
    }
    if (seats < plan.seats.used) {
      throw new AppError(
        "validation_failed",
        `This shop already uses ${plan.seats.used} paid seats (people and pending invitations); buy at least that many.`,
        { fields: { seats: `At least ${plan.seats.used}` } },
      );
    }
    let customerId = sub?.providerCustomerId ?? null;
    if (!customerId) {
      customerId = await provider.createCustomer({ shopId, name: (await shopName(shopId)) ?? "Ringdown shop", email: owner.email });
      await saveSubscription(shopId, { providerCustomerId: customerId }, tx);
    }
    const base = `${config.appOrigin}/billing`;
    const session = await provider.createCheckout({
      shopId,
      customerId,
      seats,
      successUrl: `${base}?checkout=done&session_id={CHECKOUT_SESSION_ID}`,
      cancelUrl: `${base}?checkout=cancelled`,
    });
    await recordAuditEvent(tx, {
      shopId,
      actor: owner.actor,
      action: "billing.checkout_started",
      subject: { type: "subscription", id: null, label: "Team plan" },
      detail: { seats },
    });
    return { url: session.url, sessionId: session.id };
  });
}

/**
 * After the provider sent the owner back: reads the checkout and its subscription from the
 * provider, so the plan is right even before (or without) the webhook.
 */
export async function confirmCheckout(shopId: string, sessionId: string, config: AppConfig, actor: AuditActor): Promise<BillingStatus> {
  const provider = paymentProvider(config.billing);
  const checkout = await provider.retrieveCheckout(sessionId);
  if (checkout.shopId !== shopId) throw AppError.notFound("No checkout of this shop has that id.");
  if (checkout.status !== "complete" || !checkout.subscriptionId) {
    throw AppError.conflict("This checkout was not completed, so the plan is unchanged.");
  }
  const sub = await provider.retrieveSubscription(checkout.subscriptionId);
  await inTransaction((tx) => syncSubscription(shopId, sub, tx, actor));
  return getBillingStatus(shopId, config);
}

async function requireTeamSubscription(shopId: string) {
  const sub = await findSubscription(shopId);
  if (!sub || !isTeamPlan(sub) || !sub.providerSubscriptionId) {
    throw AppError.conflict("This shop is not on a paid team plan. Upgrade to the team plan first.");
  }
  return { ...sub, providerSubscriptionId: sub.providerSubscriptionId };
}

export async function changeSeats(shopId: string, seats: number, config: AppConfig, actor: AuditActor): Promise<BillingStatus> {
  const provider = paymentProvider(config.billing);
  await inTransaction(async (tx) => {
    await lockShop(shopId, tx);
    const sub = await requireTeamSubscription(shopId);
    const plan = await getPlan(shopId, tx);
    if (seats < plan.seats.used) {
      throw new AppError(
        "conflict",
        `${plan.seats.used} paid seats are in use (people and pending invitations). Remove people, change them to operators or revoke invitations before going below that.`,
        { fields: { seats: `At least ${plan.seats.used}` } },
      );
    }
    if (seats > MAX_SEATS) throw AppError.validation(`At most ${MAX_SEATS} seats online.`, { seats: `At most ${MAX_SEATS}` });
    if (!sub.providerSubscriptionItemId) throw new AppError("service_unavailable", "The subscription has no seat item at the provider.");
    if (seats === sub.seats) return;
    const updated = await provider.changeSeats(sub.providerSubscriptionId, sub.providerSubscriptionItemId, seats);
    await syncSubscription(shopId, updated, tx, actor);
  });
  return getBillingStatus(shopId, config);
}

export async function setCancelAtPeriodEnd(shopId: string, cancel: boolean, config: AppConfig, actor: AuditActor): Promise<BillingStatus> {
  const provider = paymentProvider(config.billing);
  const sub = await requireTeamSubscription(shopId);
  if (sub.cancelAtPeriodEnd !== cancel) {
    const updated = await provider.setCancelAtPeriodEnd(sub.providerSubscriptionId, cancel);
    await inTransaction((tx) => syncSubscription(shopId, updated, tx, actor));
  }
  return getBillingStatus(shopId, config);
}

/** The subscription an event is about, if any. */
function subscriptionOf(event: Stripe.Event): { subscriptionId: string | null; shopHint: string | null; customerId: string | null } {
  const object = event.data.object as unknown as Record<string, unknown>;
  const idOf = (v: unknown) => (typeof v === "string" ? v : v && typeof v === "object" ? String((v as { id?: unknown }).id ?? "") || null : null);
  const metadata = (object.metadata ?? {}) as Record<string, string>;
  switch (event.type) {
    case "checkout.session.completed":
      return {
        subscriptionId: idOf(object.subscription),
        shopHint: (object.client_reference_id as string | null) ?? metadata.shopId ?? null,
        customerId: idOf(object.customer),
      };
    case "customer.subscription.created":
    case "customer.subscription.updated":
    case "customer.subscription.deleted":
    case "customer.subscription.paused":
    case "customer.subscription.resumed":
      return { subscriptionId: String(object.id), shopHint: metadata.shopId ?? null, customerId: idOf(object.customer) };
    case "invoice.paid":
    case "invoice.payment_failed": {
      const parent = object.parent as { subscription_details?: { subscription?: unknown } } | null | undefined;
      return { subscriptionId: idOf(parent?.subscription_details?.subscription), shopHint: null, customerId: idOf(object.customer) };
    }
    default:
      return { subscriptionId: null, shopHint: null, customerId: null };
  }
}

/**
 * Processes a verified webhook event once. The event id is recorded in the same transaction as
 * the change it causes: a replay finds it and changes nothing; a failure records nothing, so the
 * provider's retry is processed. The subscription is read back from the provider rather than
 * taken from the event, so events arriving out of order still leave the latest state.
 */
export async function handleWebhookEvent(event: Stripe.Event, config: AppConfig): Promise<{ duplicate: boolean }> {
  const provider = paymentProvider(config.billing);
  return inTransaction(async (tx) => {
    if (!(await recordEvent(event.id, event.type, tx))) return { duplicate: true };
    const { subscriptionId, shopHint, customerId } = subscriptionOf(event);
    if (!subscriptionId) return { duplicate: false };
    const sub = await provider.retrieveSubscription(subscriptionId);
    const shopId =
      (await findShopIdBySubscription(subscriptionId, tx)) ??
      sub.shopId ??
      shopHint ??
      (customerId ? await findShopIdByCustomer(customerId, tx) : null);
    if (!shopId || !(await lockShop(shopId, tx))) {
      console.warn(`[billing] ${event.type} ${event.id}: no shop for subscription ${subscriptionId}; recorded and ignored`);
      return { duplicate: false };
    }
    await setEventShop(event.id, shopId, tx);
    await syncSubscription(shopId, sub, tx, paymentProviderActor);
    return { duplicate: false };
  });
}

/**
 * Puts a shop on the team plan through an invoiced subscription at the provider (the demo seed).
 * Without a reachable provider the plan is recorded locally only, and said so.
 */
export async function grantTeamPlan(shopId: string, seats: number, config: AppConfig): Promise<"provider" | "local"> {
  try {
    const provider = paymentProvider(config.billing);
    const existing = await findSubscription(shopId);
    if (existing?.providerSubscriptionId) {
      const sub = await provider.retrieveSubscription(existing.providerSubscriptionId);
      if (PAID_STATUSES.includes(sub.status)) {
        await inTransaction((tx) => syncSubscription(shopId, sub, tx, planGrantActor));
        return "provider";
      }
    }
    const customerId = await provider.createCustomer({ shopId, name: (await shopName(shopId)) ?? "Ringdown shop", email: "billing@invalid.example" });
    const sub = await provider.createInvoicedSubscription({ shopId, customerId, seats });
    await inTransaction((tx) => syncSubscription(shopId, sub, tx, planGrantActor));
    return "provider";
  } catch {
    await saveSubscription(shopId, {
      status: "active",
      seats,
      currentPeriodEnd: new Date(Date.now() + 30 * 24 * 3600 * 1000),
      cancelAtPeriodEnd: false,
    });
    return "local";
  }
}
