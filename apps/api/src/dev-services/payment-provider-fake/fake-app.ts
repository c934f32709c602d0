/**
 * A local stand-in for the payment provider's API: exactly the endpoints Ringdown calls through
 * the `stripe` SDK, answering with the provider's object and error shapes, plus a checkout page
 * standing in for the hosted one. No money moves; state lives in memory (optionally saved to a
 * JSON file so a development restart keeps it). Documented in docs/billing.md.
 *
 * Provider API (form-encoded bodies, `Authorization: Bearer sk_test_…`):
 *   POST /v1/customers · GET /v1/customers/:id
 *   POST /v1/products
 *   GET /v1/prices?lookup_keys[]=… · POST /v1/prices · GET /v1/prices/:id
 *   POST /v1/checkout/sessions · GET /v1/checkout/sessions/:id
 *   POST /v1/subscriptions · GET /v1/subscriptions/:id · POST /v1/subscriptions/:id · DELETE /v1/subscriptions/:id
 * Checkout page: GET /checkout/:sessionId, POST /checkout/:sessionId/pay, POST /checkout/:sessionId/cancel
 * Fake-only controls (no provider equivalent; for tests and demos):
 *   GET /_fake/events · POST /_fake/subscriptions/:id/status {status} · POST /_fake/subscriptions/:id/renew
 */
import { randomBytes } from "node:crypto";
import { readFileSync, writeFileSync, mkdirSync } from "node:fs";
import path from "node:path";
import express, { type Express, type Request, type Response, type NextFunction } from "express";
import Stripe from "stripe";

export interface FakeProviderOptions {
  /** Accept only this key (any sk_test_/rk_test_ key when unset). */
  secretKey?: string;
  /** Where signed webhook events are POSTed; none are sent when unset. */
  webhookUrl?: string;
  webhookSecret: string;
  /** This server's own base URL, for the checkout page links (set once listening). */
  publicUrl?: string;
  /** Save state here after every change, and load it at start. */
  stateFile?: string;
}

type Obj = Record<string, unknown> & { id: string };

interface SubscriptionRecord extends Obj {
  status: string;
  customer: string;
  cancel_at_period_end: boolean;
  metadata: Record<string, string>;
  items: { object: "list"; data: Obj[]; has_more: false; url: string; total_count: number };
}

interface State {
  customers: Record<string, Obj>;
  products: Record<string, Obj>;
  prices: Record<string, Obj>;
  sessions: Record<string, Obj & { line_items_internal: Array<{ price: string; quantity: number }> }>;
  subscriptions: Record<string, SubscriptionRecord>;
}

export interface DeliveredEvent {
  event: Stripe.Event;
  deliveries: Array<{ at: string; status: number | null; error: string | null }>;
}

class ProviderError extends Error {
  constructor(
    readonly status: number,
    readonly body: { type: string; message: string; code?: string; param?: string },
  ) {
    super(body.message);
  }
}

