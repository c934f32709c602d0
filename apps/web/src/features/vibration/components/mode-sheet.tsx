import { modeBodySchema, modePatchBodySchema, type Machine, type MachineModeRecord, type ModeMutation, type UnitSystem } from "@ringdown/contracts";
import { naturalFrequencyHz } from "@ringdown/machining";
import { useId, useState } from "react";
import { useWatch } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { Sheet } from "@/components/ui/sheet";
import { TextareaField } from "@/components/ui/textarea";
import { formatMeasure, measures } from "@/components/ui/units";
import { cn } from "@/lib/cn";
import { formatQuantity } from "@/lib/format";
import { useCreateMode, useUpdateMode } from "../api/modes";
import { directionOptions } from "../labels";
import { todayIso } from "../lib/dates";

const [valuesSchema, estimateBodySchema] = modeBodySchema.options;
/** An emptied stiffness box means "use the machine's value": leave the field out of the request. */
const estimateSchema = estimateBodySchema.extend({
  stiffnessNPerMm: z.preprocess((v) => (v === null || (typeof v === "number" && Number.isNaN(v)) ? undefined : v), estimateBodySchema.shape.stiffnessNPerMm),
});

const sourceOptions = [
  { value: "measured", label: "Measured (tap test)" },
  { value: "fitted", label: "Fitted to a frequency response" },
  { value: "manual", label: "Entered by hand" },
];
const editSourceOptions = [...sourceOptions, { value: "estimated", label: "Estimate" }];

const dampingHint = "ζ as a fraction: 0.03 is 3 % of critical damping. Light machine frames are often 0.02–0.06.";

function EstimatePreview({ machine, system }: { machine: Machine; system: UnitSystem }) {
  const [direction, mass, stiffness] = useWatch({ name: ["direction", "massKg", "stiffnessNPerMm"] }) as ["x" | "y" | "z", number, number | undefined];
  const k = Number.isFinite(stiffness) && (stiffness ?? 0) > 0 ? (stiffness as number) : machine.axes[direction].stiffnessNPerMm;
  if (!(Number(mass) > 0) || !(k > 0)) return null;
  const fn = naturalFrequencyHz({ stiffnessNPerMm: k, massKg: Number(mass) });
  return (
    <div role="status" className="rounded-md border border-measured/30 bg-measured/5 px-3 py-2 text-sm text-ink">
      fn = √(k / m) / 2π = √({formatMeasure(k, measures.stiffness, system)} / {formatMeasure(Number(mass), measures.mass, system)}) / 2π ≈{" "}
      <span className="font-medium tabular">{formatQuantity(fn, "Hz", { significantDigits: 3 })}</span>
      <p className="mt-1 text-xs text-muted">A single mass on a spring: an estimate to replace with a tap test when you can.</p>
    </div>
  );
}

