import FFT from "fft.js";
import { requirePositive } from "../internal/require.js";
import { parabolicPeak } from "./parabolic-peak.js";

/** FFT instances by size (their twiddle tables are costly to build). */
const ffts = new Map<number, FFT>();

/** Frequency and damping of a free decay (tap test). */
export interface RingDownAnalysis {
  /** Damped frequency fd from the spectrum peak [Hz] */
  frequencyHz: number;
  /** Damped frequency from the mean spacing of the decay peaks [Hz] */
  frequencyFromPeakSpacingHz: number;
  /** Undamped natural frequency fn = fd / √(1 − ζ²) [Hz] */
  naturalFrequencyHz: number;
  /** ζ [-] */
  dampingRatio: number;
  /** Logarithmic decrement per cycle δ [-] */
  logDecrement: number;
  /** Number of cycles used in the fit [-] */
  cyclesUsed: number;
  /** Coefficient of determination of the straight-line fit of ln(amplitude) against time [-] (1 = perfect exponential decay) */
  fitQuality: number;
  /** Plain-language notes */
  notes: string[];
}

/**
 * Dominant frequency and damping of a ring-down (the free vibration after a tap).
 *
 * 1. Frequency: FFT of the whole record (mean removed, no window: the decay is its own window),
 *    zero-padded (≥ 8× length, ≤ 2^22 points), parabolic interpolation of the highest peak's log magnitude.
 * 2. Decay: the cycle peaks (local maxima at least 0.6 period apart) and the trough that follows
 *    each; amplitude A_i = (peak − trough)/2 is insensitive to a constant offset. ln A_i is fitted
 *    by least squares against the peak times from the largest peak on, while A_i stays above
 *    `minRelativeAmplitude` of the largest: slope −σ.
 * 3. Log decrement δ = σ · Td, ζ = δ / √(4π² + δ²) (= σ / √(σ² + ωd²)); Td from the least-squares
 *    peak spacing when a cycle spans ≥ 20 samples, else from the spectrum frequency.
 * With `bandHz` the record is first band-pass filtered (zero-phase, in the frequency domain, with
 * raised-cosine edges a quarter of the band wide) to isolate one mode; without it the decay of several close modes beats and the fit quality drops.
 *
 * Assumes viscous (exponential) damping of one dominant mode.
 *
 * @param input.samples the decay, starting before or at the tap [any unit]
 * @param input.sampleRateHz fs [Hz]
 * @param input.bandHz optional { minHz, maxHz } to isolate one mode [Hz]
 * @param input.minRelativeAmplitude stop the fit below this fraction of the largest cycle (default 0.05)
 * @returns frequency, damping and fit quality
 * @throws RangeError for fewer than 32 samples, non-finite samples, fs ≤ 0, a bad band, or fewer than
 *   three decaying cycles above the threshold
 * @source Logarithmic decrement: Rao, Mechanical Vibrations (from memory); Inman, Engineering Vibration
 *   (from memory). Peak interpolation: J. O. Smith, Spectral Audio Signal Processing (from memory).
 */
