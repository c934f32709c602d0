import { AreaPlaceholder } from "@/features/shell/components/area-placeholder";

export function MachinesRoute() {
  return <AreaPlaceholder area="machines" />;
}
