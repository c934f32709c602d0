/**
 * Shared numerical core of the zero-order (Altintas–Budak) milling stability model.
 *
 * The eigenvalues of [α][Φ(ω)] do not depend on spindle speed, so they are solved once on a
 * frequency grid (dense around each mode, log-spaced elsewhere) and every speed question —
 * the limit at one speed, the envelope over a thousand speeds — is answered by walking that grid.
 *
 * Notation (Altintas & Budak 1995; Altintas, Manufacturing Automation, 2nd ed., ch. 3):
 *   λ = eigenvalue of [α][Φ], Λ = −1/λ, a_lim = −(2π Λ_R / (N Kt))(1 + κ²), κ = Λ_I/Λ_R.
 *   Substituting Λ = −1/λ gives the simpler a_lim = 2π / (N · Kt · Re λ) (valid where Re λ > 0),
 *   and ε = π − 2 atan κ = π + 2 atan(Im λ / Re λ); n = 60 fc / (N (k + ε/2π)).
 * The two eigenvalues come out of the quadratic formula in an order that flips where the complex
 * square root crosses its branch cut; they are re-ordered by continuity from one grid frequency to
 * the next, otherwise lobes would be stitched from pieces of different branches. Where a branch's
 * Re λ changes sign or its phase turns fast, segments are bisected with exact receptances, so the
 * coarse per-recipe grid finds the crossings a dense grid finds.
 */
import type { DirectionalFactors } from "../directional-factors.js";
import type { Mode } from "../mode.js";

/** Receptances of the x and y directions on a frequency grid [mm/N]. */
export interface FrfGrid {
  /** The modes the grid was built from (a private copy: used to evaluate between grid points) */
  modes: readonly Mode[];
  size: number;
  frequencyHz: Float64Array;
  xxRe: Float64Array;
  xxIm: Float64Array;
  yyRe: Float64Array;
  yyIm: Float64Array;
}

/** Grid resolution: log-spaced base points plus points clustered around each mode. */
export interface GridDensity {
  basePoints: number;
  perModePoints: number;
}

/** Coarse grid for per-recipe checks (recommend). */
export const FAST_GRID: GridDensity = { basePoints: 48, perModePoints: 40 };
/** Fine grid for drawing a lobe diagram. */
export const FINE_GRID: GridDensity = { basePoints: 500, perModePoints: 500 };

/** Frequency band that covers the lobes of interest for a speed range. */
export function frequencyBandHz(modes: readonly Mode[], flutes: number, minRpm: number, maxRpm: number): { loHz: number; hiHz: number } {
  let fMin = Infinity;
  let fMax = 0;
  for (const m of modes) {
    fMin = Math.min(fMin, m.frequencyHz);
    fMax = Math.max(fMax, m.frequencyHz);
  }
  // Lobe k = 0 at speed n crosses at fc ≤ n·N/60 (ε ≤ 2π), so the top of the band must reach the
  // tooth-passing frequency at the highest speed; below the lowest mode the real part of a
  // receptance is positive and slot/up-milling cuts are stable, but down-milling can be unstable
  // just below a mode, hence the margin.
  const loHz = Math.min(0.25 * fMin, (0.25 * minRpm * flutes) / 60);
  const hiHz = Math.max(4 * fMax, (1.25 * maxRpm * flutes) / 60);
  return { loHz, hiHz };
}

/** Builds the sorted frequency grid. */
export function frequencyGrid(modes: readonly Mode[], loHz: number, hiHz: number, density: GridDensity): Float64Array {
  const values: number[] = [];
  const span = Math.log(hiHz / loHz);
  for (let i = 0; i < density.basePoints; i++) values.push(loHz * Math.exp((span * i) / (density.basePoints - 1)));
  // Around each mode: f = fn (1 + ζ t), t = 2 sinh(u), u uniform — fine near the resonance where
  // the boundary has its minimum, coarser in the wings.
  const uLo = Math.asinh(-30);
  const uHi = Math.asinh(60);
  for (const m of modes) {
    for (let i = 0; i < density.perModePoints; i++) {
      const u = uLo + ((uHi - uLo) * i) / (density.perModePoints - 1);
      const f = m.frequencyHz * (1 + m.dampingRatio * 2 * Math.sinh(u));
      if (f > loHz && f < hiHz) values.push(f);
    }
  }
  const sorted = Float64Array.from(values).sort();
  // Drop near-duplicates so that no grid segment is degenerate.
  const out: number[] = [];
  for (const f of sorted) {
    const last = out[out.length - 1];
    if (last === undefined || f - last > 1e-9 * f) out.push(f);
  }
  return Float64Array.from(out);
}

