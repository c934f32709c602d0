import { describe, expect, it } from "vitest";
import { decimateSpectrum } from "./decimate-spectrum.js";

describe("decimateSpectrum", () => {
  const n = 65537;
  const f = Array.from({ length: n }, (_, i) => i * 0.5);
  // Floor 1, a one-bin spike at bin 12345 (6172.5 Hz) of height 50 and a broad bump near 9 kHz.
  const m = f.map((hz, i) => (i === 12345 ? 50 : 1 + 3 * Math.exp(-(((hz - 9000) / 40) ** 2))));

  it("keeps a one-bin spike that a plain stride would drop (constructed example: stride 9 misses bin 12345 = 9·1371 + 6)", () => {
    const stride = Math.ceil(n / 8000);
    expect(12345 % stride).not.toBe(0);
    const out = decimateSpectrum({ frequencyHz: f, magnitude: m, maxPoints: 8000 });
    expect(out.frequencyHz.length).toBeLessThanOrEqual(8002);
    const i = out.frequencyHz.indexOf(6172.5);
    expect(i).toBeGreaterThan(0);
    expect(out.magnitude[i]).toBe(50);
    expect(Math.max(...out.magnitude)).toBe(50);
    expect(out.frequencyHz[0]).toBe(0);
    expect(out.frequencyHz[out.frequencyHz.length - 1]).toBe(f[n - 1]);
    for (let k = 1; k < out.frequencyHz.length; k++) expect(out.frequencyHz[k]!).toBeGreaterThan(out.frequencyHz[k - 1]!);
  });

  it("inserts reported peaks exactly, between bins, and a kept point replaces a bin at the same frequency", () => {
    const keep = [
      { frequencyHz: 9000.123, magnitude: 4.01 },
      { frequencyHz: 6172.5, magnitude: 51 },
    ];
    const out = decimateSpectrum({ frequencyHz: f, magnitude: m, maxPoints: 4000, keep });
    expect(out.magnitude[out.frequencyHz.indexOf(9000.123)]).toBe(4.01);
    expect(out.magnitude[out.frequencyHz.indexOf(6172.5)]).toBe(51);
    expect(out.frequencyHz.length).toBeLessThanOrEqual(4000 + 2 + keep.length);
  });

  it("returns a short spectrum unchanged", () => {
    const out = decimateSpectrum({ frequencyHz: [0, 1, 2], magnitude: [3, 1, 2], maxPoints: 10 });
    expect(out).toEqual({ frequencyHz: [0, 1, 2], magnitude: [3, 1, 2] });
  });

  it("bucket maxima: every kept bin is the largest of its bucket (property over seeded random spectra)", () => {
    let s = 987654321;
    const rand = () => (s = (s * 16807) % 2147483647) / 2147483647;
    for (let trial = 0; trial < 20; trial++) {
      const len = 1000 + Math.floor(rand() * 20000);
      const ff = Array.from({ length: len }, (_, i) => i);
      const mm = ff.map(() => rand());
      const maxPoints = 50 + Math.floor(rand() * 500);
      const out = decimateSpectrum({ frequencyHz: ff, magnitude: mm, maxPoints });
      const bucket = Math.ceil(len / maxPoints);
      for (let b = 0; b * bucket < len; b++) {
        const slice = mm.slice(b * bucket, (b + 1) * bucket);
        expect(out.magnitude).toContain(Math.max(...slice));
      }
      expect(out.frequencyHz.length).toBeLessThanOrEqual(maxPoints + 2);
    }
  });

  it("refuses unequal lengths and non-increasing frequencies", () => {
    expect(() => decimateSpectrum({ frequencyHz: [0, 1], magnitude: [1], maxPoints: 2 })).toThrow("decimateSpectrum requires frequencyHz and magnitude of equal length");
    expect(() => decimateSpectrum({ frequencyHz: [0, 0], magnitude: [1, 1], maxPoints: 2 })).toThrow("decimateSpectrum requires frequencyHz to be strictly increasing");
  });
});
