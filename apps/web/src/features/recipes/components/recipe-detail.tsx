import type { Assembly, Recipe, Role, UnitSystem } from "@ringdown/contracts";
import { ArrowLeft, ClipboardPen, Copy, Gauge, Pencil, Printer, RefreshCw, Trash2 } from "lucide-react";
import { useId, useState, type ReactNode } from "react";
import { Link, useNavigate } from "react-router-dom";
import { HeldBack } from "@/components/recommendation/held-back";
import { LimitBars } from "@/components/recommendation/limit-bars";
import { SafetyBand } from "@/components/recommendation/safety-band";
import { RecommendationWarnings } from "@/components/recommendation/warnings";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Notice, PageHeader } from "@/components/ui/page-header";
import { LoadingState, Spinner } from "@/components/ui/spinner";
import { LoadError } from "@/components/ui/load-error";
import { cn } from "@/lib/cn";
import { useDeleteRecipe } from "../api/delete-recipe";
import { useRecommendation } from "../api/get-recommendation";
import { operationLabels, statusLabels } from "../labels";
import { canDeleteRecipe, canEditRecipes, lifeActions, type LifeAction } from "../life-cycle";
import { CopyDialog } from "./copy-dialog";
import { EditRecipeSheet } from "./edit-dialog";
import { RevisionHistory, TransitionHistory } from "./history";
import { LadderSection } from "./ladder-section";
import { RecipeNumbers, RecipeSetup } from "./recipe-summary";
import type { DeletedRecipeState } from "./recipes-page";
import { RecipeStatusBadge } from "./status-badge";
import { TransitionDialog } from "./transition-dialog";