/** Sum of single-mode receptances G = 1 / (k (1 − r² + 2iζr)) per direction on a grid. */
export function frfOnGrid(modes: readonly Mode[], frequencyHz: Float64Array): FrfGrid {
  const size = frequencyHz.length;
  const xxRe = new Float64Array(size);
  const xxIm = new Float64Array(size);
  const yyRe = new Float64Array(size);
  const yyIm = new Float64Array(size);
  for (const m of modes) {
    const re = m.direction === "x" ? xxRe : yyRe;
    const im = m.direction === "x" ? xxIm : yyIm;
    for (let i = 0; i < size; i++) {
      const r = frequencyHz[i]! / m.frequencyHz;
      const d = 1 - r * r;
      const e = 2 * m.dampingRatio * r;
      const s = 1 / (m.stiffnessNPerMm * (d * d + e * e));
      re[i]! += d * s;
      im[i]! -= e * s;
    }
  }
  return { modes: modes.map((m) => ({ ...m })), size, frequencyHz, xxRe, xxIm, yyRe, yyIm };
}

/**
 * The numbers a grid depends on, in a fixed order: band, density, and each mode's direction (x = 0,
 * y = 1), frequency, damping and stiffness. Used as an exact cache key (hashed, then compared).
 */
function gridSignature(modes: readonly Mode[], loHz: number, hiHz: number, density: GridDensity): Float64Array {
  const sig = new Float64Array(4 + 4 * modes.length);
  sig[0] = loHz;
  sig[1] = hiHz;
  sig[2] = density.basePoints;
  sig[3] = density.perModePoints;
  modes.forEach((m, i) => {
    sig[4 + 4 * i] = m.direction === "x" ? 0 : 1;
    sig[5 + 4 * i] = m.frequencyHz;
    sig[6 + 4 * i] = m.dampingRatio;
    sig[7 + 4 * i] = m.stiffnessNPerMm;
  });
  return sig;
}

/** FNV-1a over the bit patterns of the numbers (a hash only: entries are compared value by value). */
function hashSignature(sig: Float64Array): number {
  const words = new Uint32Array(sig.buffer, sig.byteOffset, sig.length * 2);
  let h = 0x811c9dc5;
  for (let i = 0; i < words.length; i++) {
    h ^= words[i]!;
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h;
}

function sameSignature(a: Float64Array, b: Float64Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) return false;
  return true;
}

type CachedGrid = FrfGrid & { signature: Float64Array };
const gridCache = new Map<number, CachedGrid[]>();
let gridCacheCount = 0;

/**
 * FRF grid for a set of modes, memoised (a shop re-checks many recipes on the same machine). The
 * cache key is the exact set of numbers the grid depends on, so a mode list edited in place never
 * hits a stale grid. At most 32 grids are kept.
 */
export function cachedFrfGrid(modes: readonly Mode[], loHz: number, hiHz: number, density: GridDensity): FrfGrid {
  const sig = gridSignature(modes, loHz, hiHz, density);
  const h = hashSignature(sig);
  const bucket = gridCache.get(h);
  if (bucket) for (const g of bucket) if (sameSignature(g.signature, sig)) return g;
  if (gridCacheCount >= 32) {
    gridCache.clear();
    gridCacheCount = 0;
  }
  const grid: CachedGrid = { ...frfOnGrid(modes, frequencyGrid(modes, loHz, hiHz, density)), signature: sig };
  if (bucket) bucket.push(grid);
  else gridCache.set(h, [grid]);
  gridCacheCount++;
  return grid;
}

// Branches per grid, keyed by the cut's parameters (numbers, so no float-to-text keys on the hot path).
const branchCache = new WeakMap<FrfGrid, Map<string, Map<number, Map<number, Branches>>>>();

