import {
  planRecipe,
  summarizeRecommendation,
  type Assembly,
  type Cutter,
  type Machine,
  type Material,
  type Role,
  type UnitSystem,
} from "@ringdown/contracts";
import { RecommendInputError, type Recommendation } from "@ringdown/machining";
import { ChevronDown, Factory, Save } from "lucide-react";
import { useDeferredValue, useEffect, useId, useMemo, useRef, useState, type ReactNode, type Ref, type SelectHTMLAttributes } from "react";
import { useForm, useWatch, type UseFormReturn } from "react-hook-form";
import { Link } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Field, inputClass } from "@/components/ui/field";
import { LoadingState } from "@/components/ui/spinner";
import { LoadError } from "@/components/ui/load-error";
import { cn } from "@/lib/cn";
import { useAssemblies } from "../api/get-assemblies";
import { useCutter, useCutters } from "../api/get-cutters";
import { useMachines } from "../api/get-machines";
import { useMaterials } from "../api/get-materials";
import {
  convertTypedLengths,
  FULL_WIDTH,
  lengthInputText,
  lengthUnit,
  OPERATION_CHOICES,
  parsePlannerValues,
  type PlannerValues,
} from "../lib/planner-values";
import { NumberField } from "./number-field";
import { PlannerReadout } from "./planner-readout";
import { SaveRecipeDialog } from "./save-recipe-dialog";

export interface PlannerProps {
  shopId: string;
  role: Role;
  system: UnitSystem;
  /** Starting choices (e.g. from a recipe's "open in planner"); the rest is filled from the library. */
  initial?: Partial<PlannerValues>;
  /** What the planner shows beside the prediction: the shop's logged cuts for this machine and material. */
  evidence?: (input: {
    machineId: string;
    materialId: string;
    rec: Recommendation | null;
    /** The chosen machine and the flutes of the chosen cutter, for the resonance and stability read-out */
    machine: Machine | null;
    flutes: number | null;
    millingDirection: PlannerValues["millingDirection"];
    /** Puts a speed in the spindle-speed override (e.g. an offered stable speed) */
    applyRpm: (rpm: number) => void;
  }) => ReactNode;
}

const CAN_SAVE: ReadonlySet<Role> = new Set<Role>(["owner", "tooling_manager", "programmer"]);

const EMPTY: PlannerValues = {
  machineId: "",
  assemblyId: "",
  materialId: "",
  operation: "profile",
  axialDepth: "",
  radialDepth: "",
  workX: "",
  workY: "",
  useRegion: false,
  regionXFrom: "",
  regionXTo: "",
  regionYFrom: "",
  regionYTo: "",
  millingDirection: "climb",
  rpmOverride: "",
  chipLoadOverride: "",
};

function assemblyLabel(a: Assembly, system: UnitSystem): string {
  const out = `${lengthInputText(a.stickoutMm, system)} ${lengthUnit(system)} out`;
  const status = a.cutterStatus && a.cutterStatus !== "approved" ? ` (${a.cutterStatus})` : "";
  return `${a.cutterName ?? "Cutter"}${status} · ${a.holder} · ${out}`;
}

/** Shop materials first, then the global library, each by name. */
function materialGroups(materials: Material[]) {
  const byName = (a: Material, b: Material) => a.name.localeCompare(b.name);
  return [
    { label: "This shop's materials", items: materials.filter((m) => m.shopId !== null).sort(byName) },
    { label: "Library", items: materials.filter((m) => m.shopId === null).sort(byName) },
  ].filter((g) => g.items.length > 0);
}

/**
 * The planner: inputs on the left, and on the right a read-out the engine recomputes in the browser
 * on every keystroke. Saving sends only the choices; the server recomputes before it stores.
 */
