import { MAX_SEATS, type BillingStatus, type SeatPrice } from "@ringdown/contracts";
import { CreditCard } from "lucide-react";
import { useEffect, useRef, useState } from "react";
import { useSearchParams } from "react-router-dom";
import { z } from "zod";
import { Badge, type BadgeTone } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { Notice, PageHeader } from "@/components/ui/page-header";
import { LoadingState } from "@/components/ui/spinner";
import { useActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useDocumentTitle } from "@/lib/use-document-title";
import { useBilling, useCancelPlan, useChangeSeats, useConfirmCheckout, useResumePlan, useStartCheckout } from "../api/billing";

const seatsFormSchema = z.object({
  seats: z.coerce
    .number<string>({ error: "Enter a whole number of seats" })
    .int("Enter a whole number of seats")
    .min(1, "At least 1 seat")
    .max(MAX_SEATS, `At most ${MAX_SEATS} seats online`),
});

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: "long" });

function money(amountMinor: number, currency: string): string {
  return new Intl.NumberFormat(undefined, { style: "currency", currency: currency.toUpperCase() }).format(amountMinor / 100);
}

function priceLine(price: SeatPrice, seats: number): string {
  return `${money(price.unitAmountMinor, price.currency)} per seat per ${price.interval} · ${seats} ${seats === 1 ? "seat" : "seats"} = ${money(price.unitAmountMinor * seats, price.currency)} per ${price.interval}`;
}

const statusWords: Record<BillingStatus["subscriptionStatus"], { label: string; tone: BadgeTone }> = {
  none: { label: "free plan", tone: "neutral" },
  active: { label: "active", tone: "ok" },
  trialing: { label: "trial", tone: "ok" },
  incomplete: { label: "payment pending", tone: "near" },
  incomplete_expired: { label: "payment never completed", tone: "limit" },
  past_due: { label: "payment failed", tone: "limit" },
  unpaid: { label: "unpaid", tone: "limit" },
  canceled: { label: "ended", tone: "neutral" },
  paused: { label: "paused", tone: "near" },
};

function errorText(error: unknown): string {
  return isApiError(error) || error instanceof Error ? error.message : "Something went wrong. Try again.";
}

/** The Billing area (owners): plan, seats, renewal, upgrade, change seats, cancel at period end. */
export function BillingPage() {
  useDocumentTitle("Billing");
  const shop = useActiveShop();
  if (!shop || shop.role !== "owner") {
    return (
      <div className="mx-auto flex max-w-3xl flex-col gap-6">
        <PageHeader title="Billing" description="Seats and payment for this shop." />
        <Card>
          <EmptyState icon={CreditCard} title="Only the shop's owners manage billing">
            <p>Ask an owner of {shop?.shopName ?? "this shop"} to change the plan or the number of seats.</p>
          </EmptyState>
        </Card>
      </div>
    );
  }
  return <BillingForShop shopId={shop.shopId} shopName={shop.shopName} />;
}

function BillingForShop({ shopId, shopName }: { shopId: string; shopName: string }) {
  const billing = useBilling(shopId);
  const [search, setSearch] = useSearchParams();
  const confirm = useConfirmCheckout(shopId);
  const [notice, setNotice] = useState<{ tone: "ok" | "limit"; text: string } | null>(null);
  const confirmed = useRef(false);

  // Back from the provider's checkout: read the result once, then clean the address.
  useEffect(() => {
    const outcome = search.get("checkout");
    const sessionId = search.get("session_id");
    if (!outcome || confirmed.current) return;
    confirmed.current = true;
    if (outcome === "cancelled") setNotice({ tone: "ok", text: "Checkout cancelled. Nothing was charged and the plan is unchanged." });
    if (outcome === "done" && sessionId) {
      confirm.mutate(sessionId, {
        onSuccess: (status) =>
          setNotice({ tone: "ok", text: `Payment received: ${shopName} is on the team plan with ${status.seats.paid} paid seats.` }),
        onError: (error) => setNotice({ tone: "limit", text: errorText(error) }),
      });
    }
    setSearch({}, { replace: true });
  }, [search, setSearch, confirm, shopName]);

  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <PageHeader title="Billing" description={`Plan, seats and payment for ${shopName}. Only owners see this page.`} />
      {confirm.isPending && <Notice>Confirming the payment with the provider…</Notice>}
      {notice && (
        <Notice tone={notice.tone} onDismiss={() => setNotice(null)}>
          {notice.text}
        </Notice>
      )}
      {billing.isPending && <LoadingState label="Loading the plan…" />}
      {billing.isError && (
        <Notice tone="limit">
          {billing.error.message}{" "}
          <button type="button" className="cursor-pointer underline" onClick={() => void billing.refetch()}>
            Try again
          </button>
        </Notice>
      )}
      {billing.data && <BillingDetails shopId={shopId} status={billing.data} onNotice={setNotice} />}
    </div>
  );
}

