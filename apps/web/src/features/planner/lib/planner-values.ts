/**
 * The planner's form holds what the person typed, in their unit system; the engine wants mm.
 * These functions turn one into the other and say, per field, what is wrong with the input.
 */
import { operations, recipeParamsSchema, type Operation, type RecipeParams, type UnitSystem } from "@ringdown/contracts";
import { convertUnit, DISPLAY_UNITS } from "@ringdown/machining";
import { formatNumber } from "@/lib/format";

export interface PlannerValues {
  machineId: string;
  assemblyId: string;
  materialId: string;
  operation: Operation;
  /** Lengths as typed, in the display length unit (mm or in). */
  axialDepth: string;
  radialDepth: string;
  workX: string;
  workY: string;
  /** Take the worst stiffness over a rectangle of the bed instead of the value at the work position. */
  useRegion: boolean;
  regionXFrom: string;
  regionXTo: string;
  regionYFrom: string;
  regionYTo: string;
  millingDirection: "climb" | "conventional";
  /** Optional: empty means "let the engine choose". */
  rpmOverride: string;
  /** Chip load per tooth, display length unit; optional. */
  chipLoadOverride: string;
}

export type PlannerField = keyof PlannerValues;
export type PlannerErrors = Partial<Record<PlannerField, string>>;

/** What each operation is called on screen (trade terms). */
export const OPERATION_LABELS: Record<Operation, string> = {
  slot: "Slot (full width)",
  profile: "Profile (side cut)",
  adaptive: "Constant-engagement clearing",
  pocket: "Pocket",
  finish: "Finish pass",
  drill: "Drill",
  ramp: "Ramp entry",
};
export const OPERATION_CHOICES = operations.map((value) => ({ value, label: OPERATION_LABELS[value] }));

/** Operations that engage the full diameter or cut axially: their stepover is not asked. */
export const FULL_WIDTH: ReadonlySet<Operation> = new Set<Operation>(["slot", "ramp", "drill"]);

export function lengthUnit(system: UnitSystem): "mm" | "in" {
  return DISPLAY_UNITS.length[system] as "mm" | "in";
}

/** The length fields of the form (typed in the display length unit). */
export const LENGTH_FIELDS = ["axialDepth", "radialDepth", "workX", "workY", "regionXFrom", "regionXTo", "regionYFrom", "regionYTo", "chipLoadOverride"] as const;

/**
 * Rewrites typed lengths from one unit system into another, so switching the preference keeps
 * the same cut. Fields that are empty or not numbers are left as typed.
 */
export function convertTypedLengths(
  values: Partial<Pick<PlannerValues, (typeof LENGTH_FIELDS)[number]>>,
  from: UnitSystem,
  to: UnitSystem,
): Partial<PlannerValues> {
  const out: Partial<PlannerValues> = {};
  if (from === to) return out;
  for (const field of LENGTH_FIELDS) {
    const n = readNumber(values[field] ?? "");
    if (n !== null) out[field] = lengthInputText(fromDisplayLength(n, from), to);
  }
  return out;
}

/** mm → the display length unit. */
export function toDisplayLength(mm: number, system: UnitSystem): number {
  return convertUnit({ value: mm, quantity: "length", from: "mm", to: lengthUnit(system) });
}

/** The display length unit → mm. */
export function fromDisplayLength(value: number, system: UnitSystem): number {
  return convertUnit({ value, quantity: "length", from: lengthUnit(system), to: "mm" });
}

/** A length in mm written for an input field in the display unit (no grouping, sensible digits). */
export function lengthInputText(mm: number, system: UnitSystem): string {
  // Significant digits enough to round-trip within a micrometre or so: 0.02309 mm, 0.23622 in, 1200 mm.
  return String(Number(toDisplayLength(mm, system).toPrecision(system === "imperial" ? 5 : 4)));
}