/**
 * solveBranches memoised on the grid and the cut (with Kt = 1 the branches do not depend on the
 * chip): recipes of one machine share a handful of stepover ratios. `alpha` must be the directional
 * factors of (radialImmersion, radialForceRatio, millingDirection).
 */
export function cachedBranches(
  grid: FrfGrid,
  alpha: DirectionalFactors,
  cut: { radialImmersion: number; radialForceRatio: number; millingDirection: string },
  flutes: number,
  swapAxes: boolean,
): Branches {
  let byKind = branchCache.get(grid);
  if (!byKind) {
    byKind = new Map();
    branchCache.set(grid, byKind);
  }
  const kind = `${cut.millingDirection}${flutes}${swapAxes ? "y" : "x"}`;
  let byImmersion = byKind.get(kind);
  if (!byImmersion) {
    byImmersion = new Map();
    byKind.set(kind, byImmersion);
  }
  let byKr = byImmersion.get(cut.radialImmersion);
  if (!byKr) {
    if (byImmersion.size > 256) byImmersion.clear();
    byKr = new Map();
    byImmersion.set(cut.radialImmersion, byKr);
  }
  let br = byKr.get(cut.radialForceRatio);
  if (!br) {
    if (byKr.size > 64) byKr.clear();
    br = solveBranches(grid, alpha, flutes, 1, swapAxes);
    byKr.set(cut.radialForceRatio, br);
  }
  return br;
}

/** Eigenvalue branches of [α][Φ] on the grid, with the limiting depth and phase of each. */
export interface Branches {
  size: number;
  frequencyHz: Float64Array;
  /** Re λ, Im λ per branch */
  lr: [Float64Array, Float64Array];
  li: [Float64Array, Float64Array];
  /** a_lim [mm] per branch; ≤ 0 where the branch gives no boundary (Re λ ≤ 0) */
  a: [Float64Array, Float64Array];
  /** ε [rad] per branch */
  eps: [Float64Array, Float64Array];
  /** 2π / (N · Kt): a_lim = scale / Re λ */
  scale: number;
}

/** Eigenvalues of the 2×2 complex matrix [α][Φ] in closed form (quadratic formula). */
function eigen2(
  alpha: DirectionalFactors,
  xr: number,
  xi: number,
  yr: number,
  yi: number,
  out: Float64Array,
): void {
  const det = alpha.xx * alpha.yy - alpha.xy * alpha.yx;
  const a1r = alpha.xx * xr + alpha.yy * yr;
  const a1i = alpha.xx * xi + alpha.yy * yi;
  const pr = xr * yr - xi * yi;
  const pi = xr * yi + xi * yr;
  const dr = a1r * a1r - a1i * a1i - 4 * det * pr;
  const di = 2 * a1r * a1i - 4 * det * pi;
  const mod = Math.sqrt(dr * dr + di * di);
  const sr = Math.sqrt(Math.max(0, (mod + dr) / 2));
  let si = Math.sqrt(Math.max(0, (mod - dr) / 2));
  if (di < 0) si = -si;
  out[0] = (a1r + sr) / 2;
  out[1] = (a1i + si) / 2;
  out[2] = (a1r - sr) / 2;
  out[3] = (a1i - si) / 2;
}

/**
 * Solves both eigenvalue branches on the grid. `swapAxes` treats the grid's y receptance as the
 * feed direction (feeding along machine Y).
 */
