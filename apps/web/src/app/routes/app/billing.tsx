import { BillingPage } from "@/features/billing/components/billing-page";

export function BillingRoute() {
  return <BillingPage />;
}
