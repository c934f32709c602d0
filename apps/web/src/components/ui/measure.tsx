import type { UnitSystem } from "@ringdown/contracts";
import { useUnitSystem } from "@/lib/auth";
import { cn } from "@/lib/cn";
import { NUMBER_UNIT_SPACE } from "@/lib/format";
import { formatMeasureNumber, unitOf, type Measure } from "./units";

/**
 * A stored (base-unit) value shown in the person's unit system with its unit after it in a
 * lighter weight: tabular figures, "—" when missing.
 */
export function MeasureValue({
  value,
  measure,
  system,
  className,
}: {
  value: number | null | undefined;
  measure: Measure;
  /** Defaults to the signed-in person's preference. */
  system?: UnitSystem;
  className?: string;
}) {
  const preferred = useUnitSystem();
  const shownIn = system ?? preferred;
  const number = formatMeasureNumber(value, measure, shownIn);
  const unit = unitOf(measure, shownIn);
  return (
    <span className={cn("tabular whitespace-nowrap", className)}>
      <span className="font-medium text-ink">{number}</span>
      {unit && number !== "—" && (
        <span className="font-normal text-muted">
          {NUMBER_UNIT_SPACE}
          {unit}
        </span>
      )}
    </span>
  );
}
