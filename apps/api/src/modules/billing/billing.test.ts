import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import request from "supertest";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiErrorSchema,
  billingStatusSchema,
  checkoutStartedSchema,
  invitationSchema,
  shopPlanSchema,
  type BillingStatus,
} from "@ringdown/contracts";
import type { Express } from "express";
import { getSequelize } from "../../db/sequelize.js";
import { startStandIns, STAND_IN_WEBHOOK_SECRET, type StandIns } from "../../dev-services/stand-ins.js";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, testConfig, uniqueEmail, type SignedUp } from "../../test/harness.js";
import { closeMailers } from "../mail/mailer.js";
import { findSubscription } from "./billing.repository.js";
import { assertCanAddMachine } from "./billing.service.js";

let standIns: StandIns;
let app: Express;
let server: Server;

beforeAll(async () => {
  standIns = await startStandIns();
  app = makeTestApp(standIns.config(testConfig()));
  // The fake provider delivers webhooks over real HTTP, as the real one would.
  server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, "127.0.0.1", () => resolve(s));
  });
  standIns.payments.setWebhookUrl(`http://127.0.0.1:${(server.address() as AddressInfo).port}/api/billing/webhook`);
});
afterAll(async () => {
  await standIns.payments.settled();
  await new Promise((r) => server.close(r));
  closeMailers();
  await standIns.close();
  await disconnectTestDatabase();
});

const errorOf = (body: unknown) => apiErrorSchema.parse(body).error;
const signer = new Stripe("sk_test_signing_only", { telemetry: false });

async function status(owner: SignedUp): Promise<BillingStatus> {
  const res = await owner.agent.get(`/api/shops/${owner.shopId}/billing`);
  expect(res.status).toBe(200);
  return billingStatusSchema.parse(res.body);
}

/** Starts a checkout and completes it on the fake's checkout page (form POST, 303 back to the app). */
async function upgrade(owner: SignedUp, seats: number): Promise<string> {
  const started = await owner.agent.post(`/api/shops/${owner.shopId}/billing/checkout`).send({ seats });
  expect(started.status, JSON.stringify(started.body)).toBe(201);
  const { url, sessionId } = checkoutStartedSchema.parse(started.body);
  expect(url).toBe(`${standIns.payments.url}/checkout/${sessionId}`);

  const page = await fetch(url);
  expect(page.status).toBe(200);
  const html = await page.text();
  expect(html).toContain("NO MONEY MOVES");
  expect(html).toContain(`<td class="n">${seats}</td>`);

  const paid = await fetch(`${url}/pay`, { method: "POST", redirect: "manual" });
  expect(paid.status).toBe(303);
  expect(paid.headers.get("location")).toBe(`http://localhost:3000/billing?checkout=done&session_id=${sessionId}`);
  return sessionId;
}

