import { ClipboardList } from "lucide-react";
import { Link, useParams } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { LoadingState } from "@/components/ui/spinner";
import { useRecipeCutLogs } from "@/features/cut-logs/api/get-recipe-cut-logs";
import { RecipeCutLogs } from "@/features/cut-logs/components/recipe-cut-logs";
import { useAssemblies } from "@/features/planner/api/get-assemblies";
import { useRecipe } from "@/features/recipes/api/get-recipe";
import { RecipeDetail } from "@/features/recipes/components/recipe-detail";
import { useActiveShop, type ActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";

export function RecipeNotFound({ message }: { message: string }) {
  return (
    <Card>
      <EmptyState
        icon={ClipboardList}
        title="Recipe not found"
        action={
          <Link to="/recipes" className="inline-flex h-10 items-center rounded-md bg-brand px-4 text-sm font-medium text-white hover:bg-brand-strong">
            Back to recipes
          </Link>
        }
      >
        <p>{message}</p>
      </EmptyState>
    </Card>
  );
}

function RecipeForShop({ shop, recipeId }: { shop: ActiveShop; recipeId: string }) {
  const system = useUnitSystem();
  const recipe = useRecipe(shop.shopId, recipeId);
  const logs = useRecipeCutLogs(shop.shopId, recipeId);
  const assemblies = useAssemblies(shop.shopId, null, shop.role !== "operator");
  useDocumentTitle(recipe.data?.name ?? "Recipe");

  if (recipe.isPending) return <LoadingState label="Loading the recipe…" />;
  if (recipe.isError) {
    if (isApiError(recipe.error) && recipe.error.status === 404) {
      return (
        <RecipeNotFound
          message={
            shop.role === "operator"
              ? "It does not exist in this shop, or it is not approved yet: operators see approved recipes only."
              : "It does not exist in this shop, or it was deleted."
          }
        />
      );
    }
    return (
      <p role="alert" className="text-sm text-limit">
        Cannot load the recipe: {recipe.error.message}
      </p>
    );
  }
  const r = recipe.data;
  const clean = (logs.data?.items ?? []).filter((l) => l.outcome === "clean" && l.machineId === r.machineId).length;
  return (
    <RecipeDetail
      shopId={shop.shopId}
      role={shop.role}
      system={system}
      recipe={r}
      cleanCutsOnMachine={clean}
      copyTargets={assemblies.data?.items}
      copyTargetsError={assemblies.isError ? assemblies.error.message : null}
      cutLog={<RecipeCutLogs shopId={shop.shopId} recipeId={r.id} system={system} />}
    />
  );
}

export function RecipeRoute() {
  const { recipeId = "" } = useParams();
  const shop = useActiveShop();
  return <div className="mx-auto max-w-7xl">{shop ? <RecipeForShop key={`${shop.shopId}:${recipeId}`} shop={shop} recipeId={recipeId} /> : null}</div>;
}
