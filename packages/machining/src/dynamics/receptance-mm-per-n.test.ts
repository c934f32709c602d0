import { add, complex, divide, type Complex } from "mathjs";
import { describe, expect, it } from "vitest";
import type { Mode } from "./mode.js";
import { receptanceMmPerN } from "./receptance-mm-per-n.js";

describe("receptanceMmPerN", () => {
  const modes: Mode[] = [
    { direction: "x", frequencyHz: 600, dampingRatio: 0.02, stiffnessNPerMm: 5000 },
    { direction: "x", frequencyHz: 28, dampingRatio: 0.05, stiffnessNPerMm: 400 },
  ];
  it("is the static compliance Σ 1/k at 0 Hz", () => {
    const g = receptanceMmPerN({ modes, frequencyHz: 0 });
    expect(g.real).toBeCloseTo(1 / 5000 + 1 / 400, 15);
    expect(g.imag).toBe(0);
  });
  it("matches mathjs complex arithmetic Σ 1/(k(1 − r² + 2iζr)) (independent library)", () => {
    for (const f of [10, 28, 300, 600, 601.14, 2000]) {
      let ref: Complex = complex(0, 0);
      for (const m of modes) {
        const r = f / m.frequencyHz;
        ref = add(ref, divide(1, complex(m.stiffnessNPerMm * (1 - r * r), m.stiffnessNPerMm * 2 * m.dampingRatio * r)) as Complex) as Complex;
      }
      const g = receptanceMmPerN({ modes, frequencyHz: f });
      expect(g.real).toBeCloseTo(ref.re, 14);
      expect(g.imag).toBeCloseTo(ref.im, 14);
    }
  });
  it("STB-1: Re G min = −1/(4kζ(1+ζ)) at r = √(1+2ζ) (domain-reference STB-1: −9.108981e-8 m/N at 1.0119289)", () => {
    const m: Mode[] = [{ direction: "x", frequencyHz: 250, dampingRatio: 0.012, stiffnessNPerMm: 226000 }];
    const g = receptanceMmPerN({ modes: m, frequencyHz: 250 * Math.sqrt(1.024) });
    expect(g.real / 1000).toBeCloseTo(-9.108981e-8, 13);
    expect(Math.sqrt(1.024)).toBeCloseTo(1.0119289, 7);
  });
});
