import { RECOMMEND_DEFAULTS, stabilityLobes, type Mode } from "@ringdown/machining";

/**
 * Stability-lobe curves for a machine, cutter and material as the planner sees them, the stable
 * pockets along them, and the tooth-passing harmonics that land on a mode or an avoided band.
 * Pure functions: the chart, the vibration page and the planner share them.
 */

type Axis = "x" | "y" | "z";

export interface MachineModeLike {
  direction: Axis;
  frequencyHz: number;
  dampingRatio: number;
  stiffnessNPerMm: number;
  note?: string;
}

export interface AvoidBandLike {
  minHz: number;
  maxHz: number;
  note?: string;
}

export interface LobeInput {
  modes: readonly MachineModeLike[];
  flutes: number;
  /** ae / D [-] */
  radialImmersion: number;
  /** Kt [N/mm²] (the engine's specific cutting force at the recipe's chip) */
  specificForceNPerMm2: number;
  /** Kr / Kt [-]; the engine's default when left out */
  radialForceRatio?: number;
  minRpm: number;
  maxRpm: number;
  millingDirection?: "climb" | "conventional";
  /** Speeds on the curve (default 600) */
  speeds?: number;
}

export interface LobeCurve {
  rpm: number[];
  /** Limiting depth [mm], the lower of feeding along X and along Y; null where no lobe reaches (no chatter predicted) */
  limitingDepthMm: Array<number | null>;
  /** Feed axis whose boundary is the lower one at each speed */
  feedAxis: Array<"x" | "y" | null>;
}

/**
 * Modes in the engine's frame for a feed along `feed`: "x" is the feed direction, "y" normal to it.
 * Modes along Z do not take part in this two-direction model (as in the engine's recommend()).
 */
export function modesForFeed(modes: readonly MachineModeLike[], feed: "x" | "y"): Mode[] {
  const out: Mode[] = [];
  for (const m of modes) {
    if (m.direction === "z") continue;
    const direction = feed === "x" ? m.direction : m.direction === "x" ? "y" : "x";
    out.push({ direction, frequencyHz: m.frequencyHz, dampingRatio: m.dampingRatio, stiffnessNPerMm: m.stiffnessNPerMm });
  }
  return out;
}

/**
 * The lobe envelope over the spindle's range: the engine's stabilityLobes (zero-order method) for a
 * feed along X and along Y, keeping the lower boundary at each speed, since a contour cut feeds in
 * every direction. Null when the machine has no X or Y mode or the range is a single speed.
 */
export function lobeEnvelope(input: LobeInput): LobeCurve | null {
  if (!(input.maxRpm > input.minRpm)) return null;
  const common = {
    flutes: input.flutes,
    radialImmersion: input.radialImmersion,
    specificForceNPerMm2: input.specificForceNPerMm2,
    radialForceRatio: input.radialForceRatio ?? RECOMMEND_DEFAULTS.radialForceRatio,
    minRpm: input.minRpm,
    maxRpm: input.maxRpm,
    millingDirection: input.millingDirection ?? "climb",
    speeds: input.speeds ?? 600,
  } as const;
  const alongX = modesForFeed(input.modes, "x");
  if (alongX.length === 0) return null;
  const x = stabilityLobes({ ...common, modes: alongX });
  const y = stabilityLobes({ ...common, modes: modesForFeed(input.modes, "y") });
  const curve: LobeCurve = { rpm: [], limitingDepthMm: [], feedAxis: [] };
  for (let i = 0; i < x.length; i++) {
    const a = x[i]!.limitingDepthMm;
    const b = y[i]!.limitingDepthMm;
    curve.rpm.push(x[i]!.rpm);
    if (a === null && b === null) {
      curve.limitingDepthMm.push(null);
      curve.feedAxis.push(null);
    } else if (b === null || (a !== null && a <= b)) {
      curve.limitingDepthMm.push(a);
      curve.feedAxis.push("x");
    } else {
      curve.limitingDepthMm.push(b);
      curve.feedAxis.push("y");
    }
  }
  return curve;
}

/**
 * Limiting depth at any speed inside the curve, by linear interpolation between its points [mm];
 * null (no boundary) only where both neighbours have none; the lower neighbour's value where one
 * of them has none (the cautious reading). Outside the curve: undefined.
 */
