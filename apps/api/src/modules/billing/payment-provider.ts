/**
 * Everything Ringdown asks of the payment provider, through its official SDK. Pointed at the local
 * fake (dev-services/payment-provider-fake) by STRIPE_API_URL, or at the real service; nothing
 * else differs (see docs/billing.md).
 */
import Stripe from "stripe";
import type { SeatPrice, SubscriptionStatus } from "@ringdown/contracts";
import type { BillingConfig } from "../../config/env.js";
import { AppError } from "../../http/app-error.js";

export interface ProviderSubscription {
  id: string;
  customerId: string;
  itemId: string | null;
  status: SubscriptionStatus;
  seats: number;
  currentPeriodEnd: Date | null;
  cancelAtPeriodEnd: boolean;
  shopId: string | null;
}

export interface PaymentProvider {
  seatPrice(): Promise<{ id: string } & SeatPrice>;
  createCustomer(input: { shopId: string; name: string; email: string }): Promise<string>;
  createCheckout(input: {
    shopId: string;
    customerId: string;
    seats: number;
    successUrl: string;
    cancelUrl: string;
  }): Promise<{ id: string; url: string }>;
  retrieveCheckout(sessionId: string): Promise<{ shopId: string | null; status: string; subscriptionId: string | null; customerId: string | null }>;
  /** An invoiced subscription without a checkout (used for the demo seed). */
  createInvoicedSubscription(input: { shopId: string; customerId: string; seats: number }): Promise<ProviderSubscription>;
  retrieveSubscription(id: string): Promise<ProviderSubscription>;
  changeSeats(id: string, itemId: string, seats: number): Promise<ProviderSubscription>;
  setCancelAtPeriodEnd(id: string, cancel: boolean): Promise<ProviderSubscription>;
  /** Verifies the signature and parses the event; throws `validation_failed` on a bad one. */
  verifyWebhook(rawBody: Buffer, signature: string | undefined): Stripe.Event;
}

const statuses: readonly SubscriptionStatus[] = [
  "incomplete",
  "incomplete_expired",
  "trialing",
  "active",
  "past_due",
  "unpaid",
  "canceled",
  "paused",
];

export function toProviderSubscription(sub: Stripe.Subscription): ProviderSubscription {
  const item = sub.items.data[0];
  const customer = typeof sub.customer === "string" ? sub.customer : sub.customer.id;
  return {
    id: sub.id,
    customerId: customer,
    itemId: item?.id ?? null,
    status: statuses.includes(sub.status as SubscriptionStatus) ? (sub.status as SubscriptionStatus) : "incomplete",
    seats: item?.quantity ?? 0,
    currentPeriodEnd: item?.current_period_end ? new Date(item.current_period_end * 1000) : null,
    cancelAtPeriodEnd: sub.cancel_at_period_end,
    shopId: sub.metadata?.shopId ?? null,
  };
}

/** The provider's failures in words a shop owner can act on; details go to the log. */
function translate(error: unknown): never {
  if (error instanceof AppError) throw error;
  if (error instanceof Stripe.errors.StripeError) {
    console.error(`[billing] provider error ${error.type} ${error.code ?? ""} (${error.statusCode ?? "-"}): ${error.message}`);
    if (error instanceof Stripe.errors.StripeConnectionError || error instanceof Stripe.errors.StripeAPIError) {
      throw new AppError("service_unavailable", "The payment provider cannot be reached right now. Nothing was changed; try again in a moment.", {
        cause: error,
      });
    }
    if (error instanceof Stripe.errors.StripeAuthenticationError) {
      throw new AppError("service_unavailable", "Payments are misconfigured on this server (the provider refused its key). Nothing was changed.", {
        cause: error,
      });
    }
    if (error instanceof Stripe.errors.StripeRateLimitError) {
      throw new AppError("service_unavailable", "The payment provider is busy. Nothing was changed; try again in a minute.", { cause: error });
    }
    throw new AppError("service_unavailable", `The payment provider refused the change: ${error.message}`, { cause: error });
  }
  throw error;
}

async function call<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    return translate(error);
  }
}

function clientFor(config: BillingConfig): Stripe {
  const base = config.apiUrl;
  return new Stripe(config.secretKey, {
    telemetry: false,
    timeout: 15_000,
    appInfo: { name: "Ringdown" },
    ...(base
      ? {
          host: base.hostname,
          port: base.port || (base.protocol === "https:" ? 443 : 80),
          protocol: base.protocol === "https:" ? "https" : "http",
          // The local fake answers at once; retries would only hide a stopped fake.
          maxNetworkRetries: base.hostname === "127.0.0.1" || base.hostname === "localhost" ? 0 : 2,
        }
      : { maxNetworkRetries: 2 }),
  });
}

const providers = new Map<string, PaymentProvider>();