export function analyzeRingDown(input: {
  samples: ArrayLike<number>;
  sampleRateHz: number;
  bandHz?: { minHz: number; maxHz: number };
  minRelativeAmplitude?: number;
}): RingDownAnalysis {
  const fn = "analyzeRingDown";
  const { samples, sampleRateHz } = input;
  requirePositive(fn, "sampleRateHz", sampleRateHz);
  const n = samples.length;
  if (!(n >= 32)) throw new RangeError(`${fn} requires samples to hold at least 32 values`);
  if (n > 2 ** 21) throw new RangeError(`${fn} requires samples to hold at most 2097152 values (trim the record to the decay)`);
  const minRel = input.minRelativeAmplitude ?? 0.05;
  if (!(minRel > 0 && minRel < 1)) throw new RangeError(`${fn} requires 0 < minRelativeAmplitude < 1`);
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const v = samples[i]!;
    if (!Number.isFinite(v)) throw new RangeError(`${fn} requires samples[${i}] to be finite`);
    x[i] = v;
  }
  const notes: string[] = [];
  const size = Math.min(2 ** 22, 2 ** Math.ceil(Math.log2(8 * n)));
  if (size < 8 * n) notes.push("Long record: spectrum zero-padding limited to 2^22 points.");
  let fft = ffts.get(size);
  if (!fft) {
    fft = new FFT(size);
    ffts.set(size, fft);
  }
  const spectrum = new Float64Array(2 * size);

  let signal = x;
  if (input.bandHz) {
    const { minHz, maxHz } = input.bandHz;
    requirePositive(fn, "bandHz.minHz", minHz);
    requirePositive(fn, "bandHz.maxHz", maxHz);
    if (!(maxHz > minHz && maxHz < sampleRateHz / 2)) throw new RangeError(`${fn} requires bandHz.minHz < bandHz.maxHz < sampleRateHz / 2`);
    // Zero-phase band-pass: bins inside the band pass, a raised-cosine taper a quarter of the band
    // wide on each side (a brick wall would ring for the whole record), zero beyond.
    const padded = new Float64Array(size);
    padded.set(x);
    fft.realTransform(spectrum, padded);
    fft.completeSpectrum(spectrum);
    const df = sampleRateHz / size;
    const taper = 0.25 * (maxHz - minHz);
    const gain = (f: number): number => {
      if (f >= minHz && f <= maxHz) return 1;
      const d = f < minHz ? minHz - f : f - maxHz;
      return d >= taper ? 0 : 0.5 * (1 + Math.cos((Math.PI * d) / taper));
    };
    for (let k = 0; k < size; k++) {
      const g = gain((k <= size / 2 ? k : size - k) * df);
      spectrum[2 * k]! *= g;
      spectrum[2 * k + 1]! *= g;
    }
    const back = new Float64Array(2 * size);
    fft.inverseTransform(back, spectrum);
    signal = new Float64Array(n);
    for (let i = 0; i < n; i++) signal[i] = back[2 * i]!;
  }

  // 1. Dominant frequency from the zero-padded spectrum. No window: the decay is its own window
  // (a Hann window would weight the quiet end of the record and hide a quickly decaying mode).
  const buf = new Float64Array(size);
  let mean = 0;
  for (let i = 0; i < n; i++) mean += signal[i]!;
  mean /= n;
  for (let i = 0; i < n; i++) buf[i] = signal[i]! - mean;
  fft.realTransform(spectrum, buf);
  const half = size / 2;
  const mag = new Float64Array(half + 1);
  for (let k = 0; k <= half; k++) {
    const re = spectrum[2 * k]!;
    const im = spectrum[2 * k + 1]!;
    mag[k] = Math.sqrt(re * re + im * im);
  }
  const df = sampleRateHz / size;
  const kMin = input.bandHz ? Math.max(1, Math.ceil(input.bandHz.minHz / df)) : 1;
  const kMax = input.bandHz ? Math.min(half - 1, Math.floor(input.bandHz.maxHz / df)) : half - 1;
  let kPeak = kMin;
  for (let k = kMin; k <= kMax; k++) if (mag[k]! > mag[kPeak]!) kPeak = k;
  if (!(mag[kPeak]! > 0)) throw new RangeError(`${fn} requires a signal that is not constant`);
  const pk = parabolicPeak({
    below: Math.max(mag[kPeak - 1]!, Number.MIN_VALUE),
    centre: mag[kPeak]!,
    above: Math.max(mag[kPeak + 1]!, Number.MIN_VALUE),
  });
  const frequencyHz = (kPeak + pk.offsetBins) * df;

  // 2. Cycle peaks with non-maximum suppression over 0.6 of a period.
  const minGap = Math.max(1, Math.floor((0.6 * sampleRateHz) / frequencyHz));
  const peaks: number[] = [];
  for (let i = 1; i < n - 1; i++) {
    const v = signal[i]!;
    if (!(v >= signal[i - 1]! && v > signal[i + 1]!)) continue;
    const last = peaks[peaks.length - 1];
    if (last !== undefined && i - last < minGap) {
      if (v > signal[last]!) peaks[peaks.length - 1] = i;
    } else peaks.push(i);
  }
  // Refined peak time and peak-to-trough amplitude of every cycle that has a following peak.
  const times: number[] = [];
  const amps: number[] = [];
  for (let j = 0; j + 1 < peaks.length; j++) {
    const i = peaks[j]!;
    let trough = Infinity;
    for (let q = i; q < peaks[j + 1]!; q++) trough = Math.min(trough, signal[q]!);
    const a = signal[i - 1]!;
    const b = signal[i]!;
    const c = signal[i + 1]!;
    const den = a - 2 * b + c;
    const p = den < 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / den)) : 0;
    const peakValue = b - 0.25 * (a - c) * p;
    times.push((i + p) / sampleRateHz);
    amps.push((peakValue - trough) / 2);
  }
  let start = 0;
  for (let j = 1; j < amps.length; j++) if (amps[j]! > amps[start]!) start = j;
  // After band-pass filtering the first cycle still carries the filter's transient: skip it.
  if (input.bandHz && start + 4 < amps.length) start += 1;
  const threshold = amps[start]! * minRel;
  let end = start;
  while (end + 1 < amps.length && amps[end + 1]! > threshold) end++;
  const count = end - start + 1;
  if (count < 3) {
    throw new RangeError(`${fn} requires at least 3 decaying cycles above ${minRel} of the largest one`);
  }
  // 3. Least-squares lines: ln(A) against t (slope −σ) and peak time against cycle index (period).
  let st = 0;
  let sy = 0;
  let sj = 0;
  for (let j = start; j <= end; j++) {
    st += times[j]!;
    sy += Math.log(amps[j]!);
    sj += j;
  }
  const tMean = st / count;
  const yMean = sy / count;
  const jMean = sj / count;
  let stt = 0;
  let sty = 0;
  let syy = 0;
  let sjj = 0;
  let sjt = 0;
  for (let j = start; j <= end; j++) {
    const dt = times[j]! - tMean;
    const dy = Math.log(amps[j]!) - yMean;
    const dj = j - jMean;
    stt += dt * dt;
    sty += dt * dy;
    syy += dy * dy;
    sjj += dj * dj;
    sjt += dj * dt;
  }
  const slope = sty / stt;
  const sigma = -slope;
  if (!(sigma > 0)) throw new RangeError(`${fn} requires a decaying signal (the cycle amplitudes do not decrease)`);
  const fitQuality = syy > 0 ? (sty * sty) / (stt * syy) : 1;
  const spacing = sjt / sjj;
  const frequencyFromPeakSpacingHz = 1 / spacing;
  // Peak times are precise only with many samples per cycle; otherwise the spectrum frequency
  // (whole record, zero-padded) is the better period.
  const samplesPerCycle = sampleRateHz / frequencyHz;
  const fd = samplesPerCycle >= 20 ? frequencyFromPeakSpacingHz : frequencyHz;
  const logDecrement = sigma / fd;
  const dampingRatio = logDecrement / Math.sqrt(4 * Math.PI * Math.PI + logDecrement * logDecrement);
  const naturalFrequencyHz = fd / Math.sqrt(1 - dampingRatio * dampingRatio);
  if (fitQuality < 0.98) {
    notes.push("The decay is not a clean exponential (beating of close modes or noise); isolate one mode with a frequency band.");
  }
  if (Math.abs(frequencyFromPeakSpacingHz - frequencyHz) > 0.05 * frequencyHz) {
    notes.push("The spectrum peak and the peak spacing disagree: more than one mode rings; isolate one with a frequency band.");
  }
  return {
    frequencyHz,
    frequencyFromPeakSpacingHz,
    naturalFrequencyHz,
    dampingRatio,
    logDecrement,
    cyclesUsed: count - 1,
    fitQuality,
    notes,
  };
}
