import { describe, expect, it } from "vitest";
import { meanChipThicknessMm } from "./mean-chip-thickness-mm.js";

describe("meanChipThicknessMm", () => {
  // h_m / fz from domain-reference §2 (Altintas mean chip, from memory; COMPUTED)
  it.each([
    ["CT-1", 10, 1, 0.3108],
    ["CT-2", 6, 0.3, 0.22172],
    ["CT-3", 10, 2.5, 0.47746],
    ["CT-4 half slot", 12, 6, 2 / Math.PI],
    ["CT-4 full slot", 12, 12, 2 / Math.PI],
  ])("%s: h_m/fz", (_id, d, ae, ratio) => {
    expect(meanChipThicknessMm({ chipLoadMm: 1, diameterMm: d, radialDepthMm: ae })).toBeCloseTo(ratio, 4);
  });

  it("KZ-5: fz 0.1 mm, D 10 mm, ae 1 mm → h_m 0.0310800 mm (domain-reference KZ-5, COMPUTED)", () => {
    expect(meanChipThicknessMm({ chipLoadMm: 0.1, diameterMm: 10, radialDepthMm: 1 })).toBeCloseTo(0.03108, 7);
  });

  it("agrees with a direct numerical average of fz·sin φ over the engaged arc (independent check)", () => {
    const fz = 0.08;
    const d = 8;
    const ae = 1.7;
    const phiE = Math.acos(1 - (2 * ae) / d);
    const steps = 100000;
    let sum = 0;
    for (let i = 0; i < steps; i++) sum += fz * Math.sin(((i + 0.5) / steps) * phiE);
    expect(meanChipThicknessMm({ chipLoadMm: fz, diameterMm: d, radialDepthMm: ae })).toBeCloseTo(sum / steps, 9);
  });
});
