import { planRecipe, type Machine, type Operation, type UnitSystem } from "@ringdown/contracts";
import { RecommendInputError } from "@ringdown/machining";
import { useEffect, useId, useMemo, useState } from "react";
import { Link } from "react-router-dom";
import { SafetyBand } from "@/components/recommendation/safety-band";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Field, Input } from "@/components/ui/field";
import { Select } from "@/components/ui/select";
import { LoadingState } from "@/components/ui/spinner";
import { formatMeasure, fromDisplay, measures, toInputText, unitOf } from "@/components/ui/units";
import { LoadError } from "@/components/ui/load-error";
import { toSearch } from "@/lib/active-shop";
import { formatQuantity } from "@/lib/format";
import { useCutterOf, useMachineAssemblies, useMachineCutLogs, useMaterialChoices } from "../api/library-choices";
import { OPERATION_LABELS } from "@/features/planner/lib/planner-values";
import { StabilityPanel } from "./stability-panel";

/** Side-cutting operations, where the lobes apply, with the planner's names for them. */
const OPERATIONS: Array<{ value: Operation; label: string }> = (["profile", "adaptive", "pocket", "slot", "finish"] as const).map((value) => ({
  value,
  label: OPERATION_LABELS[value],
}));

/**
 * The stability chart of this machine for a cutter assembly on it and a material: the engine
 * computes a recipe for the chosen cut (exactly as the planner does), and the chart shows where
 * that recipe sits against the chatter boundary and the shop's logged cuts.
 */
