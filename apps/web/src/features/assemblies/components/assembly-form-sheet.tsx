import { assemblyBodySchema, type Assembly, type AssemblyBody, type Cutter } from "@ringdown/contracts";
import { TriangleAlert } from "lucide-react";
import { useId } from "react";
import { useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { Sheet } from "@/components/ui/sheet";
import { LoadingState } from "@/components/ui/spinner";
import { TextareaField } from "@/components/ui/textarea";
import { formatMeasure, measures } from "@/components/ui/units";
import { LoadError } from "@/components/ui/load-error";
import { useUnitSystem } from "@/lib/auth";
import { useCreateAssembly } from "../api/create-assembly";
import { useUpdateAssembly } from "../api/update-assembly";
import { runoutIsLarge } from "../runout";

function RunoutWarning({ cutters }: { cutters: Cutter[] }) {
  const system = useUnitSystem();
  const [runout, cutterId] = useWatch<AssemblyBody, ["runoutMm", "cutterId"]>({ name: ["runoutMm", "cutterId"] });
  const cutter = cutters.find((c) => c.id === cutterId);
  if (!runoutIsLarge(runout, cutter?.diameterMm)) return null;
  return (
    <div role="status" className="flex items-start gap-2 rounded-md border border-near/50 bg-near/10 px-3 py-2 text-sm text-ink">
      <TriangleAlert className="mt-0.5 size-4 shrink-0 text-[#8a5a12]" aria-hidden />
      <p>
        {formatMeasure(runout, measures.length, system)} of runout is large next to the chip load of
        {cutter ? ` a ${formatMeasure(cutter.diameterMm, measures.length, system)} cutter` : " a small cutter"}: one flute takes
        most of the cut and small cutters break. Reseat or clean the collet, or try another holder, and measure again.
      </p>
    </div>
  );
}

/** Add or edit a cutter assembly: a cutter in a holder at a stick-out, with its measured runout. */
export function AssemblyFormSheet({
  shopId,
  machineId,
  machineName,
  open,
  assembly,
  cutters,
  cuttersLoading = false,
  cuttersError = null,
  onRetryCutters,
  onClose,
  onSaved,
}: {
  shopId: string;
  machineId: string;
  machineName: string;
  open: boolean;
  /** null: a new assembly. */
  assembly: Assembly | null;
  cutters: Cutter[];
  /** The shop's cutters are still being fetched. */
  cuttersLoading?: boolean;
  /** Why the shop's cutters could not be fetched. */
  cuttersError?: string | null;
  /** Fetches the cutters again after a failure. */
  onRetryCutters?: () => void;
  onClose: () => void;
  onSaved: (saved: Assembly, created: boolean) => void;
}) {
  const formId = useId();
  const create = useCreateAssembly(shopId);
  const update = useUpdateAssembly(shopId);
  // Retired cutters cannot go into an assembly; the current one stays listed when editing.
  const choices = cutters
    .filter((c) => c.status !== "retired" || c.id === assembly?.cutterId)
    .map((c) => ({ value: c.id, label: `${c.name}${c.status === "proposed" ? " (proposed)" : c.status === "retired" ? " (retired)" : ""}` }));

  const defaults: AssemblyBody = assembly
    ? { machineId: assembly.machineId, cutterId: assembly.cutterId, holder: assembly.holder, stickoutMm: assembly.stickoutMm, runoutMm: assembly.runoutMm, notes: assembly.notes }
    : { machineId, cutterId: "", holder: "", stickoutMm: Number.NaN, runoutMm: Number.NaN, notes: "" };

  return (
    <Sheet
      open={open}
      onClose={onClose}
      width="max-w-lg"
      title={assembly ? "Edit cutter assembly" : "Add a cutter assembly"}
      description={`On ${machineName}. Recipes are computed for the cutter as it sits in this holder.`}
      footer={
        <>
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" form={formId} pending={create.isPending || update.isPending}>
            {assembly ? "Save changes" : "Add assembly"}
          </Button>
        </>
      }
    >
      <Form
        id={formId}
        aria-label={assembly ? "Edit cutter assembly" : "New cutter assembly"}
        schema={assemblyBodySchema}
        defaultValues={defaults}
        className="flex flex-col gap-4"
        onSubmit={async (values) => {
          if (assembly) {
            const { machineId: _m, ...patch } = values;
            onSaved(await update.mutateAsync({ assemblyId: assembly.id, body: patch }), false);
          } else {
            onSaved(await create.mutateAsync(values), true);
          }
        }}
      >
        {() => (
          <>
            <FormError />
            {cuttersLoading ? (
              <LoadingState label="Loading the shop's cutters…" />
            ) : cuttersError ? (
              <LoadError {...(onRetryCutters ? { onRetry: onRetryCutters } : {})}>Cannot load the shop's cutters: {cuttersError}</LoadError>
            ) : choices.length === 0 ? (
              <p className="rounded-md border border-dashed border-rule px-3 py-4 text-sm text-muted">
                The shop has no approved or proposed cutters yet. Add one on the Cutters page first.
              </p>
            ) : (
              <SelectField name="cutterId" label="Cutter" options={choices} placeholder="Choose a cutter" />
            )}
            <TextField name="holder" label="Holder or collet" placeholder="e.g. ER20 collet, 1/4 in" autoComplete="off" />
            <NumberField
              name="stickoutMm"
              label="Stick-out"
              measure={measures.length}
              hint="From the collet or holder face to the cutter's tip. Deflection grows with its cube."
            />
            <NumberField
              name="runoutMm"
              label="Runout (TIR)"
              measure={measures.length}
              hint="Total indicated runout on the cutter's shank or flutes, measured with a dial indicator."
            />
            <RunoutWarning cutters={cutters} />
            <TextareaField name="notes" label="Notes" rows={2} />
          </>
        )}
      </Form>
    </Sheet>
  );
}
