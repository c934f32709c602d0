import type { Recipe, UnitSystem } from "@ringdown/contracts";
import type { ReactNode } from "react";
import { MeasureValue } from "@/components/ui/measure";
import { measures, type Measure } from "@/components/ui/units";
import { cn } from "@/lib/cn";
import { operationLabels } from "../labels";

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex items-baseline justify-between gap-4 border-b border-rule/70 py-1.5 print:border-black/30">
      <dt className="text-sm text-ink">{label}</dt>
      <dd className="text-right text-sm">{children}</dd>
    </div>
  );
}

function Num({ value, measure, system, large }: { value: number | null; measure: Measure; system: UnitSystem; large?: boolean }) {
  return <MeasureValue value={value} measure={measure} system={system} className={large ? "text-lg" : undefined} />;
}

/** The numbers to set on the machine: what the server computed and stored with this revision. */
export function RecipeNumbers({
  recipe,
  system,
  used,
  className,
}: {
  recipe: Recipe;
  system: UnitSystem;
  /** The depths the engine cuts at (it may take less than asked, in more passes); the asked ones until known. */
  used?: { axialDepthMm: number; radialDepthMm: number } | undefined;
  className?: string;
}) {
  const r = recipe.result;
  const p = recipe.params;
  const ap = used?.axialDepthMm ?? p.axialDepthMm;
  const ae = used?.radialDepthMm ?? p.radialDepthMm;
  const fullWidth = recipe.operation === "slot" || recipe.operation === "ramp" || recipe.operation === "drill";
  const passes = used && ap < p.axialDepthMm * (1 - 1e-6) ? Math.ceil(p.axialDepthMm / ap - 1e-9) : null;
  return (
    <dl className={cn("grid gap-x-8 sm:grid-cols-2", className)}>
      <Row label="Spindle speed">
        <Num value={Math.round(r.rpm)} measure={measures.rpm} system={system} large />
      </Row>
      <Row label="Feed">
        <Num value={r.feedMmPerMin} measure={measures.feedRate} system={system} large />
      </Row>
      <Row label="Chip load (programmed)">
        <Num value={r.chipLoadMm} measure={measures.chipLoad} system={system} />
      </Row>
      <Row label={passes ? "Axial depth per pass" : "Axial depth"}>
        <Num value={ap} measure={measures.length} system={system} />
        {passes && (
          <span className="block text-xs text-muted">
            {passes} passes for <MeasureValue value={p.axialDepthMm} measure={measures.length} system={system} />
          </span>
        )}
      </Row>
      <Row label="Radial depth">{fullWidth ? <span className="text-muted">full width</span> : <Num value={ae} measure={measures.length} system={system} />}</Row>
      <Row label="Removal rate">
        <MeasureValue value={r.materialRemovalRateMm3PerMin} measure={{ quantity: "volumeRate" }} system={system} />
      </Row>
      <Row label="Cutting power">
        <Num value={r.powerW} measure={measures.power} system={system} />
      </Row>
      <Row label="Deflection at the tool">
        <Num value={r.totalDeflectionMm} measure={measures.length} system={system} />
      </Row>
    </dl>
  );
}

/** Where and how the recipe cuts: machine, cutter, material, operation and the programmer's choices. */
export function RecipeSetup({ recipe, system, className, extra }: { recipe: Recipe; system: UnitSystem; className?: string; extra?: ReactNode }) {
  const p = recipe.params;
  return (
    <dl className={cn("grid gap-x-8", className)}>
      <Row label="Machine">{recipe.machineName}</Row>
      <Row label="Cutter">{recipe.cutterName}</Row>
      <Row label="Material">{recipe.materialName}</Row>
      <Row label="Operation">{operationLabels[recipe.operation]}</Row>
      <Row label="Milling direction">{recipe.operation === "drill" ? "—" : p.millingDirection === "climb" ? "Climb" : "Conventional"}</Row>
      <Row label="Work position">
        <span className="tabular">
          X <Num value={p.workPositionXMm} measure={measures.length} system={system} />, Y{" "}
          <Num value={p.workPositionYMm} measure={measures.length} system={system} />
        </span>
      </Row>
      {p.workRegion && (
        <Row label="Stiffness taken over">
          <span className="tabular">
            X <Num value={p.workRegion.xMinMm} measure={measures.length} system={system} />–
            <Num value={p.workRegion.xMaxMm} measure={measures.length} system={system} />, Y{" "}
            <Num value={p.workRegion.yMinMm} measure={measures.length} system={system} />–
            <Num value={p.workRegion.yMaxMm} measure={measures.length} system={system} /> (softest spot)
          </span>
        </Row>
      )}
      {p.rpmOverride !== null && (
        <Row label="Speed asked for">
          <Num value={p.rpmOverride} measure={measures.rpm} system={system} />
        </Row>
      )}
      {p.chipLoadOverrideMm !== null && (
        <Row label="Chip load asked for">
          <Num value={p.chipLoadOverrideMm} measure={measures.chipLoad} system={system} />
        </Row>
      )}
      {extra}
    </dl>
  );
}
