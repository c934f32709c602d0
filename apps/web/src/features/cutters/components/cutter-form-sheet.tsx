import { cutterCreateBodySchema, type Cutter, type CutterCreateBody } from "@ringdown/contracts";
import { useId } from "react";
import { useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { Sheet } from "@/components/ui/sheet";
import { TextareaField } from "@/components/ui/textarea";
import { measures } from "@/components/ui/units";
import { useCreateCutter } from "../api/create-cutter";
import { useUpdateCutter } from "../api/update-cutter";
import { shapeOptions, shapesWithTipAngle, toolMaterialOptions } from "../labels";

type CutterFormValues = CutterCreateBody;

function defaultsFor(cutter: Cutter | null, mayApprove: boolean): CutterFormValues {
  if (cutter) {
    const { id: _id, shopId: _shopId, status: _status, createdAt: _c, updatedAt: _u, deletedAt: _d, ...body } = cutter;
    return { ...body };
  }
  // Required numbers start empty (NaN shows as an empty box) so nothing is saved by accident.
  return {
    name: "",
    shape: "flat",
    toolMaterial: "carbide",
    status: mayApprove ? "approved" : "proposed",
    diameterMm: Number.NaN,
    flutes: Number.NaN,
    fluteLengthMm: Number.NaN,
    overallLengthMm: Number.NaN,
    shankDiameterMm: Number.NaN,
    helixDeg: Number.NaN,
    cornerRadiusMm: 0,
    tipAngleDeg: null,
    maxRpm: null,
    coating: "",
    maker: "",
    partNumber: "",
    notes: "",
  };
}

function TipAngleField() {
  const shape = useWatch<CutterFormValues, "shape">({ name: "shape" });
  return (
    <NumberField
      name="tipAngleDeg"
      label="Tip angle"
      measure={measures.degrees}
      nullable
      hint={shapesWithTipAngle.has(shape) ? "Included angle of the point." : "Only for V-bits, chamfer cutters and drills; leave empty."}
    />
  );
}

/**
 * Add or edit a cutter in a side sheet. Checked with the shared cutter schema as the person types
 * (after the first save attempt); the server's field errors land on their fields.
 */
export function CutterFormSheet({
  shopId,
  open,
  onClose,
  cutter,
  mayApprove,
  onSaved,
}: {
  shopId: string;
  open: boolean;
  onClose: () => void;
  /** null: a new cutter. */
  cutter: Cutter | null;
  /** Curators may add a cutter as approved straight away. */
  mayApprove: boolean;
  onSaved: (saved: Cutter, created: boolean) => void;
}) {
  const formId = useId();
  const create = useCreateCutter(shopId);
  const update = useUpdateCutter(shopId);
  const pending = create.isPending || update.isPending;

  return (
    <Sheet
      open={open}
      onClose={onClose}
      title={cutter ? `Edit ${cutter.name}` : mayApprove ? "Add a cutter" : "Propose a cutter"}
      description={
        cutter
          ? "Changes apply to every recipe that uses this cutter from the next time it is computed."
          : mayApprove
            ? "Lengths in your unit system; Ringdown stores them in millimetres."
            : "A tooling manager or the owner approves it before it is used in approved recipes."
      }
      footer={
        <>
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" form={formId} pending={pending}>
            {cutter ? "Save changes" : mayApprove ? "Add cutter" : "Propose cutter"}
          </Button>
        </>
      }
    >
      <Form
        id={formId}
        aria-label={cutter ? `Edit ${cutter.name}` : "New cutter"}
        schema={cutterCreateBodySchema}
        defaultValues={defaultsFor(cutter, mayApprove)}
        onSubmit={async (values) => {
          if (cutter) {
            const { status: _status, ...patch } = values;
            onSaved(await update.mutateAsync({ cutterId: cutter.id, body: patch }), false);
          } else {
            const body = mayApprove ? values : { ...values, status: undefined };
            onSaved(await create.mutateAsync(body), true);
          }
        }}
        className="flex flex-col gap-6"
      >
        {() => (
          <>
            <FormError />
            <fieldset className="grid gap-4 sm:grid-cols-2">
              <legend className="mb-3 text-sm font-semibold text-ink">What it is</legend>
              <div className="sm:col-span-2">
                <TextField name="name" label="Name" placeholder="e.g. 6 mm 2-flute flat, aluminium" autoComplete="off" />
              </div>
              <SelectField name="shape" label="Shape" options={shapeOptions} />
              <SelectField name="toolMaterial" label="Tool material" options={toolMaterialOptions} />
              {!cutter && mayApprove && (
                <SelectField
                  name="status"
                  label="Status after saving"
                  options={[
                    { value: "approved", label: "Approved" },
                    { value: "proposed", label: "Proposed" },
                  ]}
                />
              )}
            </fieldset>

            <fieldset className="grid gap-4 sm:grid-cols-2">
              <legend className="mb-3 text-sm font-semibold text-ink">Geometry</legend>
              <NumberField name="diameterMm" label="Diameter" measure={measures.length} />
              <NumberField name="flutes" label="Flutes" measure={measures.count} />
              <NumberField name="fluteLengthMm" label="Flute length" measure={measures.length} hint="Cutting length along the axis." />
              <NumberField name="overallLengthMm" label="Overall length" measure={measures.length} />
              <NumberField name="shankDiameterMm" label="Shank diameter" measure={measures.length} />
              <NumberField name="cornerRadiusMm" label="Corner radius" measure={measures.length} hint="0 for a sharp corner; half the diameter for a ball end." />
              <NumberField name="helixDeg" label="Helix angle" measure={measures.degrees} hint="0 for straight flutes." />
              <TipAngleField />
            </fieldset>

            <fieldset className="grid gap-4 sm:grid-cols-2">
              <legend className="mb-3 text-sm font-semibold text-ink">Maker's data</legend>
              <TextField name="maker" label="Maker" autoComplete="off" />
              <TextField name="partNumber" label="Part number" autoComplete="off" />
              <TextField name="coating" label="Coating" placeholder="e.g. uncoated, TiAlN" autoComplete="off" />
              <NumberField
                name="maxRpm"
                label="Maker's max speed"
                measure={measures.rpm}
                nullable
                hint="From the maker's data sheet; recipes never exceed it. Leave empty if not given."
              />
              <div className="sm:col-span-2">
                <TextareaField name="notes" label="Notes" rows={3} />
              </div>
            </fieldset>
          </>
        )}
      </Form>
    </Sheet>
  );
}
