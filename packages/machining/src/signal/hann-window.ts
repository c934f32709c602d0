import { requirePositiveInteger } from "../internal/require.js";

/**
 * Periodic Hann window (the form whose shifted copies at 50 % overlap sum to a constant).
 *
 * w[n] = 0.5 · (1 − cos(2πn / N)),  n = 0 … N−1;  coherent gain 0.5, ENBW 1.5 bins
 *
 * @param input.size N [samples]
 * @returns the window [-]
 * @throws RangeError if N is not an integer ≥ 1
 * @source Harris, "On the use of windows for harmonic analysis with the DFT", Proc. IEEE 66(1), 1978 (from memory).
 */
export function hannWindow(input: { size: number }): Float64Array {
  requirePositiveInteger("hannWindow", "size", input.size);
  const n = input.size;
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) w[i] = 0.5 * (1 - Math.cos((2 * Math.PI * i) / n));
  return w;
}
