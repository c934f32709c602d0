import { describe, expect, it } from "vitest";
import { directionalFactors } from "./directional-factors.js";

/** Independent: integrate the instantaneous directional matrix over the engaged arc (domain-reference §15). */
function integrate(st: number, ex: number, kr: number) {
  const steps = 100000;
  const h = (ex - st) / steps;
  let xx = 0;
  let xy = 0;
  let yx = 0;
  let yy = 0;
  for (let i = 0; i < steps; i++) {
    const p = st + (i + 0.5) * h;
    const s2 = Math.sin(2 * p);
    const c2 = Math.cos(2 * p);
    xx += -(s2 + kr * (1 - c2));
    xy += -((1 + c2) + kr * s2);
    yx += 1 - c2 - kr * s2;
    yy += s2 - kr * (1 + c2);
  }
  return { xx: xx * h, xy: xy * h, yx: yx * h, yy: yy * h };
}

describe("directionalFactors", () => {
  it("ZOA-1: half immersion, climb, Kr 0.3 → [[0.528761, −1.270796], [1.870796, −1.471239]] (domain-reference ZOA-1; Altintas & Budak 1995, from memory)", () => {
    const a = directionalFactors({ radialImmersion: 0.5, radialForceRatio: 0.3, millingDirection: "climb" });
    expect(a.xx).toBeCloseTo(0.528761, 6);
    expect(a.xy).toBeCloseTo(-1.270796, 6);
    expect(a.yx).toBeCloseTo(1.870796, 6);
    expect(a.yy).toBeCloseTo(-1.471239, 6);
  });
  it("ZOA-2: slotting, Kr 0.212 → αxx = αyy = −πKr = −0.66602, αxy = −π, αyx = π (domain-reference ZOA-2)", () => {
    const a = directionalFactors({ radialImmersion: 1, radialForceRatio: 0.212 });
    expect(a.xx).toBeCloseTo(-0.66602, 5);
    expect(a.yy).toBeCloseTo(-0.66602, 5);
    expect(a.xy).toBeCloseTo(-Math.PI, 12);
    expect(a.yx).toBeCloseTo(Math.PI, 12);
  });
  it("ZOA-6/7/8: 1-DOF benchmark αxx — slot −π/3, half up −1.523599, half down +0.476401 (domain-reference ZOA-6..8)", () => {
    expect(directionalFactors({ radialImmersion: 1, radialForceRatio: 1 / 3 }).xx).toBeCloseTo(-Math.PI / 3, 9);
    expect(directionalFactors({ radialImmersion: 0.5, radialForceRatio: 1 / 3, millingDirection: "conventional" }).xx).toBeCloseTo(-1.523599, 6);
    expect(directionalFactors({ radialImmersion: 0.5, radialForceRatio: 1 / 3, millingDirection: "climb" }).xx).toBeCloseTo(0.476401, 6);
  });
  it("equals the numerical integral of the instantaneous matrix for arbitrary immersions", () => {
    for (const [r, kr, dir] of [
      [0.1, 0.3, "climb"],
      [0.37, 0.5, "conventional"],
      [0.8, 0.2, "climb"],
    ] as const) {
      const a = directionalFactors({ radialImmersion: r, radialForceRatio: kr, millingDirection: dir });
      const [st, ex] = dir === "climb" ? [Math.acos(2 * r - 1), Math.PI] : [0, Math.acos(1 - 2 * r)];
      const ref = integrate(st, ex, kr);
      expect(a.xx).toBeCloseTo(ref.xx, 8);
      expect(a.xy).toBeCloseTo(ref.xy, 8);
      expect(a.yx).toBeCloseTo(ref.yx, 8);
      expect(a.yy).toBeCloseTo(ref.yy, 8);
    }
  });
});