const now = () => Math.floor(Date.now() / 1000);
const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString("base64url").replace(/[-_]/g, "x")}`;
const MONTH_S = 30 * 24 * 3600;
const SUBSCRIPTION_STATUSES = ["incomplete", "incomplete_expired", "trialing", "active", "past_due", "unpaid", "canceled", "paused"];

function missing(kind: string, id: string): ProviderError {
  return new ProviderError(404, { type: "invalid_request_error", code: "resource_missing", param: "id", message: `No such ${kind}: '${id}'` });
}

function required(body: Record<string, unknown>, param: string): unknown {
  const value = body[param];
  if (value === undefined || value === "") {
    throw new ProviderError(400, { type: "invalid_request_error", code: "parameter_missing", param, message: `Missing required param: ${param}.` });
  }
  return value;
}

function integer(value: unknown, param: string, min = 0): number {
  const n = typeof value === "number" ? value : Number(value);
  if (!Number.isInteger(n) || n < min) {
    throw new ProviderError(400, {
      type: "invalid_request_error",
      code: "parameter_invalid_integer",
      param,
      message: `Invalid integer: ${String(value)}`,
    });
  }
  return n;
}

function bool(value: unknown): boolean {
  return value === true || value === "true";
}

function metadataOf(value: unknown): Record<string, string> {
  if (!value || typeof value !== "object") return {};
  return Object.fromEntries(Object.entries(value as Record<string, unknown>).map(([k, v]) => [k, String(v)]));
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export interface FakeProvider {
  app: Express;
  /** Signed webhook events sent so far, oldest first, with their delivery attempts. */
  events: DeliveredEvent[];
  setPublicUrl(url: string): void;
  setWebhookUrl(url: string | undefined): void;
  /** The stored subscription object (tests read it to compare). */
  subscription(id: string): SubscriptionRecord | undefined;
  /** Changes a subscription's status as the provider would on a failed payment etc., and notifies. */
  setSubscriptionStatus(id: string, status: string): Promise<SubscriptionRecord>;
  /** Ends the current period: renews, or ends the subscription when it was set to cancel. */
  renew(id: string): Promise<SubscriptionRecord>;
  /** Completes a checkout as the customer would on the checkout page. */
  completeCheckout(sessionId: string): Promise<Obj>;
  /** Waits until every webhook triggered so far has been delivered (or given up on). */
  settled(): Promise<void>;
}

export function createFakeProvider(options: FakeProviderOptions): FakeProvider {
  let publicUrl = options.publicUrl ?? "http://127.0.0.1";
  let webhookUrl = options.webhookUrl;
  const signer = new Stripe("sk_test_signing_only", { telemetry: false });
  const events: DeliveredEvent[] = [];
  const pending = new Set<Promise<void>>();
  /**
   * As the real service does, API calls answer first and notify afterwards: the caller may still
   * hold database locks that the webhook handler needs.
   */
  const notifyLater = (type: string, object: Obj, previous?: Record<string, unknown>) => {
    const work = deliver(type, structuredClone(object), previous).catch(() => undefined);
    pending.add(work);
    void work.finally(() => pending.delete(work));
  };

  let state: State = { customers: {}, products: {}, prices: {}, sessions: {}, subscriptions: {} };
  if (options.stateFile) {
    try {
      state = JSON.parse(readFileSync(options.stateFile, "utf8")) as State;
    } catch (error) {
      if ((error as { code?: string }).code !== "ENOENT") throw error;
    }
  }
  const save = () => {
    if (!options.stateFile) return;
    mkdirSync(path.dirname(options.stateFile), { recursive: true });
    writeFileSync(options.stateFile, JSON.stringify(state));
  };

  async function deliver(type: string, object: Obj, previous?: Record<string, unknown>): Promise<void> {
    const event = {
      id: newId("evt"),
      object: "event",
      api_version: Stripe.API_VERSION,
      created: now(),
      data: { object: structuredClone(object), ...(previous ? { previous_attributes: previous } : {}) },
      livemode: false,
      pending_webhooks: webhookUrl ? 1 : 0,
      request: { id: null, idempotency_key: null },
      type,
    } as unknown as Stripe.Event;
    const record: DeliveredEvent = { event, deliveries: [] };
    events.push(record);
    if (events.length > 500) events.shift();
    if (!webhookUrl) return;
    const payload = JSON.stringify(event, null, 2);
    // The real service retries for days; three quick attempts are enough locally.
    for (const wait of [0, 250, 1000]) {
      if (wait) await new Promise((r) => setTimeout(r, wait));
      try {
        const response = await fetch(webhookUrl, {
          method: "POST",
          headers: {
            "Content-Type": "application/json; charset=utf-8",
            "Stripe-Signature": signer.webhooks.generateTestHeaderString({ payload, secret: options.webhookSecret }),
          },
          body: payload,
          signal: AbortSignal.timeout(10_000),
        });
        record.deliveries.push({ at: new Date().toISOString(), status: response.status, error: null });
        if (response.ok) return;
      } catch (error) {
        record.deliveries.push({ at: new Date().toISOString(), status: null, error: String(error) });
      }
    }
  }

  function getSubscription(id: string): SubscriptionRecord {
    const sub = state.subscriptions[id];
    if (!sub) throw missing("subscription", id);
    return sub;
  }

  function priceOf(id: string): Obj {
    const price = state.prices[id];
    if (!price) throw missing("price", id);
    return price;
  }

  function makeSubscription(input: {
    customer: string;
    items: Array<{ price: string; quantity: number }>;
    metadata: Record<string, string>;
    collectionMethod: string;
  }): SubscriptionRecord {
    const id = newId("sub");
    const start = now();
    const sub: SubscriptionRecord = {
      id,
      object: "subscription",
      status: "active",
      customer: input.customer,
      cancel_at_period_end: false,
      cancel_at: null,
      canceled_at: null,
      ended_at: null,
      collection_method: input.collectionMethod,
      created: start,
      start_date: start,
      livemode: false,
      metadata: input.metadata,
      latest_invoice: null,
      items: {
        object: "list",
        has_more: false,
        total_count: input.items.length,
        url: `/v1/subscription_items?subscription=${id}`,
        data: input.items.map((item) => ({
          id: newId("si"),
          object: "subscription_item",
          created: start,
          price: priceOf(item.price),
          quantity: item.quantity,
          subscription: id,
          current_period_start: start,
          current_period_end: start + MONTH_S,
          metadata: {},
        })),
      },
    };
    state.subscriptions[id] = sub;
    return sub;
  }

  async function setSubscriptionStatus(id: string, status: string): Promise<SubscriptionRecord> {
    if (!SUBSCRIPTION_STATUSES.includes(status)) {
      throw new ProviderError(400, { type: "invalid_request_error", param: "status", message: `Invalid status: ${status}` });
    }
    const sub = getSubscription(id);
    const previous = { status: sub.status };
    sub.status = status;
    if (status === "canceled") {
      sub.ended_at = now();
      sub.canceled_at ??= now();
    }
    save();
    await deliver(status === "canceled" ? "customer.subscription.deleted" : "customer.subscription.updated", sub, previous);
    return sub;
  }

  async function renew(id: string): Promise<SubscriptionRecord> {
    const sub = getSubscription(id);
    if (sub.cancel_at_period_end) return setSubscriptionStatus(id, "canceled");
    const item = sub.items.data[0]!;
    const previous = { items: structuredClone(sub.items) };
    item.current_period_start = item.current_period_end;
    item.current_period_end = (item.current_period_end as number) + MONTH_S;
    save();
    await deliver("customer.subscription.updated", sub, previous);
    return sub;
  }

  async function completeCheckout(sessionId: string): Promise<Obj> {
    const session = state.sessions[sessionId];
    if (!session) throw missing("checkout.session", sessionId);
    if (session.status !== "open") {
      throw new ProviderError(400, { type: "invalid_request_error", message: `This checkout session is ${String(session.status)}.` });
    }
    const sub = makeSubscription({
      customer: String(session.customer),
      items: session.line_items_internal,
      metadata: metadataOf((session as Record<string, unknown>).subscription_metadata),
      collectionMethod: "charge_automatically",
    });
    session.status = "complete";
    session.payment_status = "paid";
    session.subscription = sub.id;
    save();
    await deliver("customer.subscription.created", sub);
    await deliver("checkout.session.completed", publicSession(session));
    return session;
  }

  function publicSession(session: State["sessions"][string]): Obj {
    const { line_items_internal: _items, subscription_metadata: _meta, ...rest } = session as Record<string, unknown> & Obj;
    return rest as Obj;
  }

  const app = express();
  app.disable("x-powered-by");
  app.set("query parser", "extended");
  app.use(express.urlencoded({ extended: true, limit: "1mb" }));

  // --- provider API --------------------------------------------------------------------------
  const api = express.Router();
  api.use((req, res, next) => {
    res.setHeader("Request-Id", newId("req"));
    const key = /^Bearer (.+)$/.exec(req.get("authorization") ?? "")?.[1];
    if (!key) {
      throw new ProviderError(401, {
        type: "invalid_request_error",
        message: "You did not provide an API key. Provide it in the Authorization header as a Bearer token.",
      });
    }
    if (key.includes("_live_")) {
      throw new ProviderError(401, { type: "invalid_request_error", code: "api_key_expired", message: "This local stand-in never accepts live keys." });
    }
    if (options.secretKey ? key !== options.secretKey : !/^(sk|rk)_test_/.test(key)) {
      throw new ProviderError(401, { type: "invalid_request_error", message: `Invalid API Key provided: ${key.slice(0, 8)}…` });
    }
    next();
  });

  api.post("/customers", (req, res) => {
    const body = req.body as Record<string, unknown>;
    const customer: Obj = {
      id: newId("cus"),
      object: "customer",
      created: now(),
      email: body.email ?? null,
      name: body.name ?? null,
      metadata: metadataOf(body.metadata),
      livemode: false,
    };
    state.customers[customer.id] = customer;
    save();
    res.json(customer);
  });
  api.get("/customers/:id", (req, res) => {
    const customer = state.customers[req.params.id];
    if (!customer) throw missing("customer", req.params.id);
    res.json(customer);
  });

  api.post("/products", (req, res) => {
    const body = req.body as Record<string, unknown>;
    const product: Obj = {
      id: newId("prod"),
      object: "product",
      active: true,
      created: now(),
      name: String(required(body, "name")),
      metadata: metadataOf(body.metadata),
      livemode: false,
    };
    state.products[product.id] = product;
    save();
    res.json(product);
  });

  api.get("/prices", (req, res) => {
    const keys = ([] as unknown[]).concat((req.query as Record<string, unknown>).lookup_keys ?? []).map(String);
    const data = Object.values(state.prices).filter(
      (p) => p.active === true && (keys.length === 0 || keys.includes(String(p.lookup_key))),
    );
    res.json({ object: "list", data, has_more: false, url: "/v1/prices" });
  });
  api.get("/prices/:id", (req, res) => res.json(priceOf(req.params.id)));
  api.post("/prices", (req, res) => {
    const body = req.body as Record<string, unknown>;
    const product = String(required(body, "product"));
    if (!state.products[product]) throw missing("product", product);
    const recurring = body.recurring as Record<string, unknown> | undefined;
    const price: Obj = {
      id: newId("price"),
      object: "price",
      active: true,
      billing_scheme: "per_unit",
      created: now(),
      currency: String(required(body, "currency")).toLowerCase(),
      unit_amount: integer(required(body, "unit_amount"), "unit_amount"),
      lookup_key: body.lookup_key ?? null,
      product,
      recurring: recurring
        ? { interval: String(recurring.interval ?? "month"), interval_count: 1, usage_type: "licensed" }
        : null,
      type: recurring ? "recurring" : "one_time",
      metadata: metadataOf(body.metadata),
      livemode: false,
    };
    // As the provider does with transfer_lookup_key: the newest price owns the lookup key.
    for (const other of Object.values(state.prices)) if (other.lookup_key === price.lookup_key && price.lookup_key) other.lookup_key = null;
    state.prices[price.id] = price;
    save();
    res.json(price);
  });

  api.post("/checkout/sessions", (req, res) => {
    const body = req.body as Record<string, unknown>;
    if (required(body, "mode") !== "subscription") {
      throw new ProviderError(400, { type: "invalid_request_error", param: "mode", message: "This stand-in supports mode=subscription only." });
    }
    const customer = String(required(body, "customer"));
    if (!state.customers[customer]) throw missing("customer", customer);
    const lineItems = Object.values(required(body, "line_items") as object) as Array<Record<string, unknown>>;
    const items = lineItems.map((item, i) => {
      const price = String(item.price ?? "");
      priceOf(price);
      return { price, quantity: integer(item.quantity ?? 1, `line_items[${i}][quantity]`, 1) };
    });
    const id = `cs_test_${randomBytes(24).toString("base64url").replace(/[-_]/g, "x")}`;
    const amount = items.reduce((sum, item) => sum + Number(priceOf(item.price).unit_amount) * item.quantity, 0);
    const session = {
      id,
      object: "checkout.session",
      mode: "subscription",
      status: "open",
      payment_status: "unpaid",
      customer,
      client_reference_id: body.client_reference_id ?? null,
      metadata: metadataOf(body.metadata),
      success_url: String(required(body, "success_url")),
      cancel_url: body.cancel_url ? String(body.cancel_url) : null,
      subscription: null,
      amount_total: amount,
      currency: String(priceOf(items[0]!.price).currency),
      created: now(),
      expires_at: now() + 24 * 3600,
      livemode: false,
      url: `${publicUrl}/checkout/${id}`,
      line_items_internal: items,
      subscription_metadata: metadataOf((body.subscription_data as Record<string, unknown> | undefined)?.metadata),
    };
    state.sessions[id] = session;
    save();
    res.json(publicSession(session));
  });
  api.get("/checkout/sessions/:id", (req, res) => {
    const session = state.sessions[req.params.id];
    if (!session) throw missing("checkout.session", req.params.id);
    res.json(publicSession(session));
  });

  api.post("/subscriptions", (req, res) => {
    const body = req.body as Record<string, unknown>;
    const customer = String(required(body, "customer"));
    if (!state.customers[customer]) throw missing("customer", customer);
    const items = ([] as Array<Record<string, unknown>>).concat(Object.values(required(body, "items") as object)).map((item, i) => {
      const price = String(item.price ?? "");
      priceOf(price);
      return { price, quantity: integer(item.quantity ?? 1, `items[${i}][quantity]`, 1) };
    });
    const sub = makeSubscription({
      customer,
      items,
      metadata: metadataOf(body.metadata),
      collectionMethod: String(body.collection_method ?? "charge_automatically"),
    });
    save();
    notifyLater("customer.subscription.created", sub);
    res.json(sub);
  });
  api.get("/subscriptions/:id", (req, res) => res.json(getSubscription(req.params.id)));
  api.post("/subscriptions/:id", (req, res) => {
    const sub = getSubscription(req.params.id);
    const body = req.body as Record<string, unknown>;
    if (sub.status === "canceled" || sub.status === "incomplete_expired") {
      throw new ProviderError(400, {
        type: "invalid_request_error",
        message: "A canceled subscription can only update its cancellation_details and metadata.",
      });
    }
    const previous: Record<string, unknown> = {};
    if (body.items !== undefined) {
      previous.items = structuredClone(sub.items);
      for (const [i, change] of Object.values(body.items as object).entries()) {
        const c = change as Record<string, unknown>;
        const item = sub.items.data.find((it) => it.id === c.id);
        if (!item) throw new ProviderError(400, { type: "invalid_request_error", param: `items[${i}][id]`, message: `No such subscription item: '${String(c.id)}'` });
        if (c.quantity !== undefined) item.quantity = integer(c.quantity, `items[${i}][quantity]`, 1);
      }
    }
    if (body.cancel_at_period_end !== undefined) {
      previous.cancel_at_period_end = sub.cancel_at_period_end;
      sub.cancel_at_period_end = bool(body.cancel_at_period_end);
      sub.cancel_at = sub.cancel_at_period_end ? (sub.items.data[0]?.current_period_end ?? null) : null;
      sub.canceled_at = sub.cancel_at_period_end ? now() : null;
    }
    if (body.metadata !== undefined) {
      previous.metadata = sub.metadata;
      sub.metadata = { ...sub.metadata, ...metadataOf(body.metadata) };
    }
    save();
    notifyLater("customer.subscription.updated", sub, previous);
    res.json(sub);
  });
  api.delete("/subscriptions/:id", (req, res) => {
    const sub = getSubscription(req.params.id);
    const previous = { status: sub.status };
    sub.status = "canceled";
    sub.ended_at = now();
    sub.canceled_at ??= now();
    save();
    notifyLater("customer.subscription.deleted", sub, previous);
    res.json(sub);
  });
  api.use((req) => {
    throw new ProviderError(404, {
      type: "invalid_request_error",
      message: `Unrecognized request URL (${req.method}: ${req.originalUrl.split("?")[0]}). This local stand-in implements only the endpoints Ringdown uses.`,
    });
  });
  app.use("/v1", api);

  // --- checkout page -------------------------------------------------------------------------
  app.get("/checkout/:id", (req, res) => {
    const session = state.sessions[req.params.id];
    if (!session) {
      res.status(404).type("html").send("<!doctype html><title>Unknown checkout</title><p>This checkout does not exist.</p>");
      return;
    }
    const customer = state.customers[String(session.customer)];
    const rows = session.line_items_internal
      .map((item) => {
        const price = priceOf(item.price);
        const unit = Number(price.unit_amount) / 100;
        const cur = String(price.currency).toUpperCase();
        return `<tr><td>Team plan seat, per ${escapeHtml(String((price.recurring as { interval?: string } | null)?.interval ?? "month"))}</td><td class="n">${item.quantity}</td><td class="n">${unit.toFixed(2)} ${cur}</td><td class="n">${(unit * item.quantity).toFixed(2)} ${cur}</td></tr>`;
      })
      .join("");
    const open = session.status === "open";
    res.type("html").send(`<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Local payment stand-in</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>
