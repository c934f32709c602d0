import { describe, expect, it } from "vitest";
import { analyzeRingDown } from "./analyze-ring-down.js";
import { gaussian } from "./signals.fixture.js";

function decay(fn: number, zeta: number, sampleRateHz: number, seconds: number, amp = 1, offset = 0): Float64Array {
  const wn = 2 * Math.PI * fn;
  const wd = wn * Math.sqrt(1 - zeta * zeta);
  const n = Math.round(seconds * sampleRateHz);
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / sampleRateHz;
    x[i] = offset + amp * Math.exp(-zeta * wn * t) * Math.cos(wd * t);
  }
  return x;
}

describe("analyzeRingDown", () => {
  it("DMP-6: e^(−ζωn t)·cos(ωd t), fn 25 Hz, ζ 0.03, dt 1e-5 s → ζ 0.0300000, fd 24.9888 Hz (domain-reference DMP-6, COMPUTED)", () => {
    const r = analyzeRingDown({ samples: decay(25, 0.03, 100000, 0.6), sampleRateHz: 100000 });
    expect(r.dampingRatio).toBeCloseTo(0.03, 6);
    expect(r.frequencyFromPeakSpacingHz).toBeCloseTo(24.98875, 3);
    expect(r.naturalFrequencyHz).toBeCloseTo(25, 3);
    expect(Math.abs(r.frequencyHz - 24.98875)).toBeLessThan(0.05);
    expect(r.fitQuality).toBeGreaterThan(0.9999);
    expect(r.notes).toEqual([]);
  });

  it("ignores a constant offset (peak-to-trough amplitudes)", () => {
    const r = analyzeRingDown({ samples: decay(180, 0.02, 20000, 0.5, 1, 3.5), sampleRateHz: 20000 });
    expect(r.dampingRatio).toBeCloseTo(0.02, 5);
  });

  it("stays within 3 % with measurement noise", () => {
    const g = gaussian(5);
    const x = decay(420, 0.025, 48000, 0.4).map((v) => v + 0.002 * g());
    const r = analyzeRingDown({ samples: x, sampleRateHz: 48000 });
    expect(Math.abs(r.dampingRatio / 0.025 - 1)).toBeLessThan(0.03);
    expect(Math.abs(r.naturalFrequencyHz / 420 - 1)).toBeLessThan(0.002);
  });

  it("isolates one of two ringing modes with a frequency band", () => {
    const a = decay(28, 0.05, 8000, 1.5, 1);
    const b = decay(820, 0.03, 8000, 1.5, 0.6);
    const x = a.map((v, i) => v + b[i]!);
    const high = analyzeRingDown({ samples: x, sampleRateHz: 8000, bandHz: { minHz: 500, maxHz: 1200 } });
    expect(Math.abs(high.naturalFrequencyHz / 820 - 1)).toBeLessThan(0.002);
    expect(Math.abs(high.dampingRatio / 0.03 - 1)).toBeLessThan(0.05);
    const low = analyzeRingDown({ samples: x, sampleRateHz: 8000, bandHz: { minHz: 10, maxHz: 60 } });
    expect(Math.abs(low.naturalFrequencyHz / 28 - 1)).toBeLessThan(0.01);
    expect(Math.abs(low.dampingRatio / 0.05 - 1)).toBeLessThan(0.05);
  });

  it("refuses a signal that does not decay", () => {
    const x = Float64Array.from({ length: 4000 }, (_, i) => Math.sin((2 * Math.PI * 50 * i) / 4000));
    expect(() => analyzeRingDown({ samples: x, sampleRateHz: 4000 })).toThrow(RangeError);
  });
});