/** Add a mode (measured values, or an estimate from moving mass and stiffness), or edit one. */
export function ModeSheet({
  shopId,
  machine,
  mode,
  open,
  system,
  onClose,
  onSaved,
}: {
  shopId: string;
  machine: Machine;
  /** null: a new mode */
  mode: MachineModeRecord | null;
  open: boolean;
  system: UnitSystem;
  onClose: () => void;
  onSaved: (result: ModeMutation, created: boolean) => void;
}) {
  const formId = useId();
  const create = useCreateMode(shopId, machine.id);
  const update = useUpdateMode(shopId, machine.id);
  const [how, setHow] = useState<"values" | "estimate">("values");
  const pending = create.isPending || update.isPending;

  return (
    <Sheet
      open={open}
      onClose={onClose}
      width="max-w-lg"
      title={mode ? "Edit mode" : "Add a mode"}
      description={`On ${machine.name}. A mode is a frequency at which the machine rings, with its damping and the stiffness at the tool in that direction.`}
      footer={
        <>
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" form={formId} pending={pending}>
            {mode ? "Save mode" : how === "estimate" ? "Add estimated mode" : "Add mode"}
          </Button>
        </>
      }
    >
      {!mode && (
        <div role="radiogroup" aria-label="How to enter the mode" className="mb-5 grid grid-cols-2 gap-1 rounded-md border border-rule bg-surface p-1">
          {(
            [
              ["values", "Enter its values"],
              ["estimate", "Estimate from mass"],
            ] as const
          ).map(([value, label]) => (
            <button
              key={value}
              type="button"
              role="radio"
              aria-checked={how === value}
              onClick={() => setHow(value)}
              className={cn("h-8 cursor-pointer rounded text-sm font-medium", how === value ? "bg-brand-tint text-brand" : "text-muted hover:text-ink")}
            >
              {label}
            </button>
          ))}
        </div>
      )}

      {mode ? (
        <Form
          id={formId}
          aria-label="Edit mode"
          schema={modePatchBodySchema}
          defaultValues={{
            direction: mode.direction,
            frequencyHz: mode.frequencyHz,
            dampingRatio: mode.dampingRatio,
            stiffnessNPerMm: mode.stiffnessNPerMm,
            source: mode.source,
            note: mode.note,
            measuredAt: mode.measuredAt.slice(0, 10),
          }}
          className="flex flex-col gap-4"
          onSubmit={async (values) => onSaved(await update.mutateAsync({ modeId: mode.id, body: values }), false)}
        >
          {() => (
            <>
              <FormError />
              <ValueFields sources={editSourceOptions} />
            </>
          )}
        </Form>
      ) : how === "values" ? (
        <Form
          key="values"
          id={formId}
          aria-label="New mode"
          schema={valuesSchema}
          defaultValues={{ source: "measured", direction: "x", frequencyHz: Number.NaN, dampingRatio: Number.NaN, stiffnessNPerMm: Number.NaN, note: "", measuredAt: todayIso() }}
          className="flex flex-col gap-4"
          onSubmit={async (values) => onSaved(await create.mutateAsync(values), true)}
        >
          {() => (
            <>
              <FormError />
              <ValueFields sources={sourceOptions} />
            </>
          )}
        </Form>
      ) : (
        <Form
          key="estimate"
          id={formId}
          aria-label="New estimated mode"
          schema={estimateSchema}
          defaultValues={{ source: "estimated", direction: "y", massKg: Number.NaN, stiffnessNPerMm: undefined, dampingRatio: 0.05, note: "" }}
          className="flex flex-col gap-4"
          onSubmit={async (values) => onSaved(await create.mutateAsync(values), true)}
        >
          {() => (
            <>
              <FormError />
              <SelectField name="direction" label="Direction" options={directionOptions} />
              <NumberField name="massKg" label="Moving mass" measure={measures.mass} hint="What moves in this direction: for Y on a gantry router, the whole gantry with the spindle." />
              <NumberField
                name="stiffnessNPerMm"
                label="Stiffness"
                measure={measures.stiffness}
                nullable
                placeholder="machine's value"
                hint="Leave empty to use the machine's measured stiffness in this direction."
              />
              <NumberField name="dampingRatio" label="Damping ratio" measure={measures.count} hint={dampingHint} />
              <EstimatePreview machine={machine} system={system} />
              <TextareaField name="note" label="Note" rows={2} placeholder="e.g. gantry on its belts" />
            </>
          )}
        </Form>
      )}
    </Sheet>
  );
}

function ValueFields({ sources }: { sources: Array<{ value: string; label: string }> }) {
  return (
    <>
      <div className="grid grid-cols-2 gap-3">
        <SelectField name="direction" label="Direction" options={directionOptions} />
        <SelectField name="source" label="Source" options={sources} />
      </div>
      <NumberField name="frequencyHz" label="Natural frequency" measure={measures.frequency} />
      <div className="grid grid-cols-2 gap-3">
        <NumberField name="dampingRatio" label="Damping ratio" measure={measures.count} hint={dampingHint} />
        <NumberField name="stiffnessNPerMm" label="Modal stiffness" measure={measures.stiffness} hint="At the tool, in this direction." />
      </div>
      <TextField name="measuredAt" type="date" label="Measured on" max={todayIso()} />
      <TextareaField name="note" label="Note" rows={2} placeholder="e.g. gantry rocking on its belts" />
    </>
  );
}