/** One provider per configuration (the price lookup is cached with it). */
export function paymentProvider(config: BillingConfig): PaymentProvider {
  if (!config.enabled) {
    throw new AppError("service_unavailable", "Payments are not configured on this server, so plans cannot be changed here.");
  }
  const key = JSON.stringify({ ...config, apiUrl: config.apiUrl?.toString() ?? null });
  let provider = providers.get(key);
  if (!provider) {
    provider = createPaymentProvider(config);
    providers.set(key, provider);
  }
  return provider;
}

function createPaymentProvider(config: BillingConfig): PaymentProvider {
  const stripe = clientFor(config);
  let cachedPrice: Promise<{ id: string } & SeatPrice> | undefined;

  const describePrice = (price: Stripe.Price): { id: string } & SeatPrice => ({
    id: price.id,
    unitAmountMinor: price.unit_amount ?? 0,
    currency: price.currency,
    interval: (["day", "week", "month", "year"] as const).find((i) => i === price.recurring?.interval) ?? "month",
  });

  async function findOrCreatePrice(): Promise<{ id: string } & SeatPrice> {
    if (config.seatPriceId) return describePrice(await stripe.prices.retrieve(config.seatPriceId));
    const found = await stripe.prices.list({ lookup_keys: [config.seatPriceLookupKey], active: true, limit: 1 });
    if (found.data[0]) return describePrice(found.data[0]);
    const product = await stripe.products.create({ name: "Ringdown team plan seat", metadata: { app: "ringdown" } });
    const price = await stripe.prices.create({
      product: product.id,
      currency: config.currency,
      unit_amount: config.seatAmountMinor,
      recurring: { interval: "month" },
      lookup_key: config.seatPriceLookupKey,
      transfer_lookup_key: true,
      metadata: { app: "ringdown" },
    });
    return describePrice(price);
  }

  return {
    seatPrice() {
      cachedPrice ??= call(findOrCreatePrice).catch((error: unknown) => {
        cachedPrice = undefined;
        throw error;
      });
      return cachedPrice;
    },

    createCustomer: ({ shopId, name, email }) =>
      call(async () => (await stripe.customers.create({ name, email, metadata: { shopId } })).id),

    async createCheckout({ shopId, customerId, seats, successUrl, cancelUrl }) {
      const price = await this.seatPrice();
      return call(async () => {
        const session = await stripe.checkout.sessions.create({
          mode: "subscription",
          customer: customerId,
          client_reference_id: shopId,
          line_items: [{ price: price.id, quantity: seats }],
          success_url: successUrl,
          cancel_url: cancelUrl,
          metadata: { shopId },
          subscription_data: { metadata: { shopId } },
        });
        if (!session.url) throw new AppError("service_unavailable", "The payment provider did not return a checkout page.");
        return { id: session.id, url: session.url };
      });
    },

    retrieveCheckout: (sessionId) =>
      call(async () => {
        const session = await stripe.checkout.sessions.retrieve(sessionId).catch((error: unknown) => {
          // An id the provider does not know came from the caller: not found, not an outage.
          if (error instanceof Stripe.errors.StripeInvalidRequestError && error.statusCode === 404) {
            throw AppError.notFound("No checkout of this shop has that id.");
          }
          throw error;
        });
        const sub = session.subscription;
        const customer = session.customer;
        return {
          shopId: session.client_reference_id ?? session.metadata?.shopId ?? null,
          status: session.status ?? "open",
          subscriptionId: typeof sub === "string" ? sub : (sub?.id ?? null),
          customerId: typeof customer === "string" ? customer : (customer?.id ?? null),
        };
      }),

    async createInvoicedSubscription({ shopId, customerId, seats }) {
      const price = await this.seatPrice();
      return call(async () =>
        toProviderSubscription(
          await stripe.subscriptions.create({
            customer: customerId,
            items: [{ price: price.id, quantity: seats }],
            collection_method: "send_invoice",
            days_until_due: 30,
            metadata: { shopId },
          }),
        ),
      );
    },

    retrieveSubscription: (id) => call(async () => toProviderSubscription(await stripe.subscriptions.retrieve(id))),

    changeSeats: (id, itemId, seats) =>
      call(async () =>
        toProviderSubscription(
          await stripe.subscriptions.update(id, {
            items: [{ id: itemId, quantity: seats }],
            proration_behavior: "create_prorations",
          }),
        ),
      ),

    setCancelAtPeriodEnd: (id, cancel) =>
      call(async () => toProviderSubscription(await stripe.subscriptions.update(id, { cancel_at_period_end: cancel }))),

    verifyWebhook(rawBody, signature) {
      if (!signature) throw AppError.validation("The webhook has no signature header.");
      try {
        return stripe.webhooks.constructEvent(rawBody, signature, config.webhookSecret);
      } catch (error) {
        if (error instanceof Stripe.errors.StripeSignatureVerificationError) {
          throw AppError.validation("The webhook signature is not valid.");
        }
        throw AppError.validation("The webhook body is not a valid event.");
      }
    },
  };
}