export function solveBranches(grid: FrfGrid, alpha: DirectionalFactors, flutes: number, ktNPerMm2: number, swapAxes: boolean): Branches {
  const c = (2 * Math.PI) / (flutes * ktNPerMm2);
  const axx = alpha.xx;
  const ayy = alpha.yy;
  const det4 = 4 * (alpha.xx * alpha.yy - alpha.xy * alpha.yx);
  const fxr = swapAxes ? grid.yyRe : grid.xxRe;
  const fxi = swapAxes ? grid.yyIm : grid.xxIm;
  const fyr = swapAxes ? grid.xxRe : grid.yyRe;
  const fyi = swapAxes ? grid.xxIm : grid.yyIm;

  // Growable output.
  let capacity = grid.size + 64;
  let freq = new Float64Array(capacity);
  let lr0 = new Float64Array(capacity);
  let li0 = new Float64Array(capacity);
  let lr1 = new Float64Array(capacity);
  let li1 = new Float64Array(capacity);
  let ph0 = new Float64Array(capacity);
  let ph1 = new Float64Array(capacity);
  let n = 0;
  const grow = (): void => {
    capacity *= 2;
    const g = (a: Float64Array<ArrayBuffer>): Float64Array<ArrayBuffer> => {
      const b = new Float64Array(capacity);
      b.set(a);
      return b;
    };
    freq = g(freq);
    lr0 = g(lr0);
    li0 = g(li0);
    lr1 = g(lr1);
    li1 = g(li1);
    ph0 = g(ph0);
    ph1 = g(ph1);
  };

  // A point: frequency and the two eigenvalues, raw (quadratic-formula order) or tracked.
  interface Pt {
    f: number;
    ar: number;
    ai: number;
    br: number;
    bi: number;
    /** ε of each branch (0 where Re λ ≤ 0), set once the point is tracked */
    ea: number;
    eb: number;
    depth: number;
  }
  // Closed-form eigenvalues of [α][Φ] (see eigen2), inlined for speed; written into `out`.
  const eigInto = (out: Pt, f: number, xr: number, xi: number, yr: number, yi: number, depth: number): Pt => {
    const a1r = axx * xr + ayy * yr;
    const a1i = axx * xi + ayy * yi;
    const dr = a1r * a1r - a1i * a1i - det4 * (xr * yr - xi * yi);
    const di = 2 * a1r * a1i - det4 * (xr * yi + xi * yr);
    const mod = Math.sqrt(dr * dr + di * di);
    const sr = Math.sqrt(Math.max(0, (mod + dr) * 0.5));
    const si0 = Math.sqrt(Math.max(0, (mod - dr) * 0.5));
    const si = di < 0 ? -si0 : si0;
    out.f = f;
    out.ar = (a1r + sr) * 0.5;
    out.ai = (a1i + si) * 0.5;
    out.br = (a1r - sr) * 0.5;
    out.bi = (a1i - si) * 0.5;
    out.depth = depth;
    return out;
  };
  const newPt = (): Pt => ({ f: 0, ar: 0, ai: 0, br: 0, bi: 0, ea: 0, eb: 0, depth: 0 });
  const eig = (f: number, xr: number, xi: number, yr: number, yi: number, depth: number): Pt => eigInto(newPt(), f, xr, xi, yr, yi, depth);
  // Exact receptances between grid points, from the grid's own copy of the modes.
  const eigBetween = (f: number, depth: number): Pt => {
    let xr = 0;
    let xi = 0;
    let yr = 0;
    let yi = 0;
    for (const m of grid.modes) {
      const r = f / m.frequencyHz;
      const d = 1 - r * r;
      const e = 2 * m.dampingRatio * r;
      const k = 1 / (m.stiffnessNPerMm * (d * d + e * e));
      if ((m.direction === "x") !== swapAxes) {
        xr += d * k;
        xi -= e * k;
      } else {
        yr += d * k;
        yi -= e * k;
      }
    }
    return eig(f, xr, xi, yr, yi, depth);
  };
  // Order q's two eigenvalues to continue p's branches (the smaller total jump), then its phases.
  const track = (p: Pt, q: Pt): void => {
    const d0r = q.ar - p.ar;
    const d0i = q.ai - p.ai;
    const d1r = q.br - p.br;
    const d1i = q.bi - p.bi;
    const x0r = q.br - p.ar;
    const x0i = q.bi - p.ai;
    const x1r = q.ar - p.br;
    const x1i = q.ai - p.bi;
    if (x0r * x0r + x0i * x0i + x1r * x1r + x1i * x1i < d0r * d0r + d0i * d0i + d1r * d1r + d1i * d1i) {
      const tr = q.ar;
      const ti = q.ai;
      q.ar = q.br;
      q.ai = q.bi;
      q.br = tr;
      q.bi = ti;
    }
    q.ea = q.ar > 0 ? Math.PI + 2 * Math.atan(q.ai / q.ar) : 0;
    q.eb = q.br > 0 ? Math.PI + 2 * Math.atan(q.bi / q.br) : 0;
  };
  // A segment needs more points where a branch gains or loses a boundary (Re λ changes sign: the
  // boundary runs to infinity there and crossings hide next to it) or its phase turns fast.
  const MAX_DEPTH = 10;
  const TURN = 0.25;
  const needsSplit = (p: Pt, q: Pt): boolean => {
    if (q.depth >= MAX_DEPTH) return false;
    if (p.ar > 0 !== q.ar > 0 || p.br > 0 !== q.br > 0) return true;
    if (p.ar > 0 && Math.abs(q.ea - p.ea) > TURN) return true;
    if (p.br > 0 && Math.abs(q.eb - p.eb) > TURN) return true;
    return false;
  };
  const emit = (q: Pt): void => {
    if (n === capacity) grow();
    freq[n] = q.f;
    lr0[n] = q.ar;
    li0[n] = q.ai;
    lr1[n] = q.br;
    li1[n] = q.bi;
    ph0[n] = q.ea;
    ph1[n] = q.eb;
    n++;
  };

  let prev = eig(grid.frequencyHz[0]!, fxr[0]!, fxi[0]!, fyr[0]!, fyi[0]!, 0);
  prev.ea = prev.ar > 0 ? Math.PI + 2 * Math.atan(prev.ai / prev.ar) : 0;
  prev.eb = prev.br > 0 ? Math.PI + 2 * Math.atan(prev.bi / prev.br) : 0;
  emit(prev);
  const stack: Pt[] = [];
  // Two points alternate as "previous" and "current" in the common case: no allocation per grid point.
  let spare = newPt();
  for (let i = 1; i < grid.size; i++) {
    const q = eigInto(spare, grid.frequencyHz[i]!, fxr[i]!, fxi[i]!, fyr[i]!, fyi[i]!, 0);
    track(prev, q);
    if (!needsSplit(prev, q)) {
      emit(q);
      spare = prev;
      prev = q;
      continue;
    }
    stack.push({ ...q });
    while (stack.length > 0) {
      const top = stack[stack.length - 1]!;
      track(prev, top);
      if (needsSplit(prev, top)) {
        top.depth++;
        stack.push(eigBetween(0.5 * (prev.f + top.f), top.depth));
        continue;
      }
      stack.pop();
      emit(top);
      prev = top;
    }
  }

  const a0 = new Float64Array(n);
  const a1 = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const ar = lr0[i]!;
    const br = lr1[i]!;
    a0[i] = ar > 0 ? c / ar : -1;
    a1[i] = br > 0 ? c / br : -1;
  }
  return {
    size: n,
    frequencyHz: freq.slice(0, n),
    lr: [lr0.slice(0, n), lr1.slice(0, n)],
    li: [li0.slice(0, n), li1.slice(0, n)],
    a: [a0, a1],
    eps: [ph0.slice(0, n), ph1.slice(0, n)],
    scale: c,
  };
}

