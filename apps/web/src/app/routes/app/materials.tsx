import { AreaPlaceholder } from "@/features/shell/components/area-placeholder";

export function MaterialsRoute() {
  return <AreaPlaceholder area="materials" />;
}
