import type { Operation } from "./types.js";

/** How an operation changes the recipe. */
export interface OperationRule {
  label: string;
  /** Multiplies the material's chip load [-] */
  chipFactor: number;
  /** Axial operation (feeds along Z, no lateral load, no milling stability) */
  axial: boolean;
  /** The cutter engages its full diameter */
  fullWidth: boolean;
}

/**
 * Operation rules. The chip factors are common practice, no published source: lighter chips for
 * finishing (surface and deflection), half chips for plunging, drilling and ramping (the end
 * cutting edges and the chip evacuation are the weak points).
 */
export const OPERATION_RULES: Readonly<Record<Operation, OperationRule>> = {
  slot: { label: "slot", chipFactor: 1, axial: false, fullWidth: true },
  profile: { label: "profile", chipFactor: 1, axial: false, fullWidth: false },
  adaptive: { label: "constant-engagement clearing", chipFactor: 1, axial: false, fullWidth: false },
  pocket: { label: "pocket", chipFactor: 1, axial: false, fullWidth: false },
  finish: { label: "finish", chipFactor: 0.8, axial: false, fullWidth: false },
  ramp: { label: "ramp", chipFactor: 0.5, axial: false, fullWidth: true },
  plunge: { label: "plunge", chipFactor: 0.5, axial: true, fullWidth: true },
  drill: { label: "drill", chipFactor: 0.5, axial: true, fullWidth: true },
};