describe("plans and seats", () => {
  it("a new shop is on the free plan: 1 paid seat (the owner), 1 machine, operators free", async () => {
    const owner = await createPerson(app, "free-owner");
    const operator = await createPerson(app, "free-operator");
    await joinShop(operator.userId, owner.shopId, "operator");
    const s = await status(owner);
    expect(s).toMatchObject({
      plan: "free",
      readOnly: false,
      subscriptionStatus: "none",
      currentPeriodEnd: null,
      cancelAtPeriodEnd: false,
      billingAvailable: true,
      seats: { used: 1, paid: 1, owners: 1, toolingManagers: 0, programmers: 0, pendingInvitations: 0, operators: 1 },
      machines: { used: 0, limit: 1 },
    });
    // The price comes from the provider (created there on first use, per seat per month).
    expect(s.seatPrice).toEqual({ unitAmountMinor: 1900, currency: "eur", interval: "month" });
    // Every member can read the plan; only owners reach billing.
    const plan = shopPlanSchema.parse((await operator.agent.get(`/api/shops/${owner.shopId}/plan`)).body);
    expect(plan.plan).toBe("free");
    const refused = await operator.agent.get(`/api/shops/${owner.shopId}/billing`);
    expect(refused.status).toBe(403);
    expect(errorOf(refused.body).message).toBe("Only the owner of this shop can do this.");
  });

  it("counts owners, tooling managers, programmers and pending invitations for those roles as seats", async () => {
    const owner = await createPerson(app, "count-owner");
    await getSequelize().query(
      `INSERT INTO shop_subscriptions (shop_id, status, seats, provider_subscription_id) VALUES ($1, 'active', 10, $2)`,
      { bind: [owner.shopId, `sub_count_${owner.shopId}`] },
    );
    for (const role of ["tooling_manager", "programmer", "operator", "operator"] as const) {
      const p = await createPerson(app, `count-${role}`);
      await joinShop(p.userId, owner.shopId, role);
    }
    await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("c1"), role: "programmer" }).expect(201);
    await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("c2"), role: "operator" }).expect(201);
    const plan = shopPlanSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/plan`)).body);
    expect(plan.seats).toEqual({ used: 4, paid: 10, owners: 1, toolingManagers: 1, programmers: 1, pendingInvitations: 1, operators: 2 });
  });
});

describe("upgrading through the provider's checkout", () => {
  it("checkout → the provider's signed webhook puts the shop on the team plan with the seats bought", async () => {
    const owner = await createPerson(app, "upgrade-owner", "Upgrade shop");
    await upgrade(owner, 3);
    const s = await status(owner);
    expect(s).toMatchObject({ plan: "team", subscriptionStatus: "active", cancelAtPeriodEnd: false, machines: { limit: null } });
    expect(s.seats.paid).toBe(3);
    const renewal = Date.parse(s.currentPeriodEnd!);
    expect(renewal - Date.now()).toBeGreaterThan(29 * 86_400_000);
    // The webhook (not the return page) did it: the event is recorded against the shop.
    const [rows] = await getSequelize().query(`SELECT type FROM billing_events WHERE shop_id = $1 ORDER BY type`, { bind: [owner.shopId] });
    expect((rows as Array<{ type: string }>).map((r) => r.type)).toEqual(["checkout.session.completed", "customer.subscription.created"]);

    // With seats to spare, a programmer can now be invited.
    const invited = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("prog"), role: "programmer" });
    expect(invited.status).toBe(201);
    invitationSchema.parse(invited.body);
  });

  it("confirming the checkout on return reads it back from the provider (also without a webhook)", async () => {
    const owner = await createPerson(app, "confirm-owner");
    standIns.payments.setWebhookUrl(undefined);
    let sessionId: string;
    try {
      sessionId = await upgrade(owner, 2);
    } finally {
      standIns.payments.setWebhookUrl(`http://127.0.0.1:${(server.address() as AddressInfo).port}/api/billing/webhook`);
    }
    expect((await status(owner)).plan).toBe("free");
    const res = await owner.agent.post(`/api/shops/${owner.shopId}/billing/checkout/confirm`).send({ sessionId });
    expect(res.status).toBe(200);
    expect(billingStatusSchema.parse(res.body)).toMatchObject({ plan: "team", seats: { paid: 2 } });

    const other = await createPerson(app, "confirm-other");
    const foreign = await other.agent.post(`/api/shops/${other.shopId}/billing/checkout/confirm`).send({ sessionId });
    expect(foreign.status).toBe(404);
    // An id the provider never issued is the caller's mistake (404), not a provider outage (503).
    const unknown = await owner.agent.post(`/api/shops/${owner.shopId}/billing/checkout/confirm`).send({ sessionId: "cs_test_never_issued" });
    expect(unknown.status).toBe(404);
    expect(errorOf(unknown.body)).toEqual({ code: "not_found", message: "No checkout of this shop has that id." });
  });

  it("an abandoned checkout changes nothing, and buying fewer seats than in use is refused", async () => {
    const owner = await createPerson(app, "abandon-owner");
    const started = checkoutStartedSchema.parse((await owner.agent.post(`/api/shops/${owner.shopId}/billing/checkout`).send({ seats: 1 })).body);
    const cancelled = await fetch(`${started.url}/cancel`, { method: "POST", redirect: "manual" });
    expect(cancelled.headers.get("location")).toBe("http://localhost:3000/billing?checkout=cancelled");
    expect((await status(owner)).plan).toBe("free");
    const confirm = await owner.agent.post(`/api/shops/${owner.shopId}/billing/checkout/confirm`).send({ sessionId: started.sessionId });
    expect(confirm.status).toBe(409);

    const tooFew = await owner.agent.post(`/api/shops/${owner.shopId}/billing/checkout`).send({ seats: 0 });
    expect(tooFew.status).toBe(400);
    expect(errorOf(tooFew.body).fields?.seats).toBe("At least 1 seat");
  });
});

