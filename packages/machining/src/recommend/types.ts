import type { StiffnessPoint } from "../deflection/stiffness-map-lookup.js";
import type { WorkRegion } from "../deflection/stiffness-over-region.js";
import type { MillingDirection } from "../forces/immersion-angles-rad.js";

/** Cutter material: sets the cutting-speed range, default stiffness and edge hone. */
export type ToolMaterial = "carbide" | "hss";
/** Cutter end shape. `drill` only drills. */
export type CutterShape = "flat" | "ball" | "bull" | "drill";
/** What the cutter does. */
export type Operation = "slot" | "profile" | "adaptive" | "pocket" | "finish" | "drill" | "ramp" | "plunge";
/** Machine axis. */
export type MachineAxis = "x" | "y" | "z";

/** The cutter assembly (cutter + holder as mounted). */
export interface CutterInput {
  shape: CutterShape;
  /** Cutting diameter D [mm] */
  diameterMm: number;
  /** Number of flutes z [-] */
  flutes: number;
  /** Length of cut (fluted length) from the tip [mm] */
  fluteLengthMm: number;
  /** Length out of the holder, holder face to tip [mm] */
  stickoutMm: number;
  /** Shank diameter [mm] */
  shankDiameterMm: number;
  toolMaterial: ToolMaterial;
  /** Helix angle [deg], 0–60 (recorded; the force model uses straight teeth, which is conservative for the peak force) */
  helixAngleDeg: number;
  /** Corner radius [mm], required for shape "bull" */
  cornerRadiusMm?: number;
  /** The cutter maker's maximum speed [rpm] */
  maxRpm?: number;
  /** Edge hone (cutting-edge rounding) [mm]; default 0.01 mm for carbide, 0.005 mm for HSS */
  edgeHoneMm?: number;
  /** Runout of the mounted cutter, total indicator reading at the cutting edges [mm]; default 0 (not measured) */
  runoutTirMm?: number;
  /** Young's modulus of the cutter [GPa]; default 600 carbide, 210 HSS */
  youngsModulusGPa?: number;
}

/** Chip load at one cutter diameter (the material's table is a list of these). */
export interface ChipLoadPoint {
  /** Cutter diameter [mm] */
  diameterMm: number;
  /** Recommended chip load (maximum chip thickness) [mm] */
  chipLoadMm: number;
}

/** A speed range [m/min]. */
export interface SpeedRange {
  minMPerMin: number;
  maxMPerMin: number;
}

/** The work material. Give Kienzle kc1.1 and mc, or a unit power (specific cutting energy). */
export interface MaterialInput {
  name: string;
  /** Cutting-speed range per tool material [m/min]; the cutter's material must be present */
  cuttingSpeedMPerMin: Partial<Record<ToolMaterial, SpeedRange>>;
  /** Chip load as a function of diameter: linear interpolation between points, end values held outside */
  chipLoad: ChipLoadPoint[];
  /** Smallest chip that cuts rather than rubs [mm] (default 0; the edge hone always applies) */
  minChipThicknessMm?: number;
  /** Kienzle kc1.1 [N/mm²] */
  kc11NPerMm2?: number;
  /** Kienzle exponent mc [-] */
  mc?: number;
  /** Unit power (specific cutting energy) [J/mm³], used when kc1.1/mc are not given */
  unitPowerJPerMm3?: number;
  /** Radial / tangential force ratio [-]; default 0.3 */
  radialForceRatio?: number;
}

/** One point of the spindle's power curve. */
export interface PowerPoint {
  rpm: number;
  /** Shaft power available at that speed [W] */
  powerW: number;
}

/** One setting of a spindle with discrete speeds (e.g. a router's dial). */
export interface DialSpeed {
  /** What the dial shows, e.g. "3" */
  label: string;
  /** Measured speed at that setting [rpm] */
  rpm: number;
}

export interface SpindleInput {
  minRpm: number;
  maxRpm: number;
  /** Rated shaft power [W], used where no power curve is given */
  ratedPowerW: number;
  /** Available power against speed (linear interpolation; end values held outside) */
  powerCurve?: PowerPoint[];
  /** Discrete speeds: when given, only these speeds are used */
  dialSpeeds?: DialSpeed[];
}

/** A measured mode of the machine at the tool, in machine axes. */
export interface MachineMode {
  direction: MachineAxis;
  frequencyHz: number;
  dampingRatio: number;
  stiffnessNPerMm: number;
  /** Free text, e.g. "carriage on belt" */
  label?: string;
}

/** A band of tooth-passing frequencies the shop wants avoided (e.g. where it heard chatter). */
export interface AvoidBand {
  minHz: number;
  maxHz: number;
  label?: string;
}