function BillingDetails({
  shopId,
  status,
  onNotice,
}: {
  shopId: string;
  status: BillingStatus;
  onNotice: (n: { tone: "ok" | "limit"; text: string }) => void;
}) {
  const team = status.plan === "team";
  const word = statusWords[status.subscriptionStatus];
  const seats = status.seats;
  return (
    <>
      {status.readOnly && (
        <Notice tone="limit">
          <strong>The shop is read-only for everyone but its owners.</strong> {status.readOnlyReason}
        </Notice>
      )}
      <Card>
        <CardHeader
          title={team ? "Team plan" : "Free plan"}
          description={team ? "Billed per paid seat per month." : "1 paid seat and 1 machine. Operators are free on every plan."}
          actions={<Badge tone={word.tone}>{word.label}</Badge>}
        />
        <CardBody>
          <dl className="grid grid-cols-1 gap-x-8 gap-y-3 text-sm sm:grid-cols-2">
            <div>
              <dt className="text-muted">Paid seats in use</dt>
              <dd className="text-lg font-semibold text-ink tabular-nums" data-testid="seats-used">
                {seats.used} of {seats.paid}
              </dd>
              <dd className="text-xs text-muted">
                {seats.owners} owner{seats.owners === 1 ? "" : "s"}, {seats.toolingManagers} tooling manager
                {seats.toolingManagers === 1 ? "" : "s"}, {seats.programmers} programmer{seats.programmers === 1 ? "" : "s"},{" "}
                {seats.pendingInvitations} pending invitation{seats.pendingInvitations === 1 ? "" : "s"} · {seats.operators} operator
                {seats.operators === 1 ? "" : "s"} (free)
              </dd>
            </div>
            <div>
              <dt className="text-muted">Machines</dt>
              <dd className="text-lg font-semibold text-ink tabular-nums">
                {status.machines.used}
                {status.machines.limit !== null ? ` of ${status.machines.limit}` : ""}
              </dd>
              <dd className="text-xs text-muted">{status.machines.limit === null ? "No limit on the team plan." : "Upgrade for more."}</dd>
            </div>
            {status.currentPeriodEnd && (
              <div>
                <dt className="text-muted">{status.cancelAtPeriodEnd ? "Plan ends on" : team ? "Next renewal" : "Ended on"}</dt>
                <dd className="font-medium text-ink" data-testid="renewal">
                  {dateFormat.format(new Date(status.currentPeriodEnd))}
                </dd>
              </div>
            )}
            <div>
              <dt className="text-muted">Price</dt>
              <dd className="font-medium text-ink tabular-nums">
                {status.seatPrice ? priceLine(status.seatPrice, team ? seats.paid : Math.max(seats.used, 1)) : "Unavailable right now"}
              </dd>
            </div>
          </dl>
        </CardBody>
      </Card>

      {!status.billingAvailable ? (
        <Notice tone="limit">Payments are not configured on this server, so the plan cannot be changed here.</Notice>
      ) : team ? (
        <TeamPlanActions shopId={shopId} status={status} onNotice={onNotice} />
      ) : (
        <UpgradeCard shopId={shopId} status={status} />
      )}
    </>
  );
}