export function StabilitySection({ shopId, machine, system }: { shopId: string; machine: Machine; system: UnitSystem }) {
  const assemblies = useMachineAssemblies(shopId, machine.id);
  const materials = useMaterialChoices(shopId);
  const [assemblyId, setAssemblyId] = useState("");
  const [materialId, setMaterialId] = useState("");
  const [operation, setOperation] = useState<Operation>("profile");
  const [axialText, setAxialText] = useState("");
  const [radialText, setRadialText] = useState("");
  const ids = { assembly: useId(), material: useId(), operation: useId(), ap: useId(), ae: useId() };

  const assembly = assemblies.data?.items.find((a) => a.id === assemblyId) ?? null;
  const material = materials.data?.items.find((m) => m.id === materialId) ?? null;
  const cutter = useCutterOf(shopId, assembly?.cutterId ?? null);
  const logs = useMachineCutLogs(shopId, machine.id, material?.id ?? null);

  useEffect(() => {
    const first = assemblies.data?.items[0];
    if (!assemblyId && first) setAssemblyId(first.id);
  }, [assemblies.data, assemblyId]);
  useEffect(() => {
    if (materialId || !materials.data) return;
    const items = materials.data.items;
    const first = items.find((m) => m.shopId !== null) ?? items[0];
    if (first) setMaterialId(first.id);
  }, [materials.data, materialId]);
  // A first cut to look at: one diameter deep (within the flutes), a quarter wide (common practice, no published source).
  useEffect(() => {
    const c = cutter.data;
    if (!c) return;
    setAxialText(toInputText(Math.min(c.diameterMm, c.fluteLengthMm), measures.length, system));
    setRadialText(toInputText(c.diameterMm / 4, measures.length, system));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [cutter.data?.id]);

  const unit = unitOf(measures.length, system);
  const parse = (text: string) => {
    const v = Number(text.trim().replace(",", "."));
    return text.trim() !== "" && Number.isFinite(v) && v > 0 ? fromDisplay(v, measures.length, system) : null;
  };
  const ap = parse(axialText);
  const ae = parse(radialText);

  const plan = useMemo(() => {
    if (!assembly || !cutter.data || !material || ap === null || ae === null || assembly.cutterId !== cutter.data.id) return null;
    try {
      const rec = planRecipe({
        machine,
        assembly,
        cutter: cutter.data,
        material,
        operation,
        params: {
          axialDepthMm: ap,
          radialDepthMm: ae,
          workPositionXMm: machine.axes.x.travelMm / 2,
          workPositionYMm: machine.axes.y.travelMm / 2,
          workRegion: null,
          millingDirection: "climb",
          rpmOverride: null,
          chipLoadOverrideMm: null,
        },
      });
      return { rec, error: null };
    } catch (error) {
      if (error instanceof RecommendInputError) return { rec: null, error: Object.values(error.fields).join(" ") || error.message };
      if (error instanceof RangeError) return { rec: null, error: error.message };
      throw error;
    }
  }, [machine, assembly, cutter.data, material, operation, ap, ae]);

  const loading = assemblies.isPending || materials.isPending;
  const noAssemblies = assemblies.isSuccess && assemblies.data.items.length === 0;

  return (
    <Card>
      <CardHeader
        title="Stability lobes"
        description="Limiting depth of cut against spindle speed for a cutter on this machine in a material. The recipe shown is the one the planner would give for this cut."
      />
      <CardBody className="flex flex-col gap-5">
        {loading ? (
          <LoadingState label="Loading the machine's assemblies and the materials…" />
        ) : assemblies.isError || materials.isError ? (
          <LoadError
            onRetry={() => {
              if (assemblies.isError) void assemblies.refetch();
              if (materials.isError) void materials.refetch();
            }}
          >
            Cannot load the {assemblies.isError ? "machine's cutter assemblies" : "materials"}: {(assemblies.error ?? materials.error)?.message}
          </LoadError>
        ) : noAssemblies ? (
          <p className="text-sm text-muted">Add a cutter assembly to this machine (on its Figures and assemblies tab) to draw its stability lobes.</p>
        ) : (
          <>
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-[2fr_2fr_1.4fr_1fr_1fr]">
              <Field id={ids.assembly} label="Cutter assembly">
                <Select
                  id={ids.assembly}
                  value={assemblyId}
                  onChange={(e) => setAssemblyId(e.target.value)}
                  options={(assemblies.data?.items ?? []).map((a) => ({ value: a.id, label: `${a.cutterName ?? "Cutter"} · ${a.holder}` }))}
                />
              </Field>
              <Field id={ids.material} label="Material">
                <Select id={ids.material} value={materialId} onChange={(e) => setMaterialId(e.target.value)} options={(materials.data?.items ?? []).map((m) => ({ value: m.id, label: m.name }))} />
              </Field>
              <Field id={ids.operation} label="Operation">
                <Select id={ids.operation} value={operation} onChange={(e) => setOperation(e.target.value as Operation)} options={OPERATIONS} />
              </Field>
              <Field id={ids.ap} label={`Axial depth [${unit}]`} error={axialText && ap === null ? "Enter a depth above 0" : undefined}>
                <Input id={ids.ap} inputMode="decimal" className="tabular text-right" value={axialText} onChange={(e) => setAxialText(e.target.value)} invalid={Boolean(axialText) && ap === null} />
              </Field>
              <Field id={ids.ae} label={`Radial depth [${unit}]`} error={operation !== "slot" && radialText && ae === null ? "Enter a width above 0" : undefined}>
                <Input
                  id={ids.ae}
                  inputMode="decimal"
                  className="tabular text-right"
                  disabled={operation === "slot"}
                  value={radialText}
                  onChange={(e) => setRadialText(e.target.value)}
                  invalid={operation !== "slot" && Boolean(radialText) && ae === null}
                />
              </Field>
            </div>
            {cutter.isPending && assembly ? (
              <LoadingState label="Loading the cutter…" />
            ) : cutter.isError ? (
              <p role="alert" className="text-sm text-limit">
                Cannot load the cutter: {cutter.error.message}
              </p>
            ) : plan?.error ? (
              <p role="alert" className="text-sm text-limit">
                The engine cannot compute this cut: {plan.error}
              </p>
            ) : plan?.rec && cutter.data ? (
              <>
                <p className="text-sm text-ink">
                  The planner's recipe for this cut: {formatQuantity(plan.rec.rpm, "rpm", { fractionDigits: 0 })}, {formatMeasure(plan.rec.feedMmPerMin, measures.feedRate, system)} feed.{" "}
                  {assembly && material && (
                    <Link
                      className="font-medium text-brand underline-offset-2 hover:underline"
                      to={`/planner${toSearch({ machineId: machine.id, assemblyId: assembly.id, materialId: material.id, operation, ap, ae })}`}
                    >
                      Open in the planner
                    </Link>
                  )}
                </p>
                <StabilityPanel machine={machine} flutes={cutter.data.flutes} rec={plan.rec} cutLogs={logs.data?.items ?? []} system={system} headingLevel={3} />
                <SafetyBand notes={plan.rec.safetyNotes} />
              </>
            ) : (
              <p className="text-sm text-muted">Choose a cutter assembly, a material and the depths of the cut.</p>
            )}
          </>
        )}
      </CardBody>
    </Card>
  );
}
