import { describe, expect, it } from "vitest";
import { fitModeFromFrf } from "./fit-mode-from-frf.js";
import { receptanceMmPerN } from "./receptance-mm-per-n.js";
import type { Mode } from "./mode.js";

function synth(modes: Mode[], from: number, to: number, step: number) {
  const f: number[] = [];
  const re: number[] = [];
  const im: number[] = [];
  for (let x = from; x <= to + 1e-9; x += step) {
    const g = receptanceMmPerN({ modes, frequencyHz: x });
    f.push(x);
    re.push(g.real);
    im.push(g.imag);
  }
  return { frequencyHz: f, real: re, imag: im };
}

describe("fitModeFromFrf", () => {
  it("DMP-2: a synthesised ζ 0.05 receptance at 500 Hz (k 200 N/mm) is recovered; peak 498.748 Hz, half-power 473.055 / 523.181 Hz (domain-reference DMP-2)", () => {
    const fit = fitModeFromFrf(synth([{ direction: "x", frequencyHz: 500, dampingRatio: 0.05, stiffnessNPerMm: 200 }], 300, 700, 0.25));
    expect(fit.frequencyHz).toBeCloseTo(500, 1);
    expect(Math.abs(fit.dampingRatio / 0.05 - 1)).toBeLessThan(2e-3);
    expect(Math.abs(fit.stiffnessNPerMm / 200 - 1)).toBeLessThan(3e-3);
    expect(fit.peakFrequencyHz).toBeCloseTo(498.748, 1);
    expect(fit.lowerHalfPowerHz).toBeCloseTo(473.055, 1);
    expect(fit.upperHalfPowerHz).toBeCloseTo(523.181, 1);
  });
  it("picks the mode inside the band when two modes are measured", () => {
    const data = synth(
      [
        { direction: "y", frequencyHz: 28, dampingRatio: 0.04, stiffnessNPerMm: 400 },
        { direction: "y", frequencyHz: 820, dampingRatio: 0.03, stiffnessNPerMm: 3500 },
      ],
      5,
      1500,
      0.1,
    );
    const low = fitModeFromFrf(data);
    expect(low.frequencyHz).toBeCloseTo(28, 0);
    const high = fitModeFromFrf({ ...data, minHz: 500, maxHz: 1500 });
    expect(Math.abs(high.frequencyHz / 820 - 1)).toBeLessThan(2e-3);
    expect(Math.abs(high.dampingRatio / 0.03 - 1)).toBeLessThan(0.03);
    expect(Math.abs(high.stiffnessNPerMm / 3500 - 1)).toBeLessThan(0.03);
  });
  it("refuses a peak whose half-power points fall outside the data", () => {
    const data = synth([{ direction: "x", frequencyHz: 500, dampingRatio: 0.05, stiffnessNPerMm: 200 }], 480, 505, 1);
    expect(() => fitModeFromFrf(data)).toThrow("fitModeFromFrf requires both half-power points of the peak inside the measured band");
  });
  it("rejects mismatched arrays", () => {
    expect(() => fitModeFromFrf({ frequencyHz: [1, 2, 3, 4, 5], real: [1, 2, 3, 4], imag: [1, 2, 3, 4, 5] })).toThrow("fitModeFromFrf requires frequencyHz, real and imag of equal length");
  });
});
