import type { Recipe, RecipeRevision, UnitSystem } from "@ringdown/contracts";
import { ArrowRight, History, RotateCcw } from "lucide-react";
import { useState } from "react";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { Form, FormError } from "@/components/ui/form";
import { MeasureValue } from "@/components/ui/measure";
import { LoadingState } from "@/components/ui/spinner";
import { TextareaField } from "@/components/ui/textarea";
import { measures } from "@/components/ui/units";
import { LoadError } from "@/components/ui/load-error";
import { useRestoreRevision } from "../api/restore-revision";
import { useRevisions } from "../api/get-revisions";
import { useTransitions } from "../api/get-transitions";
import { statusLabels } from "../labels";
import { RecipeStatusBadge } from "./status-badge";

const when = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });

/** Every revision: who, what changed, when; any earlier one can be restored (as a new revision). */
export function RevisionHistory({ shopId, recipe, system, canRestore }: { shopId: string; recipe: Recipe; system: UnitSystem; canRestore: boolean }) {
  const revisions = useRevisions(shopId, recipe.id);
  const [restoring, setRestoring] = useState<RecipeRevision | null>(null);

  if (revisions.isPending) return <LoadingState label="Loading the revisions…" />;
  if (revisions.isError)
    return (
      <LoadError onRetry={() => void revisions.refetch()}>Cannot load the revisions: {revisions.error.message}</LoadError>
    );
  return (
    <>
      <ol aria-label="Revisions" className="flex flex-col divide-y divide-rule/70">
        {revisions.data.items.map((rev) => {
          const current = rev.revision === recipe.revision;
          return (
            <li key={rev.id} className="flex flex-col gap-1 py-3">
              <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
                <span className="text-sm font-semibold text-ink">Revision {rev.revision}</span>
                {current && <span className="text-xs font-medium text-brand">current</span>}
                <span className="text-xs text-muted">
                  {rev.authorName} · <time dateTime={rev.createdAt}>{when.format(new Date(rev.createdAt))}</time>
                </span>
                {canRestore && !current && (
                  <Button variant="secondary" size="sm" className="ml-auto" onClick={() => setRestoring(rev)}>
                    <RotateCcw className="size-3.5" aria-hidden />
                    Restore revision {rev.revision}
                  </Button>
                )}
              </div>
              {rev.changeNote && <p className="text-sm text-ink">{rev.changeNote}</p>}
              {rev.changes.length > 0 && (
                <ul className="list-disc pl-5 text-xs text-muted">
                  {rev.changes.map((c) => (
                    <li key={c}>{c}</li>
                  ))}
                </ul>
              )}
              <p className="tabular text-xs text-muted">
                <MeasureValue value={Math.round(rev.result.rpm)} measure={measures.rpm} system={system} /> ·{" "}
                <MeasureValue value={rev.result.feedMmPerMin} measure={measures.feedRate} system={system} /> · ap{" "}
                <MeasureValue value={rev.params.axialDepthMm} measure={measures.length} system={system} /> · ae{" "}
                <MeasureValue value={rev.params.radialDepthMm} measure={measures.length} system={system} />
              </p>
            </li>
          );
        })}
      </ol>
      {restoring && <RestoreDialog shopId={shopId} recipe={recipe} revision={restoring} onClose={() => setRestoring(null)} />}
    </>
  );
}

function RestoreDialog({ shopId, recipe, revision, onClose }: { shopId: string; recipe: Recipe; revision: RecipeRevision; onClose: () => void }) {
  const restore = useRestoreRevision(shopId, recipe.id);
  return (
    <Dialog
      open
      onClose={onClose}
      title={`Restore revision ${revision.revision}`}
      description={`Its choices come back as revision ${recipe.revision + 1}, recomputed against today's machine data. Nothing in the history is lost.`}
    >
      <Form
        schema={z.object({ changeNote: z.string().trim().max(400, "Use at most 400 characters") })}
        defaultValues={{ changeNote: "" }}
        aria-label="Restore revision"
        className="flex flex-col gap-4"
        onSubmit={async ({ changeNote }) => {
          await restore.mutateAsync({ revision: revision.revision, changeNote });
          onClose();
        }}
      >
        {({ formState }) => (
          <>
            <FormError />
            <TextareaField name="changeNote" label="Why (optional)" rows={2} />
            <div className="flex justify-end gap-2">
              <Button variant="secondary" onClick={onClose}>
                Cancel
              </Button>
              <Button type="submit" pending={formState.isSubmitting}>
                <History className="size-4" aria-hidden />
                Restore as revision {recipe.revision + 1}
              </Button>
            </div>
          </>
        )}
      </Form>
    </Dialog>
  );
}

/** The recipe's status changes, newest first, with who made them and their comments. */
export function TransitionHistory({ shopId, recipeId }: { shopId: string; recipeId: string }) {
  const transitions = useTransitions(shopId, recipeId);
  if (transitions.isPending) return <LoadingState label="Loading the status history…" />;
  if (transitions.isError)
    return (
      <LoadError onRetry={() => void transitions.refetch()}>Cannot load the status history: {transitions.error.message}</LoadError>
    );
  if (transitions.data.items.length === 0) return <p className="text-sm text-muted">No status changes yet: the recipe is where it started.</p>;
  return (
    <ol aria-label="Status history" className="flex flex-col divide-y divide-rule/70">
      {transitions.data.items.map((t) => (
        <li key={t.id} className="flex flex-col gap-1 py-2.5">
          <div className="flex flex-wrap items-center gap-2">
            <RecipeStatusBadge status={t.from} />
            <ArrowRight className="size-3.5 text-muted" aria-label="to" />
            <RecipeStatusBadge status={t.to} />
            <span className="text-xs text-muted">
              {t.actorName} · <time dateTime={t.createdAt}>{when.format(new Date(t.createdAt))}</time>
            </span>
          </div>
          {t.comment && (
            <blockquote className="border-l-2 border-rule pl-3 text-sm text-ink" aria-label={`Comment on ${statusLabels[t.to].toLowerCase()}`}>
              {t.comment}
            </blockquote>
          )}
        </li>
      ))}
    </ol>
  );
}
