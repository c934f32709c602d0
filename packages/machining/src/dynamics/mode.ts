/**
 * One vibration mode of the machine measured at the tool tip (tap test or recorded cut),
 * in the frame used by the caller: for stability calculations "x" is the feed direction and
 * "y" the direction normal to it; recommend() maps machine axes onto that frame itself.
 */
export interface Mode {
  /** Direction of the mode's motion at the tool */
  direction: "x" | "y";
  /** Undamped natural frequency fn [Hz] */
  frequencyHz: number;
  /** Viscous damping ratio ζ [-], 0 < ζ < 1 */
  dampingRatio: number;
  /** Modal stiffness k at the tool tip [N/mm] */
  stiffnessNPerMm: number;
}
