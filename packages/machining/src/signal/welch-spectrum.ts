import FFT from "fft.js";
import { requirePositive, requirePositiveInteger } from "../internal/require.js";
import { hannWindow } from "./hann-window.js";

/** An averaged amplitude spectrum. */
export interface Spectrum {
  /** Bin centre frequencies, 0 … fs/2 [Hz] */
  frequencyHz: number[];
  /** Amplitude: a sinusoid of amplitude A centred on a bin reads A (Hann coherent gain removed) [signal units] */
  magnitude: number[];
  /** Δf = fs / segment length [Hz] */
  binWidthHz: number;
  /** Segment (FFT) length [samples] */
  segmentLength: number;
  /** Number of averaged segments [-] */
  segments: number;
}

/** Largest power of two ≤ n. */
function floorPow2(n: number): number {
  return 2 ** Math.floor(Math.log2(n));
}

/** Default segment: the smallest power of two whose bins are ≤ 3 Hz wide, at most the record. */
export function defaultSegmentLength(length: number, sampleRateHz: number): number {
  const wanted = 2 ** Math.ceil(Math.log2(sampleRateHz / 3));
  return Math.max(16, Math.min(wanted, floorPow2(length)));
}

interface FftWorkspace {
  fft: FFT;
  window: Float64Array;
  input: Float64Array;
  output: Float64Array;
}
const workspaces = new Map<number, FftWorkspace>();

/** FFT instance, window and buffers for one size, kept for reuse (sizes are few: powers of two). */
export function fftWorkspace(size: number): FftWorkspace {
  let ws = workspaces.get(size);
  if (!ws) {
    ws = {
      fft: new FFT(size),
      window: hannWindow({ size }),
      input: new Float64Array(size),
      output: new Float64Array(2 * size),
    };
    workspaces.set(size, ws);
  }
  return ws;
}

/**
 * Welch-averaged amplitude spectrum: the record is cut into segments (Hann window, 50 % overlap),
 * each is transformed with a real FFT, the squared magnitudes are averaged, and the root of the
 * mean is scaled so that a sinusoid of amplitude A shows as A:
 *
 *   |X̄[k]| = √( (1/S) Σ_s |X_s[k]|² ) · 2 / (N · 0.5)      (k = 1 … N/2−1; DC and Nyquist without the 2)
 *
 * The record's mean is removed first. Averaging trades frequency resolution (Δf = fs/N) for a
 * steadier noise floor.
 *
 * @param input.samples the signal [any unit]
 * @param input.sampleRateHz fs [Hz]
 * @param input.segmentLength N, a power of two ≥ 16 (default: bins ≤ 3 Hz, at most the record length)
 * @returns the spectrum from 0 to fs/2
 * @throws RangeError for fewer than 16 samples, a non-finite sample, fs ≤ 0, or a segment length
 *   that is not a power of two or exceeds the record
 * @source Welch, "The use of FFT for the estimation of power spectra", IEEE Trans. Audio Electroacoust.
 *   15(2), 1967 (from memory); window factors: Harris 1978 (from memory).
 */
export function welchSpectrum(input: { samples: ArrayLike<number>; sampleRateHz: number; segmentLength?: number }): Spectrum {
  const fn = "welchSpectrum";
  const { samples, sampleRateHz } = input;
  requirePositive(fn, "sampleRateHz", sampleRateHz);
  const len = samples.length;
  if (!(len >= 16)) throw new RangeError(`${fn} requires samples to hold at least 16 values`);
  const size = input.segmentLength ?? defaultSegmentLength(len, sampleRateHz);
  requirePositiveInteger(fn, "segmentLength", size);
  if (size < 16 || (size & (size - 1)) !== 0) throw new RangeError(`${fn} requires segmentLength to be a power of two >= 16`);
  if (size > len) throw new RangeError(`${fn} requires segmentLength <= samples.length`);
  let sum = 0;
  for (let i = 0; i < len; i++) sum += samples[i]!;
  if (!Number.isFinite(sum)) {
    for (let i = 0; i < len; i++) {
      if (!Number.isFinite(samples[i]!)) throw new RangeError(`${fn} requires samples[${i}] to be finite`);
    }
  }
  const mean = sum / len;
  const { fft, window, input: buf, output: out } = fftWorkspace(size);
  const half = size / 2;
  const power = new Float64Array(half + 1);
  const hop = size / 2;
  const segments = Math.floor((len - size) / hop) + 1;
  for (let s = 0; s < segments; s++) {
    const off = s * hop;
    for (let i = 0; i < size; i++) buf[i] = (samples[off + i]! - mean) * window[i]!;
    fft.realTransform(out, buf);
    for (let k = 0; k <= half; k++) {
      const re = out[2 * k]!;
      const im = out[2 * k + 1]!;
      power[k]! += re * re + im * im;
    }
  }
  const scale = 4 / size; // 2 (one-sided) / (N · coherent gain 0.5)
  const magnitude = new Array<number>(half + 1);
  const frequencyHz = new Array<number>(half + 1);
  const binWidthHz = sampleRateHz / size;
  for (let k = 0; k <= half; k++) {
    const m = Math.sqrt(power[k]! / segments) * scale;
    magnitude[k] = k === 0 || k === half ? m / 2 : m;
    frequencyHz[k] = k * binWidthHz;
  }
  return { frequencyHz, magnitude, binWidthHz, segmentLength: size, segments };
}
