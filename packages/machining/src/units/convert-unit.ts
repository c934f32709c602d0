import { requireFinite } from "../internal/require.js";
import { UNIT_FACTORS, type Quantity, type UnitOf } from "./unit-factors.js";

/**
 * Converts a value between two units of the same quantity, through the table UNIT_FACTORS.
 *
 * value_to = value_from × factor(from) / factor(to)
 *
 * @param input.value the value in `from` units
 * @param input.quantity e.g. "length", "feedRate", "stiffness"
 * @param input.from unit of the value (e.g. "mm")
 * @param input.to wanted unit (e.g. "in")
 * @returns the value in `to` units
 * @throws RangeError for a non-finite value or a unit that does not belong to the quantity
 * @source Factors: NIST SP 811 appendix B (from memory); 1959 international inch and pound.
 * @example convertUnit({ value: 0.0254, quantity: "length", from: "mm", to: "in" }) // 0.001
 */
export function convertUnit<Q extends Quantity>(input: { value: number; quantity: Q; from: UnitOf<Q>; to: UnitOf<Q> }): number {
  const { value, quantity, from, to } = input;
  requireFinite("convertUnit", "value", value);
  const row = UNIT_FACTORS[quantity] as Record<string, number> | undefined;
  if (!row) throw new RangeError(`convertUnit requires a known quantity (got ${String(quantity)})`);
  const f = row[from];
  const t = row[to];
  if (f === undefined) throw new RangeError(`convertUnit requires from to be a unit of ${quantity} (got ${from})`);
  if (t === undefined) throw new RangeError(`convertUnit requires to to be a unit of ${quantity} (got ${to})`);
  if (from === to) return value;
  return (value * f) / t;
}
