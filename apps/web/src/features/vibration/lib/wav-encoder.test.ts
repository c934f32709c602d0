import { describe, expect, it } from "vitest";
import { WaveFile } from "wavefile";
import { concatSamples, encodeWav16, floatToInt16, wav16Bytes } from "./wav-encoder";

/**
 * Round trips through an independent decoder: the `wavefile` package (rochars/wavefile 11), which
 * reads RIFF/WAVE files on its own, so a header or byte-order mistake here shows up as a mismatch.
 */
function decode(buffer: ArrayBuffer) {
  return new WaveFile(new Uint8Array(buffer));
}

describe("encodeWav16", () => {
  it("writes a mono 16-bit PCM file that wavefile reads back sample for sample", () => {
    const samples = new Float32Array([0, 0.5, -0.5, 1, -1, 0.25, -0.999]);
    const wav = decode(encodeWav16(samples, 48_000));
    const fmt = wav.fmt as { audioFormat: number; numChannels: number; sampleRate: number; byteRate: number; blockAlign: number; bitsPerSample: number };
    expect(fmt.audioFormat).toBe(1);
    expect(fmt.numChannels).toBe(1);
    expect(fmt.sampleRate).toBe(48_000);
    expect(fmt.bitsPerSample).toBe(16);
    expect(fmt.blockAlign).toBe(2);
    expect(fmt.byteRate).toBe(96_000);
    expect(wav.bitDepth).toBe("16");
    // Expected integers worked by hand from the scaling rule: x ≥ 0 → round(x·32767), x < 0 → round(x·32768).
    expect(Array.from(wav.getSamples(false, Int16Array))).toEqual([0, 16384, -16384, 32767, -32768, 8192, -32735]);
  });

  it("interleaves stereo channels in the order given", () => {
    const left = new Float32Array([0.1, 0.2, 0.3]);
    const right = new Float32Array([-0.1, -0.2, -0.3]);
    const wav = decode(encodeWav16([left, right], 44_100));
    expect((wav.fmt as { numChannels: number }).numChannels).toBe(2);
    const channels = wav.getSamples(false, Int16Array) as unknown as Int16Array[];
    // 0.1·32767 = 3276.7 → 3277; −0.1·32768 = −3276.8 → −3277 (hand-computed).
    expect(Array.from(channels[0]!)).toEqual([3277, 6553, 9830]);
    expect(Array.from(channels[1]!)).toEqual([-3277, -6554, -9830]);
    const interleaved = Array.from(wav.getSamples(true, Int16Array));
    expect(interleaved).toEqual([3277, -3277, 6553, -6554, 9830, -9830]);
  });

  it("keeps a 1 kHz tone within one quantisation step", () => {
    const fs = 8_000;
    const tone = new Float32Array(fs / 10).map((_, i) => 0.8 * Math.sin((2 * Math.PI * 1000 * i) / fs));
    const back = Array.from(decode(encodeWav16(tone, fs)).getSamples(false, Float64Array));
    expect(back).toHaveLength(tone.length);
    for (let i = 0; i < tone.length; i++) expect(Math.abs(back[i]! / 32768 - tone[i]!)).toBeLessThanOrEqual(1 / 32767);
  });

  it("gives the file the size of its header and data, and says so in the RIFF and data sizes", () => {
    const buffer = encodeWav16(new Float32Array(1000), 16_000);
    expect(buffer.byteLength).toBe(44 + 2000);
    expect(wav16Bytes(1000)).toBe(buffer.byteLength);
    const view = new DataView(buffer);
    expect(view.getUint32(4, true)).toBe(buffer.byteLength - 8);
    expect(view.getUint32(40, true)).toBe(2000);
    expect(decode(buffer).getSamples(false, Int16Array)).toHaveLength(1000);
  });

  it("clips out-of-range samples and turns NaN into silence", () => {
    expect(floatToInt16(1.7)).toBe(32767);
    expect(floatToInt16(-3)).toBe(-32768);
    expect(floatToInt16(Number.NaN)).toBe(0);
    expect(floatToInt16(Number.POSITIVE_INFINITY)).toBe(0);
  });

  it("refuses what it cannot encode", () => {
    expect(() => encodeWav16([], 48_000)).toThrow("encodeWav16 requires at least one channel");
    expect(() => encodeWav16([new Float32Array(2), new Float32Array(3)], 48_000)).toThrow("channels of equal length");
    expect(() => encodeWav16(new Float32Array(2), 0)).toThrow("sampleRateHz");
    expect(() => encodeWav16(new Float32Array(2), 44_100.5)).toThrow("sampleRateHz");
  });
});

describe("concatSamples", () => {
  it("joins blocks in order", () => {
    expect(Array.from(concatSamples([new Float32Array([1, 2]), new Float32Array([]), new Float32Array([3])]))).toEqual([1, 2, 3]);
  });
});
