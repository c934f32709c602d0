import { describe, expect, it } from "vitest";
import { millingForcesN } from "./milling-forces-n.js";

/** Independent numerical model: sum the instantaneous tooth forces over a fine angle grid. */
function numericForces(n: number, a: number, c: number, kt: number, kr: number, st: number, ex: number, steps = 200000) {
  let sx = 0;
  let sy = 0;
  let peak = 0;
  for (let i = 0; i < steps; i++) {
    const phi0 = ((i + 0.5) / steps) * 2 * Math.PI;
    let fx = 0;
    let fy = 0;
    for (let j = 0; j < n; j++) {
      const phi = (phi0 + (j * 2 * Math.PI) / n) % (2 * Math.PI);
      if (phi < st || phi > ex) continue;
      const ft = kt * a * c * Math.sin(phi);
      const fr = kr * ft;
      fx += -ft * Math.cos(phi) - fr * Math.sin(phi);
      fy += ft * Math.sin(phi) - fr * Math.cos(phi);
    }
    sx += fx;
    sy += fy;
    peak = Math.max(peak, Math.hypot(fx, fy));
  }
  return { fx: sx / steps, fy: sy / steps, peak };
}

describe("millingForcesN", () => {
  it("FRC-1: slotting N=4, a=2, c=0.1, Kt=796, Kr=0.212 → F̄y 159.200 N, F̄x −33.7504 N (domain-reference FRC-1; Altintas ch. 2, from memory, checked numerically)", () => {
    const f = millingForcesN({ flutes: 4, axialDepthMm: 2, chipLoadMm: 0.1, tangentialCoefficientNPerMm2: 796, radialForceRatio: 0.212, startAngleRad: 0, exitAngleRad: Math.PI });
    expect(f.meanNormalForceN).toBeCloseTo(159.2, 3);
    expect(f.meanFeedForceN).toBeCloseTo(-33.7504, 3);
  });

  it("means and peak match a direct numerical sum of tooth forces (independent model in the test)", () => {
    const cases: [number, number, number, number, number, number, number][] = [
      [2, 6, 0.05, 2000, 0.3, 0, Math.acos(0.8)],
      [3, 4, 0.04, 1500, 0.4, Math.acos(2 * 0.3 - 1), Math.PI],
      [4, 2, 0.1, 796, 0.212, 0, Math.PI],
    ];
    for (const [n, a, c, kt, kr, st, ex] of cases) {
      const f = millingForcesN({ flutes: n, axialDepthMm: a, chipLoadMm: c, tangentialCoefficientNPerMm2: kt, radialForceRatio: kr, startAngleRad: st, exitAngleRad: ex });
      const ref = numericForces(n, a, c, kt, kr, st, ex);
      expect(f.meanFeedForceN).toBeCloseTo(ref.fx, 2);
      expect(f.meanNormalForceN).toBeCloseTo(ref.fy, 2);
      expect(Math.abs(f.peakResultantN - ref.peak) / ref.peak).toBeLessThan(2e-3);
      expect(f.peakResultantN).toBeGreaterThanOrEqual(f.meanResultantN);
    }
  });

  it("one tooth in a light conventional cut peaks at its exit: Kt·a·c·sin φe·√(1 + Kr²) (hand derivation)", () => {
    const phiE = Math.acos(0.8);
    const f = millingForcesN({ flutes: 2, axialDepthMm: 3, chipLoadMm: 0.05, tangentialCoefficientNPerMm2: 1800, radialForceRatio: 0.3, startAngleRad: 0, exitAngleRad: phiE });
    expect(f.peakResultantN).toBeCloseTo(1800 * 3 * 0.05 * Math.sin(phiE) * Math.sqrt(1 + 0.09), 9);
  });

  it("KZ-5: mean tangential force × vc reproduces Pc = 530.674 W (domain-reference KZ-5, COMPUTED)", () => {
    const f = millingForcesN({ flutes: 2, axialDepthMm: 10, chipLoadMm: 0.1, tangentialCoefficientNPerMm2: 1667.162, radialForceRatio: 0.3, startAngleRad: 0, exitAngleRad: Math.acos(0.8) });
    // Fc,m per engaged tooth 518.154 N × z_e 0.204833 = mean total tangential force.
    expect(f.meanTangentialForceN).toBeCloseTo(518.154 * 0.204833, 2);
    expect((f.meanTangentialForceN * 300) / 60).toBeCloseTo(530.674, 1);
  });

  it("rejects an empty engagement", () => {
    expect(() =>
      millingForcesN({ flutes: 2, axialDepthMm: 1, chipLoadMm: 0.1, tangentialCoefficientNPerMm2: 1000, radialForceRatio: 0.3, startAngleRad: 1, exitAngleRad: 1 }),
    ).toThrow("millingForcesN requires 0 <= startAngleRad < exitAngleRad <= π");
  });
});
