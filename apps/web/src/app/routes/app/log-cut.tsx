import type { CutLog } from "@ringdown/contracts";
import { CheckCircle2 } from "lucide-react";
import { useEffect, useState } from "react";
import { Link, useParams, useSearchParams } from "react-router-dom";
import { SafetyBand } from "@/components/recommendation/safety-band";
import { Button } from "@/components/ui/button";
import { LoadingState } from "@/components/ui/spinner";
import { MeasureValue } from "@/components/ui/measure";
import { measures } from "@/components/ui/units";
import { CutLogForm } from "@/features/cut-logs/components/cut-log-form";
import { OutcomeBadge } from "@/features/cut-logs/components/outcome-badge";
import { useRecipe } from "@/features/recipes/api/get-recipe";
import { useRecommendation } from "@/features/recipes/api/get-recommendation";
import { useSwitchShop } from "@/features/shell/api/update-me";
import { useActiveShop, type ActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useMe, useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";
import { RecipeNotFound } from "./recipe";

function LogForShop({ shop, recipeId }: { shop: ActiveShop; recipeId: string }) {
  const system = useUnitSystem();
  const recipe = useRecipe(shop.shopId, recipeId);
  const r = recipe.data;
  // The depths the engine actually uses (it may take less than asked, in more passes).
  const server = useRecommendation(shop.shopId, r ? { assemblyId: r.assemblyId, materialId: r.materialId, operation: r.operation, params: r.params } : null);
  const [logged, setLogged] = useState<CutLog | null>(null);
  const [formKey, setFormKey] = useState(0);
  useDocumentTitle(r ? `Log a cut: ${r.name}` : "Log a cut");

  if (recipe.isPending || (server.isPending && !server.isError)) return <LoadingState label="Loading the recipe…" />;
  if (recipe.isError) {
    if (isApiError(recipe.error) && recipe.error.status === 404) return <RecipeNotFound message="It does not exist in this shop, or it is not open for logging to you." />;
    return (
      <p role="alert" className="text-sm text-limit">
        Cannot load the recipe: {recipe.error.message}
      </p>
    );
  }
  const rec = recipe.data;
  const used = server.data?.recommendation;

  if (logged) {
    return (
      <div role="status" className="flex flex-col items-start gap-4">
        <p className="flex items-center gap-2 text-lg font-semibold text-ok">
          <CheckCircle2 className="size-6" aria-hidden />
          Cut logged. Thank you.
        </p>
        <p className="flex flex-wrap items-center gap-2 text-sm text-ink">
          <OutcomeBadge outcome={logged.outcome} /> at <MeasureValue value={logged.actualRpm} measure={measures.rpm} system={system} /> and{" "}
          <MeasureValue value={logged.actualFeedMmPerMin} measure={measures.feedRate} system={system} />
          {logged.photos.length > 0 && `, ${logged.photos.length} ${logged.photos.length === 1 ? "photo" : "photos"}`}.
        </p>
        <div className="grid w-full grid-cols-2 gap-2">
          <Button
            variant="secondary"
            className="h-12"
            onClick={() => {
              setLogged(null);
              setFormKey((k) => k + 1);
            }}
          >
            Log another cut
          </Button>
          <Link to={`/recipes/${rec.id}`} className="inline-flex h-12 items-center justify-center rounded-md bg-brand px-4 text-sm font-medium text-white hover:bg-brand-strong">
            Open the recipe
          </Link>
        </div>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-5">
      <header>
        <p className="text-sm text-muted">Log a cut · {rec.machineName}</p>
        <h1 className="text-xl leading-tight font-semibold text-ink">{rec.name}</h1>
        <p className="mt-1 text-sm text-muted">
          {rec.cutterName} in {rec.materialName}
        </p>
      </header>
      <CutLogForm
        key={formKey}
        shopId={shop.shopId}
        recipe={rec}
        system={system}
        defaults={{
          rpm: rec.result.rpm,
          feedMmPerMin: rec.result.feedMmPerMin,
          // To the micrometre: what a person would read off a setup sheet.
          axialDepthMm: Number((used?.axialDepthMm ?? rec.params.axialDepthMm).toFixed(3)),
          radialDepthMm: Number((used?.radialDepthMm ?? rec.params.radialDepthMm).toFixed(3)),
        }}
        onLogged={setLogged}
      />
      <SafetyBand />
    </div>
  );
}

/**
 * The phone cut-log form the setup card's QR code opens. The code carries the shop: a person
 * working for several shops is switched to it first, when they belong to it.
 */
export function LogCutRoute() {
  const { recipeId = "" } = useParams();
  const [search] = useSearchParams();
  const wantedShop = search.get("shop");
  const me = useMe();
  const shop = useActiveShop();
  const switchShop = useSwitchShop();
  const member = Boolean(wantedShop && me.data?.memberships.some((m) => m.shopId === wantedShop));
  const mustSwitch = member && shop?.shopId !== wantedShop;

  useEffect(() => {
    if (mustSwitch && wantedShop && switchShop.isIdle) switchShop.mutate(wantedShop);
  }, [mustSwitch, wantedShop, switchShop]);

  let body;
  if (wantedShop && !member && me.data) {
    body = <RecipeNotFound message="This code belongs to a shop you are not a member of. Ask its owner to add you." />;
  } else if (mustSwitch) {
    body = switchShop.isError ? (
      <p role="alert" className="text-sm text-limit">
        Cannot switch to the recipe's shop: {switchShop.error.message}
      </p>
    ) : (
      <LoadingState label="Switching to the recipe's shop…" />
    );
  } else if (shop) {
    body = <LogForShop key={`${shop.shopId}:${recipeId}`} shop={shop} recipeId={recipeId} />;
  } else body = null;
  return <div className="mx-auto max-w-lg">{body}</div>;
}
