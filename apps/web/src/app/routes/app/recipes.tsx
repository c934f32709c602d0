import { AreaPlaceholder } from "@/features/shell/components/area-placeholder";

export function RecipesRoute() {
  return <AreaPlaceholder area="recipes" />;
}
