import { stiffnessReadingBodySchema, type Machine, type StiffnessReadingBody, type StiffnessReadingMutation } from "@ringdown/contracts";
import { useId } from "react";
import { useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { Sheet } from "@/components/ui/sheet";
import { TextareaField } from "@/components/ui/textarea";
import { formatMeasure, measures, type Measure } from "@/components/ui/units";
import { useUnitSystem } from "@/lib/auth";
import { useCreateStiffnessReading } from "../api/create-stiffness-reading";
import { directionOptions } from "../labels";
import { todayIso } from "../lib/dates";

export const forceMeasure: Measure = { quantity: "force" };

/** Resolution of a common dial indicator [mm] (0.01 mm graduations). */
const DIAL_RESOLUTION_MM = 0.01;

function StiffnessPreview() {
  const system = useUnitSystem();
  const [force, deflection] = useWatch<StiffnessReadingBody, ["forceN", "deflectionMm"]>({ name: ["forceN", "deflectionMm"] });
  if (!(Number(force) > 0) || !(Number(deflection) > 0)) return null;
  const k = Number(force) / Number(deflection);
  const fewDivisions = Number(deflection) < 5 * DIAL_RESOLUTION_MM;
  return (
    <div role="status" className="rounded-md border border-measured/30 bg-measured/5 px-3 py-2 text-sm text-ink">
      <p>
        Stiffness k = F / δ = <span className="font-medium tabular">{formatMeasure(k, measures.stiffness, system)}</span>
      </p>
      {fewDivisions && (
        <p className="mt-1 text-xs text-[#8a5a12]">
          The dial moved fewer than five divisions: one division either way changes k by{" "}
          {Math.round((DIAL_RESOLUTION_MM / Number(deflection)) * 100)} %. A larger force gives a steadier reading.
        </p>
      )}
    </div>
  );
}

/** A dial-indicator stiffness reading: a known push on the spindle and the deflection it caused. */
export function StiffnessReadingSheet({
  shopId,
  machine,
  open,
  onClose,
  onSaved,
}: {
  shopId: string;
  machine: Machine;
  open: boolean;
  onClose: () => void;
  onSaved: (result: StiffnessReadingMutation) => void;
}) {
  const formId = useId();
  const system = useUnitSystem();
  const create = useCreateStiffnessReading(shopId, machine.id);
  const defaults: StiffnessReadingBody = {
    xMm: Math.round(machine.axes.x.travelMm / 2),
    yMm: Math.round(machine.axes.y.travelMm / 2),
    zMm: 0,
    direction: "x",
    forceN: Number.NaN,
    deflectionMm: Number.NaN,
    note: "",
    measuredAt: todayIso(),
  };
  return (
    <Sheet
      open={open}
      onClose={onClose}
      width="max-w-lg"
      title="Add a stiffness reading"
      description={`On ${machine.name}. Push the spindle with a known force (spring scale or weights) and read how far it moved on a dial indicator.`}
      footer={
        <>
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" form={formId} pending={create.isPending}>
            Add reading
          </Button>
        </>
      }
    >
      <Form
        id={formId}
        aria-label="New stiffness reading"
        schema={stiffnessReadingBodySchema}
        defaultValues={defaults}
        className="flex flex-col gap-4"
        onSubmit={async (values) => onSaved(await create.mutateAsync(values))}
      >
        {() => (
          <>
            <FormError />
            <fieldset className="flex flex-col gap-2">
              <legend className="mb-1 text-sm font-medium text-ink">Spindle position</legend>
              <p className="-mt-1 text-xs text-muted">
                Machine coordinates from the front-left corner of the envelope ({formatMeasure(machine.axes.x.travelMm, measures.length, system)} ×{" "}
                {formatMeasure(machine.axes.y.travelMm, measures.length, system)} × {formatMeasure(machine.axes.z.travelMm, measures.length, system)}).
              </p>
              <div className="grid grid-cols-3 gap-3">
                <NumberField name="xMm" label="X" measure={measures.length} />
                <NumberField name="yMm" label="Y" measure={measures.length} />
                <NumberField name="zMm" label="Z" measure={measures.length} hint="Height above the lowest point" />
              </div>
            </fieldset>
            <SelectField name="direction" label="Direction of the push" options={directionOptions} hint="The dial indicator reads along the same direction." />
            <div className="grid grid-cols-2 gap-3">
              <NumberField name="forceN" label="Force" measure={forceMeasure} hint="Spring-scale reading or the weight's load." />
              <NumberField
                name="deflectionMm"
                label="Deflection"
                measure={measures.length}
                hint={`Dial indicator, reads to ${formatMeasure(DIAL_RESOLUTION_MM, measures.length, system)}.`}
              />
            </div>
            <StiffnessPreview />
            <TextField name="measuredAt" type="date" label="Measured on" max={todayIso()} />
            <TextareaField name="note" label="Note" rows={2} placeholder="e.g. belt tension just adjusted, gantry at mid-span" />
          </>
        )}
      </Form>
    </Sheet>
  );
}