export function Planner({ shopId, role, system, initial, evidence }: PlannerProps) {
  const machines = useMachines(shopId);
  const materials = useMaterials(shopId);
  const form = useForm<PlannerValues>({ defaultValues: { ...EMPTY, ...initial }, mode: "onChange" });
  const values = useWatch({ control: form.control }) as PlannerValues;
  const [saving, setSaving] = useState(false);

  const machine = machines.data?.items.find((m) => m.id === values.machineId) ?? null;
  const assemblies = useAssemblies(shopId, values.machineId || null, Boolean(values.machineId));
  const assembly = assemblies.data?.items.find((a) => a.id === values.assemblyId) ?? null;
  // The cutter comes from the shop's cutter list (loaded alongside the machines); only a cutter
  // missing from it (e.g. beyond the first page) is fetched on its own.
  const cutters = useCutters(shopId);
  const listed = assembly ? (cutters.data?.items.find((c) => c.id === assembly.cutterId) ?? null) : null;
  const single = useCutter(shopId, assembly && cutters.isSuccess && !listed ? assembly.cutterId : null);
  const cutter = listed
    ? { data: listed, isPending: false, isError: false as const, error: null }
    : assembly && cutters.isPending
      ? { data: undefined, isPending: true, isError: false as const, error: null }
      : single;
  const material = materials.data?.items.find((m) => m.id === values.materialId) ?? null;

  // Switching metric/imperial rewrites the typed lengths, so the cut stays the same.
  const shownSystem = useRef(system);
  useEffect(() => {
    if (shownSystem.current === system) return;
    const converted = convertTypedLengths(form.getValues(), shownSystem.current, system);
    for (const [name, value] of Object.entries(converted)) form.setValue(name as keyof PlannerValues, value as never);
    shownSystem.current = system;
  }, [system, form]);

  useLibraryDefaults(form, system, machines.data?.items, assemblies.data?.items, materials.data?.items, machine, cutter.data ?? null);

  // Typing stays smooth even on a slow phone: the engine runs on the deferred values.
  const deferred = useDeferredValue(values);
  const parsed = useMemo(
    () =>
      parsePlannerValues(deferred, {
        system,
        ...(machine ? { travelXMm: machine.axes.x.travelMm, travelYMm: machine.axes.y.travelMm } : {}),
      }),
    [deferred, system, machine],
  );
  const plan = useMemo(() => {
    if (!machine || !assembly || !cutter.data || !material || !parsed.params) return null;
    if (assembly.cutterId !== cutter.data.id) return null;
    try {
      const rec = planRecipe({ machine, assembly, cutter: cutter.data, material, operation: deferred.operation, params: parsed.params });
      return { rec, error: null };
    } catch (error) {
      if (error instanceof RecommendInputError) {
        return { rec: null, error: Object.values(error.fields).join(" ") || error.message };
      }
      if (error instanceof RangeError) return { rec: null, error: error.message };
      throw error;
    }
  }, [machine, assembly, cutter.data, material, parsed.params, deferred.operation]);

  if (machines.isPending || materials.isPending) return <LoadingState label="Loading the shop's machines and materials…" />;
  if (machines.isError || materials.isError) {
    const error = machines.error ?? materials.error;
    return (
      <Card>
        <LoadError className="p-5" onRetry={() => void Promise.all([machines.refetch(), materials.refetch()])}>
          Cannot load the shop's library: {error?.message}
        </LoadError>
      </Card>
    );
  }
  if (machines.data.items.length === 0) {
    return (
      <Card>
        <EmptyState
          icon={Factory}
          title="No machines in this shop yet"
          action={
            <Link to="/machines" className="inline-flex h-10 items-center rounded-md bg-brand px-4 text-sm font-medium text-white hover:bg-brand-strong">
              Go to Machines
            </Link>
          }
        >
          <p>
            The planner holds every recipe within a machine's measured limits, so it needs a machine first: add one with its spindle, stiffness and
            modes, then a cutter assembly on it.
          </p>
        </EmptyState>
      </Card>
    );
  }

  const unit = lengthUnit(system);
  const errors = parsed.errors;
  const fullWidth = FULL_WIDTH.has(values.operation);
  const noAssemblies = assemblies.isSuccess && assemblies.data.items.length === 0;
  const canSave = CAN_SAVE.has(role);
  const saveBody =
    plan?.rec && parsed.params && assembly && material
      ? {
          assemblyId: assembly.id,
          materialId: material.id,
          operation: deferred.operation,
          params: parsed.params,
          suggestedName: `${assembly.cutterName ?? "Cutter"} in ${material.name}, ${OPERATION_CHOICES.find((o) => o.value === deferred.operation)?.label.toLowerCase()}`,
          summary: summarizeRecommendation(plan.rec),
          broken: plan.rec.limits.filter((l) => !l.holds).map((l) => l.label),
        }
      : null;

  return (
    <div className="grid items-start gap-6 lg:grid-cols-[minmax(18rem,22rem)_minmax(0,1fr)]">
      <Card>
        <form
          aria-label="Cut to plan"
          noValidate
          onSubmit={(event) => {
            event.preventDefault();
            if (saveBody && canSave) setSaving(true);
          }}
        >
          <Section title="Machine and cutter">
            <SelectField label="Machine" {...form.register("machineId")}>
              {machines.data.items.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                </option>
              ))}
            </SelectField>
            <SelectField
              label="Cutter assembly"
              disabled={!values.machineId || assemblies.isPending || noAssemblies}
              hint={
                noAssemblies ? (
                  <>
                    No cutter assemblies on this machine yet.{" "}
                    <Link to="/machines" className="font-medium text-brand underline underline-offset-2">
                      Add one under Machines
                    </Link>
                    .
                  </>
                ) : assembly ? (
                  `Runout ${lengthInputText(assembly.runoutMm, system)} ${unit} TIR${assembly.notes ? ` · ${assembly.notes}` : ""}`
                ) : undefined
              }
              error={assemblies.isError ? `Cannot load the assemblies: ${assemblies.error.message}` : undefined}
              {...form.register("assemblyId")}
            >
              {assemblies.isPending && <option value="">Loading…</option>}
              {noAssemblies && <option value="">None on this machine</option>}
              {assemblies.data?.items.map((a) => (
                <option key={a.id} value={a.id}>
                  {assemblyLabel(a, system)}
                </option>
              ))}
            </SelectField>
            <SelectField label="Material" {...form.register("materialId")}>
              {materialGroups(materials.data.items).map((g) => (
                <optgroup key={g.label} label={g.label}>
                  {g.items.map((m) => (
                    <option key={m.id} value={m.id}>
                      {m.name}
                    </option>
                  ))}
                </optgroup>
              ))}
            </SelectField>
            <SelectField label="Operation" {...form.register("operation")}>
              {OPERATION_CHOICES.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </SelectField>
          </Section>

          <Section title="Engagement">
            <div className="grid grid-cols-2 gap-3">
              <NumberField
                label={values.operation === "drill" ? "Hole depth" : "Axial depth"}
                unit={unit}
                error={errors.axialDepth}
                {...form.register("axialDepth")}
              />
              <NumberField
                label="Radial depth"
                unit={unit}
                disabled={fullWidth}
                hint={fullWidth ? "Full diameter" : undefined}
                error={fullWidth ? undefined : errors.radialDepth}
                {...form.register("radialDepth")}
              />
            </div>
            <fieldset disabled={values.operation === "drill"}>
              <legend className="mb-1.5 text-sm font-medium text-ink">Milling direction</legend>
              <div className="flex gap-4">
                {(["climb", "conventional"] as const).map((d) => (
                  <label key={d} className="flex cursor-pointer items-center gap-2 text-sm">
                    <input type="radio" value={d} className="size-4 accent-brand" {...form.register("millingDirection")} />
                    {d === "climb" ? "Climb" : "Conventional"}
                  </label>
                ))}
              </div>
            </fieldset>
          </Section>

          <Section title="Work position on the bed" description={machine ? workPositionNote(machine, system, unit) : undefined}>
            <div className="grid grid-cols-2 gap-3">
              <NumberField label="X" unit={unit} error={errors.workX} {...form.register("workX")} />
              <NumberField label="Y" unit={unit} error={errors.workY} {...form.register("workY")} />
            </div>
            <label className="mt-3 flex cursor-pointer items-start gap-2 text-sm">
              <input
                type="checkbox"
                className="mt-0.5 size-4 accent-brand"
                {...form.register("useRegion", {
                  onChange: (event: { target: { checked: boolean } }) => {
                    // A first region: the whole table, to narrow down.
                    if (!event.target.checked || !machine || form.getValues("regionXTo") !== "") return;
                    form.setValue("regionXFrom", "0");
                    form.setValue("regionXTo", lengthInputText(machine.axes.x.travelMm, system));
                    form.setValue("regionYFrom", "0");
                    form.setValue("regionYTo", lengthInputText(machine.axes.y.travelMm, system));
                  },
                })}
              />
              <span>
                The cut moves across the bed: use the softest spot of a region
                <span className="block text-xs text-muted">Deflection is then checked where the machine is weakest inside the region.</span>
              </span>
            </label>
            {values.useRegion ? (
              <fieldset className="mt-3 grid grid-cols-2 gap-3">
                <legend className="sr-only">Region of the bed</legend>
                <NumberField label="Region X from" unit={unit} error={errors.regionXFrom} {...form.register("regionXFrom")} />
                <NumberField label="Region X to" unit={unit} error={errors.regionXTo} {...form.register("regionXTo")} />
                <NumberField label="Region Y from" unit={unit} error={errors.regionYFrom} {...form.register("regionYFrom")} />
                <NumberField label="Region Y to" unit={unit} error={errors.regionYTo} {...form.register("regionYTo")} />
              </fieldset>
            ) : null}
          </Section>

          <Section title="Overrides" description="Optional. The engine still holds them within every limit.">
            <div className="grid grid-cols-2 gap-3">
              <NumberField label="Spindle speed" unit="rpm" placeholder="auto" error={errors.rpmOverride} {...form.register("rpmOverride")} />
              <NumberField
                label="Chip load"
                unit={`${unit}/tooth`}
                placeholder="auto"
                error={errors.chipLoadOverride}
                {...form.register("chipLoadOverride")}
              />
            </div>
          </Section>

          <div className="flex flex-col gap-2 px-5 py-4">
            {canSave ? (
              <>
                <Button type="submit" disabled={!saveBody}>
                  <Save className="size-4" aria-hidden />
                  Save as recipe…
                </Button>
                {!saveBody && <p className="text-xs text-muted">Complete the inputs to save this cut as a recipe.</p>}
              </>
            ) : (
              <p className="text-xs text-muted">Operators can plan here; saving recipes is for programmers, tooling managers and owners.</p>
            )}
          </div>
        </form>
      </Card>

      <div className="flex min-w-0 flex-col gap-6">
        <PlannerReadout
          rec={plan?.rec ?? null}
          error={plan?.error ?? null}
          loading={Boolean(values.assemblyId) && (cutter.isPending || assemblies.isPending)}
          cutterError={cutter.isError ? cutter.error.message : null}
          hasInputErrors={Object.keys(errors).length > 0}
          noAssembly={noAssemblies || !values.assemblyId}
          system={system}
          requested={parsed.params}
          machineName={machine?.name ?? null}
        />
        {evidence &&
          values.machineId &&
          values.materialId &&
          evidence({
            machineId: values.machineId,
            materialId: values.materialId,
            rec: plan?.rec ?? null,
            machine,
            flutes: cutter.data?.flutes ?? null,
            millingDirection: deferred.millingDirection,
            applyRpm: (rpm) => form.setValue("rpmOverride", String(Math.round(rpm)), { shouldDirty: true, shouldValidate: true }),
          })}
      </div>

      {saving && saveBody && (
        <SaveRecipeDialog
          shopId={shopId}
          open={saving}
          onClose={() => setSaving(false)}
          body={saveBody}
        />
      )}
    </div>
  );
}

