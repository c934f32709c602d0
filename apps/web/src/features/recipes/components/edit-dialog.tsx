import { operations, recipeParamsSchema, type Recipe } from "@ringdown/contracts";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { Sheet } from "@/components/ui/sheet";
import { TextareaField } from "@/components/ui/textarea";
import { measures } from "@/components/ui/units";
import { useUpdateRecipe } from "../api/update-recipe";
import { operationLabels } from "../labels";

const schema = z.object({
  name: z.string().trim().min(1, "Name the recipe").max(160, "Use at most 160 characters"),
  operation: z.enum(operations),
  params: recipeParamsSchema,
  notes: z.string().trim().max(4000, "Use at most 4000 characters"),
  changeNote: z.string().trim().min(1, "Say what you changed and why").max(500, "Use at most 500 characters"),
});

/** Edits the recipe's choices; the server recomputes and keeps the change as a new revision with its note. */
export function EditRecipeSheet({ shopId, recipe, onClose }: { shopId: string; recipe: Recipe; onClose: () => void }) {
  const update = useUpdateRecipe(shopId, recipe.id);
  return (
    <Sheet
      open
      onClose={onClose}
      title={`Edit ${recipe.name}`}
      description={`Saving makes revision ${recipe.revision + 1}; the numbers are recomputed against ${recipe.machineName}.`}
      width="max-w-xl"
    >
      <Form
        schema={schema}
        defaultValues={{ name: recipe.name, operation: recipe.operation, params: recipe.params, notes: recipe.notes, changeNote: "" }}
        aria-label="Edit recipe"
        className="flex flex-col gap-4"
        onSubmit={async (values) => {
          await update.mutateAsync(values);
          onClose();
        }}
      >
        {({ formState }) => (
          <>
            <FormError />
            <TextField name="name" label="Recipe name" />
            <SelectField name="operation" label="Operation" options={operations.map((o) => ({ value: o, label: operationLabels[o] }))} />
            <div className="grid grid-cols-2 gap-3">
              <NumberField name="params.axialDepthMm" label="Axial depth" measure={measures.length} />
              <NumberField name="params.radialDepthMm" label="Radial depth" measure={measures.length} />
              <NumberField name="params.workPositionXMm" label="Work position X" measure={measures.length} />
              <NumberField name="params.workPositionYMm" label="Work position Y" measure={measures.length} />
              <NumberField name="params.rpmOverride" label="Spindle speed (optional)" measure={measures.rpm} nullable placeholder="auto" />
              <NumberField name="params.chipLoadOverrideMm" label="Chip load (optional)" measure={measures.chipLoad} nullable placeholder="auto" />
            </div>
            <SelectField
              name="params.millingDirection"
              label="Milling direction"
              options={[
                { value: "climb", label: "Climb" },
                { value: "conventional", label: "Conventional" },
              ]}
            />
            <TextareaField name="notes" label="Notes" rows={3} />
            <TextareaField name="changeNote" label="What changed, and why" hint="Shown in the revision history." rows={2} />
            <div className="flex justify-end gap-2">
              <Button variant="secondary" onClick={onClose}>
                Cancel
              </Button>
              <Button type="submit" pending={formState.isSubmitting}>
                Save revision {recipe.revision + 1}
              </Button>
            </div>
          </>
        )}
      </Form>
    </Sheet>
  );
}