export function Section({ title, description, actions, children, className }: { title: string; description?: ReactNode; actions?: ReactNode; children: ReactNode; className?: string }) {
  const id = useId();
  return (
    <Card className={className}>
      <section aria-labelledby={id} className="flex flex-col gap-4 px-5 py-4">
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div>
            <h2 id={id} className="text-base font-semibold text-ink">
              {title}
            </h2>
            {description && <div className="mt-0.5 text-xs text-muted">{description}</div>}
          </div>
          {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
        </div>
        {children}
      </section>
    </Card>
  );
}

const linkButton =
  "inline-flex h-8 shrink-0 items-center justify-center gap-1.5 rounded-md border border-rule bg-surface px-2.5 text-sm font-medium text-ink hover:bg-paper";

/** The planner address that reopens this recipe's choices. */
export function plannerHref(recipe: Recipe): string {
  const p = recipe.params;
  const q = new URLSearchParams({
    machineId: recipe.machineId,
    assemblyId: recipe.assemblyId,
    materialId: recipe.materialId,
    operation: recipe.operation,
    ap: String(p.axialDepthMm),
    ae: String(p.radialDepthMm),
    x: String(p.workPositionXMm),
    y: String(p.workPositionYMm),
    dir: p.millingDirection,
  });
  if (p.rpmOverride !== null) q.set("rpm", String(p.rpmOverride));
  if (p.chipLoadOverrideMm !== null) q.set("fz", String(p.chipLoadOverrideMm));
  if (p.workRegion) {
    q.set("rx0", String(p.workRegion.xMinMm));
    q.set("rx1", String(p.workRegion.xMaxMm));
    q.set("ry0", String(p.workRegion.yMinMm));
    q.set("ry1", String(p.workRegion.yMaxMm));
  }
  return `/planner?${q.toString()}`;
}

/**
 * One recipe: its numbers with units and the safety band, today's limits on its machine, the
 * actions this person may take, the test-cut ladder, the cut log and the history.
 */
export function RecipeDetail({
  shopId,
  role,
  system,
  recipe,
  cleanCutsOnMachine,
  copyTargets,
  copyTargetsError = null,
  cutLog,
}: {
  shopId: string;
  role: Role;
  system: UnitSystem;
  recipe: Recipe;
  /** Clean cuts of this recipe logged on its machine (what "Mark proven" needs). */
  cleanCutsOnMachine: number;
  /** Assemblies the recipe can be copied onto; undefined while they load. */
  copyTargets: Assembly[] | undefined;
  /** Why those assemblies could not be loaded. */
  copyTargetsError?: string | null;
  /** The recipe's cut log (composed by the route). */
  cutLog: ReactNode;
}) {
  const navigate = useNavigate();
  const [acting, setActing] = useState<LifeAction | null>(null);
  const [editing, setEditing] = useState(false);
  const [copying, setCopying] = useState(false);
  const [deleting, setDeleting] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const remove = useDeleteRecipe(shopId, recipe.id);
  const reasonId = useId();

  const server = useRecommendation(shopId, {
    assemblyId: recipe.assemblyId,
    materialId: recipe.materialId,
    operation: recipe.operation,
    params: recipe.params,
  });

  const editor = canEditRecipes(role);
  const actions = lifeActions(recipe.status, role, { cleanCutsOnMachine, machineName: recipe.machineName });
  const blocked = actions.find((a) => a.disabledReason);
  const canLog = role !== "operator" || recipe.status === "approved" || recipe.status === "trial";

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={
          <Link to="/recipes" className="inline-flex items-center gap-1 hover:text-ink">
            <ArrowLeft className="size-3.5" aria-hidden />
            Recipes
          </Link>
        }
        title={recipe.name}
        description={
          <span className="flex flex-wrap items-center gap-2">
            <RecipeStatusBadge status={recipe.status} />
            <span>revision {recipe.revision}</span>
            <span aria-hidden>·</span>
            <span>
              {operationLabels[recipe.operation]} on {recipe.machineName}
            </span>
            <span aria-hidden>·</span>
            <span>by {recipe.authorName}</span>
            {recipe.needsRecheck && (
              <Badge tone="near">
                <RefreshCw className="size-3" aria-hidden />
                Needs recheck
              </Badge>
            )}
          </span>
        }
        actions={
          <>
            <Link to={`/recipes/${recipe.id}/card`} className={linkButton}>
              <Printer className="size-4" aria-hidden />
              Setup card
            </Link>
            {canLog && (
              <Link to={`/log/${recipe.id}`} className={linkButton}>
                <ClipboardPen className="size-4" aria-hidden />
                Log a cut
              </Link>
            )}
            {editor && (
              <>
                <Link to={plannerHref(recipe)} className={linkButton}>
                  <Gauge className="size-4" aria-hidden />
                  Open in planner
                </Link>
                <Button variant="secondary" size="sm" onClick={() => setEditing(true)}>
                  <Pencil className="size-4" aria-hidden />
                  Edit
                </Button>
                <Button variant="secondary" size="sm" onClick={() => setCopying(true)}>
                  <Copy className="size-4" aria-hidden />
                  Copy to another machine
                </Button>
              </>
            )}
            {canDeleteRecipe(role, recipe.status) && (
              <Button
                variant="quiet"
                size="sm"
                onClick={() => {
                  remove.reset();
                  setDeleting(true);
                }}
              >
                <Trash2 className="size-4" aria-hidden />
                Delete
              </Button>
            )}
          </>
        }
      />

      {notice && <Notice onDismiss={() => setNotice(null)}>{notice}</Notice>}

      {actions.length > 0 && (
        <Card className="flex flex-wrap items-center gap-3 px-5 py-3">
          <span className="text-sm text-muted">Status: {statusLabels[recipe.status].toLowerCase()}. Next:</span>
          {actions.map((a) => (
            <Button
              key={a.to}
              size="sm"
              variant={a.danger ? "quiet" : a.primary ? "primary" : "secondary"}
              className={cn(a.danger && "text-limit")}
              disabled={a.disabledReason !== null}
              aria-describedby={a.disabledReason ? reasonId : undefined}
              onClick={() => setActing(a)}
            >
              {a.label}
            </Button>
          ))}
          {blocked && (
            <p id={reasonId} className="w-full text-xs text-muted">
              {blocked.label}: {blocked.disabledReason}
            </p>
          )}
        </Card>
      )}

      {recipe.lastComment && (recipe.status === "trial" || recipe.status === "draft") && (
        <p className="rounded-md border border-near/50 bg-near/5 px-4 py-2 text-sm text-ink">
          <span className="font-medium">Last comment: </span>
          {recipe.lastComment}
        </p>
      )}

      {recipe.needsRecheck && (
        <p role="status" className="rounded-md border border-near/50 bg-near/5 px-4 py-2 text-sm text-ink">
          The machine, cutter, assembly or material changed after revision {recipe.revision} was computed. The limits below are computed against
          today's data; save an edit to store recomputed numbers.
        </p>
      )}

      <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="flex min-w-0 flex-col gap-6">
          <Section title="Numbers" description={`Computed by the server for revision ${recipe.revision}.`}>
            <RecipeNumbers
              recipe={recipe}
              system={system}
              used={server.data ? { axialDepthMm: server.data.recommendation.axialDepthMm, radialDepthMm: server.data.recommendation.radialDepthMm } : undefined}
            />
            {recipe.result.bindingLimit && (
              <p className="text-sm font-medium text-limit">
                Held back by: {recipe.result.bindingLimit.charAt(0).toLowerCase() + recipe.result.bindingLimit.slice(1)}
              </p>
            )}
            {recipe.result.stable === false && <p className="text-sm font-medium text-limit">Chatter is likely at this speed and depth.</p>}
            <SafetyBand />
          </Section>

          <Section
            title={`Limits on ${recipe.machineName}`}
            description="Each bar is the value against its ceiling (the dark mark), computed against the machine's data as it stands today."
            actions={server.isFetching ? <Spinner label="Computing" /> : undefined}
          >
            {server.isPending ? (
              <LoadingState label="Computing the limits…" />
            ) : server.isError ? (
              <LoadError onRetry={() => void server.refetch()}>Cannot compute the limits: {server.error.message}</LoadError>
            ) : (
              <>
                <HeldBack rec={server.data.recommendation} where={recipe.params} system={system} />
                <LimitBars rec={server.data.recommendation} system={system} />
                <RecommendationWarnings rec={server.data.recommendation} adjustments={false} />
              </>
            )}
          </Section>

        </div>

        <div className="flex min-w-0 flex-col gap-6">
          <Section title="Setup">
            <RecipeSetup recipe={recipe} system={system} />
            {recipe.notes && (
              <div>
                <h3 className="text-xs font-medium tracking-wide text-muted uppercase">Notes</h3>
                <p className="mt-1 text-sm whitespace-pre-line text-ink">{recipe.notes}</p>
              </div>
            )}
          </Section>
          <Section title="Revisions">
            <RevisionHistory shopId={shopId} recipe={recipe} system={system} canRestore={editor} />
          </Section>
          <Section title="Status history">
            <TransitionHistory shopId={shopId} recipeId={recipe.id} />
          </Section>
        </div>
      </div>

      <Section title="Test-cut ladder" description="Step one parameter on scrap stock, score each rung, keep the best.">
        <LadderSection shopId={shopId} recipe={recipe} system={system} canBuild={editor && recipe.status !== "retired"} canScore={canLog} />
      </Section>

      <Section
        title="Cut log"
        actions={
          canLog ? (
            <Link to={`/log/${recipe.id}`} className={linkButton}>
              <ClipboardPen className="size-4" aria-hidden />
              Log a cut
            </Link>
          ) : undefined
        }
      >
        {cutLog}
      </Section>

      {acting && (
        <TransitionDialog
          shopId={shopId}
          recipe={recipe}
          action={acting}
          onClose={() => setActing(null)}
          onDone={(saved) => {
            setActing(null);
            setNotice(`${saved.name} is now ${statusLabels[saved.status].toLowerCase()}.`);
          }}
        />
      )}
      {editing && <EditRecipeSheet shopId={shopId} recipe={recipe} onClose={() => setEditing(false)} />}
      {copying && <CopyDialog shopId={shopId} recipe={recipe} targets={copyTargets} targetsError={copyTargetsError} onClose={() => setCopying(false)} />}
      {deleting && (
        <ConfirmDialog
          open
          onClose={() => setDeleting(false)}
          title={`Delete ${recipe.name}?`}
          confirmLabel="Delete recipe"
          danger
          pending={remove.isPending}
          error={remove.isError ? remove.error.message : null}
          onConfirm={() =>
            remove.mutate(undefined, {
              onSuccess: () => void navigate("/recipes", { state: { deletedRecipe: { id: recipe.id, name: recipe.name } } satisfies DeletedRecipeState }),
            })
          }
        >
          <p>The recipe goes to the shop's bin with its history and cut log; it can be restored from the recipe list (tick “Deleted recipes”).</p>
        </ConfirmDialog>
      )}
    </div>
  );
}
