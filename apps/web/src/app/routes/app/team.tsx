import { AreaPlaceholder } from "@/features/shell/components/area-placeholder";

export function TeamRoute() {
  return <AreaPlaceholder area="team" />;
}