export interface MachineInput {
  name?: string;
  spindle: SpindleInput;
  /** Highest feed per axis [mm/min] */
  maxFeedMmPerMin: Record<MachineAxis, number>;
  /** Static stiffness at the tool per axis [N/mm] (used where the map has no point for that axis) */
  stiffnessNPerMm: { x: number; y: number };
  /** Stiffness measured at work positions; interpolated at the work position */
  stiffnessMap?: StiffnessPoint[];
  /** Measured modes at the tool */
  modes: MachineMode[];
  /** Largest acceptable deflection at the tool [mm]; default 0.025 */
  deflectionCeilingMm?: number;
  /** Measured backlash per axis [mm] */
  backlashMm?: Partial<Record<MachineAxis, number>>;
  /** Tooth-passing frequencies to avoid [Hz] */
  avoidBands?: AvoidBand[];
  /** Keep the tooth-passing frequency this fraction away from every mode [-]; default 0.1 (10 %) */
  resonanceMargin?: number;
}

export interface EngagementInput {
  /** Axial depth of cut ap [mm] (for drill/plunge: depth of the hole or plunge) */
  axialDepthMm: number;
  /** Radial depth (stepover) ae [mm]; a slot, drill or plunge uses the full diameter */
  radialDepthMm?: number;
  /** Ramp angle for "ramp" [deg]; default 3 */
  rampAngleDeg?: number;
}

export interface RecommendPreferences {
  /** Wanted cutting speed instead of the middle of the material's range [m/min] */
  cuttingSpeedMPerMin?: number;
  /** Wanted chip load (maximum chip thickness) instead of the material table [mm] */
  chipLoadMm?: number;
  /** Fraction of the stability boundary used as the depth ceiling [-]; default 0.8 */
  stabilitySafetyFactor?: number;
}

export interface RecommendInput {
  cutter: CutterInput;
  material: MaterialInput;
  machine: MachineInput;
  operation: Operation;
  engagement: EngagementInput;
  /** Where on the table the cut happens [mm]; needed with a stiffness map */
  workPosition?: { xMm: number; yMm: number };
  /** Where the cut may happen when it moves over the table [mm]: with a stiffness map, the
   *  machine stiffness is the worst case over this rectangle (it takes precedence over workPosition) */
  workRegion?: WorkRegion;
  /** Default "climb" */
  millingDirection?: MillingDirection;
  /** Axis the cut feeds along; "any" (default) checks both X and Y and keeps the worse */
  feedAxis?: "x" | "y" | "any";
  preferences?: RecommendPreferences;
}

/** Identifiers of the ceilings recommend() checks. */
export type LimitId =
  | "spindle-max-speed"
  | "cutter-max-speed"
  | "rim-speed"
  | "spindle-min-speed"
  | "feed"
  | "power"
  | "deflection"
  | "resonance"
  | "avoid-band"
  | "stability";

/** One ceiling and where the recipe stands against it. */
export interface LimitCheck {
  id: LimitId;
  label: string;
  /** The recipe's value */
  value: number;
  /** The limit: a maximum, or a minimum when kind is "min" */
  ceiling: number;
  unit: string;
  kind: "max" | "min";
  /** True when this limit reduced or moved the recipe */
  binding: boolean;
  /** True when the final recipe respects the limit */
  holds: boolean;
  /** Plain-language explanation */
  detail: string;
}

/** Identifiers of warnings. */
export type WarningId =
  | "rubbing"
  | "runout"
  | "stickout"
  | "rim-speed"
  | "climb-backlash"
  | "speed-snapped"
  | "cutting-speed-outside-range"
  | "chip-table-extrapolated"
  | "outside-stiffness-map"
  | "no-modes"
  | "stability-not-applicable"
  | "engagement-sensitive"
  | "depth-reduced"
  | "limit-not-held"
  | "assumption";

export interface RecommendWarning {
  id: WarningId;
  severity: "caution" | "warning";
  message: string;
}

/** One input of the formula behind an output number. */
export interface ExplainInput {
  name: string;
  value: number | string;
  unit: string;
}

/** Why an output number is what it is. */
export interface Explanation {
  /** The formula in words and symbols */
  formula: string;
  /** Its inputs with units */
  inputs: ExplainInput[];
  /** Limits that bound this number (empty when none did) */
  boundBy: LimitId[];
  /** Source and assumptions */
  source: string;
  /** Extra plain-language notes */
  notes: string[];
}

