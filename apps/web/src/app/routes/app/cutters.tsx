import { AreaPlaceholder } from "@/features/shell/components/area-placeholder";

export function CuttersRoute() {
  return <AreaPlaceholder area="cutters" />;
}