export function depthAt(curve: LobeCurve, rpm: number): number | null | undefined {
  const n = curve.rpm.length;
  if (n === 0 || rpm < curve.rpm[0]! - 1e-9 || rpm > curve.rpm[n - 1]! + 1e-9) return undefined;
  const hi = curve.rpm.findIndex((r) => r >= rpm);
  if (hi <= 0 || curve.rpm[hi] === rpm) return curve.limitingDepthMm[Math.max(0, hi)] ?? null;
  const lo = hi - 1;
  const a = curve.limitingDepthMm[lo] ?? null;
  const b = curve.limitingDepthMm[hi] ?? null;
  if (a === null) return b;
  if (b === null) return a;
  const t = (rpm - curve.rpm[lo]!) / (curve.rpm[hi]! - curve.rpm[lo]!);
  return a + (b - a) * t;
}

/** True when a depth is within the safety factor of the boundary at this speed (or there is none). */
export function isStableAt(curve: LobeCurve, rpm: number, depthMm: number, safetyFactor: number): boolean {
  const limit = depthAt(curve, rpm);
  if (limit === undefined) return false;
  return limit === null || depthMm <= safetyFactor * limit + 1e-12;
}

export interface StablePocket {
  /** Speed range in which the depth is stable [rpm] */
  minRpm: number;
  maxRpm: number;
  /** Speed of the deepest boundary in the pocket [rpm] */
  bestRpm: number;
  /** Deepest allowed depth in the pocket (safety factor applied) [mm]; null when no boundary is predicted there */
  maxAllowedDepthMm: number | null;
  /** Distance of the pocket from the given speed [rpm] (0 when inside) */
  distanceRpm: number;
}

/**
 * Speed ranges along the curve where `depthMm` stays below safetyFactor × the boundary, nearest to
 * `nearRpm` first. A pocket is a run of consecutive curve points that are all stable.
 */
export function stablePockets(curve: LobeCurve, depthMm: number, safetyFactor: number, nearRpm: number): StablePocket[] {
  const pockets: StablePocket[] = [];
  let start = -1;
  const close = (end: number) => {
    let best = start;
    let bestDepth: number | null = curve.limitingDepthMm[start] ?? null;
    for (let j = start; j <= end; j++) {
      const d = curve.limitingDepthMm[j] ?? null;
      if (d === null) {
        if (bestDepth !== null) {
          best = j;
          bestDepth = null;
        }
      } else if (bestDepth !== null && d > bestDepth) {
        best = j;
        bestDepth = d;
      }
    }
    const minRpm = curve.rpm[start]!;
    const maxRpm = curve.rpm[end]!;
    pockets.push({
      minRpm,
      maxRpm,
      bestRpm: curve.rpm[best]!,
      maxAllowedDepthMm: bestDepth === null ? null : safetyFactor * bestDepth,
      distanceRpm: nearRpm < minRpm ? minRpm - nearRpm : nearRpm > maxRpm ? nearRpm - maxRpm : 0,
    });
  };
  for (let j = 0; j < curve.rpm.length; j++) {
    const d = curve.limitingDepthMm[j] ?? null;
    const stable = d === null || depthMm <= safetyFactor * d + 1e-12;
    if (stable && start < 0) start = j;
    if (!stable && start >= 0) {
      close(j - 1);
      start = -1;
    }
  }
  if (start >= 0) close(curve.rpm.length - 1);
  return pockets.sort((a, b) => a.distanceRpm - b.distanceRpm || a.minRpm - b.minRpm);
}

export interface ResonanceHit {
  /** k: the k-th harmonic of the tooth-passing frequency (1 = the fundamental) */
  harmonic: number;
  /** k · z · n / 60 [Hz] */
  frequencyHz: number;
  kind: "mode" | "band";
  /** The mode's frequency, or the band's edges [Hz] */
  targetHz: number;
  bandMaxHz: number | null;
  /** Direction of the mode hit (modes only) */
  direction: Axis | null;
  /** |f − fn| / fn × 100 (modes only) [%] */
  offsetPct: number | null;
  label: string;
}

/**
 * Tooth-passing frequency f_tp = z · n / 60 and its harmonics k · f_tp (k = 1 … harmonics) that lie
 * within marginPct of a mode's natural frequency or inside an avoided band. The cutting force of a
 * milling cutter is periodic at f_tp with harmonics, so each of them can drive a mode it meets
 * (Schmitz & Smith, Machining Dynamics, 2009, ch. 4 — from memory).
 */
