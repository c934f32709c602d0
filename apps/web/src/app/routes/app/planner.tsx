import { AreaPlaceholder } from "@/features/shell/components/area-placeholder";

export function PlannerRoute() {
  return <AreaPlaceholder area="planner" />;
}
