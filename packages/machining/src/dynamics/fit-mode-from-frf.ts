import { requireFinite, requirePositive } from "../internal/require.js";

/** Modal parameters fitted to one resonance peak of a measured receptance. */
export interface FittedMode {
  /** Undamped natural frequency fn [Hz] */
  frequencyHz: number;
  /** Damping ratio ζ [-] */
  dampingRatio: number;
  /** Modal stiffness k [N/mm] */
  stiffnessNPerMm: number;
  /** Frequency of the magnitude peak [Hz] (= fn·√(1 − 2ζ²) for one mode) */
  peakFrequencyHz: number;
  /** Half-power frequencies f1, f2 [Hz] */
  lowerHalfPowerHz: number;
  upperHalfPowerHz: number;
}

/**
 * Fits one mode to the largest resonance peak of a measured frequency response (receptance,
 * displacement per force), by peak picking with the half-power bandwidth.
 *
 * 1. |G| peak located on the samples and refined by a parabola through the three highest points.
 * 2. f1, f2 where |G| = |G|peak / √2, by linear interpolation between samples.
 * 3. Exact inversion of the single-mode receptance G = 1/(k(1 − r² + 2iζr)), whose half-power
 *    points satisfy r² = 1 − 2ζ² ∓ 2ζ√(1 − ζ²):
 *      q = (f2² − f1²)/(f1² + f2²),  ζ = √((1 − 1/√(1 + q²))/2),  fn² = (f1² + f2²)/(2(1 − 2ζ²))
 *    (for light damping ζ ≈ (f2 − f1)/(2 fn), the textbook half-power rule).
 * 4. k = 1 / (2ζ√(1 − ζ²) · |G|peak).
 *
 * Assumes the peak is dominated by one mode (neighbouring modes well separated compared with the
 * bandwidth); restrict the band with minHz/maxHz to fit a particular peak. The FRF resolution must
 * put several samples inside the half-power band.
 *
 * @param input.frequencyHz frequencies, strictly increasing [Hz]
 * @param input.real Re G [mm/N]
 * @param input.imag Im G [mm/N]
 * @param input.minHz lower edge of the band searched for the peak [Hz] (optional)
 * @param input.maxHz upper edge [Hz] (optional)
 * @returns { frequencyHz, dampingRatio, stiffnessNPerMm, … }
 * @throws RangeError for arrays of different lengths, fewer than 5 samples, non-increasing or
 *   non-finite values, or a peak whose half-power points are not inside the measured band
 * @source Ewins, Modal Testing, 2nd ed. 2000, peak-picking method (from memory); half-power points of
 *   the SDOF receptance: Rao, Mechanical Vibrations (from memory; exact inversion derived here).
 */
export function fitModeFromFrf(input: {
  frequencyHz: ArrayLike<number>;
  real: ArrayLike<number>;
  imag: ArrayLike<number>;
  minHz?: number;
  maxHz?: number;
}): FittedMode {
  const fn = "fitModeFromFrf";
  const { frequencyHz: f, real, imag } = input;
  const n = f.length;
  if (real.length !== n || imag.length !== n) throw new RangeError(`${fn} requires frequencyHz, real and imag of equal length`);
  if (n < 5) throw new RangeError(`${fn} requires at least 5 samples`);
  const mag = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    requireFinite(fn, `frequencyHz[${i}]`, f[i]!);
    requireFinite(fn, `real[${i}]`, real[i]!);
    requireFinite(fn, `imag[${i}]`, imag[i]!);
    if (i > 0 && !(f[i]! > f[i - 1]!)) throw new RangeError(`${fn} requires frequencyHz to be strictly increasing`);
    mag[i] = Math.hypot(real[i]!, imag[i]!);
  }
  requirePositive(fn, "frequencyHz[0]", f[0]!);
  const minHz = input.minHz ?? f[0]!;
  const maxHz = input.maxHz ?? f[n - 1]!;
  let p = -1;
  for (let i = 1; i < n - 1; i++) {
    if (f[i]! < minHz || f[i]! > maxHz) continue;
    if (p < 0 || mag[i]! > mag[p]!) p = i;
  }
  if (p < 0 || !(mag[p]! > 0)) throw new RangeError(`${fn} requires a resonance peak inside the band`);
  // Parabola through the three samples around the maximum (on magnitude).
  const a = mag[p - 1]!;
  const b = mag[p]!;
  const c = mag[p + 1]!;
  const den = a - 2 * b + c;
  let offset = den < 0 ? (0.5 * (a - c)) / den : 0;
  offset = Math.max(-0.5, Math.min(0.5, offset));
  const peakMag = b - 0.25 * (a - c) * offset;
  const step = offset >= 0 ? f[p + 1]! - f[p]! : f[p]! - f[p - 1]!;
  const peakFrequencyHz = f[p]! + offset * step;
  const half = peakMag / Math.SQRT2;
  let f1 = NaN;
  for (let i = p; i > 0; i--) {
    if (mag[i - 1]! <= half && mag[i]! > half) {
      f1 = f[i - 1]! + ((half - mag[i - 1]!) / (mag[i]! - mag[i - 1]!)) * (f[i]! - f[i - 1]!);
      break;
    }
  }
  let f2 = NaN;
  for (let i = p; i < n - 1; i++) {
    if (mag[i + 1]! <= half && mag[i]! > half) {
      f2 = f[i]! + ((mag[i]! - half) / (mag[i]! - mag[i + 1]!)) * (f[i + 1]! - f[i]!);
      break;
    }
  }
  if (!Number.isFinite(f1) || !Number.isFinite(f2)) {
    throw new RangeError(`${fn} requires both half-power points of the peak inside the measured band`);
  }
  const q = (f2 * f2 - f1 * f1) / (f1 * f1 + f2 * f2);
  const dampingRatio = Math.sqrt((1 - 1 / Math.sqrt(1 + q * q)) / 2);
  const frequencyHz = Math.sqrt((f1 * f1 + f2 * f2) / (2 * (1 - 2 * dampingRatio * dampingRatio)));
  const stiffnessNPerMm = 1 / (2 * dampingRatio * Math.sqrt(1 - dampingRatio * dampingRatio) * peakMag);
  return { frequencyHz, dampingRatio, stiffnessNPerMm, peakFrequencyHz, lowerHalfPowerHz: f1, upperHalfPowerHz: f2 };
}
