/**
 * What a shop's subscription and usage allow: the plan, the seats, the machine limit and whether
 * a lapsed team plan has made the shop read-only. Pure: tests check the rules without a database.
 */
import { FREE_PLAN_MACHINES, FREE_PLAN_SEATS, type ShopPlan, type SubscriptionStatus } from "@ringdown/contracts";
import type { ShopUsage, SubscriptionRecord } from "./billing.repository.js";

/** The provider's states in which the team plan is paid for. */
export const PAID_STATUSES: readonly SubscriptionStatus[] = ["active", "trialing"];
/** States of a team plan that is no longer paid for. */
const LAPSED_STATUSES: readonly SubscriptionStatus[] = ["past_due", "unpaid", "canceled", "incomplete_expired", "paused"];

export function isTeamPlan(sub: SubscriptionRecord | null): boolean {
  return sub !== null && PAID_STATUSES.includes(sub.status);
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

export function computePlan(sub: SubscriptionRecord | null, usage: ShopUsage): ShopPlan {
  const team = sub !== null && isTeamPlan(sub);
  const paidMembers = usage.owners + usage.toolingManagers + usage.programmers;
  const overFreePlan = paidMembers > FREE_PLAN_SEATS || usage.machines > FREE_PLAN_MACHINES;
  // A shop that never subscribed is not locked: limits are enforced when people and machines are
  // added. Only a team plan that stopped being paid for, in a shop bigger than the free plan,
  // drops the shop to read-only (nothing is deleted).
  const lapsed = !team && sub !== null && LAPSED_STATUSES.includes(sub.status) && overFreePlan;
  let readOnlyReason: string | null = null;
  if (lapsed && sub) {
    readOnlyReason =
      sub.status === "past_due" || sub.status === "unpaid"
        ? "The last payment for the team plan failed, so the shop is read-only for everyone but its owners. Nothing has been deleted; the owner can renew the team plan on the Billing page."
        : "The team plan has ended and the shop holds more than the free plan allows (1 paid seat, 1 machine), so it is read-only for everyone but its owners. Nothing has been deleted; the owner can renew the team plan on the Billing page.";
  }
  return {
    plan: team ? "team" : "free",
    readOnly: lapsed,
    readOnlyReason,
    seats: {
      used: paidMembers + usage.pendingPaidInvitations,
      paid: team && sub ? sub.seats : FREE_PLAN_SEATS,
      owners: usage.owners,
      toolingManagers: usage.toolingManagers,
      programmers: usage.programmers,
      pendingInvitations: usage.pendingPaidInvitations,
      operators: usage.operators,
    },
    machines: { used: usage.machines, limit: team ? null : FREE_PLAN_MACHINES },
  };
}

/** Why one more paid seat is refused, and how to get one. */
export function seatLimitMessage(plan: ShopPlan): string {
  const s = plan.seats;
  const people = plural(s.used - s.pendingInvitations, "person", "people");
  const taken = s.pendingInvitations > 0 ? `${people} and ${plural(s.pendingInvitations, "pending invitation", "pending invitations")}` : people;
  if (plan.plan === "free") {
    return (
      `The free plan includes ${FREE_PLAN_SEATS} paid seat (owners, tooling managers and programmers) and it is taken by ${taken}. ` +
      "To add someone who edits, the owner can upgrade to the team plan on the Billing page. Operators are free and unlimited."
    );
  }
  return (
    `All ${plural(s.paid, "paid seat", "paid seats")} are in use (${taken}). ` +
    "The owner can add seats on the Billing page (Change seats), or invite this person as an operator: operators are free."
  );
}

export function machineLimitMessage(): string {
  return `The free plan includes ${FREE_PLAN_MACHINES} machine and it is in use. The owner can upgrade to the team plan on the Billing page to measure more machines.`;
}
