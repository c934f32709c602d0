import { axes, machineBodySchema, type Machine, type MachineBody } from "@ringdown/contracts";
import { Plus, Trash2 } from "lucide-react";
import { useEffect, useRef, type ReactNode } from "react";
import { useBlocker } from "react-router-dom";
import { get, useFieldArray, useFormContext, useWatch, type UseFormReturn } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { TextareaField } from "@/components/ui/textarea";
import { measures, unitOf } from "@/components/ui/units";
import { useUnitSystem } from "@/lib/auth";
import { cn } from "@/lib/cn";
import { afterRemoval, clearEstimate, estimatesUnder } from "../estimates";
import { directionOptions, driveOptions, kindOptions, sourceOptions } from "../labels";
import { EstimateTag } from "./estimate-tag";

/** The editable part of a stored machine. */
export function bodyOfMachine(m: Machine): MachineBody {
  const { id: _i, shopId: _s, createdAt: _c, updatedAt: _u, deletedAt: _d, ...body } = m;
  return body;
}

const modeNumberField = /^modes\.(\d+)\.(direction|frequencyHz|dampingRatio|stiffnessNPerMm)$/;

/**
 * A value the person sets is theirs, not an estimate any more; a mode whose numbers they change
 * is no longer the kind's estimate but entered by hand.
 */
function EstimateTracker() {
  const { watch, getValues, setValue } = useFormContext<MachineBody>();
  useEffect(() => {
    const subscription = watch((_values, { name, type }) => {
      if (type !== "change" || !name || name === "estimatedFields") return;
      const estimated = getValues("estimatedFields") ?? [];
      const next = clearEstimate(estimated, name);
      if (next.length !== estimated.length) setValue("estimatedFields", next, { shouldDirty: true });
      const mode = modeNumberField.exec(name);
      if (mode && getValues(`modes.${Number(mode[1])}.source`) === "estimated") {
        setValue(`modes.${Number(mode[1])}.source`, "manual", { shouldDirty: true });
      }
    });
    return () => subscription.unsubscribe();
  }, [watch, getValues, setValue]);
  return null;
}

function Section({ title, description, children, aside }: { title: string; description?: ReactNode; children: ReactNode; aside?: ReactNode }) {
  return (
    <section className="rounded-lg border border-rule bg-surface">
      <div className="flex flex-wrap items-start justify-between gap-3 border-b border-rule px-5 py-3">
        <div>
          <h2 className="text-base font-semibold text-ink">{title}</h2>
          {description && <p className="mt-0.5 max-w-prose text-sm text-muted">{description}</p>}
        </div>
        {aside}
      </div>
      <div className="px-5 py-4">{children}</div>
    </section>
  );
}

function EstimateCount({ path }: { path: string }) {
  const estimated = useWatch<MachineBody, "estimatedFields">({ name: "estimatedFields" }) ?? [];
  const n = estimatesUnder(estimated, path);
  if (n === 0) return null;
  return (
    <span className="text-xs font-medium text-[#8a5a12]">
      {n} {n === 1 ? "value is an estimate" : "values are estimates"}
    </span>
  );
}

const th = "px-2 py-1.5 text-left text-xs font-medium whitespace-nowrap text-muted";
const thNum = "px-2 py-1.5 text-right text-xs font-medium whitespace-nowrap text-muted";
const td = "px-2 py-1.5 align-top";

function HeaderUnit({ children }: { children: string }) {
  return <span className="font-normal"> ({children})</span>;
}