/**
 * Fills the form from the library as it loads: the first machine, assembly and material when none
 * is chosen (or the chosen one is gone), the middle of the bed, and depths from the cutter's
 * diameter while the person has not typed their own.
 */
function useLibraryDefaults(
  form: UseFormReturn<PlannerValues>,
  system: UnitSystem,
  machines: Machine[] | undefined,
  assemblies: Assembly[] | undefined,
  materials: Material[] | undefined,
  machine: Machine | null,
  cutter: Cutter | null,
) {
  // Each effect runs when its record arrives or changes (its id), not on every render: the form
  // methods are stable and the values are read when the effect runs.
  const { getValues, setValue, getFieldState } = form;
  const set = (name: keyof PlannerValues, value: string) => setValue(name, value as never, { shouldDirty: false });

  useEffect(() => {
    if (!machines || machines.length === 0) return;
    if (!machines.some((m) => m.id === getValues("machineId"))) set("machineId", machines[0]!.id);
  }, [machines]);

  useEffect(() => {
    if (!assemblies) return;
    if (!assemblies.some((a) => a.id === getValues("assemblyId"))) set("assemblyId", assemblies[0]?.id ?? "");
  }, [assemblies]);

  useEffect(() => {
    if (!materials || materials.length === 0) return;
    if (!materials.some((m) => m.id === getValues("materialId"))) {
      const first = materialGroups(materials)[0]?.items[0];
      if (first) set("materialId", first.id);
    }
  }, [materials]);

  // On the first machine and cutter, values given at the start (e.g. from a recipe) are kept;
  // after a change of machine or cutter, fields the person has not typed in follow the new one.
  const first = useRef({ machine: true, cutter: true });
  const keep = (name: keyof PlannerValues, isFirst: boolean) =>
    getFieldState(name).isDirty || (isFirst && getValues(name) !== "");

  useEffect(() => {
    if (!machine) return;
    const isFirst = first.current.machine;
    first.current.machine = false;
    if (!keep("workX", isFirst)) set("workX", lengthInputText(machine.axes.x.travelMm / 2, system));
    if (!keep("workY", isFirst)) set("workY", lengthInputText(machine.axes.y.travelMm / 2, system));
  }, [machine?.id]);

  useEffect(() => {
    if (!cutter) return;
    const isFirst = first.current.cutter;
    first.current.cutter = false;
    // A first guess to edit: one diameter deep (within the flutes), a quarter of it wide
    // (common practice for side cuts, no published source).
    const d = cutter.diameterMm;
    if (!keep("axialDepth", isFirst)) set("axialDepth", lengthInputText(Math.min(d, cutter.fluteLengthMm), system));
    if (!keep("radialDepth", isFirst)) set("radialDepth", lengthInputText(d / 4, system));
  }, [cutter?.id]);
}

