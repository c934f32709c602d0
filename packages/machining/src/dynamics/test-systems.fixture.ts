/**
 * Stability test systems from domain-reference §15 (parameters ILLUSTRATIVE or from the public
 * benchmark of Insperger & Stépán as transcribed in university-lab scripts, FOUND-2nd).
 */
import type { Mode } from "./mode.js";

/** ZOA-3: symmetric 2-DOF, kx = ky = 5.0e6 N/m, fn 600 Hz, ζ 0.02; N = 4, Kt 796 N/mm², Kr 0.212. */
export const zoa3Modes: Mode[] = [
  { direction: "x", frequencyHz: 600, dampingRatio: 0.02, stiffnessNPerMm: 5000 },
  { direction: "y", frequencyHz: 600, dampingRatio: 0.02, stiffnessNPerMm: 5000 },
];
export const zoa3Cut = { modes: zoa3Modes, flutes: 4, specificForceNPerMm2: 796, radialForceRatio: 0.212 };

/** ZOA-6…9: 1-DOF benchmark, N = 2, Kt 6e8 N/m² (600 N/mm²), Kn 2e8 N/m² (Kr = 1/3), fn 922 Hz, ζ 0.011, m 0.03993 kg. */
const k1 = 0.03993 * (2 * Math.PI * 922) ** 2; // N/m (FN-2: 1 340 049.65)
export const benchmarkModes: Mode[] = [{ direction: "x", frequencyHz: 922, dampingRatio: 0.011, stiffnessNPerMm: k1 / 1000 }];
export const benchmarkCut = { modes: benchmarkModes, flutes: 2, specificForceNPerMm2: 600, radialForceRatio: 1 / 3 };