describe("changing seats and cancelling", () => {
  it("adds and removes seats at the provider; never below the seats in use", async () => {
    const owner = await createPerson(app, "seats-owner");
    await upgrade(owner, 2);
    const sub = await findSubscription(owner.shopId);
    const more = await owner.agent.post(`/api/shops/${owner.shopId}/billing/seats`).send({ seats: 4 });
    expect(more.status).toBe(200);
    expect(billingStatusSchema.parse(more.body).seats.paid).toBe(4);
    expect(standIns.payments.subscription(sub!.providerSubscriptionId!)?.items.data[0]?.quantity).toBe(4);

    const p = await createPerson(app, "seats-prog");
    await joinShop(p.userId, owner.shopId, "programmer");
    const tooFew = await owner.agent.post(`/api/shops/${owner.shopId}/billing/seats`).send({ seats: 1 });
    expect(tooFew.status).toBe(409);
    expect(errorOf(tooFew.body).message).toMatch(/^2 paid seats are in use/);
    expect(standIns.payments.subscription(sub!.providerSubscriptionId!)?.items.data[0]?.quantity).toBe(4);
  });

  it("refuses inviting beyond the paid seats with a message that says how to add seats", async () => {
    const owner = await createPerson(app, "full-owner");
    await upgrade(owner, 2);
    await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("p1"), role: "programmer" }).expect(201);
    const res = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("p2"), role: "tooling_manager" });
    expect(res.status).toBe(409);
    expect(errorOf(res.body).message).toBe(
      "All 2 paid seats are in use (1 person and 1 pending invitation). The owner can add seats on the Billing page (Change seats), or invite this person as an operator: operators are free.",
    );
    await owner.agent.post(`/api/shops/${owner.shopId}/billing/seats`).send({ seats: 3 }).expect(200);
    await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("p2"), role: "tooling_manager" }).expect(201);
  });

  it("cancels at the period end (plan kept until then), resumes, and answers 409 without a team plan", async () => {
    const owner = await createPerson(app, "cancel-owner");
    expect((await owner.agent.post(`/api/shops/${owner.shopId}/billing/cancel`)).status).toBe(409);
    await upgrade(owner, 1);
    const cancelled = billingStatusSchema.parse((await owner.agent.post(`/api/shops/${owner.shopId}/billing/cancel`)).body);
    expect(cancelled).toMatchObject({ plan: "team", cancelAtPeriodEnd: true, subscriptionStatus: "active" });
    const resumed = billingStatusSchema.parse((await owner.agent.post(`/api/shops/${owner.shopId}/billing/resume`)).body);
    expect(resumed.cancelAtPeriodEnd).toBe(false);
  });
});

describe("a lapsed team plan", () => {
  it("makes the shop read-only for everyone but owners, loses nothing, and lifts once renewed", async () => {
    const owner = await createPerson(app, "lapse-owner");
    await upgrade(owner, 3);
    const programmer = await createPerson(app, "lapse-programmer");
    await joinShop(programmer.userId, owner.shopId, "programmer");
    const sub = await findSubscription(owner.shopId);

    // The period ends after a cancellation: the provider ends the subscription and says so.
    await owner.agent.post(`/api/shops/${owner.shopId}/billing/cancel`).expect(200);
    await standIns.payments.renew(sub!.providerSubscriptionId!);

    const plan = shopPlanSchema.parse((await programmer.agent.get(`/api/shops/${owner.shopId}/plan`)).body);
    expect(plan).toMatchObject({ plan: "free", readOnly: true });
    expect(plan.readOnlyReason).toMatch(/team plan has ended/);

    // Reading goes on; changes by non-owners are refused with the reason.
    expect((await programmer.agent.get(`/api/shops/${owner.shopId}/members`)).status).toBe(200);
    const write = await programmer.agent.patch(`/api/shops/${owner.shopId}`).send({ name: "Renamed" });
    expect(write.status).toBe(403);
    expect(errorOf(write.body).message).toMatch(/^This shop is read-only for now\./);
    // The owner can still act (here: invite an operator, free on any plan).
    await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("op"), role: "operator" }).expect(201);
    // Nothing was lost: both members are still there.
    const members = await owner.agent.get(`/api/shops/${owner.shopId}/members`);
    expect(members.body.total).toBe(2);

    // A new checkout renews the plan and lifts the lock.
    await upgrade(owner, 2);
    expect(shopPlanSchema.parse((await programmer.agent.get(`/api/shops/${owner.shopId}/plan`)).body)).toMatchObject({ plan: "team", readOnly: false });
  });

  it("a failed payment (past due) locks the same way; a shop within the free plan is not locked", async () => {
    const big = await createPerson(app, "pastdue-owner");
    await upgrade(big, 2);
    const p = await createPerson(app, "pastdue-prog");
    await joinShop(p.userId, big.shopId, "programmer");
    await standIns.payments.setSubscriptionStatus((await findSubscription(big.shopId))!.providerSubscriptionId!, "past_due");
    const plan = shopPlanSchema.parse((await p.agent.get(`/api/shops/${big.shopId}/plan`)).body);
    expect(plan.readOnly).toBe(true);
    expect(plan.readOnlyReason).toMatch(/payment for the team plan failed/);

    const small = await createPerson(app, "pastdue-small");
    await upgrade(small, 1);
    await standIns.payments.setSubscriptionStatus((await findSubscription(small.shopId))!.providerSubscriptionId!, "canceled");
    expect(shopPlanSchema.parse((await small.agent.get(`/api/shops/${small.shopId}/plan`)).body)).toMatchObject({ plan: "free", readOnly: false });
  });
});

