import { complex, eigs, matrix, multiply, divide, type Complex, type MathCollection } from "mathjs";
import { describe, expect, it } from "vitest";
import { directionalFactors } from "./directional-factors.js";
import { limitingDepthAtChatterFrequency } from "./limiting-depth-at-chatter-frequency.js";
import { benchmarkCut, zoa3Cut } from "./test-systems.fixture.js";

const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe("limitingDepthAtChatterFrequency (ZOA at one chatter frequency)", () => {
  it("ZOA-3: slot minimum 0.124496 mm near 601.14 Hz, ε 3.37065 rad, n 16 808.6 / 5868.7 / 3555.0 rpm (domain-reference ZOA-3, COMPUTED; Altintas & Budak 1995, from memory)", () => {
    const [b] = limitingDepthAtChatterFrequency({ ...zoa3Cut, radialImmersion: 1, chatterFrequencyHz: 601.14 });
    expect(rel(b!.limitingDepthMm, 0.124496)).toBeLessThan(1e-5);
    expect(b!.phaseRad).toBeCloseTo(3.37065, 2);
    [16808.6, 5868.7, 3555.0].forEach((n, k) => expect(rel(b!.spindleSpeedsRpm[k]!, n)).toBeLessThan(3e-4));
  });

  it.each([
    [605, 0.13648, 2.77276, [20564.3, 6296.4, 3717.3]],
    [610, 0.18292, 2.17802, [26396.1, 6794.7, 3899.2]],
    [620, 0.35535, 1.51305, [38619.6, 7495.1, 4150.3]],
    [650, 1.25483, 0.90702, [67541.2, 8520.1, 4546.8]],
  ])("ZOA-4 slot row fc = %d Hz → a %d mm (domain-reference ZOA-4)", (fc, a, eps, speeds) => {
    const [b] = limitingDepthAtChatterFrequency({ ...zoa3Cut, radialImmersion: 1, chatterFrequencyHz: fc });
    expect(rel(b!.limitingDepthMm, a)).toBeLessThan(1e-4);
    expect(b!.phaseRad).toBeCloseTo(eps, 4);
    speeds.forEach((n, k) => expect(rel(b!.spindleSpeedsRpm[k]!, n)).toBeLessThan(1e-5));
  });

  it.each([
    [605, 0.35051, 6209.5],
    [610, 0.46008, 6694.4],
    [620, 0.86525, 7375.2],
    [650, 2.88522, 8372.5],
  ])("ZOA-5 half-immersion climb row fc = %d Hz → a %d mm, n1 %d rpm (domain-reference ZOA-5)", (fc, a, n1) => {
    const [b] = limitingDepthAtChatterFrequency({ ...zoa3Cut, radialImmersion: 0.5, millingDirection: "climb", chatterFrequencyHz: fc });
    expect(rel(b!.limitingDepthMm, a)).toBeLessThan(1e-4);
    expect(rel(b!.spindleSpeedsRpm[1]!, n1)).toBeLessThan(1e-5);
  });

  it.each([
    [930, 0.30609, 4.95163, [35402.7, 15603.4, 10006.9]],
    [940, 0.34966, 4.17606, [42429.0, 16940.6, 10583.0]],
    [960, 0.60547, 3.67327, [49262.8, 18174.7, 11142.8]],
    [1000, 1.20325, 3.41056, [55268.1, 19445.1, 11798.0]],
  ])("ZOA-9 1-DOF benchmark slot row fc = %d Hz → a %d mm (domain-reference ZOA-9; Insperger & Stépán parameters, FOUND-2nd)", (fc, a, eps, speeds) => {
    const [b] = limitingDepthAtChatterFrequency({ ...benchmarkCut, radialImmersion: 1, chatterFrequencyHz: fc });
    expect(rel(b!.limitingDepthMm, a)).toBeLessThan(1e-4);
    expect(b!.phaseRad).toBeCloseTo(eps, 4);
    speeds.forEach((n, k) => expect(rel(b!.spindleSpeedsRpm[k]!, n)).toBeLessThan(1e-5));
  });

  it("agrees with mathjs eigs of the complex 2×2 oriented FRF [α][Φ] (independent library)", () => {
    for (const [r, dir, fc] of [
      [1, "climb", 601.14],
      [0.5, "climb", 612],
      [0.3, "conventional", 640],
    ] as const) {
      const alpha = directionalFactors({ radialImmersion: r, radialForceRatio: zoa3Cut.radialForceRatio, millingDirection: dir });
      const g = (fn: number, zeta: number, k: number): Complex => {
        const x = fc / fn;
        return divide(1, complex(k * (1 - x * x), k * 2 * zeta * x)) as Complex;
      };
      const gx = g(600, 0.02, 5000);
      const gy = g(600, 0.02, 5000);
      const a = matrix([
        [multiply(alpha.xx, gx) as Complex, multiply(alpha.xy, gy) as Complex],
        [multiply(alpha.yx, gx) as Complex, multiply(alpha.yy, gy) as Complex],
      ]);
      const values = (eigs(a as unknown as MathCollection).values as unknown as { toArray(): Complex[] }).toArray();
      const depths = values
        .map((l) => (typeof l === "number" ? complex(l, 0) : l))
        .filter((l) => l.re > 0)
        .map((l) => (2 * Math.PI) / (zoa3Cut.flutes * zoa3Cut.specificForceNPerMm2 * l.re))
        .sort((p, q) => p - q);
      const ours = limitingDepthAtChatterFrequency({ ...zoa3Cut, radialImmersion: r, millingDirection: dir, chatterFrequencyHz: fc }).map((b) => b.limitingDepthMm);
      expect(ours.length).toBe(depths.length);
      ours.forEach((d, i) => expect(rel(d, depths[i]!)).toBeLessThan(1e-9));
    }
  });

  it("returns no boundary where the oriented FRF cannot regenerate (1-DOF slot below the mode)", () => {
    expect(limitingDepthAtChatterFrequency({ ...benchmarkCut, radialImmersion: 1, chatterFrequencyHz: 500 })).toEqual([]);
  });
});
