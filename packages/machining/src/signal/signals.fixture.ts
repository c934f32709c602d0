/** Deterministic test signals (seeded noise), so every run sees the same samples. */

/** mulberry32 PRNG → uniform [0, 1). */
export function uniform(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal samples by Box–Muller. */
export function gaussian(seed: number): () => number {
  const u = uniform(seed);
  return () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

/** Sum of sines Σ A·sin(2π f t) + σ·noise, t = n / fs. */
export function tones(length: number, sampleRateHz: number, parts: { hz: number; amp: number; phase?: number }[], noise = 0, seed = 1): Float64Array {
  const g = gaussian(seed);
  const x = new Float64Array(length);
  for (let n = 0; n < length; n++) {
    let v = 0;
    for (const p of parts) v += p.amp * Math.sin((2 * Math.PI * p.hz * n) / sampleRateHz + (p.phase ?? 0));
    x[n] = v + (noise > 0 ? noise * g() : 0);
  }
  return x;
}

/** Plain O(N²) DFT magnitude of bins 0 … N/2 (oracle). */
export function dftMagnitude(x: ArrayLike<number>): number[] {
  const n = x.length;
  const out: number[] = [];
  for (let k = 0; k <= n / 2; k++) {
    let re = 0;
    let im = 0;
    for (let j = 0; j < n; j++) {
      re += x[j]! * Math.cos((2 * Math.PI * k * j) / n);
      im -= x[j]! * Math.sin((2 * Math.PI * k * j) / n);
    }
    out.push(Math.hypot(re, im));
  }
  return out;
}