describe("POST /api/billing/webhook", () => {
  const post = (payload: string, signature?: string) => {
    const req = request(app).post("/api/billing/webhook").set("Content-Type", "application/json");
    return (signature ? req.set("Stripe-Signature", signature) : req).send(payload);
  };

  it("answers 400 for a bad or missing signature and changes nothing", async () => {
    const payload = JSON.stringify({ id: "evt_forged", object: "event", type: "customer.subscription.updated", data: { object: {} } });
    const forged = signer.webhooks.generateTestHeaderString({ payload, secret: "whsec_someone_elses_secret" });
    const bad = await post(payload, forged);
    expect(bad.status).toBe(400);
    expect(errorOf(bad.body).message).toBe("The webhook signature is not valid.");
    const missing = await post(payload);
    expect(missing.status).toBe(400);
    const tampered = signer.webhooks.generateTestHeaderString({ payload, secret: STAND_IN_WEBHOOK_SECRET });
    expect((await post(payload.replace("evt_forged", "evt_other"), tampered)).status).toBe(400);
    const [rows] = await getSequelize().query(`SELECT 1 FROM billing_events WHERE event_id IN ('evt_forged', 'evt_other')`);
    expect(rows).toHaveLength(0);
  });

  it("processes each event once: a replayed event changes nothing", async () => {
    const owner = await createPerson(app, "replay-owner");
    await upgrade(owner, 2);
    const sub = await findSubscription(owner.shopId);
    const created = standIns.payments.events.find(
      (e) => e.event.type === "customer.subscription.created" && (e.event.data.object as { id: string }).id === sub!.providerSubscriptionId,
    );
    expect(created?.deliveries.at(-1)?.status).toBe(200);

    // The shop's state moves on (seats 2 → 5); then the old event is delivered again.
    await owner.agent.post(`/api/shops/${owner.shopId}/billing/seats`).send({ seats: 5 }).expect(200);
    await standIns.payments.settled();
    // Make the provider's answer differ from the stored state: a re-processed event would copy it.
    standIns.payments.subscription(sub!.providerSubscriptionId!)!.items.data[0]!.quantity = 9;
    const payload = JSON.stringify(created!.event);
    const replay = await post(payload, signer.webhooks.generateTestHeaderString({ payload, secret: STAND_IN_WEBHOOK_SECRET }));
    expect(replay.status).toBe(200);
    expect(replay.body).toEqual({ received: true, duplicate: true });
    expect((await findSubscription(owner.shopId))?.seats).toBe(5);
    standIns.payments.subscription(sub!.providerSubscriptionId!)!.items.data[0]!.quantity = 5;
  });

  it("acknowledges events it does not act on, once", async () => {
    const payload = JSON.stringify({ id: `evt_misc_${Date.now()}`, object: "event", type: "customer.created", data: { object: { id: "cus_x" } } });
    const header = () => signer.webhooks.generateTestHeaderString({ payload, secret: STAND_IN_WEBHOOK_SECRET });
    expect((await post(payload, header())).body).toEqual({ received: true, duplicate: false });
    expect((await post(payload, header())).body).toEqual({ received: true, duplicate: true });
  });
});

describe("assertCanAddMachine (for the machines module)", () => {
  it("allows one machine on the free plan and any number on the team plan", async () => {
    const owner = await createPerson(app, "machine-owner");
    await expect(assertCanAddMachine(owner.shopId)).resolves.toBeUndefined();
    await getSequelize().query(`INSERT INTO machines (shop_id, name, kind, spindle, axes) VALUES ($1, 'Test gantry', 'router', '{}', '{}')`, {
      bind: [owner.shopId],
    });
    await expect(assertCanAddMachine(owner.shopId)).rejects.toThrow(/free plan includes 1 machine.*Billing page/);
    await upgrade(owner, 1);
    await expect(assertCanAddMachine(owner.shopId)).resolves.toBeUndefined();
  });
});
