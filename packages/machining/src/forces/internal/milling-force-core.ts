/**
 * Unchecked core of millingForcesN (the public function validates first). Kept separate so
 * recommend(), which has validated its whole input already, can call it in its inner loops.
 */
export interface ForceCore {
  meanFeedForceN: number;
  meanNormalForceN: number;
  meanTangentialForceN: number;
  peakResultantN: number;
}

const SAMPLES = 16;

export function millingForceCore(
  flutes: number,
  axialDepthMm: number,
  chipLoadMm: number,
  kt: number,
  kr: number,
  st: number,
  ex: number,
  withMeans: boolean,
): ForceCore {
  let meanFeedForceN = 0;
  let meanNormalForceN = 0;
  let meanTangentialForceN = 0;
  if (withMeans) {
    const scale = (flutes * axialDepthMm * chipLoadMm) / (8 * Math.PI);
    const fxTerm = (p: number): number => kt * Math.cos(2 * p) - kr * kt * (2 * p - Math.sin(2 * p));
    const fyTerm = (p: number): number => kt * (2 * p - Math.sin(2 * p)) + kr * kt * Math.cos(2 * p);
    meanFeedForceN = scale * (fxTerm(ex) - fxTerm(st));
    meanNormalForceN = scale * (fyTerm(ex) - fyTerm(st));
    meanTangentialForceN = ((flutes * axialDepthMm * chipLoadMm * kt) / (2 * Math.PI)) * (Math.cos(st) - Math.cos(ex));
  }
  // Peak of the instantaneous total force; the pattern repeats every tooth pitch.
  const twoPi = 2 * Math.PI;
  const pitch = twoPi / flutes;
  const k = kt * axialDepthMm * chipLoadMm;
  const forceAt = (phi0: number): number => {
    let fx = 0;
    let fy = 0;
    let phi = phi0 - Math.floor(phi0 / twoPi) * twoPi;
    for (let j = 0; j < flutes; j++) {
      if (phi >= st && phi <= ex) {
        const s = Math.sin(phi);
        const c = Math.cos(phi);
        const ft = k * s;
        const fr = kr * ft;
        fx -= ft * c + fr * s;
        fy += ft * s - fr * c;
      }
      phi += pitch;
      if (phi >= twoPi) phi -= twoPi;
    }
    return Math.sqrt(fx * fx + fy * fy);
  };
  // Sampled over one pitch; sines and cosines by rotation (one pair per call, not per tooth).
  const step = pitch / SAMPLES;
  const cStep = Math.cos(step);
  const sStep = Math.sin(step);
  const cPitch = Math.cos(pitch);
  const sPitch = Math.sin(pitch);
  let c0 = 1;
  let s0 = 0;
  let peak = 0;
  for (let i = 0; i < SAMPLES; i++) {
    let fx = 0;
    let fy = 0;
    let c = c0;
    let sn = s0;
    let phi = i * step;
    for (let j = 0; j < flutes; j++) {
      if (phi >= st && phi <= ex) {
        const ft = k * sn;
        const fr = kr * ft;
        fx -= ft * c + fr * sn;
        fy += ft * sn - fr * c;
      }
      const cn = c * cPitch - sn * sPitch;
      sn = sn * cPitch + c * sPitch;
      c = cn;
      phi += pitch;
    }
    const f = Math.sqrt(fx * fx + fy * fy);
    if (f > peak) peak = f;
    const cn0 = c0 * cStep - s0 * sStep;
    s0 = s0 * cStep + c0 * sStep;
    c0 = cn0;
  }
  // Critical angles: a tooth at the entry, at the exit, and where its own chip is thickest.
  const thickest = Math.min(Math.max(Math.PI / 2, st), ex);
  peak = Math.max(peak, forceAt(st), forceAt(ex), forceAt(thickest));
  return { meanFeedForceN, meanNormalForceN, meanTangentialForceN, peakResultantN: peak };
}