function AxesTable({ readOnly }: { readOnly: boolean }) {
  const system = useUnitSystem();
  const cols = [
    { key: "travelMm", label: "Travel", measure: measures.length, nullable: false },
    { key: "maxFeedMmPerMin", label: "Max feed", measure: measures.feedRate, nullable: false },
    { key: "accelerationMmPerS2", label: "Acceleration", measure: measures.acceleration, nullable: true },
    { key: "backlashMm", label: "Backlash", measure: measures.length, nullable: false },
    { key: "movingMassKg", label: "Moving mass", measure: measures.mass, nullable: true },
    { key: "stiffnessNPerMm", label: "Stiffness at the tool", measure: measures.stiffness, nullable: false },
  ] as const;
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[60rem] border-collapse text-sm">
        <caption className="sr-only">Axes</caption>
        <thead>
          <tr className="border-b border-rule">
            <th scope="col" className={th}>Axis</th>
            <th scope="col" className={th}>Drive</th>
            {cols.map((c) => (
              <th key={c.key} scope="col" className={thNum}>
                {c.label}
                <HeaderUnit>{unitOf(c.measure, system)}</HeaderUnit>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {axes.map((axis) => (
            <tr key={axis} className="border-b border-rule/70 last:border-b-0">
              <th scope="row" className={cn(td, "pt-3.5 text-left font-semibold")}>{axis.toUpperCase()}</th>
              <td className={cn(td, "w-40")}>
                <SelectField name={`axes.${axis}.drive`} label={`${axis.toUpperCase()} drive`} hideLabel options={driveOptions} />
                <EstimateTag path={`axes.${axis}.drive`} what={`the ${axis.toUpperCase()} drive`} readOnly={readOnly} className="mt-1" />
              </td>
              {cols.map((c) => (
                <td key={c.key} className={cn(td, "min-w-32 text-right")}>
                  <NumberField
                    name={`axes.${axis}.${c.key}`}
                    label={`${axis.toUpperCase()} ${c.label.toLowerCase()}`}
                    hideLabel
                    measure={c.measure}
                    nullable={c.nullable}
                    placeholder={c.nullable ? "not known" : undefined}
                  />
                  <EstimateTag path={`axes.${axis}.${c.key}`} what={`${axis.toUpperCase()} ${c.label.toLowerCase()}`} readOnly={readOnly} className="mt-1" />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function ModesTable({ readOnly }: { readOnly: boolean }) {
  const system = useUnitSystem();
  const { control, getValues, setValue, formState } = useFormContext<MachineBody>();
  const { fields, append, remove } = useFieldArray({ control, name: "modes" });
  const listError = (get(formState.errors, "modes") as { message?: string; root?: { message?: string } } | undefined);
  return (
    <div className="flex flex-col gap-3">
      {fields.length === 0 ? (
        <p className="rounded-md border border-dashed border-rule px-4 py-6 text-center text-sm text-muted">
          No modes recorded. Without them Ringdown cannot keep tooth-passing frequencies away from the machine's resonances;
          add the modes from a tap test, or start from the defaults for this kind of machine.
        </p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full min-w-[56rem] border-collapse text-sm">
            <caption className="sr-only">Vibration modes</caption>
            <thead>
              <tr className="border-b border-rule">
                <th scope="col" className={th}>Direction</th>
                <th scope="col" className={thNum}>Frequency<HeaderUnit>Hz</HeaderUnit></th>
                <th scope="col" className={thNum}>Damping ratio ζ</th>
                <th scope="col" className={thNum}>Modal stiffness<HeaderUnit>{unitOf(measures.stiffness, system)}</HeaderUnit></th>
                <th scope="col" className={th}>Source</th>
                <th scope="col" className={th}>Note</th>
                {!readOnly && <th scope="col" className={th}><span className="sr-only">Remove</span></th>}
              </tr>
            </thead>
            <tbody>
              {fields.map((f, i) => (
                <tr key={f.id} className="border-b border-rule/70 last:border-b-0">
                  <td className={cn(td, "w-24")}>
                    <SelectField name={`modes.${i}.direction`} label={`Mode ${i + 1} direction`} hideLabel options={directionOptions} />
                    <EstimateTag path={`modes.${i}`} what={`mode ${i + 1}`} readOnly={readOnly} className="mt-1" />
                  </td>
                  <td className={cn(td, "w-36")}>
                    <NumberField name={`modes.${i}.frequencyHz`} label={`Mode ${i + 1} frequency`} hideLabel measure={measures.frequency} />
                  </td>
                  <td className={cn(td, "w-32")}>
                    <NumberField name={`modes.${i}.dampingRatio`} label={`Mode ${i + 1} damping ratio`} hideLabel measure={measures.count} />
                  </td>
                  <td className={cn(td, "w-40")}>
                    <NumberField name={`modes.${i}.stiffnessNPerMm`} label={`Mode ${i + 1} modal stiffness`} hideLabel measure={measures.stiffness} />
                  </td>
                  <td className={cn(td, "w-44")}>
                    <SelectField name={`modes.${i}.source`} label={`Mode ${i + 1} source`} hideLabel options={sourceOptions} />
                  </td>
                  <td className={td}>
                    <TextField name={`modes.${i}.note`} label={<span className="sr-only">Mode {i + 1} note</span>} autoComplete="off" />
                  </td>
                  {!readOnly && (
                    <td className={cn(td, "w-10")}>
                      <Button
                        variant="quiet"
                        size="sm"
                        aria-label={`Remove mode ${i + 1}`}
                        onClick={() => {
                          setValue("estimatedFields", afterRemoval(getValues("estimatedFields") ?? [], "modes", i), { shouldDirty: true });
                          remove(i);
                        }}
                        className="mt-1"
                      >
                        <Trash2 className="size-4" aria-hidden />
                      </Button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {(listError?.message ?? listError?.root?.message) && <p className="text-xs font-medium text-limit">{listError?.message ?? listError?.root?.message}</p>}
      {!readOnly && (
        <div>
          <Button
            variant="secondary"
            size="sm"
            disabled={fields.length >= 40}
            onClick={() => append({ direction: "x", frequencyHz: Number.NaN, dampingRatio: Number.NaN, stiffnessNPerMm: Number.NaN, source: "manual", note: "" })}
          >
            <Plus className="size-4" aria-hidden /> Add a mode
          </Button>
        </div>
      )}
      <p className="text-xs text-muted">
        ζ is the fraction of critical damping (0.03 = 3 %). Modal stiffness is the mode's own stiffness from the fit or
        the tap test, not the static stiffness of the axis.
      </p>
    </div>
  );
}

function PowerCurve({ readOnly }: { readOnly: boolean }) {
  const { control } = useFormContext<MachineBody>();
  const { fields, append, remove } = useFieldArray({ control, name: "spindle.powerCurve" });
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="text-sm font-semibold text-ink">Power curve (optional)</legend>
      <p className="text-xs text-muted">Power available at a few speeds, for spindles that lose power at low rpm. Without it the rated power applies at every speed.</p>
      {fields.map((f, i) => (
        <div key={f.id} className="grid grid-cols-[1fr_1fr_auto] items-end gap-3">
          <NumberField name={`spindle.powerCurve.${i}.rpm`} label={`Point ${i + 1} speed`} measure={measures.rpm} />
          <NumberField name={`spindle.powerCurve.${i}.powerW`} label={`Point ${i + 1} power`} measure={measures.power} />
          {!readOnly && (
            <Button variant="quiet" size="sm" className="mb-1" aria-label={`Remove power point ${i + 1}`} onClick={() => remove(i)}>
              <Trash2 className="size-4" aria-hidden />
            </Button>
          )}
        </div>
      ))}
      {!readOnly && (
        <div>
          <Button variant="secondary" size="sm" disabled={fields.length >= 50} onClick={() => append({ rpm: Number.NaN, powerW: Number.NaN })}>
            <Plus className="size-4" aria-hidden /> Add a point
          </Button>
        </div>
      )}
    </fieldset>
  );
}

function DialSettings({ readOnly }: { readOnly: boolean }) {
  const { control, register } = useFormContext<MachineBody>();
  const { fields, append, remove } = useFieldArray({ control, name: "spindle.dialSettings" });
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="text-sm font-semibold text-ink">Speed dial settings (routers with a dial)</legend>
      <p className="text-xs text-muted">Each dial position with the speed it really gives; Ringdown then picks a dial setting instead of any speed.</p>
      {fields.map((f, i) => (
        <div key={f.id} className="grid grid-cols-[8rem_1fr_auto_auto] items-end gap-3">
          <TextField name={`spindle.dialSettings.${i}.label`} label={`Setting ${i + 1}`} placeholder="e.g. 3" autoComplete="off" />
          <NumberField name={`spindle.dialSettings.${i}.rpm`} label={`Setting ${i + 1} speed`} measure={measures.rpm} />
          <label className="mb-2.5 flex items-center gap-2 text-sm text-ink">
            <input type="checkbox" className="size-4 accent-brand" {...register(`spindle.dialSettings.${i}.measured`)} />
            Measured
          </label>
          {!readOnly && (
            <Button variant="quiet" size="sm" className="mb-1" aria-label={`Remove dial setting ${i + 1}`} onClick={() => remove(i)}>
              <Trash2 className="size-4" aria-hidden />
            </Button>
          )}
        </div>
      ))}
      {!readOnly && (
        <div>
          <Button variant="secondary" size="sm" disabled={fields.length >= 30} onClick={() => append({ label: "", rpm: Number.NaN, measured: false })}>
            <Plus className="size-4" aria-hidden /> Add a dial setting
          </Button>
        </div>
      )}
    </fieldset>
  );
}

function AvoidBands({ readOnly }: { readOnly: boolean }) {
  const { control } = useFormContext<MachineBody>();
  const { fields, append, remove } = useFieldArray({ control, name: "avoidBands" });
  return (
    <fieldset className="flex flex-col gap-2 sm:col-span-2">
      <legend className="text-sm font-semibold text-ink">Frequency bands to avoid</legend>
      <p className="text-xs text-muted">Tooth-passing frequencies inside these bands are refused, e.g. a band where the machine was heard to sing.</p>
      {fields.map((f, i) => (
        <div key={f.id} className="grid grid-cols-[1fr_1fr_2fr_auto] items-end gap-3">
          <NumberField name={`avoidBands.${i}.minHz`} label={`Band ${i + 1} from`} measure={measures.frequency} />
          <NumberField name={`avoidBands.${i}.maxHz`} label={`Band ${i + 1} to`} measure={measures.frequency} />
          <TextField name={`avoidBands.${i}.note`} label={`Band ${i + 1} note`} autoComplete="off" />
          {!readOnly && (
            <Button variant="quiet" size="sm" className="mb-1" aria-label={`Remove band ${i + 1}`} onClick={() => remove(i)}>
              <Trash2 className="size-4" aria-hidden />
            </Button>
          )}
        </div>
      ))}
      {!readOnly && (
        <div>
          <Button variant="secondary" size="sm" disabled={fields.length >= 20} onClick={() => append({ minHz: Number.NaN, maxHz: Number.NaN, note: "" })}>
            <Plus className="size-4" aria-hidden /> Add a band
          </Button>
        </div>
      )}
    </fieldset>
  );
}

/** Asks before leaving the page with unsaved changes. */
function LeaveGuard({ dirty }: { dirty: boolean }) {
  const blocker = useBlocker(({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname);
  useEffect(() => {
    if (!dirty) return;
    const onBeforeUnload = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", onBeforeUnload);
    return () => window.removeEventListener("beforeunload", onBeforeUnload);
  }, [dirty]);
  return (
    <ConfirmDialog
      open={blocker.state === "blocked"}
      onClose={() => blocker.reset?.()}
      title="Leave without saving?"
      confirmLabel="Leave and discard changes"
      danger
      onConfirm={() => blocker.proceed?.()}
    >
      <p>The changes to this machine have not been saved.</p>
    </ConfirmDialog>
  );
}

function SaveBar({ form, readOnly, submitLabel, isNew }: { form: UseFormReturn<MachineBody, unknown, MachineBody>; readOnly: boolean; submitLabel: string; isNew: boolean }) {
  const { isDirty, isSubmitting } = form.formState;
  if (readOnly) return null;
  return (
    <div
      className={cn(
        "-mx-1 flex flex-wrap items-center justify-end gap-3 rounded-lg border border-rule bg-surface/95 px-4 py-3",
        // Kept in view while there is something to save.
        (isNew || isDirty) && "sticky bottom-0 z-20 shadow-[0_-4px_12px_-8px_rgb(34_37_42/0.3)] backdrop-blur",
      )}
    >
      <span className="mr-auto text-sm text-muted" aria-live="polite">
        {isNew ? "Not saved yet." : isDirty ? "Unsaved changes." : "All changes saved."}
      </span>
      {!isNew && (
        <Button variant="secondary" disabled={!isDirty || isSubmitting} onClick={() => form.reset()}>
          Discard changes
        </Button>
      )}
      <Button type="submit" pending={isSubmitting} disabled={!isNew && !isDirty}>
        {submitLabel}
      </Button>
    </div>
  );
}

/**
 * Every figure of a machine in sections: spindle, axes, modes, limits. Values are shown and typed
 * in the person's units; those that came from the defaults by kind say "Estimate" until changed
 * or marked checked. Read-only (all inputs disabled) for people who may not edit machines.
 */
export function MachineForm({
  initial,
  readOnly,
  isNew,
  showKind,
  submitLabel,
  onSubmit,
  onSaved,
}: {
  initial: MachineBody;
  readOnly: boolean;
  isNew: boolean;
  /** The kind is chosen above the form when a new machine starts from defaults. */
  showKind: boolean;
  submitLabel: string;
  /** Saves (POST or PATCH) and resolves with the stored machine; throw to show the errors. */
  onSubmit: (values: MachineBody) => Promise<Machine>;
  onSaved: (saved: Machine) => void;
}) {
  const formRef = useRef<UseFormReturn<MachineBody, unknown, MachineBody> | null>(null);
  return (
    <Form
      schema={machineBodySchema}
      defaultValues={initial}
      aria-label={isNew ? "New machine" : "Machine"}
      className="flex flex-col gap-5"
      onSubmit={async (values) => {
        const saved = await onSubmit(values);
        // What is stored becomes the baseline: "unsaved changes" clears, Discard returns here.
        formRef.current?.reset(bodyOfMachine(saved));
        onSaved(saved);
      }}
    >
      {(form) => {
        formRef.current = form as unknown as UseFormReturn<MachineBody, unknown, MachineBody>;
        return (
          <MachineFormBody form={formRef.current} readOnly={readOnly} isNew={isNew} showKind={showKind} submitLabel={submitLabel} />
        );
      }}
    </Form>
  );
}

function MachineFormBody({
  form,
  readOnly,
  isNew,
  showKind,
  submitLabel,
}: {
  form: UseFormReturn<MachineBody, unknown, MachineBody>;
  readOnly: boolean;
  isNew: boolean;
  showKind: boolean;
  submitLabel: string;
}) {
  return (
    <>
      {!readOnly && <EstimateTracker />}
      {!readOnly && <LeaveGuard dirty={isNew ? false : form.formState.isDirty} />}
      <FormError />
      <fieldset disabled={readOnly} className="flex min-w-0 flex-col gap-5">
        <Section title="Machine">
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField name="name" label="Name" autoComplete="off" />
            {showKind && <SelectField name="kind" label="Kind" options={kindOptions} />}
            <div className="sm:col-span-2">
              <TextareaField name="notes" label="Notes" rows={2} placeholder="Frame, spindle model, upgrades, where it stands…" />
            </div>
          </div>
        </Section>

        <Section title="Spindle" aside={<EstimateCount path="spindle" />}>
          <div className="grid gap-4 sm:grid-cols-3">
            <NumberField name="spindle.minRpm" label="Slowest speed" measure={measures.rpm} tag={<EstimateTag path="spindle.minRpm" what="the slowest speed" readOnly={readOnly} />} />
            <NumberField name="spindle.maxRpm" label="Fastest speed" measure={measures.rpm} tag={<EstimateTag path="spindle.maxRpm" what="the fastest speed" readOnly={readOnly} />} />
            <NumberField name="spindle.powerW" label="Rated power" measure={measures.power} tag={<EstimateTag path="spindle.powerW" what="the rated power" readOnly={readOnly} />} />
          </div>
          <div className="mt-6 grid gap-6 lg:grid-cols-2">
            <PowerCurve readOnly={readOnly} />
            <DialSettings readOnly={readOnly} />
          </div>
        </Section>

        <Section
          title="Axes"
          description="Static stiffness at the tool per direction, as measured with a dial indicator and a known force; drives, travel, feeds and backlash."
          aside={<EstimateCount path="axes" />}
        >
          <AxesTable readOnly={readOnly} />
        </Section>

        <Section
          title="Vibration modes"
          description="The machine's resonances: Ringdown keeps tooth-passing frequencies clear of them by the margin below."
          aside={<EstimateCount path="modes" />}
        >
          <ModesTable readOnly={readOnly} />
        </Section>

        <Section title="Limits for recipes" aside={<EstimateCount path="deflectionCeilingMm" />}>
          <div className="grid gap-4 sm:grid-cols-2">
            <NumberField
              name="deflectionCeilingMm"
              label="Deflection ceiling at the tool"
              measure={measures.length}
              hint="Recipes keep the tool's deflection below this. 0.025 mm (about 0.001 in) is a common starting point."
              tag={<EstimateTag path="deflectionCeilingMm" what="the deflection ceiling" readOnly={readOnly} />}
            />
            <NumberField
              name="modeMarginPct"
              label="Margin from every mode"
              measure={measures.percent}
              hint="How far tooth-passing frequencies stay from each mode."
              tag={<EstimateTag path="modeMarginPct" what="the mode margin" readOnly={readOnly} />}
            />
            <AvoidBands readOnly={readOnly} />
          </div>
        </Section>
      </fieldset>
      <SaveBar form={form} readOnly={readOnly} submitLabel={submitLabel} isNew={isNew} />
    </>
  );
}

