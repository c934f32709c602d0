/**
 * Input guards shared by every engine function. Each throws a RangeError whose
 * message names the function and the parameter, in one fixed format:
 * `"<function> requires <param> > 0"` (or the condition that failed).
 * Nothing is clamped: an impossible value is reported, never silently repaired.
 */

/** Throws unless `value` is a finite number greater than zero. */
export function requirePositive(fn: string, param: string, value: number): void {
  if (!(typeof value === "number" && value > 0 && Number.isFinite(value))) {
    throw new RangeError(`${fn} requires ${param} > 0`);
  }
}

/** Throws unless `value` is a finite number greater than or equal to zero. */
export function requireNonNegative(fn: string, param: string, value: number): void {
  if (!(typeof value === "number" && value >= 0 && Number.isFinite(value))) {
    throw new RangeError(`${fn} requires ${param} >= 0`);
  }
}

/** Throws unless `value` is a finite number. */
export function requireFinite(fn: string, param: string, value: number): void {
  if (!(typeof value === "number" && Number.isFinite(value))) {
    throw new RangeError(`${fn} requires ${param} to be a finite number`);
  }
}

/** Throws unless `value` is an integer >= 1 (flute counts, lobe counts). */
export function requirePositiveInteger(fn: string, param: string, value: number): void {
  if (!(typeof value === "number" && Number.isInteger(value) && value >= 1)) {
    throw new RangeError(`${fn} requires ${param} to be an integer >= 1`);
  }
}

/** Throws unless lo <= value <= hi (both ends inclusive). */
export function requireInClosedRange(fn: string, param: string, value: number, lo: number, hi: number): void {
  if (!(typeof value === "number" && value >= lo && value <= hi)) {
    throw new RangeError(`${fn} requires ${lo} <= ${param} <= ${hi}`);
  }
}

/** Throws unless lo <= value < hi. */
export function requireInHalfOpenRange(fn: string, param: string, value: number, lo: number, hi: number): void {
  if (!(typeof value === "number" && value >= lo && value < hi)) {
    throw new RangeError(`${fn} requires ${lo} <= ${param} < ${hi}`);
  }
}