/** Where the boundary at one speed was found. */
export interface BoundaryHit {
  limitingDepthMm: number;
  chatterFrequencyHz: number;
  lobeIndex: number;
  branch: 0 | 1;
  segment: number;
  t: number;
}

/**
 * Lowest boundary crossing at one spindle speed: along each branch, g(f) = 60f/(N n) − ε/2π
 * passes through the integer k exactly where lobe k meets speed n.
 */
export function boundaryAtRpm(br: Branches, flutes: number, rpm: number, capMm = Number.MAX_VALUE): BoundaryHit | null {
  // Segments whose depths both exceed the cap cannot give an answer below it (the interpolated depth
  // is monotonic along a segment), so callers that only ask "is this depth stable?" pass a cap.
  const q = 60 / (flutes * rpm);
  const twoPi = 2 * Math.PI;
  let best: BoundaryHit | null = null;
  const f = br.frequencyHz;
  for (let b = 0 as 0 | 1; b <= 1; b = (b + 1) as 0 | 1) {
    const a = br.a[b];
    const lr = br.lr[b];
    const eps = br.eps[b];
    let prevValid = a[0]! > 0;
    let gPrev = q * f[0]! - eps[0]! / twoPi;
    for (let i = 1; i < br.size; i++) {
      const ai = a[i]!;
      const valid = ai > 0;
      if (valid && prevValid && ai > capMm && a[i - 1]! > capMm) {
        gPrev = q * f[i]! - eps[i]! / twoPi;
        continue;
      }
      const g = q * f[i]! - eps[i]! / twoPi;
      if (valid && prevValid) {
        const lo = Math.min(gPrev, g);
        const hi = Math.max(gPrev, g);
        const kLo = Math.max(0, Math.ceil(lo));
        for (let k = kLo; k <= hi; k++) {
          const t = g === gPrev ? 0 : (k - gPrev) / (g - gPrev);
          // Interpolate Re λ (smooth), not a_lim = scale / Re λ (steep where Re λ → 0).
          const depth = br.scale / (lr[i - 1]! + t * (lr[i]! - lr[i - 1]!));
          if (best === null || depth < best.limitingDepthMm) {
            best = {
              limitingDepthMm: depth,
              chatterFrequencyHz: f[i - 1]! + t * (f[i]! - f[i - 1]!),
              lobeIndex: k,
              branch: b,
              segment: i - 1,
              t,
            };
          }
        }
      }
      prevValid = valid;
      gPrev = g;
    }
    if (b === 1) break;
  }
  return best;
}

