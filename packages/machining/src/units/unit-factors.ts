/**
 * The one table of unit conversion factors used for display. Every quantity is computed in the
 * engine's base unit (first entry) and converted only at the edges: value_in_base = value × factor.
 *
 * All factors are exact by definition except the horsepower, which is derived exactly from its
 * definition (550 ft·lbf/s) with 1 ft = 0.3048 m and 1 lbf = 0.45359237 kg × 9.80665 m/s².
 * Sources: NIST SP 811, Guide for the Use of the SI, appendix B (from memory); the international
 * yard and pound agreement of 1959 (1 in = 25.4 mm, 1 lb = 0.45359237 kg).
 */
const LBF_N = 0.45359237 * 9.80665; // 4.4482216152605 N
const HP_W = 550 * 0.3048 * LBF_N; // 745.69987158227022 W
const IN3_MM3 = 25.4 ** 3; // 16387.064 mm³

export const UNIT_FACTORS = {
  length: { mm: 1, um: 0.001, m: 1000, in: 25.4, ft: 304.8 },
  cuttingSpeed: { "m/min": 1, "m/s": 60, sfm: 0.3048 },
  feedRate: { "mm/min": 1, "mm/s": 60, "in/min": 25.4 },
  force: { N: 1, kN: 1000, lbf: LBF_N },
  power: { W: 1, kW: 1000, hp: HP_W },
  torque: { "N·m": 1, "lbf·in": LBF_N * 0.0254, "lbf·ft": LBF_N * 0.3048 },
  stiffness: { "N/mm": 1, "N/µm": 1000, "N/m": 0.001, "lbf/in": LBF_N / 25.4 },
  volumeRate: { "mm³/min": 1, "cm³/min": 1000, "in³/min": IN3_MM3 },
  specificForce: { "N/mm²": 1, MPa: 1, psi: LBF_N / 25.4 ** 2 },
  specificEnergy: { "J/mm³": 1, "hp·min/in³": (HP_W * 60) / IN3_MM3 },
  mass: { kg: 1, g: 0.001, lb: 0.45359237 },
  frequency: { Hz: 1, kHz: 1000 },
} as const;

/** A physical quantity the display can convert. */
export type Quantity = keyof typeof UNIT_FACTORS;
/** A unit of a given quantity. */
export type UnitOf<Q extends Quantity> = keyof (typeof UNIT_FACTORS)[Q] & string;
/** Metric or imperial (inch) display. */
export type UnitSystem = "metric" | "imperial";

/** The unit each quantity is shown in, per system (the first entry of each row is the engine's base unit). */
export const DISPLAY_UNITS: { [Q in Quantity]: Record<UnitSystem, UnitOf<Q>> } = {
  length: { metric: "mm", imperial: "in" },
  cuttingSpeed: { metric: "m/min", imperial: "sfm" },
  feedRate: { metric: "mm/min", imperial: "in/min" },
  force: { metric: "N", imperial: "lbf" },
  power: { metric: "W", imperial: "hp" },
  torque: { metric: "N·m", imperial: "lbf·in" },
  stiffness: { metric: "N/mm", imperial: "lbf/in" },
  volumeRate: { metric: "mm³/min", imperial: "in³/min" },
  specificForce: { metric: "N/mm²", imperial: "psi" },
  specificEnergy: { metric: "J/mm³", imperial: "hp·min/in³" },
  mass: { metric: "kg", imperial: "lb" },
  frequency: { metric: "Hz", imperial: "Hz" },
};
