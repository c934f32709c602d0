import { requirePositive, requirePositiveInteger } from "../internal/require.js";
import { parabolicPeak } from "./parabolic-peak.js";

/** A peak in an amplitude spectrum. */
export interface SpectralPeak {
  /** Interpolated peak frequency [Hz] */
  frequencyHz: number;
  /** Interpolated peak amplitude [signal units] */
  magnitude: number;
  /** Peak height over the spectrum's median level (noise floor) [-] */
  aboveFloor: number;
}

/**
 * Finds the strongest peaks of an amplitude spectrum.
 *
 * A bin is a peak when it is a local maximum, stands `minAboveFloor` times above the median of the
 * searched bins (a robust noise-floor estimate) and is not within 3 bins of a stronger peak (the
 * Hann main lobe is ±2 bins wide). Position and height are refined by parabolic interpolation of
 * the log magnitude.
 *
 * @param input.frequencyHz bin frequencies (uniform) [Hz]
 * @param input.magnitude amplitudes (≥ 0)
 * @param input.minFrequencyHz ignore bins below this [Hz] (default: 3 bins)
 * @param input.maxFrequencyHz ignore bins above this [Hz] (default: the last bin)
 * @param input.maxPeaks how many peaks at most (default 12)
 * @param input.minAboveFloor threshold over the median [-] (default 8, ≈ 18 dB)
 * @returns peaks, strongest first
 * @throws RangeError for arrays of different or too small length, or invalid options
 * @source Peak interpolation: J. O. Smith, Spectral Audio Signal Processing (from memory); median as a
 *   robust floor estimate: common practice, no published source.
 */
export function findSpectralPeaks(input: {
  frequencyHz: ArrayLike<number>;
  magnitude: ArrayLike<number>;
  minFrequencyHz?: number;
  maxFrequencyHz?: number;
  maxPeaks?: number;
  minAboveFloor?: number;
}): SpectralPeak[] {
  const fn = "findSpectralPeaks";
  const { frequencyHz: f, magnitude: m } = input;
  const n = f.length;
  if (m.length !== n) throw new RangeError(`${fn} requires frequencyHz and magnitude of equal length`);
  if (n < 5) throw new RangeError(`${fn} requires at least 5 bins`);
  const df = f[1]! - f[0]!;
  requirePositive(fn, "bin width", df);
  const maxPeaks = input.maxPeaks ?? 12;
  requirePositiveInteger(fn, "maxPeaks", maxPeaks);
  const minAboveFloor = input.minAboveFloor ?? 8;
  requirePositive(fn, "minAboveFloor", minAboveFloor);
  const fMin = input.minFrequencyHz ?? f[0]! + 3 * df;
  const fMax = input.maxFrequencyHz ?? f[n - 1]!;
  const lo = Math.max(1, Math.ceil((fMin - f[0]!) / df));
  const hi = Math.min(n - 2, Math.floor((fMax - f[0]!) / df));
  if (hi < lo) return [];
  const band = Float64Array.from({ length: hi - lo + 1 }, (_, i) => m[lo + i]!).sort();
  const floor = band[Math.floor(band.length / 2)]!;
  const threshold = floor > 0 ? floor * minAboveFloor : Number.MIN_VALUE;
  const candidates: number[] = [];
  for (let k = lo; k <= hi; k++) {
    const v = m[k]!;
    if (v > threshold && v > m[k - 1]! && v >= m[k + 1]!) candidates.push(k);
  }
  candidates.sort((a, b) => m[b]! - m[a]!);
  const kept: number[] = [];
  for (const k of candidates) {
    if (kept.some((q) => Math.abs(q - k) <= 3)) continue;
    kept.push(k);
    if (kept.length >= maxPeaks) break;
  }
  return kept.map((k) => {
    const below = Math.max(m[k - 1]!, Number.MIN_VALUE);
    const above = Math.max(m[k + 1]!, Number.MIN_VALUE);
    const p = parabolicPeak({ below, centre: m[k]!, above });
    return {
      frequencyHz: f[k]! + p.offsetBins * df,
      magnitude: p.height,
      aboveFloor: floor > 0 ? p.height / floor : Number.MAX_VALUE,
    };
  });
}
