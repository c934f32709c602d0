import { convertUnit } from "./convert-unit.js";
import { DISPLAY_UNITS, UNIT_FACTORS, type Quantity, type UnitOf, type UnitSystem } from "./unit-factors.js";

/** A value expressed in the display unit of a system. */
export interface DisplayValue {
  value: number;
  unit: string;
}

/**
 * Expresses a value given in the engine's base unit of a quantity (mm, m/min, mm/min, N, W, N·m,
 * N/mm, mm³/min, N/mm², J/mm³, kg, Hz) in the display unit of the metric or imperial system.
 *
 * @param input.value value in the base unit
 * @param input.quantity the quantity
 * @param input.system "metric" or "imperial"
 * @returns { value, unit }
 * @throws RangeError for a non-finite value or unknown quantity/system
 * @source UNIT_FACTORS (see there).
 * @example toUnitSystem({ value: 0.025, quantity: "length", system: "imperial" }) // { value: 0.000984…, unit: "in" }
 */
export function toUnitSystem<Q extends Quantity>(input: { value: number; quantity: Q; system: UnitSystem }): DisplayValue {
  const { value, quantity, system } = input;
  const units = DISPLAY_UNITS[quantity];
  if (!units) throw new RangeError(`toUnitSystem requires a known quantity (got ${String(quantity)})`);
  if (system !== "metric" && system !== "imperial") throw new RangeError('toUnitSystem requires system to be "metric" or "imperial"');
  const base = Object.keys(UNIT_FACTORS[quantity])[0] as UnitOf<Q>;
  const unit = units[system];
  return { value: convertUnit({ value, quantity, from: base, to: unit }), unit };
}