/** Output numbers that carry an explanation. */
export type ExplainedField =
  | "rpm"
  | "cuttingSpeedMPerMin"
  | "feedMmPerMin"
  | "chipLoadMm"
  | "compensatedChipLoadMm"
  | "maxChipThicknessMm"
  | "axialDepthMm"
  | "radialDepthMm"
  | "materialRemovalRateMm3PerMin"
  | "specificCuttingForceNPerMm2"
  | "cuttingForceN"
  | "powerW"
  | "torqueNm"
  | "toolDeflectionMm"
  | "machineDeflectionMm"
  | "totalDeflectionMm"
  | "toothPassingFrequencyHz"
  | "nearestModeMargin"
  | "limitingDepthMm";

/** The nearest mode to the tooth-passing frequency. */
export interface NearestMode {
  frequencyHz: number;
  direction: MachineAxis;
  label: string | null;
  /** |f_tp − fn| / fn [-] */
  margin: number;
}

/** Predicted chatter stability at the recipe's speed. */
export interface StabilityResult {
  /** False when no modes were given or the operation is axial (drill, plunge) */
  checked: boolean;
  /** Largest chatter-free axial depth at this speed [mm] (worst feed axis); null when unchecked or no boundary in the analysed band */
  limitingDepthMm: number | null;
  /** Depth used [mm] */
  depthMm: number;
  /** limitingDepth / depth [-]; null when limitingDepthMm is null */
  depthRatio: number | null;
  /** True when depth ≤ safety factor × limiting depth (or no boundary exists) */
  stable: boolean;
  /** Expected chatter frequency at the boundary [Hz] */
  chatterFrequencyHz: number | null;
  /** Axis whose feed direction gave the lower boundary */
  feedAxis: "x" | "y" | null;
  /** Safety factor used [-] */
  safetyFactor: number;
}

/** The computed, clamped and explained recipe. */
export interface Recommendation {
  /** True when every limit holds */
  ok: boolean;
  operation: Operation;
  /** Spindle speed [rpm] */
  rpm: number;
  /** Dial setting when the spindle has discrete speeds */
  spindleDial: DialSpeed | null;
  /** Cutting speed at the effective diameter [m/min] */
  cuttingSpeedMPerMin: number;
  /** Effective cutting diameter (ball/bull at shallow depth) [mm] */
  effectiveDiameterMm: number;
  /** Feed rate (along the feed axis; Z for drill/plunge) [mm/min] */
  feedMmPerMin: number;
  /** Nominal chip load: the target maximum chip thickness [mm] */
  chipLoadMm: number;
  /** Programmed feed per tooth after chip-thinning compensation (and any reduction) [mm] */
  compensatedChipLoadMm: number;
  /** Chip-thinning factor applied [-] (≥ 1) */
  chipThinningFactor: number;
  /** Maximum chip thickness actually cut (nominal flute) [mm] */
  maxChipThicknessMm: number;
  /** Mean chip thickness [mm] */
  meanChipThicknessMm: number;
  /** Maximum chip thickness of the most and least loaded flute with runout [mm] */
  runoutMaxChipMm: number;
  runoutMinChipMm: number;
  /** Axial and radial depth used [mm] (may be less than asked) */
  axialDepthMm: number;
  radialDepthMm: number;
  /** ae / D [-] */
  radialImmersion: number;
  /** Engaged arc [deg] */
  engagementAngleDeg: number;
  /** [mm³/min] */
  materialRemovalRateMm3PerMin: number;
  /** Kt: specific cutting force at the mean chip thickness [N/mm²] */
  specificCuttingForceNPerMm2: number;
  /** Peak resultant cutting force (worst flute with runout) [N] */
  cuttingForceN: number;
  /** Cutting power [W] */
  powerW: number;
  /** Spindle power available at this speed [W] */
  availablePowerW: number;
  /** Spindle torque [N·m] */
  torqueNm: number;
  /** Cutter bending at the tip [mm] */
  toolDeflectionMm: number;
  /** Machine deflection at the tool (softer of X and Y at the work position) [mm] */
  machineDeflectionMm: number;
  /** Tool + machine [mm] */
  totalDeflectionMm: number;
  /** Deflection ceiling [mm] */
  deflectionCeilingMm: number;
  /** Machine stiffness used [N/mm] */
  machineStiffnessNPerMm: number;
  /** Relative change of the radial engagement that the total deflection causes (δ / ae) [-] */
  engagementChangeFraction: number;
  /** Tooth-passing frequency [Hz] */
  toothPassingFrequencyHz: number;
  /** Spindle rotation frequency [Hz] */
  spindleFrequencyHz: number;
  nearestMode: NearestMode | null;
  stability: StabilityResult;
  limits: LimitCheck[];
  warnings: RecommendWarning[];
  /** What was moved or reduced, in order, in plain language */
  adjustments: string[];
  explain: Record<ExplainedField, Explanation>;
  /** Cautions to show wherever a recipe is shown */
  safetyNotes: readonly string[];
}
