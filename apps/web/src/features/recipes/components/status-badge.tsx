import type { RecipeStatus } from "@ringdown/contracts";
import { Badge } from "@/components/ui/badge";
import { statusLabels, statusTones } from "../labels";

export function RecipeStatusBadge({ status }: { status: RecipeStatus }) {
  return <Badge tone={statusTones[status]}>{statusLabels[status]}</Badge>;
}