/** Reads a typed number: accepts a decimal comma, refuses anything else that is not a plain number. */
export function readNumber(text: string): number | null {
  const t = text.trim().replace(",", ".");
  if (t === "" || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

function limitText(mm: number, system: UnitSystem): string {
  const v = toDisplayLength(mm, system);
  return `${formatNumber(v, { significantDigits: 4, system })}\u202F${lengthUnit(system)}`;
}

export interface ParseContext {
  system: UnitSystem;
  /** The machine's X and Y travel [mm], to keep the work position on the table. */
  travelXMm?: number;
  travelYMm?: number;
}

export interface ParsedPlanner {
  /** Engine-ready parameters, or null while a field is wrong. */
  params: RecipeParams | null;
  errors: PlannerErrors;
}

/**
 * Turns the typed values into recipe parameters in mm, checking each against the same bounds the
 * server applies (recipeParamsSchema) and the work position against the machine's travel.
 */
export function parsePlannerValues(values: PlannerValues, ctx: ParseContext): ParsedPlanner {
  const { system } = ctx;
  const errors: PlannerErrors = {};

  const length = (field: (typeof LENGTH_FIELDS)[number], label: string, min: number, max: number, required: boolean): number | null => {
    const text = values[field];
    if (text.trim() === "") {
      if (required) errors[field] = `Enter the ${label}`;
      return null;
    }
    const n = readNumber(text);
    if (n === null) {
      errors[field] = `Enter the ${label} as a number`;
      return null;
    }
    const mm = fromDisplayLength(n, system);
    if (mm < min) {
      errors[field] = min === 0 ? `The ${label} cannot be negative` : `The ${label} must be at least ${limitText(min, system)}`;
      return null;
    }
    if (mm > max) {
      errors[field] = `The ${label} must be at most ${limitText(max, system)}`;
      return null;
    }
    return mm;
  };

  const fullWidth = FULL_WIDTH.has(values.operation);
  const ap = length("axialDepth", values.operation === "drill" ? "hole depth" : "axial depth", 0.001, 200, true);
  const ae = fullWidth ? null : length("radialDepth", "radial depth", 0.001, 200, true);
  const x = length("workX", "work position X", 0, ctx.travelXMm ?? 20000, true);
  const y = length("workY", "work position Y", 0, ctx.travelYMm ?? 20000, true);
  if (ctx.travelXMm !== undefined && errors.workX?.includes("at most")) errors.workX = `X is beyond the machine's travel (${limitText(ctx.travelXMm, system)})`;
  if (ctx.travelYMm !== undefined && errors.workY?.includes("at most")) errors.workY = `Y is beyond the machine's travel (${limitText(ctx.travelYMm, system)})`;
  const fz = length("chipLoadOverride", "chip load", 0.0005, 2, false);

  // The region where the cut moves: each edge on the table, and each "to" not before its "from".
  let region: RecipeParams["workRegion"] = null;
  if (values.useRegion) {
    const edge = (field: "regionXFrom" | "regionXTo" | "regionYFrom" | "regionYTo", label: string, travel: number | undefined, axis: "X" | "Y") => {
      const v = length(field, label, 0, travel ?? 20000, true);
      if (travel !== undefined && errors[field]?.includes("at most")) errors[field] = `${axis} is beyond the machine's travel (${limitText(travel, system)})`;
      return v;
    };
    const x0 = edge("regionXFrom", "region's first X", ctx.travelXMm, "X");
    const x1 = edge("regionXTo", "region's last X", ctx.travelXMm, "X");
    const y0 = edge("regionYFrom", "region's first Y", ctx.travelYMm, "Y");
    const y1 = edge("regionYTo", "region's last Y", ctx.travelYMm, "Y");
    if (x0 !== null && x1 !== null && x1 < x0) errors.regionXTo = "The region's last X must not be below its first X";
    if (y0 !== null && y1 !== null && y1 < y0) errors.regionYTo = "The region's last Y must not be below its first Y";
    if (x0 !== null && x1 !== null && y0 !== null && y1 !== null) region = { xMinMm: x0, xMaxMm: x1, yMinMm: y0, yMaxMm: y1 };
  }

  let rpm: number | null = null;
  if (values.rpmOverride.trim() !== "") {
    const n = readNumber(values.rpmOverride);
    if (n === null) errors.rpmOverride = "Enter the spindle speed as a number";
    else if (n < 1 || n > 200000) errors.rpmOverride = "The spindle speed must be from 1 to 200 000 rpm";
    else rpm = n;
  }

  if (Object.keys(errors).length > 0 || ap === null || x === null || y === null) return { params: null, errors };

  const parsed = recipeParamsSchema.safeParse({
    axialDepthMm: ap,
    // The engine ignores the stepover of a full-width cut; the recipe still records one.
    radialDepthMm: ae ?? ap,
    workPositionXMm: x,
    workPositionYMm: y,
    workRegion: region,
    millingDirection: values.millingDirection,
    rpmOverride: rpm,
    chipLoadOverrideMm: fz,
  });
  if (!parsed.success) {
    // Not expected after the checks above; say so on the form rather than compute with bad input.
    return { params: null, errors: { axialDepth: parsed.error.issues[0]?.message ?? "Check the inputs" } };
  }
  return { params: parsed.data, errors };
}

/** Typed values for given parameters (e.g. when opening a saved recipe in the planner). */
export function valuesFromParams(params: RecipeParams, system: UnitSystem): Pick<
  PlannerValues,
  | "axialDepth"
  | "radialDepth"
  | "workX"
  | "workY"
  | "useRegion"
  | "regionXFrom"
  | "regionXTo"
  | "regionYFrom"
  | "regionYTo"
  | "millingDirection"
  | "rpmOverride"
  | "chipLoadOverride"
> {
  const region = params.workRegion ?? null;
  return {
    axialDepth: lengthInputText(params.axialDepthMm, system),
    radialDepth: lengthInputText(params.radialDepthMm, system),
    workX: lengthInputText(params.workPositionXMm, system),
    workY: lengthInputText(params.workPositionYMm, system),
    useRegion: region !== null,
    regionXFrom: region ? lengthInputText(region.xMinMm, system) : "",
    regionXTo: region ? lengthInputText(region.xMaxMm, system) : "",
    regionYFrom: region ? lengthInputText(region.yMinMm, system) : "",
    regionYTo: region ? lengthInputText(region.yMaxMm, system) : "",
    millingDirection: params.millingDirection,
    rpmOverride: params.rpmOverride === null ? "" : String(Math.round(params.rpmOverride)),
    chipLoadOverride: params.chipLoadOverrideMm === null ? "" : lengthInputText(params.chipLoadOverrideMm, system),
  };
}
