import { ceilingsBodySchema, type Ceilings, type Machine, type UnitSystem } from "@ringdown/contracts";
import { Plus, Trash2 } from "lucide-react";
import { useFieldArray, type UseFormReturn } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Input } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { LoadingState } from "@/components/ui/spinner";
import { measures } from "@/components/ui/units";
import { useCeilings, usePutCeilings } from "../api/ceilings";

/**
 * The machine's ceilings: how far the tool may deflect, frequency bands tooth-passing must keep
 * out of, and how far it must stay from every mode.
 */
export function CeilingsCard({
  shopId,
  machine,
  mayEdit,
  system,
  onSaved,
}: {
  shopId: string;
  machine: Machine;
  mayEdit: boolean;
  system: UnitSystem;
  onSaved: (saved: string, recipesFlagged: number) => void;
}) {
  const query = useCeilings(shopId, machine.id);
  const put = usePutCeilings(shopId, machine.id);
  return (
    <Card>
      <CardHeader
        title="Ceilings"
        description="Every recipe on this machine is held under these. Changing one flags the machine's recipes for a re-check."
      />
      <CardBody>
        {query.isPending ? (
          <LoadingState label="Loading the ceilings…" />
        ) : query.isError ? (
          <p role="alert" className="text-sm text-limit">
            Cannot load the ceilings: {query.error.message}
          </p>
        ) : (
          <CeilingsForm
            key={JSON.stringify(query.data)}
            ceilings={query.data}
            readOnly={!mayEdit || Boolean(machine.deletedAt)}
            system={system}
            pending={put.isPending}
            onSubmit={async (values) => {
              const result = await put.mutateAsync(values);
              onSaved("Saved the ceilings.", result.recipesFlagged);
            }}
          />
        )}
      </CardBody>
    </Card>
  );
}

function CeilingsForm({
  ceilings,
  readOnly,
  pending,
  onSubmit,
}: {
  ceilings: Ceilings;
  readOnly: boolean;
  system: UnitSystem;
  pending: boolean;
  onSubmit: (values: z.output<typeof ceilingsBodySchema>) => Promise<void>;
}) {
  return (
    <Form
      aria-label="Ceilings"
      schema={ceilingsBodySchema}
      defaultValues={{ deflectionCeilingMm: ceilings.deflectionCeilingMm, modeMarginPct: ceilings.modeMarginPct, avoidBands: ceilings.avoidBands }}
      className="flex flex-col gap-5"
      onSubmit={onSubmit}
    >
      {(form) => (
        <fieldset disabled={readOnly} className="flex flex-col gap-5">
          <FormError />
          <div className="grid gap-4 sm:grid-cols-2">
            <NumberField
              name="deflectionCeilingMm"
              label="Deflection ceiling"
              measure={measures.length}
              hint="Tool plus machine deflection a recipe may cause (default 0.025 mm, about 0.001 in)."
            />
            <NumberField
              name="modeMarginPct"
              label="Distance from every mode"
              measure={measures.percent}
              hint="Tooth-passing frequency kept at least this far from each mode's frequency."
            />
          </div>
          <BandsField form={form} readOnly={readOnly} />
          {!readOnly && (
            <div className="flex justify-end">
              <Button type="submit" pending={pending} disabled={!form.formState.isDirty}>
                Save ceilings
              </Button>
            </div>
          )}
        </fieldset>
      )}
    </Form>
  );
}

type BandsForm = UseFormReturn<z.input<typeof ceilingsBodySchema>, unknown, z.output<typeof ceilingsBodySchema>>;

function BandsField({ form, readOnly }: { form: BandsForm; readOnly: boolean }) {
  const bands = useFieldArray({ control: form.control, name: "avoidBands" });
  const errors = form.formState.errors.avoidBands;
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="text-sm font-medium text-ink">Frequency bands to keep tooth-passing out of</legend>
      <p className="text-xs text-muted">
        e.g. a band where a cover panel or the spindle fan rings. Recipes move their speed so that the tooth-passing frequency is outside every band.
      </p>
      {bands.fields.length === 0 ? (
        <p className="rounded-md border border-dashed border-rule px-3 py-3 text-sm text-muted">No bands: only the modes and their margin are avoided.</p>
      ) : (
        <table className="w-full text-sm">
          <thead>
            <tr className="text-left text-xs text-muted">
              <th scope="col" className="pb-1 font-medium">
                From [Hz]
              </th>
              <th scope="col" className="pb-1 font-medium">
                To [Hz]
              </th>
              <th scope="col" className="pb-1 font-medium">
                Why
              </th>
              <th scope="col" className="pb-1">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {bands.fields.map((field, i) => {
              const rowErrors = errors?.[i];
              return (
                <tr key={field.id} className="align-top">
                  <td className="pr-2 pb-2">
                    <NumberField name={`avoidBands.${i}.minHz`} label={`Band ${i + 1} from`} measure={measures.frequency} hideLabel />
                  </td>
                  <td className="pr-2 pb-2">
                    <NumberField name={`avoidBands.${i}.maxHz`} label={`Band ${i + 1} to`} measure={measures.frequency} hideLabel />
                  </td>
                  <td className="pr-2 pb-2">
                    <Input aria-label={`Band ${i + 1}: why`} {...form.register(`avoidBands.${i}.note`)} invalid={Boolean(rowErrors?.note)} />
                  </td>
                  <td className="pb-2 text-right">
                    {!readOnly && (
                      <Button variant="quiet" size="sm" onClick={() => bands.remove(i)} aria-label={`Remove band ${i + 1}`}>
                        <Trash2 className="size-4" aria-hidden />
                      </Button>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
      {typeof errors?.message === "string" && <p className="text-xs font-medium text-limit">{errors.message}</p>}
      {!readOnly && bands.fields.length < 20 && (
        <div>
          <Button variant="secondary" size="sm" onClick={() => bands.append({ minHz: Number.NaN, maxHz: Number.NaN, note: "" })}>
            <Plus className="size-4" aria-hidden /> Add band
          </Button>
        </div>
      )}
    </fieldset>
  );
}
