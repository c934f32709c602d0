import { useParams } from "react-router-dom";
import { LoadingState } from "@/components/ui/spinner";
import { useAssembly } from "@/features/planner/api/get-assembly";
import { useCutter } from "@/features/planner/api/get-cutters";
import { useRecipe } from "@/features/recipes/api/get-recipe";
import { useRecommendation } from "@/features/recipes/api/get-recommendation";
import { SetupCard } from "@/features/recipes/components/setup-card";
import { useActiveShop, type ActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";
import { RecipeNotFound } from "./recipe";

/** The absolute address the card's QR code opens: the phone cut-log form of this recipe, in this shop. */
export function cutLogUrl(origin: string, shopId: string, recipeId: string): string {
  return `${origin}/log/${encodeURIComponent(recipeId)}?shop=${encodeURIComponent(shopId)}`;
}

function Card({ shop, recipeId }: { shop: ActiveShop; recipeId: string }) {
  const system = useUnitSystem();
  const recipe = useRecipe(shop.shopId, recipeId);
  const r = recipe.data;
  const assembly = useAssembly(shop.shopId, r?.assemblyId ?? null);
  const cutter = useCutter(shop.shopId, r?.cutterId ?? null);
  const server = useRecommendation(
    shop.shopId,
    r ? { assemblyId: r.assemblyId, materialId: r.materialId, operation: r.operation, params: r.params } : null,
  );
  useDocumentTitle(r ? `Setup card: ${r.name}` : "Setup card");

  if (recipe.isPending) return <LoadingState label="Loading the recipe…" />;
  if (recipe.isError) {
    if (isApiError(recipe.error) && recipe.error.status === 404) return <RecipeNotFound message="It does not exist in this shop, or it is not available to you." />;
    return (
      <p role="alert" className="text-sm text-limit">
        Cannot load the recipe: {recipe.error.message}
      </p>
    );
  }
  if (server.isPending && !server.isError) return <LoadingState label="Computing the limits…" />;
  return (
    <SetupCard
      recipe={recipe.data}
      assembly={assembly.data ?? null}
      cutter={cutter.data ?? null}
      rec={server.data?.recommendation ?? null}
      system={system}
      logUrl={cutLogUrl(window.location.origin, shop.shopId, recipe.data.id)}
    />
  );
}

export function RecipeCardRoute() {
  const { recipeId = "" } = useParams();
  const shop = useActiveShop();
  return shop ? <Card key={`${shop.shopId}:${recipeId}`} shop={shop} recipeId={recipeId} /> : null;
}
