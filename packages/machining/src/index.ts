/**
 * @ringdown/machining — the feeds, speeds, forces, deflection, dynamics and chatter-stability
 * engine shared by the browser and the server. Every function takes one object with
 * unit-suffixed fields and throws RangeError ("<function> requires <param> > 0") on impossible input.
 */

// speeds/
export { spindleSpeedRpm } from "./speeds/spindle-speed-rpm.js";
export { cuttingSpeedMPerMin } from "./speeds/cutting-speed-m-per-min.js";
export { feedRateMmPerMin } from "./speeds/feed-rate-mm-per-min.js";
export { engagementAngleRad } from "./speeds/engagement-angle-rad.js";
export { chipThinningFactor } from "./speeds/chip-thinning-factor.js";
export { meanChipThicknessMm } from "./speeds/mean-chip-thickness-mm.js";
export { ballNoseEffectiveDiameterMm } from "./speeds/ball-nose-effective-diameter-mm.js";
export { cornerRadiusEffectiveDiameterMm } from "./speeds/corner-radius-effective-diameter-mm.js";
export { materialRemovalRateMm3PerMin } from "./speeds/material-removal-rate-mm3-per-min.js";
export { runoutChipLoadsMm, type RunoutChipLoads } from "./speeds/runout-chip-loads-mm.js";

// forces/
export { specificCuttingForceNPerMm2 } from "./forces/specific-cutting-force-n-per-mm2.js";
export { immersionAnglesRad, type ImmersionAngles, type MillingDirection } from "./forces/immersion-angles-rad.js";
export { millingForcesN, type MillingForces } from "./forces/milling-forces-n.js";
export { cuttingPowerW } from "./forces/cutting-power-w.js";
export { spindleTorqueNm } from "./forces/spindle-torque-nm.js";

// deflection/
export { toolDeflectionMm } from "./deflection/tool-deflection-mm.js";
export { steppedToolDeflectionMm, FLUTED_DIAMETER_RATIO } from "./deflection/stepped-tool-deflection-mm.js";
export { seriesStiffness } from "./deflection/series-stiffness.js";
export { stiffnessMapLookup, type Axis, type StiffnessPoint, type StiffnessLookup } from "./deflection/stiffness-map-lookup.js";
export { stiffnessAt } from "./deflection/stiffness-at.js";
export { stiffnessGrid, type StiffnessGrid } from "./deflection/stiffness-grid.js";
export { stiffnessOverRegion, type RegionStiffness, type WorkRegion } from "./deflection/stiffness-over-region.js";
export { radialEngagementChange } from "./deflection/radial-engagement-change.js";

// dynamics/
export type { Mode } from "./dynamics/mode.js";
export { naturalFrequencyHz } from "./dynamics/natural-frequency-hz.js";
export { modeFromMassStiffness } from "./dynamics/mode-from-mass-stiffness.js";
export { toothPassingFrequencyHz } from "./dynamics/tooth-passing-frequency-hz.js";
export { dampingRatioFromHalfPower } from "./dynamics/damping-ratio-from-half-power.js";
export { dampingRatioFromLogDecrement } from "./dynamics/damping-ratio-from-log-decrement.js";
export { dynamicAmplification } from "./dynamics/dynamic-amplification.js";
export { receptanceMmPerN, type Receptance } from "./dynamics/receptance-mm-per-n.js";
export { criticalDepthOfCutMm } from "./dynamics/critical-depth-of-cut-mm.js";
export { stableSpindleSpeedsRpm } from "./dynamics/stable-spindle-speeds-rpm.js";
export { directionalFactors, type DirectionalFactors } from "./dynamics/directional-factors.js";
export { limitingDepthAtChatterFrequency, type BoundaryAtFrequency } from "./dynamics/limiting-depth-at-chatter-frequency.js";
export { stabilityLobes, type StabilityLobePoint } from "./dynamics/stability-lobes.js";
export { stabilityLimitAtRpm, type StabilityLimit } from "./dynamics/stability-limit-at-rpm.js";
export { fitModeFromFrf, type FittedMode } from "./dynamics/fit-mode-from-frf.js";

// signal/
export { hannWindow } from "./signal/hann-window.js";
export { parabolicPeak, type ParabolicPeak } from "./signal/parabolic-peak.js";
export { welchSpectrum, type Spectrum } from "./signal/welch-spectrum.js";
export { findSpectralPeaks, type SpectralPeak } from "./signal/find-spectral-peaks.js";
export {
  analyzeRecording,
  type PeakKind,
  type RecordingAnalysis,
  type RecordingPeak,
  type SpeedSuggestion,
} from "./signal/analyze-recording.js";
export { analyzeRingDown, type RingDownAnalysis } from "./signal/analyze-ring-down.js";
export { decimateSpectrum, type DecimatedSpectrum } from "./signal/decimate-spectrum.js";

// units/
export { UNIT_FACTORS, DISPLAY_UNITS, type Quantity, type UnitOf, type UnitSystem } from "./units/unit-factors.js";
export { convertUnit } from "./units/convert-unit.js";
export { toUnitSystem, type DisplayValue } from "./units/to-unit-system.js";
export { formatQuantity } from "./units/format-quantity.js";

// recommend/
export { recommend, RECOMMEND_DEFAULTS } from "./recommend/recommend.js";
export { RecommendInputError } from "./recommend/recommend-input-error.js";
export { validateRecommendInput } from "./recommend/validate-recommend-input.js";
export { rimSpeedMaxRpm } from "./recommend/rim-speed-max-rpm.js";
export { OPERATION_RULES, type OperationRule } from "./recommend/operation-rules.js";
export { SAFETY_NOTES } from "./recommend/safety-notes.js";
export type * from "./recommend/types.js";
