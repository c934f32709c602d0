import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { useDocumentTitle } from "@/lib/use-document-title";
import { areaByKey, type AreaKey } from "../areas";

/** An area that exists in the navigation but is not built yet: says so, and what it will hold. */
export function AreaPlaceholder({ area: key }: { area: AreaKey }) {
  const area = areaByKey(key);
  useDocumentTitle(area.label);
  return (
    <div className="mx-auto flex max-w-5xl flex-col gap-6">
      <header>
        <h1 className="text-xl font-semibold text-ink">{area.label}</h1>
        <p className="mt-1 text-sm text-muted">{area.purpose}</p>
      </header>
      <Card>
        <EmptyState icon={area.icon} title={`The ${area.label.toLowerCase()} area is not available yet`}>
          <p>{area.comingUp}</p>
        </EmptyState>
      </Card>
    </div>
  );
}
