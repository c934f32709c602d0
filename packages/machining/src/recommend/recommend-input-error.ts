/**
 * Thrown by recommend() when the input is impossible: lists every bad field by its path
 * (e.g. "cutter.diameterMm") with a plain-language reason, so forms can show each one.
 */
export class RecommendInputError extends Error {
  override readonly name = "RecommendInputError";
  readonly fields: Record<string, string>;

  constructor(fields: Record<string, string>) {
    const list = Object.entries(fields)
      .map(([k, v]) => `${k}: ${v}`)
      .join("; ");
    super(`recommend requires valid input (${list})`);
    this.fields = fields;
  }
}
