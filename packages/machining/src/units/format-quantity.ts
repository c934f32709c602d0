import { requirePositiveInteger } from "../internal/require.js";
import { toUnitSystem } from "./to-unit-system.js";
import type { Quantity, UnitSystem } from "./unit-factors.js";

const formatters = new Map<string, Intl.NumberFormat>();

/**
 * Formats a base-unit value for display with its unit, in the metric or imperial system,
 * e.g. 0.0254 (length) → "0.0254 mm" or "0.001 in"; 18000 (feedRate) → "18,000 mm/min".
 *
 * @param input.value value in the engine's base unit of the quantity
 * @param input.quantity the quantity
 * @param input.system "metric" or "imperial"
 * @param input.significantDigits maximum significant digits (default 4)
 * @param input.locale BCP 47 locale for digit grouping (default "en-US")
 * @returns the formatted text, number and unit separated by a space
 * @throws RangeError for a non-finite value, unknown quantity or system, or digits outside 1–21
 * @source UNIT_FACTORS (see there).
 */
export function formatQuantity(input: { value: number; quantity: Quantity; system: UnitSystem; significantDigits?: number; locale?: string }): string {
  const digits = input.significantDigits ?? 4;
  requirePositiveInteger("formatQuantity", "significantDigits", digits);
  if (digits > 21) throw new RangeError("formatQuantity requires significantDigits <= 21");
  const { value, unit } = toUnitSystem(input);
  const locale = input.locale ?? "en-US";
  const key = `${locale}|${digits}`;
  let nf = formatters.get(key);
  if (!nf) {
    nf = new Intl.NumberFormat(locale, { maximumSignificantDigits: digits });
    formatters.set(key, nf);
  }
  return `${nf.format(value)} ${unit}`;
}