/** What the work position changes on this machine: its measured stiffness map, or nothing yet. */
function workPositionNote(machine: Machine, system: UnitSystem, unit: string): string {
  const travel = `Travel ${lengthInputText(machine.axes.x.travelMm, system)} × ${lengthInputText(machine.axes.y.travelMm, system)} ${unit}.`;
  const lateral = (machine.stiffnessPoints ?? []).filter((p) => p.direction !== "z").length;
  return lateral > 0
    ? `${travel} Stiffness is taken from ${lateral} dial-indicator reading${lateral === 1 ? "" : "s"} at this position.`
    : `${travel} No stiffness readings on this machine yet: its single stiffness per axis is used wherever the cut is.`;
}

function Section({ title, description, children }: { title: string; description?: string | undefined; children: ReactNode }) {
  const id = useId();
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3 border-b border-rule px-5 py-4">
      <div>
        <h2 id={id} className="text-sm font-semibold text-ink">
          {title}
        </h2>
        {description && <p className="mt-0.5 text-xs text-muted">{description}</p>}
      </div>
      {children}
    </section>
  );
}

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  hint?: ReactNode;
  error?: string | undefined;
  ref?: Ref<HTMLSelectElement>;
};

function SelectField({ label, hint, error, className, children, ...rest }: SelectProps) {
  const id = useId();
  return (
    <Field id={id} label={label} hint={hint} error={error}>
      <div className="relative">
        <select
          id={id}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
          className={cn(inputClass, "cursor-pointer appearance-none pr-9 disabled:cursor-not-allowed", className)}
          {...rest}
        >
          {children}
        </select>
        <ChevronDown aria-hidden className="pointer-events-none absolute top-1/2 right-3 size-4 -translate-y-1/2 text-muted" />
      </div>
    </Field>
  );
}
