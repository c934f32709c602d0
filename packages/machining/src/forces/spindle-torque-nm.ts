import { requireNonNegative, requirePositive } from "../internal/require.js";

/**
 * Torque at the spindle for a cutting power at a spindle speed.
 *
 * T = P / ω = P / (2π · n / 60)      (= 9549.3 · P[kW] / n)
 *
 * @param input.powerW P [W] (≥ 0)
 * @param input.rpm n [rpm]
 * @returns T [N·m]
 * @throws RangeError for P < 0 or n ≤ 0
 * @source Any mechanics text (P = T·ω); Machinery's Handbook power formulas (from memory).
 * @example spindleTorqueNm({ powerW: 240, rpm: 18000 }) // 0.127324 N·m
 */
export function spindleTorqueNm(input: { powerW: number; rpm: number }): number {
  const { powerW, rpm } = input;
  requireNonNegative("spindleTorqueNm", "powerW", powerW);
  requirePositive("spindleTorqueNm", "rpm", rpm);
  return powerW / ((2 * Math.PI * rpm) / 60);
}
