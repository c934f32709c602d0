import type { UnitSystem } from "@ringdown/contracts";

/** U+2009 THIN SPACE: the thousands separator of metric display (SI brochure, 9th ed., §5.4.4). */
export const THIN_SPACE = "\u2009";
/** U+202F NARROW NO-BREAK SPACE: between a number and its unit, so they never wrap apart. */
export const NUMBER_UNIT_SPACE = "\u202F";
/** U+2212 MINUS SIGN: the same width as the digits, unlike the hyphen. */
export const MINUS = "\u2212";

export interface NumberFormat {
  /** Fixed number of decimals. Ignored when `significantDigits` is given. */
  fractionDigits?: number;
  /** Round to this many significant digits instead (1–21). */
  significantDigits?: number;
  /** Metric groups thousands with thin spaces, imperial with commas. */
  system?: UnitSystem;
}

const formatters = new Map<string, Intl.NumberFormat>();

function formatterFor(fractionDigits: number | undefined, significantDigits: number | undefined) {
  const key = `${fractionDigits ?? ""}|${significantDigits ?? ""}`;
  let formatter = formatters.get(key);
  if (!formatter) {
    // en-US gives "," grouping and "." decimals, which we then localise ourselves:
    // the look is fixed by the product, not by the browser's locale.
    formatter = new Intl.NumberFormat(
      "en-US",
      significantDigits !== undefined
        ? { maximumSignificantDigits: significantDigits, minimumSignificantDigits: 1 }
        : { minimumFractionDigits: fractionDigits ?? 0, maximumFractionDigits: fractionDigits ?? 0 },
    );
    formatters.set(key, formatter);
  }
  return formatter;
}

/**
 * Formats a number for display: thousands grouped (thin spaces in metric,
 * commas in imperial), "." decimals, a true minus sign, "—" for a missing or
 * non-finite value.
 */
export function formatNumber(value: number | null | undefined, options: NumberFormat = {}): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const { fractionDigits, significantDigits, system = "metric" } = options;
  if (fractionDigits !== undefined && (!Number.isInteger(fractionDigits) || fractionDigits < 0 || fractionDigits > 20)) {
    throw new RangeError("formatNumber requires fractionDigits to be an integer from 0 to 20");
  }
  if (
    significantDigits !== undefined &&
    (!Number.isInteger(significantDigits) || significantDigits < 1 || significantDigits > 21)
  ) {
    throw new RangeError("formatNumber requires significantDigits to be an integer from 1 to 21");
  }
  let text = formatterFor(fractionDigits, significantDigits).format(value);
  // Rounding can produce "-0"; a signed zero means nothing to a reader.
  if (/^-0(\.0+)?$/.test(text)) text = text.slice(1);
  if (system === "metric") text = text.replaceAll(",", THIN_SPACE);
  return text.replace("-", MINUS);
}

/** A number and its unit as one string, e.g. "18 000 rpm" (unit may be empty for counts). */
export function formatQuantity(value: number | null | undefined, unit: string, options: NumberFormat = {}): string {
  const number = formatNumber(value, options);
  return unit ? `${number}${NUMBER_UNIT_SPACE}${unit}` : number;
}
