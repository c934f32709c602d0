import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { useCutters } from "@/features/planner/api/get-cutters";
import { useMachines } from "@/features/planner/api/get-machines";
import { useMaterials } from "@/features/planner/api/get-materials";
import { RecipesPage } from "@/features/recipes/components/recipes-page";
import { useActiveShop, type ActiveShop } from "@/lib/active-shop";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";

const byLabel = (a: { label: string }, b: { label: string }) => a.label.localeCompare(b.label);

function RecipesForShop({ shop }: { shop: ActiveShop }) {
  const system = useUnitSystem();
  const machines = useMachines(shop.shopId);
  const materials = useMaterials(shop.shopId);
  const cutters = useCutters(shop.shopId);
  const options = {
    machines: (machines.data?.items ?? []).map((m) => ({ value: m.id, label: m.name })).sort(byLabel),
    materials: (materials.data?.items ?? []).map((m) => ({ value: m.id, label: m.name })).sort(byLabel),
    cutters: (cutters.data?.items ?? []).map((c) => ({ value: c.id, label: c.name })).sort(byLabel),
  };
  return <RecipesPage shopId={shop.shopId} role={shop.role} system={system} options={options} />;
}

export function RecipesRoute() {
  useDocumentTitle("Recipes");
  const shop = useActiveShop();
  return (
    <div className="mx-auto flex max-w-7xl flex-col gap-6">
      <PageHeader
        title="Recipes"
        description={
          shop?.role === "operator"
            ? "The recipes approved for use in this shop. Open one for its setup card and to log how a cut went."
            : "The shop's saved recipes, their status and the cuts logged against them."
        }
      />
      {shop ? (
        <RecipesForShop key={shop.shopId} shop={shop} />
      ) : (
        <Card>
          <EmptyState title="No shop selected">
            <p>Create a shop or ask to be added to one to see its recipes.</p>
          </EmptyState>
        </Card>
      )}
    </div>
  );
}
