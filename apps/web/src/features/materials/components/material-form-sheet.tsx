import { materialBodySchema, type Material, type MaterialBody } from "@ringdown/contracts";
import { Plus, Trash2 } from "lucide-react";
import { useId } from "react";
import { get, useFieldArray, useFormContext } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { Sheet } from "@/components/ui/sheet";
import { TextareaField } from "@/components/ui/textarea";
import { measures } from "@/components/ui/units";
import { useCreateMaterial } from "../api/create-material";
import { useUpdateMaterial } from "../api/update-material";
import { groupOptions } from "../labels";

function bodyOf(m: Material | null): MaterialBody {
  if (!m) {
    return {
      name: "",
      group: "aluminium",
      hardness: "",
      cuttingSpeed: {
        carbide: { minMPerMin: Number.NaN, maxMPerMin: Number.NaN },
        hss: { minMPerMin: Number.NaN, maxMPerMin: Number.NaN },
      },
      chipLoad: [{ diameterMm: Number.NaN, minMm: Number.NaN, maxMm: Number.NaN }],
      kc11NPerMm2: null,
      mc: null,
      unitPowerJPerMm3: null,
      minChipThicknessMm: Number.NaN,
      sourceNote: "",
    };
  }
  return {
    name: m.name,
    group: m.group,
    hardness: m.hardness,
    cuttingSpeed: m.cuttingSpeed,
    chipLoad: m.chipLoad,
    kc11NPerMm2: m.kc11NPerMm2,
    mc: m.mc,
    unitPowerJPerMm3: m.unitPowerJPerMm3,
    minChipThicknessMm: m.minChipThicknessMm,
    sourceNote: m.sourceNote,
  };
}

function ChipLoadPoints() {
  const { control, formState } = useFormContext<MaterialBody>();
  const { fields, append, remove } = useFieldArray({ control, name: "chipLoad" });
  const listError = (get(formState.errors, "chipLoad") as { message?: string; root?: { message?: string } } | undefined);
  const message = listError?.message ?? listError?.root?.message;
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-1 text-sm font-semibold text-ink">Chip load per tooth by cutter diameter</legend>
      <p className="text-xs text-muted">For carbide cutters. Give one row per diameter you have data for; Ringdown interpolates between them.</p>
      {fields.map((f, i) => (
        <div key={f.id} className="grid grid-cols-[1fr_1fr_1fr_auto] items-start gap-3" role="group" aria-label={`Chip-load point ${i + 1}`}>
          <NumberField name={`chipLoad.${i}.diameterMm`} label="Cutter diameter" measure={measures.length} />
          <NumberField name={`chipLoad.${i}.minMm`} label="From" measure={measures.chipLoad} />
          <NumberField name={`chipLoad.${i}.maxMm`} label="To" measure={measures.chipLoad} />
          <Button
            variant="quiet"
            size="sm"
            className="mt-7"
            disabled={fields.length === 1}
            onClick={() => remove(i)}
            aria-label={`Remove chip-load point ${i + 1}`}
          >
            <Trash2 className="size-4" aria-hidden />
          </Button>
        </div>
      ))}
      {message && <p className="text-xs font-medium text-limit">{message}</p>}
      <div>
        <Button
          variant="secondary"
          size="sm"
          disabled={fields.length >= 12}
          onClick={() => append({ diameterMm: Number.NaN, minMm: Number.NaN, maxMm: Number.NaN })}
        >
          <Plus className="size-4" aria-hidden /> Add a diameter
        </Button>
      </div>
    </fieldset>
  );
}

/** Add or edit one of the shop's own materials. */
export function MaterialFormSheet({
  shopId,
  open,
  material,
  onClose,
  onSaved,
}: {
  shopId: string;
  open: boolean;
  /** null: a new material. */
  material: Material | null;
  onClose: () => void;
  onSaved: (saved: Material, created: boolean) => void;
}) {
  const formId = useId();
  const create = useCreateMaterial(shopId);
  const update = useUpdateMaterial(shopId);
  return (
    <Sheet
      open={open}
      onClose={onClose}
      title={material ? `Edit ${material.name}` : "Add a material"}
      description="Recipes that use this material are flagged for a fresh computation when its numbers change."
      footer={
        <>
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" form={formId} pending={create.isPending || update.isPending}>
            {material ? "Save changes" : "Add material"}
          </Button>
        </>
      }
    >
      <Form
        id={formId}
        aria-label={material ? `Edit ${material.name}` : "New material"}
        schema={materialBodySchema}
        defaultValues={bodyOf(material)}
        className="flex flex-col gap-6"
        onSubmit={async (values) => {
          if (material) onSaved(await update.mutateAsync({ materialId: material.id, body: values }), false);
          else onSaved(await create.mutateAsync(values), true);
        }}
      >
        {() => (
          <>
            <FormError />
            <fieldset className="grid gap-4 sm:grid-cols-2">
              <legend className="mb-3 text-sm font-semibold text-ink">Material</legend>
              <div className="sm:col-span-2">
                <TextField name="name" label="Name" autoComplete="off" />
              </div>
              <SelectField name="group" label="Group" options={groupOptions} />
              <TextField name="hardness" label="Hardness or density" placeholder="e.g. 95 HB, Janka 5.7 kN" autoComplete="off" />
            </fieldset>

            <fieldset className="grid gap-4 sm:grid-cols-2">
              <legend className="mb-3 text-sm font-semibold text-ink">Cutting speed</legend>
              <NumberField name="cuttingSpeed.carbide.minMPerMin" label="Carbide, from" measure={measures.cuttingSpeed} />
              <NumberField name="cuttingSpeed.carbide.maxMPerMin" label="Carbide, to" measure={measures.cuttingSpeed} />
              <NumberField name="cuttingSpeed.hss.minMPerMin" label="HSS, from" measure={measures.cuttingSpeed} />
              <NumberField name="cuttingSpeed.hss.maxMPerMin" label="HSS, to" measure={measures.cuttingSpeed} />
            </fieldset>

            <ChipLoadPoints />

            <fieldset className="grid gap-4 sm:grid-cols-2">
              <legend className="mb-1 text-sm font-semibold text-ink">Cutting force</legend>
              <p className="text-xs text-muted sm:col-span-2">Give the Kienzle constants, or the unit power, or both. Leave a box empty when you have no value.</p>
              <NumberField name="kc11NPerMm2" label="kc1.1 (Kienzle)" measure={measures.specificForce} nullable />
              <NumberField name="mc" label="mc (Kienzle exponent)" measure={measures.count} nullable hint="Dimensionless, typically 0.15–0.35." />
              <NumberField name="unitPowerJPerMm3" label="Unit power" measure={measures.specificEnergy} nullable />
              <NumberField
                name="minChipThicknessMm"
                label="Minimum chip thickness"
                measure={measures.length}
                hint="Below this the edge rubs or burns instead of cutting."
              />
            </fieldset>

            <TextareaField
              name="sourceNote"
              label="Where these values come from"
              rows={4}
              hint="Name the book, table, maker's sheet or test cut for each number; say “from memory” or “common practice” where that is the truth."
            />
          </>
        )}
      </Form>
    </Sheet>
  );
}