body{font-family:system-ui,sans-serif;background:#eef0f3;color:#1d2330;margin:0;padding:32px 16px}
main{max-width:560px;margin:0 auto;background:#fff;border:2px dashed #8a94a6;border-radius:6px;padding:24px}
.tag{display:inline-block;background:#1d2330;color:#fff;font-size:12px;padding:2px 8px;border-radius:3px;letter-spacing:.04em}
table{width:100%;border-collapse:collapse;margin:16px 0}td,th{padding:6px 4px;border-bottom:1px solid #d5d9e0;text-align:left;font-size:14px}
.n{text-align:right;font-variant-numeric:tabular-nums}button{font:inherit;padding:10px 16px;border-radius:4px;border:1px solid #1d2330;cursor:pointer}
.pay{background:#1d2330;color:#fff}.row{display:flex;gap:12px;margin-top:16px}
</style></head><body><main>
<span class="tag">LOCAL STAND-IN — NO MONEY MOVES</span>
<h1 style="font-size:20px">Checkout for ${escapeHtml(String(customer?.name ?? "your shop"))}</h1>
<p>This page replaces the payment provider's hosted checkout while developing. Completing it creates the subscription and sends the signed webhook the provider would send.</p>
<table><thead><tr><th>Item</th><th class="n">Qty</th><th class="n">Unit</th><th class="n">Amount</th></tr></thead><tbody>${rows}</tbody>
<tfoot><tr><th colspan="3">Total per period</th><th class="n">${(Number(session.amount_total) / 100).toFixed(2)} ${escapeHtml(String(session.currency).toUpperCase())}</th></tr></tfoot></table>
${
  open
    ? `<div class="row"><form method="post" action="/checkout/${escapeHtml(session.id)}/pay"><button class="pay" type="submit">Complete test payment</button></form>
<form method="post" action="/checkout/${escapeHtml(session.id)}/cancel"><button type="submit">Cancel and go back</button></form></div>`
    : `<p><strong>This checkout is ${escapeHtml(String(session.status))}.</strong></p>`
}
</main></body></html>`);
  });
  app.post("/checkout/:id/pay", async (req, res) => {
    const session = await completeCheckout(req.params.id);
    res.redirect(303, String(session.success_url).replace("{CHECKOUT_SESSION_ID}", session.id));
  });
  app.post("/checkout/:id/cancel", (req, res) => {
    const session = state.sessions[req.params.id];
    if (!session) throw missing("checkout.session", req.params.id);
    res.redirect(303, String(session.cancel_url ?? session.success_url).replace("{CHECKOUT_SESSION_ID}", session.id));
  });

  // --- fake-only controls --------------------------------------------------------------------
  app.get("/_fake/health", (_req, res) => res.json({ ok: true }));
  app.get("/_fake/events", (_req, res) => res.json({ data: events }));
  app.post("/_fake/subscriptions/:id/status", async (req, res) => {
    res.json(await setSubscriptionStatus(req.params.id, String((req.body as Record<string, unknown>).status ?? "")));
  });
  app.post("/_fake/subscriptions/:id/renew", async (req, res) => res.json(await renew(req.params.id)));

  app.use((error: unknown, _req: Request, res: Response, next: NextFunction) => {
    if (res.headersSent) {
      next(error);
      return;
    }
    if (error instanceof ProviderError) {
      res.status(error.status).json({ error: error.body });
      return;
    }
    console.error("[payment-fake]", error);
    res.status(500).json({ error: { type: "api_error", message: "The local stand-in failed; see its log." } });
  });

  return {
    app,
    events,
    setPublicUrl: (url) => {
      publicUrl = url.replace(/\/$/, "");
    },
    setWebhookUrl: (url) => {
      webhookUrl = url;
    },
    subscription: (id) => state.subscriptions[id],
    setSubscriptionStatus,
    renew,
    completeCheckout,
    settled: async () => {
      while (pending.size > 0) await Promise.allSettled([...pending]);
    },
  };
}
