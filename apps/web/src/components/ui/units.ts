import { convertUnit, DISPLAY_UNITS, UNIT_FACTORS, type Quantity, type UnitSystem } from "@ringdown/machining";
import { formatNumber } from "@/lib/format";

/**
 * What a number measures, for display and entry in the person's unit system. Values are always
 * stored and sent in the engine's base unit (mm, m/min, mm/min, N, W, N/mm, kg, Hz…); only the
 * screen converts, through the engine's one table of factors.
 *
 * - `{ quantity }` converts, e.g. length: mm ↔ in;
 * - `{ quantity, per }` converts the quantity and keeps a denominator, e.g. chip load mm/tooth ↔
 *   in/tooth, acceleration mm/s² ↔ in/s²;
 * - `{ unit }` is the same in both systems (rpm, °, %, flutes).
 */
export type Measure = { quantity: Quantity; per?: string } | { unit: string };

export const measures = {
  length: { quantity: "length" },
  chipLoad: { quantity: "length", per: "/tooth" },
  acceleration: { quantity: "length", per: "/s²" },
  cuttingSpeed: { quantity: "cuttingSpeed" },
  feedRate: { quantity: "feedRate" },
  power: { quantity: "power" },
  stiffness: { quantity: "stiffness" },
  mass: { quantity: "mass" },
  frequency: { quantity: "frequency" },
  specificForce: { quantity: "specificForce" },
  specificEnergy: { quantity: "specificEnergy" },
  rpm: { unit: "rpm" },
  degrees: { unit: "°" },
  percent: { unit: "%" },
  count: { unit: "" },
} as const satisfies Record<string, Measure>;

function baseUnit(quantity: Quantity): string {
  return Object.keys(UNIT_FACTORS[quantity])[0] as string;
}

/** The unit a measure is shown in, e.g. "in/tooth" for a chip load in imperial. */
export function unitOf(measure: Measure, system: UnitSystem): string {
  if ("unit" in measure) return measure.unit;
  return `${DISPLAY_UNITS[measure.quantity][system]}${measure.per ?? ""}`;
}

/** A base-unit value in the display unit of the system. */
export function toDisplay(value: number, measure: Measure, system: UnitSystem): number {
  if ("unit" in measure) return value;
  const to = DISPLAY_UNITS[measure.quantity][system];
  return convertUnit({ value, quantity: measure.quantity, from: baseUnit(measure.quantity) as never, to: to as never });
}

/** A value typed in the display unit, back to the base unit the API stores. */
export function fromDisplay(value: number, measure: Measure, system: UnitSystem): number {
  if ("unit" in measure) return value;
  const from = DISPLAY_UNITS[measure.quantity][system];
  return convertUnit({ value, quantity: measure.quantity, from: from as never, to: baseUnit(measure.quantity) as never });
}

/**
 * Digits to show: whole numbers from 1 000 up (rpm, feeds, stiffness), otherwise four significant
 * digits, enough to tell 0.025 mm from 0.03 mm and 0.25 in from 0.2500 in without noise.
 */
export function displayDigits(value: number): { fractionDigits?: number; significantDigits?: number } {
  return Math.abs(value) >= 1000 ? { fractionDigits: 0 } : { significantDigits: 4 };
}

/** The number part of a base-unit value, formatted in the system ("6.35", "0.25", "18 000"). */
export function formatMeasureNumber(value: number | null | undefined, measure: Measure, system: UnitSystem): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const shown = toDisplay(value, measure, system);
  return formatNumber(shown, { ...displayDigits(shown), system });
}

/** A base-unit value as text with its unit, e.g. "0.25 in" (a narrow no-break space between). */
export function formatMeasure(value: number | null | undefined, measure: Measure, system: UnitSystem): string {
  const unit = unitOf(measure, system);
  const number = formatMeasureNumber(value, measure, system);
  return unit && number !== "—" ? `${number}\u202F${unit}` : number;
}

/**
 * The text an input starts with for a stored value: six significant digits, trailing zeros
 * dropped, plain "." decimals and no grouping, so it can be edited and parsed back.
 * 6.35 mm → "0.25" in; 6 mm → "0.23622" in.
 */
export function toInputText(value: number | null | undefined, measure: Measure, system: UnitSystem): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  return String(Number(toDisplay(value, measure, system).toPrecision(6)));
}

/**
 * Parses what was typed in the display unit: "" → null, not a number → NaN (the schema then says
 * "Enter …"), otherwise the base-unit value. Accepts a decimal comma and spaces as grouping.
 */
export function parseInputText(text: string, measure: Measure, system: UnitSystem): number | null {
  const cleaned = text.trim().replace(/[\s\u2009\u202F]/g, "").replace(",", ".").replace("\u2212", "-");
  if (cleaned === "") return null;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(cleaned)) return Number.NaN;
  return fromDisplay(Number(cleaned), measure, system);
}

/**
 * Shared schemas phrase limits in base units ("diameter must be at most 100"). Rewrites the
 * trailing number into the display unit, with the unit, so an imperial form says "… at most
 * 3.937 in" and a metric one "… at most 100 mm".
 */
export function localiseLimitMessage(message: string, measure: Measure, system: UnitSystem): string {
  const match = /(-?\d+(?:\.\d+)?(?:e[-+]?\d+)?)$/i.exec(message);
  if (!match?.[1]) return message;
  const limit = Number(match[1]);
  if (!Number.isFinite(limit)) return message;
  return message.slice(0, match.index) + formatMeasure(limit, measure, system);
}
