import { requirePositive } from "../internal/require.js";

/**
 * Stiffness of springs in series (cutter, spindle mount, carriage, gantry beam, belt …): the
 * same force passes through each, the deflections add.
 *
 * 1 / k_total = Σ 1 / k_i
 *
 * @param input.stiffnessesNPerMm k_i [N/mm], at least one, each > 0
 * @returns k_total [N/mm] (always ≤ the smallest k_i)
 * @throws RangeError for an empty list or any k_i ≤ 0
 * @source Any mechanics/vibration text (Rao, Mechanical Vibrations, springs in series; from memory).
 * @example seriesStiffness({ stiffnessesNPerMm: [2000, 5000, 3000, 4000] }) // 779.22 N/mm
 */
export function seriesStiffness(input: { stiffnessesNPerMm: readonly number[] }): number {
  const { stiffnessesNPerMm } = input;
  if (!Array.isArray(stiffnessesNPerMm) || stiffnessesNPerMm.length === 0) {
    throw new RangeError("seriesStiffness requires stiffnessesNPerMm to hold at least one value");
  }
  let compliance = 0;
  stiffnessesNPerMm.forEach((k, i) => {
    requirePositive("seriesStiffness", `stiffnessesNPerMm[${i}]`, k);
    compliance += 1 / k;
  });
  return 1 / compliance;
}
