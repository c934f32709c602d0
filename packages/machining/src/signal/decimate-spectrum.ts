import { requireFinite, requirePositiveInteger } from "../internal/require.js";

/** A spectrum reduced for plotting and transport. */
export interface DecimatedSpectrum {
  /** Kept frequencies, strictly increasing [Hz] */
  frequencyHz: number[];
  /** Their amplitudes [signal units] */
  magnitude: number[];
}

/**
 * Reduces a spectrum to about `maxPoints` points for a chart without losing its peaks.
 *
 * Peak-hold decimation: the bins are split into ⌈n / b⌉ consecutive buckets of b = ⌈n/maxPoints⌉
 * bins and each bucket keeps its largest bin (so every local maximum taller than its bucket
 * neighbours survives, at its exact bin frequency and height; a plain stride would drop peaks
 * between strides). The first and last bins are always kept. Then every point of `keep` (e.g. the
 * interpolated peaks found by findSpectralPeaks, whose frequency and height fall between bins) is
 * inserted exactly, so the plotted peak is the reported one. A spectrum with n ≤ maxPoints is
 * returned unchanged (plus `keep`).
 *
 * @param input.frequencyHz bin frequencies, strictly increasing [Hz]
 * @param input.magnitude amplitudes, same length [signal units]
 * @param input.maxPoints target number of points, integer ≥ 2 (the result holds at most maxPoints + 2 + keep.length)
 * @param input.keep points that must appear exactly (optional) [Hz, signal units]
 * @returns the reduced spectrum, frequencies strictly increasing
 * @throws RangeError for arrays of different lengths, non-finite values, non-increasing frequencies or maxPoints < 2
 * @source Min/max ("peak-hold") decimation for plotting: common practice, no published source.
 */
export function decimateSpectrum(input: {
  frequencyHz: ArrayLike<number>;
  magnitude: ArrayLike<number>;
  maxPoints: number;
  keep?: ReadonlyArray<{ frequencyHz: number; magnitude: number }>;
}): DecimatedSpectrum {
  const fn = "decimateSpectrum";
  const { frequencyHz: f, magnitude: m, maxPoints } = input;
  const n = f.length;
  if (m.length !== n) throw new RangeError(`${fn} requires frequencyHz and magnitude of equal length`);
  requirePositiveInteger(fn, "maxPoints", maxPoints);
  if (maxPoints < 2) throw new RangeError(`${fn} requires maxPoints >= 2`);
  for (let i = 0; i < n; i++) {
    requireFinite(fn, `frequencyHz[${i}]`, f[i]!);
    requireFinite(fn, `magnitude[${i}]`, m[i]!);
    if (i > 0 && !(f[i]! > f[i - 1]!)) throw new RangeError(`${fn} requires frequencyHz to be strictly increasing`);
  }
  const idx: number[] = [];
  if (n <= maxPoints) {
    for (let i = 0; i < n; i++) idx.push(i);
  } else {
    const bucket = Math.ceil(n / maxPoints);
    idx.push(0);
    for (let start = 0; start < n; start += bucket) {
      const end = Math.min(n, start + bucket);
      let best = start;
      for (let i = start + 1; i < end; i++) if (m[i]! > m[best]!) best = i;
      if (best !== idx[idx.length - 1]) idx.push(best);
    }
    if (idx[idx.length - 1] !== n - 1) idx.push(n - 1);
  }
  const points = idx.map((i) => ({ frequencyHz: f[i]!, magnitude: m[i]! }));
  for (const k of input.keep ?? []) {
    requireFinite(fn, "keep.frequencyHz", k.frequencyHz);
    requireFinite(fn, "keep.magnitude", k.magnitude);
    points.push({ frequencyHz: k.frequencyHz, magnitude: k.magnitude });
  }
  points.sort((a, b) => a.frequencyHz - b.frequencyHz);
  const out: DecimatedSpectrum = { frequencyHz: [], magnitude: [] };
  const keepSet = new Set((input.keep ?? []).map((k) => k.frequencyHz));
  for (const p of points) {
    const last = out.frequencyHz.length - 1;
    if (last >= 0 && out.frequencyHz[last] === p.frequencyHz) {
      // Same frequency twice: a kept (reported) point wins over a bin.
      if (keepSet.has(p.frequencyHz)) out.magnitude[last] = p.magnitude;
      continue;
    }
    out.frequencyHz.push(p.frequencyHz);
    out.magnitude.push(p.magnitude);
  }
  return out;
}
