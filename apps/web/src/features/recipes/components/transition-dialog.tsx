import type { Recipe } from "@ringdown/contracts";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { Form, FormError } from "@/components/ui/form";
import { TextareaField } from "@/components/ui/textarea";
import { useTransitionRecipe } from "../api/transition-recipe";
import { statusLabels } from "../labels";
import type { LifeAction } from "../life-cycle";

/** Confirms one status step, with the comment it needs (required when sending back). */
export function TransitionDialog({
  shopId,
  recipe,
  action,
  onClose,
  onDone,
}: {
  shopId: string;
  recipe: Recipe;
  action: LifeAction;
  onClose: () => void;
  onDone: (recipe: Recipe) => void;
}) {
  const transition = useTransitionRecipe(shopId, recipe.id);
  const schema = z.object({
    comment:
      action.comment === "required"
        ? z.string().trim().min(1, "Say why, for whoever picks it up next").max(1000, "Use at most 1000 characters")
        : z.string().trim().max(1000, "Use at most 1000 characters"),
  });
  return (
    <Dialog
      open
      onClose={onClose}
      title={`${action.label}: ${recipe.name}`}
      description={`${statusLabels[recipe.status]} → ${statusLabels[action.to]}. ${action.explain}`}
    >
      <Form
        schema={schema}
        defaultValues={{ comment: "" }}
        aria-label={action.label}
        className="flex flex-col gap-4"
        onSubmit={async ({ comment }) => {
          const saved = await transition.mutateAsync({ to: action.to, comment });
          onDone(saved);
        }}
      >
        {({ formState }) => (
          <>
            <FormError />
            <TextareaField
              name="comment"
              label={action.comment === "required" ? "Comment" : "Comment (optional)"}
              hint="Kept in the recipe's status history."
              rows={3}
            />
            <div className="flex justify-end gap-2">
              <Button variant="secondary" onClick={onClose}>
                Cancel
              </Button>
              <Button type="submit" variant={action.danger ? "danger" : "primary"} pending={formState.isSubmitting}>
                {action.label}
              </Button>
            </div>
          </>
        )}
      </Form>
    </Dialog>
  );
}
