import { describe, expect, it } from "vitest";
import { findSpectralPeaks } from "./find-spectral-peaks.js";
import { tones } from "./signals.fixture.js";
import { welchSpectrum } from "./welch-spectrum.js";

const fs = 48000;
const n = 16384;

function peaksOf(x: Float64Array) {
  const s = welchSpectrum({ samples: x, sampleRateHz: fs, segmentLength: n });
  return findSpectralPeaks({ frequencyHz: s.frequencyHz, magnitude: s.magnitude });
}

describe("findSpectralPeaks", () => {
  it.each([
    [1234.5, 1234.54],
    [600, 599.959],
    [215.3, 215.305],
  ])("FFT-4: sin(2π·%d t) + 0.3·sin(3·…), N 16384, Hann, parabolic interpolation → %d Hz (domain-reference FFT-4, COMPUTED)", (f0, expected) => {
    const x = tones(n, fs, [
      { hz: f0, amp: 1 },
      { hz: 3 * f0, amp: 0.3 },
    ]);
    const peaks = peaksOf(x);
    expect(peaks[0]!.frequencyHz).toBeCloseTo(expected, 2);
    expect(Math.abs(peaks[1]!.frequencyHz - 3 * f0)).toBeLessThan(0.15);
  });

  it("FFT-5: 0.8 sin(600) + 1.0 sin(730.2) + noise → 599.956 Hz (≈0.80) and 730.242 Hz (≈1.01) (domain-reference FFT-5; our seeded noise, so ±0.1 Hz / ±2 %)", () => {
    const x = tones(
      n,
      fs,
      [
        { hz: 600, amp: 0.8 },
        { hz: 730.2, amp: 1 },
      ],
      0.05,
      7,
    );
    const peaks = peaksOf(x);
    const p730 = peaks.find((p) => Math.abs(p.frequencyHz - 730) < 5)!;
    const p600 = peaks.find((p) => Math.abs(p.frequencyHz - 600) < 5)!;
    expect(p730.frequencyHz).toBeCloseTo(730.242, 0);
    expect(Math.abs(p730.frequencyHz - 730.242)).toBeLessThan(0.1);
    expect(Math.abs(p600.frequencyHz - 599.956)).toBeLessThan(0.1);
    expect(Math.abs(p730.magnitude / 1.0094 - 1)).toBeLessThan(0.02);
    expect(Math.abs(p600.magnitude / 0.8048 - 1)).toBeLessThan(0.02);
    expect(peaks[0]!.frequencyHz).toBeCloseTo(p730.frequencyHz, 9);
  });

  it("reports nothing for white noise alone", () => {
    expect(peaksOf(tones(n * 4, fs, [], 1, 3))).toEqual([]);
  });
});
