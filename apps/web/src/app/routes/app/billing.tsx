import { AreaPlaceholder } from "@/features/shell/components/area-placeholder";

export function BillingRoute() {
  return <AreaPlaceholder area="billing" />;
}