/** Lower envelope of all lobes on a uniform speed grid. NaN marks speeds with no boundary in the band. */
export interface Envelope {
  rpm: Float64Array;
  limitingDepthMm: Float64Array;
  chatterFrequencyHz: Float64Array;
  lobeIndex: Float64Array;
}

export function envelopeOverSpeeds(
  br: Branches,
  flutes: number,
  minRpm: number,
  maxRpm: number,
  count: number,
  maxLobes: number,
  capMm = Number.MAX_VALUE,
): Envelope {
  const rpm = new Float64Array(count);
  const depth = new Float64Array(count).fill(NaN);
  const fc = new Float64Array(count).fill(NaN);
  const lobe = new Float64Array(count).fill(NaN);
  const step = count > 1 ? (maxRpm - minRpm) / (count - 1) : 0;
  for (let j = 0; j < count; j++) rpm[j] = minRpm + step * j;
  const f = br.frequencyHz;
  const twoPi = 2 * Math.PI;
  const c = 60 / flutes;
  for (let b = 0; b <= 1; b++) {
    const a = br.a[b as 0 | 1];
    const lr = br.lr[b as 0 | 1];
    const eps = br.eps[b as 0 | 1];
    for (let i = 0; i + 1 < br.size; i++) {
      const a0 = a[i]!;
      const a1 = a[i + 1]!;
      if (!(a0 > 0 && a1 > 0) || (a0 > capMm && a1 > capMm)) continue;
      const l0 = lr[i]!;
      const l1 = lr[i + 1]!;
      const f0 = f[i]!;
      const f1 = f[i + 1]!;
      const e0 = eps[i]! / twoPi;
      const e1 = eps[i + 1]! / twoPi;
      // Lobes whose speeds n = 60 f / (N (k + ε/2π)) can fall inside [minRpm, maxRpm].
      const kLo = Math.max(0, Math.floor((c * f0) / maxRpm - 1));
      const kHi = Math.min(maxLobes - 1, Math.ceil((c * f1) / minRpm));
      for (let k = kLo; k <= kHi; k++) {
        const n0 = (c * f0) / (k + e0);
        const n1 = (c * f1) / (k + e1);
        const nLo = Math.min(n0, n1);
        const nHi = Math.max(n0, n1);
        if (nHi < minRpm || nLo > maxRpm) continue;
        let jLo: number;
        let jHi: number;
        if (step > 0) {
          jLo = Math.max(0, Math.ceil((nLo - minRpm) / step));
          jHi = Math.min(count - 1, Math.floor((nHi - minRpm) / step));
        } else {
          jLo = 0;
          jHi = nLo <= minRpm && minRpm <= nHi ? 0 : -1;
        }
        for (let j = jLo; j <= jHi; j++) {
          const t = n1 === n0 ? 0 : (rpm[j]! - n0) / (n1 - n0);
          const d = br.scale / (l0 + t * (l1 - l0));
          if (!(d >= depth[j]!)) {
            depth[j] = d;
            fc[j] = f0 + t * (f1 - f0);
            lobe[j] = k;
          }
        }
      }
    }
  }
  return { rpm, limitingDepthMm: depth, chatterFrequencyHz: fc, lobeIndex: lobe };
}

