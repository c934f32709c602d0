import type { Operation, RecipeParams, RecipeResultSummary } from "@ringdown/contracts";
import { useEffect } from "react";
import { useFormContext } from "react-hook-form";
import { useNavigate } from "react-router-dom";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { useUnitSystem } from "@/lib/auth";
import { formatQuantity } from "@/lib/format";
import { showText } from "@/components/recommendation/readout";
import { useCreateRecipe } from "../api/create-recipe";

const saveSchema = z.object({
  name: z.string().trim().min(1, "Name the recipe").max(160, "Use at most 160 characters"),
  notes: z.string().trim().max(4000, "Use at most 4000 characters"),
});

export interface SaveBody {
  assemblyId: string;
  materialId: string;
  operation: Operation;
  params: RecipeParams;
  suggestedName: string;
  /** What the browser computed, shown for reference; the server recomputes before storing. */
  summary: RecipeResultSummary;
  /** Limits the cut breaks (the engine could not bring it within them). */
  broken: string[];
}

/** Names the planned cut and saves it as a draft recipe, then opens it. */
export function SaveRecipeDialog({ shopId, open, onClose, body }: { shopId: string; open: boolean; onClose: () => void; body: SaveBody }) {
  const create = useCreateRecipe(shopId);
  const navigate = useNavigate();
  const system = useUnitSystem();
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="Save as recipe"
      description={
        <>
          Saved as a draft at {formatQuantity(Math.round(body.summary.rpm), "rpm", { system })} and{" "}
          {showText(body.summary.feedMmPerMin, { quantity: "feedRate" }, system)}. The server recomputes every number against the machine before
          storing it.
        </>
      }
    >
      <Form
        schema={saveSchema}
        defaultValues={{ name: body.suggestedName.slice(0, 160), notes: "" }}
        aria-label="Save as recipe"
        onSubmit={async (values) => {
          const recipe = await create.mutateAsync({
            name: values.name,
            notes: values.notes,
            assemblyId: body.assemblyId,
            materialId: body.materialId,
            operation: body.operation,
            params: body.params,
          });
          onClose();
          void navigate(`/recipes/${recipe.id}`);
        }}
        className="flex flex-col gap-4"
      >
        {({ register, formState }) => (
          <>
            <FormError />
            {body.broken.length > 0 && (
              <p className="rounded-md border border-limit/40 bg-limit/5 px-3 py-2 text-sm text-limit">
                This cut is outside a limit ({body.broken.join("; ").toLowerCase()}). It is saved as a draft to rework, not to run.
              </p>
            )}
            <TextField name="name" label="Recipe name" />
            <FocusField name="name" />
            <div className="flex flex-col gap-1.5">
              <label htmlFor="save-recipe-notes" className="text-sm font-medium text-ink">
                Notes <span className="font-normal text-muted">(optional)</span>
              </label>
              <textarea
                id="save-recipe-notes"
                rows={3}
                className="w-full rounded-md border border-rule-strong bg-surface px-3 py-2 text-sm text-ink focus-visible:border-brand focus-visible:outline-2 focus-visible:outline-brand/30"
                {...register("notes")}
              />
              {formState.errors.notes?.message && <p className="text-xs font-medium text-limit">{String(formState.errors.notes.message)}</p>}
            </div>
            <div className="flex justify-end gap-2">
              <Button variant="secondary" onClick={onClose}>
                Cancel
              </Button>
              <Button type="submit" pending={formState.isSubmitting}>
                Save recipe
              </Button>
            </div>
          </>
        )}
      </Form>
    </Dialog>
  );
}

/**
 * Puts the caret in a field once the dialog is open: the native dialog focuses its first button
 * when it opens (after this mounts), so the focus waits a tick.
 */
function FocusField({ name }: { name: string }) {
  const { setFocus } = useFormContext();
  useEffect(() => {
    const timer = setTimeout(() => setFocus(name, { shouldSelect: true }), 0);
    return () => clearTimeout(timer);
  }, [name, setFocus]);
  return null;
}
