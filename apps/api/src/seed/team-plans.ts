/**
 * The demo shops' plans: both on the team plan with a couple of seats to spare, so the demo
 * owners can invite without upgrading first. The subscriptions are created through the payment
 * SDK (an invoiced subscription at the local fake, or wherever STRIPE_API_URL points); without a
 * reachable provider the plan is recorded locally only. Idempotent: a shop with a plan is left alone.
 */
import { readConfig } from "../config/env.js";
import { findSubscription } from "../modules/billing/billing.repository.js";
import { grantTeamPlan } from "../modules/billing/billing.service.js";
import { isTeamPlan } from "../modules/billing/plan.js";
import { demoShopIds } from "./demo-ids.js";

const plans = [
  // Owner, tooling manager, two programmers = 4 paid seats; 6 bought.
  { shopId: demoShopIds.quillfeather, seats: 6 },
  // Owner and the contract programmer = 2; 3 bought.
  { shopId: demoShopIds.ostrander, seats: 3 },
];

export async function seedTeamPlans(log: (line: string) => void = () => undefined): Promise<number> {
  let created = 0;
  for (const plan of plans) {
    if (isTeamPlan(await findSubscription(plan.shopId))) continue;
    const where = await grantTeamPlan(plan.shopId, plan.seats, readConfig());
    if (where === "local") log(`demo seed: the payment provider was not reachable; the team plan of shop ${plan.shopId} is recorded locally only`);
    created++;
  }
  return created;
}
