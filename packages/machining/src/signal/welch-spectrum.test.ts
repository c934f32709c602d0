import FFT from "fft.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { dftMagnitude, tones, uniform } from "./signals.fixture.js";
import { welchSpectrum } from "./welch-spectrum.js";

describe("welchSpectrum", () => {
  it("FFT-3: 1.5·sin(2π·1000 t) at 8 kHz, N 8192, Hann: peak at bin 1024 (1000 Hz) reading 1.5 — |X| = 3072 = A·N/4 (domain-reference FFT-3)", () => {
    const x = tones(8192, 8000, [{ hz: 1000, amp: 1.5 }]);
    const s = welchSpectrum({ samples: x, sampleRateHz: 8000, segmentLength: 8192 });
    let k = 0;
    for (let i = 1; i < s.magnitude.length; i++) if (s.magnitude[i]! > s.magnitude[k]!) k = i;
    expect(k).toBe(1024);
    expect(s.frequencyHz[k]).toBe(1000);
    expect(s.magnitude[k]).toBeCloseTo(1.5, 9);
    expect((s.magnitude[k]! * 8192) / 4).toBeCloseTo(3072, 6);
  });

  it("FFT-1 / FFT-2: fft.js and a plain O(N²) DFT agree on the reference vectors (domain-reference FFT-1, FFT-2)", () => {
    const x1 = Array.from({ length: 8 }, (_, n) => Math.cos((2 * Math.PI * n) / 8));
    expect(dftMagnitude(x1).map((v) => Math.round(v * 1e9) / 1e9)).toEqual([0, 4, 0, 0, 0]);
    const x2 = Array.from({ length: 16 }, (_, n) => 3 * Math.sin((2 * Math.PI * 2 * n) / 16));
    const f = new FFT(16);
    const out = f.createComplexArray() as number[];
    f.realTransform(out, x2);
    expect(out[4]).toBeCloseTo(0, 12);
    expect(out[5]).toBeCloseTo(-24, 12);
  });

  it("equals Welch averaging done by hand with an O(N²) DFT: Hann, 50 % overlap, rms of segments (independent oracle, property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1000 }), fc.integer({ min: 0, max: 40 }), (seed, extra) => {
        const n = 32;
        const len = 64 + extra;
        const u = uniform(seed);
        const x = Array.from({ length: len }, () => u() * 2 - 1 + 0.3);
        const mean = x.reduce((a, b) => a + b, 0) / len;
        const w = Array.from({ length: n }, (_, i) => 0.5 * (1 - Math.cos((2 * Math.PI * i) / n)));
        const segs = Math.floor((len - n) / (n / 2)) + 1;
        const acc = new Array<number>(n / 2 + 1).fill(0);
        for (let s = 0; s < segs; s++) {
          const seg = Array.from({ length: n }, (_, i) => (x[s * (n / 2) + i]! - mean) * w[i]!);
          dftMagnitude(seg).forEach((m, k) => (acc[k]! += m * m));
        }
        const expected = acc.map((p, k) => (Math.sqrt(p / segs) * 4) / n / (k === 0 || k === n / 2 ? 2 : 1));
        const got = welchSpectrum({ samples: x, sampleRateHz: 1000, segmentLength: n });
        expect(got.segments).toBe(segs);
        got.magnitude.forEach((m, k) => expect(m).toBeCloseTo(expected[k]!, 10));
      }),
      { numRuns: 40 },
    );
  });

  it("defaults to bins of at most 3 Hz (16 384 points at 48 kHz) and averages the segments", () => {
    const x = tones(48000 * 2, 48000, [{ hz: 440, amp: 1 }], 0.1);
    const s = welchSpectrum({ samples: x, sampleRateHz: 48000 });
    expect(s.segmentLength).toBe(16384);
    expect(s.binWidthHz).toBeCloseTo(2.9296875, 12);
    expect(s.segments).toBe(Math.floor((96000 - 16384) / 8192) + 1);
  });

  it("rejects a non-finite sample, a non-power-of-two segment and a too-short record", () => {
    const x = new Float64Array(64);
    x[10] = Number.NaN;
    expect(() => welchSpectrum({ samples: x, sampleRateHz: 100 })).toThrow("welchSpectrum requires samples[10] to be finite");
    expect(() => welchSpectrum({ samples: new Float64Array(64), sampleRateHz: 100, segmentLength: 48 })).toThrow("welchSpectrum requires segmentLength to be a power of two >= 16");
    expect(() => welchSpectrum({ samples: new Float64Array(8), sampleRateHz: 100 })).toThrow("welchSpectrum requires samples to hold at least 16 values");
  });
});
