import type { Assembly, Recipe } from "@ringdown/contracts";
import { useNavigate } from "react-router-dom";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { SelectField } from "@/components/ui/select";
import { LoadingState } from "@/components/ui/spinner";
import { LoadError } from "@/components/ui/load-error";
import { useCopyRecipe } from "../api/copy-recipe";

const schema = z.object({
  assemblyId: z.string().min(1, "Choose the assembly to copy onto"),
  name: z.string().trim().max(160, "Use at most 160 characters"),
});

/**
 * Copies the recipe onto another cutter assembly, usually on another machine: the server
 * recomputes it against that machine's limits and it starts there as an unproven draft.
 */
export function CopyDialog({
  shopId,
  recipe,
  targets,
  targetsError = null,
  onClose,
}: {
  shopId: string;
  recipe: Recipe;
  /** The shop's assemblies; undefined while they are still being fetched. */
  targets: Assembly[] | undefined;
  /** Why the assemblies could not be fetched. */
  targetsError?: string | null;
  onClose: () => void;
}) {
  const copy = useCopyRecipe(shopId, recipe.id);
  const navigate = useNavigate();
  const options = (targets ?? [])
    .filter((a) => a.id !== recipe.assemblyId)
    .map((a) => ({
      value: a.id,
      label: `${a.machineName ?? "Machine"} — ${a.cutterName ?? "cutter"} in ${a.holder}${a.cutterStatus === "retired" ? " (retired cutter)" : ""}`,
    }))
    .sort((a, b) => a.label.localeCompare(b.label));
  return (
    <Dialog
      open
      onClose={onClose}
      title="Copy to another machine"
      description="The copy is recomputed against the chosen machine's limits and starts as a draft: it is not proven there yet."
    >
      {targetsError || targets === undefined || options.length === 0 ? (
        <div className="flex flex-col gap-4 text-sm">
          {targetsError ? (
            <LoadError>Cannot load the cutter assemblies to copy onto: {targetsError}</LoadError>
          ) : targets === undefined ? (
            <LoadingState label="Loading the cutter assemblies…" />
          ) : (
            <p>There is no other cutter assembly to copy onto. Add one under Machines first.</p>
          )}
          <div className="flex justify-end">
            <Button variant="secondary" onClick={onClose}>
              Close
            </Button>
          </div>
        </div>
      ) : (
        <Form
          schema={schema}
          defaultValues={{ assemblyId: "", name: "" }}
          aria-label="Copy recipe"
          className="flex flex-col gap-4"
          onSubmit={async (values) => {
            const saved = await copy.mutateAsync({ assemblyId: values.assemblyId, ...(values.name ? { name: values.name } : {}) });
            onClose();
            void navigate(`/recipes/${saved.id}`);
          }}
        >
          {({ formState }) => (
            <>
              <FormError />
              <SelectField name="assemblyId" label="Copy onto" options={options} placeholder="Choose machine and assembly…" />
              <TextField name="name" label="Name of the copy (optional)" placeholder={`${recipe.name} (other machine)`} />
              <div className="flex justify-end gap-2">
                <Button variant="secondary" onClick={onClose}>
                  Cancel
                </Button>
                <Button type="submit" pending={formState.isSubmitting}>
                  Copy and recompute
                </Button>
              </div>
            </>
          )}
        </Form>
      )}
    </Dialog>
  );
}
