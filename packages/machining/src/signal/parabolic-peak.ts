/** Refined position and height of a spectral peak. */
export interface ParabolicPeak {
  /** Offset of the true peak from the centre bin, in bins, −0.5 … 0.5 */
  offsetBins: number;
  /** Interpolated peak height, in the units of the input (linear) */
  height: number;
}

/**
 * Quadratic (parabolic) interpolation of a spectral peak on the log magnitude of three bins
 * k−1, k, k+1 (α, β, γ):
 *   p = ½ (α − γ) / (α − 2β + γ),   f = (k + p)·Δf,   log-height = β − ¼ (α − γ) p
 *
 * Scale-free: the same p results from magnitude or power. The Hann window's main lobe makes the
 * log-magnitude close to a parabola, so the bias is a few hundredths of a bin.
 *
 * @param input.below magnitude at bin k−1 (> 0)
 * @param input.centre magnitude at bin k (the local maximum, > 0)
 * @param input.above magnitude at bin k+1 (> 0)
 * @returns { offsetBins, height }
 * @throws RangeError if a magnitude is not > 0
 * @source J. O. Smith, Spectral Audio Signal Processing, "Quadratic interpolation of spectral peaks" (from memory).
 */
export function parabolicPeak(input: { below: number; centre: number; above: number }): ParabolicPeak {
  const { below, centre, above } = input;
  if (!(below > 0 && centre > 0 && above > 0)) {
    throw new RangeError("parabolicPeak requires below, centre and above > 0");
  }
  const a = Math.log(below);
  const b = Math.log(centre);
  const c = Math.log(above);
  const den = a - 2 * b + c;
  if (!(den < 0)) return { offsetBins: 0, height: centre };
  const p = Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / den));
  return { offsetBins: p, height: Math.exp(b - 0.25 * (a - c) * p) };
}