/** Exact eigenvalues of [α][Φ(f)] at one frequency (no grid). */
export function eigenvaluesAt(modes: readonly Mode[], alpha: DirectionalFactors, frequencyHz: number, swapAxes: boolean, out: Float64Array): void {
  let xr = 0;
  let xi = 0;
  let yr = 0;
  let yi = 0;
  for (const m of modes) {
    const r = frequencyHz / m.frequencyHz;
    const d = 1 - r * r;
    const e = 2 * m.dampingRatio * r;
    const s = 1 / (m.stiffnessNPerMm * (d * d + e * e));
    const inX = (m.direction === "x") !== swapAxes;
    if (inX) {
      xr += d * s;
      xi -= e * s;
    } else {
      yr += d * s;
      yi -= e * s;
    }
  }
  eigen2(alpha, xr, xi, yr, yi, out);
}

/**
 * Refines a grid crossing with exact evaluations: bisection on h(f) = 60f/(N n) − ε(f)/2π − k over
 * the bracketing grid segment, following the branch whose eigenvalue is nearest the grid's.
 */
export function refineHit(
  hit: BoundaryHit,
  br: Branches,
  modes: readonly Mode[],
  alpha: DirectionalFactors,
  flutes: number,
  ktNPerMm2: number,
  rpm: number,
  swapAxes: boolean,
): BoundaryHit {
  const i = hit.segment;
  const b = hit.branch;
  const f = br.frequencyHz;
  const q = 60 / (flutes * rpm);
  const c = (2 * Math.PI) / (flutes * ktNPerMm2);
  const ev = new Float64Array(4);
  const lrA = br.lr[b][i]!;
  const liA = br.li[b][i]!;
  const lrB = br.lr[b][i + 1]!;
  const liB = br.li[b][i + 1]!;
  const fA = f[i]!;
  const fB = f[i + 1]!;
  const evalAt = (freq: number): { h: number; a: number } | null => {
    eigenvaluesAt(modes, alpha, freq, swapAxes, ev);
    const t = (freq - fA) / (fB - fA);
    const gr = lrA + t * (lrB - lrA);
    const gi = liA + t * (liB - liA);
    const d0 = (ev[0]! - gr) ** 2 + (ev[1]! - gi) ** 2;
    const d1 = (ev[2]! - gr) ** 2 + (ev[3]! - gi) ** 2;
    const lr = d0 <= d1 ? ev[0]! : ev[2]!;
    const li = d0 <= d1 ? ev[1]! : ev[3]!;
    if (!(lr > 0)) return null;
    const eps = Math.PI + 2 * Math.atan(li / lr);
    return { h: q * freq - eps / (2 * Math.PI) - hit.lobeIndex, a: c / lr };
  };
  // Illinois (modified regula falsi) on the bracket: superlinear, and never leaves the bracket.
  let lo = fA;
  let hi = fB;
  const rLo = evalAt(lo);
  const rHi = evalAt(hi);
  if (!rLo || !rHi || rLo.h * rHi.h > 0) return hit;
  let hLo = rLo.h;
  let hHi = rHi.h;
  let best = Math.abs(hLo) < Math.abs(hHi) ? { f: lo, a: rLo.a } : { f: hi, a: rHi.a };
  let side = 0;
  for (let it = 0; it < 30; it++) {
    const f = hi - (hHi * (hi - lo)) / (hHi - hLo);
    const r = evalAt(f);
    if (!r) break;
    best = { f, a: r.a };
    if (Math.abs(r.h) < 1e-12 || hi - lo < 1e-10 * f) break;
    if (r.h * hHi > 0) {
      hi = f;
      hHi = r.h;
      if (side === 1) hLo /= 2;
      side = 1;
    } else {
      lo = f;
      hLo = r.h;
      if (side === -1) hHi /= 2;
      side = -1;
    }
  }
  return { ...hit, limitingDepthMm: best.a, chatterFrequencyHz: best.f };
}