export function toothPassingHits(input: {
  rpm: number;
  flutes: number;
  modes: readonly MachineModeLike[];
  bands: readonly AvoidBandLike[];
  marginPct: number;
  harmonics?: number;
}): ResonanceHit[] {
  const { rpm, flutes, modes, bands, marginPct } = input;
  const harmonics = input.harmonics ?? 3;
  const hits: ResonanceHit[] = [];
  if (!(rpm > 0) || !(flutes > 0)) return hits;
  const ftp = (flutes * rpm) / 60;
  for (let k = 1; k <= harmonics; k++) {
    const f = k * ftp;
    for (const m of modes) {
      const offset = Math.abs(f - m.frequencyHz) / m.frequencyHz;
      if (offset < marginPct / 100) {
        hits.push({
          harmonic: k,
          frequencyHz: f,
          kind: "mode",
          targetHz: m.frequencyHz,
          bandMaxHz: null,
          direction: m.direction,
          offsetPct: offset * 100,
          label: m.note ?? "",
        });
      }
    }
    for (const b of bands) {
      if (f >= b.minHz && f <= b.maxHz) {
        hits.push({ harmonic: k, frequencyHz: f, kind: "band", targetHz: b.minHz, bandMaxHz: b.maxHz, direction: null, offsetPct: null, label: b.note ?? "" });
      }
    }
  }
  return hits;
}

export interface SpeedOffer {
  rpm: number;
  /** Boundary at that speed [mm] (null: none predicted) */
  limitingDepthMm: number | null;
  /** Dial setting label when the spindle has discrete speeds */
  dialLabel: string | null;
}

/**
 * The nearest speed within the spindle's range (or among its dial settings) at which the depth is
 * stable with a 1 % speed tolerance either side (router spindles slip under load), and no
 * tooth-passing harmonic up to `harmonics` meets a mode or an avoided band. Continuous speeds are
 * rounded to 10 rpm. Without a curve (no X/Y modes) only the harmonics are checked. Null when no
 * speed qualifies.
 */
export function nearestSafeSpeed(input: {
  currentRpm: number;
  curve: LobeCurve | null;
  depthMm: number;
  safetyFactor: number;
  flutes: number;
  modes: readonly MachineModeLike[];
  bands: readonly AvoidBandLike[];
  marginPct: number;
  harmonics?: number;
  dialSettings?: ReadonlyArray<{ label: string; rpm: number }>;
  minRpm: number;
  maxRpm: number;
}): SpeedOffer | null {
  const { curve } = input;
  const ok = (rpm: number) => {
    if (rpm < input.minRpm - 1e-9 || rpm > input.maxRpm + 1e-9) return false;
    if (curve) {
      for (const r of [rpm, Math.max(input.minRpm, rpm * 0.99), Math.min(input.maxRpm, rpm * 1.01)]) {
        if (!isStableAt(curve, r, input.depthMm, input.safetyFactor)) return false;
      }
    }
    return (
      toothPassingHits({ rpm, flutes: input.flutes, modes: input.modes, bands: input.bands, marginPct: input.marginPct, harmonics: input.harmonics ?? 3 })
        .length === 0
    );
  };
  const candidates: Array<{ rpm: number; label: string | null }> =
    input.dialSettings && input.dialSettings.length > 0
      ? input.dialSettings.map((d) => ({ rpm: d.rpm, label: d.label }))
      : evenSpeeds(input.minRpm, input.maxRpm, Math.min(2001, Math.max(2, Math.round((input.maxRpm - input.minRpm) / 10) + 1))).map((r) => ({
          rpm: Math.min(input.maxRpm, Math.max(input.minRpm, Math.round(r / 10) * 10)),
          label: null,
        }));
  let best: { rpm: number; label: string | null } | null = null;
  for (const c of candidates) {
    if (!ok(c.rpm)) continue;
    if (!best || Math.abs(c.rpm - input.currentRpm) < Math.abs(best.rpm - input.currentRpm)) best = c;
  }
  if (!best) return null;
  return { rpm: best.rpm, limitingDepthMm: curve ? (depthAt(curve, best.rpm) ?? null) : null, dialLabel: best.label };
}

function evenSpeeds(minRpm: number, maxRpm: number, count: number): number[] {
  if (!(maxRpm > minRpm)) return [minRpm];
  return Array.from({ length: count }, (_, i) => minRpm + ((maxRpm - minRpm) * i) / (count - 1));
}
