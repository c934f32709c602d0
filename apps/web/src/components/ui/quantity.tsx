import type { UnitSystem } from "@ringdown/contracts";
import { formatNumber, NUMBER_UNIT_SPACE, type NumberFormat } from "@/lib/format";
import { cn } from "@/lib/cn";

/**
 * A number with its unit: tabular figures, thousands grouped, the unit right
 * after it in a lighter weight ("18 000 rpm"). The accessible text is the same
 * string a reader sees.
 */
export function Quantity({
  value,
  unit,
  fractionDigits,
  significantDigits,
  system,
  className,
}: {
  value: number | null | undefined;
  unit: string;
  system?: UnitSystem;
  className?: string;
} & Pick<NumberFormat, "fractionDigits" | "significantDigits">) {
  const options: NumberFormat = { system };
  if (fractionDigits !== undefined) options.fractionDigits = fractionDigits;
  if (significantDigits !== undefined) options.significantDigits = significantDigits;
  return (
    <span className={cn("tabular whitespace-nowrap", className)}>
      <span className="font-medium text-ink">{formatNumber(value, options)}</span>
      {unit && (
        <span className="font-normal text-muted">
          {NUMBER_UNIT_SPACE}
          {unit}
        </span>
      )}
    </span>
  );
}
