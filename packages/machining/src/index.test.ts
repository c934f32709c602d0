import fc from "fast-check";
import { describe, expect, it } from "vitest";
import * as engine from "./index.js";

describe("public surface", () => {
  it("exports the exact names other packages and outside checks call", () => {
    const names = [
      "spindleSpeedRpm",
      "cuttingSpeedMPerMin",
      "feedRateMmPerMin",
      "chipThinningFactor",
      "ballNoseEffectiveDiameterMm",
      "materialRemovalRateMm3PerMin",
      "specificCuttingForceNPerMm2",
      "toolDeflectionMm",
      "naturalFrequencyHz",
      "toothPassingFrequencyHz",
      "dampingRatioFromHalfPower",
      "dampingRatioFromLogDecrement",
      "criticalDepthOfCutMm",
      "stableSpindleSpeedsRpm",
      "stabilityLobes",
      "analyzeRecording",
      "fitModeFromFrf",
      "recommend",
      "analyzeRingDown",
      "modeFromMassStiffness",
      "stiffnessAt",
      "seriesStiffness",
      "convertUnit",
      "formatQuantity",
      "toUnitSystem",
      "RecommendInputError",
    ];
    for (const n of names) expect(typeof (engine as Record<string, unknown>)[n], n).toBe("function");
    expect(engine.UNIT_FACTORS.length.in).toBe(25.4);
  });
});

describe("no NaN or Infinity over the valid input space (property)", () => {
  it("speeds, chips, forces, power, deflection and dynamics stay finite and positive", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.2, max: 100, noNaN: true }),
        fc.double({ min: 1e-3, max: 1, noNaN: true }),
        fc.double({ min: 5, max: 3000, noNaN: true }),
        fc.integer({ min: 1, max: 12 }),
        fc.double({ min: 1e-4, max: 1, noNaN: true }),
        fc.double({ min: 0.001, max: 0.5, noNaN: true }),
        (d, immersion, vc, z, fz, zeta) => {
          const ae = immersion * d;
          const n = engine.spindleSpeedRpm({ cuttingSpeedMPerMin: vc, diameterMm: d });
          const thin = engine.chipThinningFactor({ diameterMm: d, radialDepthMm: ae });
          const vf = engine.feedRateMmPerMin({ rpm: n, flutes: z, chipLoadMm: fz * thin });
          const hm = engine.meanChipThicknessMm({ chipLoadMm: fz * thin, diameterMm: d, radialDepthMm: ae });
          const kt = engine.specificCuttingForceNPerMm2({ kc11NPerMm2: 1500, mc: 0.25, chipThicknessMm: hm });
          const ang = engine.immersionAnglesRad({ radialImmersion: immersion, millingDirection: "climb" });
          const f = engine.millingForcesN({ flutes: z, axialDepthMm: d / 2, chipLoadMm: fz * thin, tangentialCoefficientNPerMm2: kt, radialForceRatio: 0.3, startAngleRad: ang.startRad, exitAngleRad: ang.exitRad });
          const q = engine.materialRemovalRateMm3PerMin({ axialDepthMm: d / 2, radialDepthMm: ae, feedMmPerMin: vf });
          const p = engine.cuttingPowerW({ specificEnergyJPerMm3: kt / 1000, materialRemovalRateMm3PerMin: q });
          const defl = engine.toolDeflectionMm({ forceN: Math.max(f.peakResultantN, 1e-9), stickoutMm: 4 * d, diameterMm: 0.8 * d, youngsModulusGPa: 600 });
          const crit = engine.criticalDepthOfCutMm({ stiffnessNPerMm: 1000, dampingRatio: zeta, specificForceNPerMm2: kt });
          const ftp = engine.toothPassingFrequencyHz({ rpm: n, flutes: z });
          for (const v of [n, thin, vf, hm, kt, f.peakResultantN, f.meanResultantN, q, p, defl, crit, ftp]) {
            expect(Number.isFinite(v)).toBe(true);
            expect(v).toBeGreaterThanOrEqual(0);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