function UpgradeCard({ shopId, status }: { shopId: string; status: BillingStatus }) {
  const start = useStartCheckout(shopId);
  const minimum = Math.max(1, status.seats.used);
  return (
    <Card>
      <CardHeader
        title="Upgrade to the team plan"
        description="Choose how many paid seats to buy. You finish the payment on the payment provider's page and come back here."
      />
      <CardBody>
        <Form
          schema={seatsFormSchema}
          defaultValues={{ seats: String(Math.max(minimum, 2)) }}
          aria-label="Upgrade to the team plan"
          className="flex flex-col gap-4 sm:flex-row sm:items-start"
          onSubmit={async (values) => {
            const { url } = await start.mutateAsync(values.seats);
            window.location.assign(url);
          }}
        >
          {({ formState }) => (
            <>
              <div className="sm:w-full">
                <FormError />
              </div>
              <TextField name="seats" label="Paid seats" type="number" inputMode="numeric" min={minimum} max={MAX_SEATS} hint={`At least ${minimum} (in use now).`} />
              <Button type="submit" pending={formState.isSubmitting} className="sm:mt-7">
                Continue to payment
              </Button>
            </>
          )}
        </Form>
      </CardBody>
    </Card>
  );
}

function TeamPlanActions({
  shopId,
  status,
  onNotice,
}: {
  shopId: string;
  status: BillingStatus;
  onNotice: (n: { tone: "ok" | "limit"; text: string }) => void;
}) {
  const change = useChangeSeats(shopId);
  const cancel = useCancelPlan(shopId);
  const resume = useResumePlan(shopId);
  const [confirming, setConfirming] = useState(false);
  const ends = status.currentPeriodEnd ? dateFormat.format(new Date(status.currentPeriodEnd)) : "the end of the period";
  return (
    <>
      <Card>
        <CardHeader title="Change seats" description="Added seats are billed pro rata for the rest of the period; removed seats are credited." />
        <CardBody>
          <Form
            key={status.seats.paid}
            schema={seatsFormSchema}
            defaultValues={{ seats: String(status.seats.paid) }}
            aria-label="Change seats"
            className="flex flex-col gap-4 sm:flex-row sm:items-start"
            onSubmit={async (values) => {
              const updated = await change.mutateAsync(values.seats);
              onNotice({ tone: "ok", text: `The team plan now has ${updated.seats.paid} paid seats.` });
            }}
          >
            {({ formState }) => (
              <>
                <div className="sm:w-full">
                  <FormError />
                </div>
                <TextField
                  name="seats"
                  label="Paid seats"
                  type="number"
                  inputMode="numeric"
                  min={Math.max(1, status.seats.used)}
                  max={MAX_SEATS}
                  hint={`${status.seats.used} in use now.`}
                />
                <Button type="submit" pending={formState.isSubmitting} className="sm:mt-7">
                  Update seats
                </Button>
              </>
            )}
          </Form>
        </CardBody>
      </Card>
      <Card>
        <CardHeader
          title={status.cancelAtPeriodEnd ? "Cancellation planned" : "Cancel the team plan"}
          description={
            status.cancelAtPeriodEnd
              ? `The team plan ends on ${ends}. Nothing is deleted; if the shop then holds more than the free plan allows, it becomes read-only for everyone but owners.`
              : `The plan stays active until ${ends}, then ends. Nothing is deleted.`
          }
        />
        <CardBody>
          {status.cancelAtPeriodEnd ? (
            <Button
              variant="secondary"
              pending={resume.isPending}
              onClick={() =>
                resume.mutate(undefined, {
                  onSuccess: () => onNotice({ tone: "ok", text: "The team plan will renew as usual." }),
                  onError: (error) => onNotice({ tone: "limit", text: errorText(error) }),
                })
              }
            >
              Keep the team plan
            </Button>
          ) : (
            <Button variant="secondary" onClick={() => setConfirming(true)}>
              Cancel at period end
            </Button>
          )}
        </CardBody>
      </Card>
      <ConfirmDialog
        open={confirming}
        onClose={() => {
          setConfirming(false);
          cancel.reset();
        }}
        title="Cancel the team plan at the period end?"
        confirmLabel="Cancel at period end"
        danger
        pending={cancel.isPending}
        error={cancel.error ? errorText(cancel.error) : null}
        onConfirm={() =>
          cancel.mutate(undefined, {
            onSuccess: () => {
              setConfirming(false);
              onNotice({ tone: "ok", text: `The team plan will end on ${ends}.` });
            },
          })
        }
      >
        <p>
          The team plan stays active until {ends}. After that the shop is on the free plan (1 paid seat, 1 machine); if it holds
          more, it becomes read-only for everyone but owners until the plan is renewed. No data is deleted.
        </p>
      </ConfirmDialog>
    </>
  );
}
