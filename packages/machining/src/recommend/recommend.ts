import { stiffnessMapLookup } from "../deflection/stiffness-map-lookup.js";
import { stiffnessOverRegion } from "../deflection/stiffness-over-region.js";
import { FLUTED_DIAMETER_RATIO, steppedToolDeflectionMm } from "../deflection/stepped-tool-deflection-mm.js";
import { directionalFactors } from "../dynamics/directional-factors.js";
import {
  boundaryAtRpm,
  cachedBranches,
  cachedFrfGrid,
  envelopeOverSpeeds,
  FAST_GRID,
  frequencyBandHz,
  refineHit,
  type Branches,
  type BoundaryHit,
} from "../dynamics/internal/stability-model.js";
import type { Mode } from "../dynamics/mode.js";
import { immersionAnglesRad } from "../forces/immersion-angles-rad.js";
import { millingForceCore } from "../forces/internal/milling-force-core.js";
import { interpolateTable, preparedTable } from "./interpolate-table.js";
import { OPERATION_RULES, type OperationRule } from "./operation-rules.js";
import { RecommendInputError } from "./recommend-input-error.js";
import { rimSpeedMaxRpm } from "./rim-speed-max-rpm.js";
import { SAFETY_NOTES } from "./safety-notes.js";
import type {
  DialSpeed,
  ExplainedField,
  Explanation,
  LimitCheck,
  LimitId,
  MachineAxis,
  NearestMode,
  RecommendInput,
  Recommendation,
  RecommendWarning,
  StabilityResult,
} from "./types.js";
import { validateRecommendInput } from "./validate-recommend-input.js";

/** Defaults recommend() applies when the input leaves a value out; each is reported when used. */
export const RECOMMEND_DEFAULTS = {
  /** Common practice, no published source: 0.001 in. */
  deflectionCeilingMm: 0.025,
  /** Ringdown default: keep f_tp 10 % away from every mode. */
  resonanceMargin: 0.1,
  /** Typical Fr/Ft of sharp tools, 0.2–0.5 (from memory). */
  radialForceRatio: 0.3,
  /** Ringdown default: use 80 % of the predicted stability boundary. */
  stabilitySafetyFactor: 0.8,
  /** Common practice, no published source. */
  rampAngleDeg: 3,
  /** Round values (from memory): WC-Co 530–630 GPa, HSS 200–220 GPa. */
  youngsModulusGPa: { carbide: 600, hss: 210 },
  /** Carbide edges are honed to roughly 0.01–0.05 mm (common practice); ground HSS edges are sharper. */
  edgeHoneMm: { carbide: 0.01, hss: 0.005 },
  /** Common practice, no published source: stick-out beyond 4×D (carbide) or 2×D (HSS) invites deflection and chatter. */
  stickoutRatio: { carbide: 4, hss: 2 },
  /** Ringdown default: warn when deflection changes the stepover by more than 20 %. */
  engagementSensitivity: 0.2,
  /** Ringdown default: reduce the chip load to no less than half before taking depth off. */
  chipFloorFraction: 0.5,
} as const;

/** Short number text for messages: 4 significant digits, thousands grouped (cheap: called often). */
const fmt = (v: number, digits = 4): string => {
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1000) {
    const r = String(Math.round(a));
    let out = "";
    for (let i = 0; i < r.length; i++) {
      if (i > 0 && (r.length - i) % 3 === 0) out += ",";
      out += r[i];
    }
    return v < 0 ? `-${out}` : out;
  }
  // Round to `digits` significant digits without toPrecision's string round trip.
  const scale = Math.pow(10, digits - 1 - Math.floor(Math.log10(a)));
  return String(Math.round(v * scale) / scale);
};

interface Context {
  input: RecommendInput;
  rule: OperationRule;
  d: number;
  z: number;
  ae: number;
  immersion: number;
  apRequested: number;
  startRad: number;
  exitRad: number;
  sinFactor: number;
  kienzle: { kc11: number; mc: number } | null;
  unitPower: number;
  kr: number;
  tir: number;
  hone: number;
  minChip: number;
  youngs: number;
  /** Cutter tip compliance (deflection per newton) [mm/N] */
  toolCompliance: number;
  /** Radius differences r_j − r_(j−m) of the runout model [mm], index j·z + (m−1) */
  runoutSteps: Float64Array;
  kMachine: number;
  kMachineNote: string;
  deflectionCeiling: number;
  feedCeiling: number;
  feedCeilingLabel: string;
  vcMin: number;
  vcMax: number;
  vcTarget: number;
  fzNominal: number;
  chipTableNote: string;
  rampAngleDeg: number;
  powerAt: (rpm: number) => number;
  safetyFactor: number;
  resonanceMargin: number;
  warnings: RecommendWarning[];
  assumptions: string[];
}

interface CutEval {
  rpm: number;
  fz: number;
  ap: number;
  deff: number;
  axialFactor: number;
  thinning: number;
  hMax: number;
  hMean: number;
  kt: number;
  runoutMax: number;
  runoutMin: number;
  loadFactor: number;
  feed: number;
  mrr: number;
  power: number;
  available: number;
  torque: number;
  force: number;
  toolDefl: number;
  machDefl: number;
  totalDefl: number;
  vc: number;
  ftp: number;
}

function effectiveDiameter(ctx: Context, ap: number): { deff: number; axialFactor: number } {
  const c = ctx.input.cutter;
  if (ctx.rule.axial || (c.shape !== "ball" && c.shape !== "bull")) return { deff: ctx.d, axialFactor: 1 };
  const r = c.shape === "ball" ? ctx.d / 2 : (c.cornerRadiusMm as number);
  if (ap >= r) return { deff: ctx.d, axialFactor: 1 };
  // Contact circle at the top of the cut; the chip thins by sin κ of the contact angle.
  const rise = r - ap;
  const sinKappa = Math.sqrt(1 - (rise / r) ** 2);
  return { deff: ctx.d - 2 * r + 2 * r * sinKappa, axialFactor: sinKappa };
}

/**
 * Largest and smallest per-flute feed with runout (same model as runoutChipLoadsMm:
 * h_j = max(0, min over m of m·fz + r_j − r_(j−m))), with the radius steps precomputed.
 */
function runoutExtremes(ctx: Context, fz: number): { max: number; min: number; loadFactor: number } {
  const z = ctx.z;
  if (ctx.tir === 0) return { max: fz, min: fz, loadFactor: 1 };
  let max = 0;
  let min = Number.MAX_VALUE;
  for (let j = 0; j < z; j++) {
    let h = Number.MAX_VALUE;
    for (let m = 1; m <= z; m++) {
      const v = m * fz + ctx.runoutSteps[j * z + m - 1]!;
      if (v < h) h = v;
    }
    if (h < 0) h = 0;
    if (h > max) max = h;
    if (h < min) min = h;
  }
  return { max, min, loadFactor: max / fz };
}

function evaluate(ctx: Context, rpm: number, fz: number, ap: number, withForce = true): CutEval {
  const { z, d } = ctx;
  const { deff, axialFactor } = effectiveDiameter(ctx, ap);
  const hMax = fz * ctx.sinFactor * axialFactor;
  // Mean chip over the engaged arc: h_m = fz (cos φst − cos φex) / (φex − φst).
  const hMean = ctx.rule.axial
    ? fz * axialFactor
    : ((fz * (Math.cos(ctx.startRad) - Math.cos(ctx.exitRad))) / (ctx.exitRad - ctx.startRad)) * axialFactor;
  const kt = ctx.kienzle ? ctx.kienzle.kc11 * Math.pow(hMean, -ctx.kienzle.mc) : ctx.unitPower;
  const ro = runoutExtremes(ctx, fz);
  const feed = fz * z * rpm;
  const mrr = ctx.rule.axial ? ((Math.PI * d * d) / 4) * feed : ap * ctx.ae * feed;
  // Kt [N/mm²] · Q [mm³/min] = N·mm/min; /60 000 gives W.
  const power = (kt * mrr) / 60000;
  const omega = (2 * Math.PI * rpm) / 60;
  const torque = power / omega;
  let force: number;
  let toolDefl = 0;
  let machDefl = 0;
  if (ctx.rule.axial) {
    // Tangential force per lip acting at D/4 (mean radius of a lip): T = z · F · D/4.
    force = torque / (z * (d / 4000));
  } else if (!withForce) {
    force = 0;
  } else {
    force = millingForceCore(z, ap, fz * ro.loadFactor * axialFactor, kt, ctx.kr, ctx.startRad, ctx.exitRad, false).peakResultantN;
    toolDefl = force * ctx.toolCompliance;
    machDefl = force / ctx.kMachine;
  }
  return {
    rpm,
    fz,
    ap,
    deff,
    axialFactor,
    thinning: 1 / (ctx.sinFactor * axialFactor),
    hMax,
    hMean,
    kt,
    runoutMax: ro.max * ctx.sinFactor * axialFactor,
    runoutMin: ro.min * ctx.sinFactor * axialFactor,
    loadFactor: ro.loadFactor,
    feed,
    mrr,
    power,
    available: ctx.powerAt(rpm),
    torque,
    force,
    toolDefl,
    machDefl,
    totalDefl: toolDefl + machDefl,
    vc: (Math.PI * deff * rpm) / 1000,
    ftp: (z * rpm) / 60,
  };
}

/**
 * Largest x in [lo, hi] with h(x) ≤ ceiling, for h increasing and positive (force, power and
 * deflection grow roughly as a power of chip load and depth). Secant steps in log–log space (exact
 * in one step for a pure power law), bisection every third step to guarantee progress. Returns
 * null when even h(lo) exceeds the ceiling; the result always satisfies h(x) ≤ ceiling.
 */
function largestFeasible(h: (x: number) => number, ceiling: number, lo: number, hi: number, hHi: number, exponentGuess = 1): number | null {
  let b = hi;
  let hb = hHi;
  if (hb <= ceiling) return b;
  // First try the power-law guess from the top; it usually lands within a fraction of a percent.
  const guess = hi * Math.pow(ceiling / hHi, 1 / exponentGuess);
  if (guess > lo && guess < hi) {
    const hg = h(guess);
    if (hg <= ceiling) {
      if (ceiling - hg <= 1e-3 * ceiling) return guess;
      lo = guess;
    } else {
      b = guess;
      hb = hg;
    }
  }
  let a = lo;
  let ha = h(a);
  if (ha > ceiling) return null;
  for (let i = 0; i < 40; i++) {
    let x: number;
    const p = Math.log(hb / ha) / Math.log(b / a);
    if (i % 3 !== 2 && p > 0 && Number.isFinite(p) && ha > 0) x = a * Math.pow(ceiling / ha, 1 / p);
    else x = Math.sqrt(a * b);
    if (!(x > a && x < b)) x = Math.sqrt(a * b);
    const hx = h(x);
    if (hx <= ceiling) {
      a = x;
      ha = hx;
      if (ceiling - hx <= 1e-5 * ceiling) break;
    } else {
      b = x;
      hb = hx;
    }
    if (b - a <= 1e-6 * b) break;
  }
  return a;
}

interface StabilityCtx {
  axes: ("x" | "y")[];
  branches: Branches[];
  modes: Mode[];
  alpha: ReturnType<typeof directionalFactors>;
}

function buildStability(ctx: Context, rpmLo: number, rpmHi: number): StabilityCtx | null {
  if (ctx.rule.axial) return null;
  const modes: Mode[] = [];
  for (const m of ctx.input.machine.modes) {
    if (m.direction === "x" || m.direction === "y") {
      modes.push({ direction: m.direction, frequencyHz: m.frequencyHz, dampingRatio: m.dampingRatio, stiffnessNPerMm: m.stiffnessNPerMm });
    }
  }
  if (modes.length === 0) return null;
  const alpha = directionalFactors({
    radialImmersion: ctx.immersion,
    radialForceRatio: ctx.kr,
    millingDirection: ctx.input.millingDirection ?? "climb",
  });
  const band = frequencyBandHz(modes, ctx.z, rpmLo, rpmHi);
  const grid = cachedFrfGrid(modes, band.loHz, band.hiHz, FAST_GRID);
  const feedAxis = ctx.input.feedAxis ?? "any";
  const axes: ("x" | "y")[] = feedAxis === "any" ? ["x", "y"] : [feedAxis];
  const cut = { radialImmersion: ctx.immersion, radialForceRatio: ctx.kr, millingDirection: ctx.input.millingDirection ?? "climb" };
  // Kt = 1: every depth found is divided by the actual Kt (a_lim ∝ 1/Kt; the phases do not depend on it).
  const branches = axes.map((ax) => cachedBranches(grid, alpha, cut, ctx.z, ax === "y"));
  return { axes, branches, modes, alpha };
}

interface Limit {
  depth: number;
  fc: number;
  axis: "x" | "y";
  /** Grid crossing per orientation (for refining later without a new search) */
  hits?: (BoundaryHit | null)[];
}

function limitAt(st: StabilityCtx, ctx: Context, rpm: number, kt: number, refine: boolean, capMm = Number.MAX_VALUE): Limit | null {
  // Branch depths are for Kt = 1: the cap scales the same way.
  const hits = st.branches.map((br) => boundaryAtRpm(br, ctx.z, rpm, capMm * kt));
  return limitFromHits(st, ctx, rpm, kt, refine, hits);
}

/** The lowest of the orientations' crossings, refined when asked (the lowest, and any within 5 %). */
function limitFromHits(st: StabilityCtx, ctx: Context, rpm: number, kt: number, refine: boolean, hits: (BoundaryHit | null)[]): Limit | null {
  let lowest = Number.MAX_VALUE;
  for (const h of hits) if (h && h.limitingDepthMm < lowest) lowest = h.limitingDepthMm;
  let best: Limit | null = null;
  hits.forEach((h, i) => {
    if (!h) return;
    // Refine the lowest orientation, and any other within 5 % of it on the grid.
    const hit = refine && h.limitingDepthMm <= 1.05 * lowest ? refineHit(h, st.branches[i]!, st.modes, st.alpha, ctx.z, 1, rpm, st.axes[i] === "y") : h;
    const depth = hit.limitingDepthMm / kt;
    if (!best || depth < best.depth) best = { depth, fc: hit.chatterFrequencyHz, axis: st.axes[i]!, hits };
  });
  return best;
}

function buildContext(input: RecommendInput): Context {
  const { cutter, material, machine } = input;
  const rule = OPERATION_RULES[input.operation];
  const warnings: RecommendWarning[] = [];
  const assumptions: string[] = [];
  const d = cutter.diameterMm;
  const z = cutter.flutes;
  const ae = rule.fullWidth || rule.axial ? d : (input.engagement.radialDepthMm as number);
  const immersion = Math.min(1, ae / d);
  const dir = input.millingDirection ?? "climb";
  const angles = rule.axial ? { startRad: 0, exitRad: Math.PI } : immersionAnglesRad({ radialImmersion: immersion, millingDirection: dir });
  const sinFactor = rule.axial || immersion >= 0.5 ? 1 : 2 * Math.sqrt(immersion - immersion * immersion);
  const kienzle =
    material.kc11NPerMm2 !== undefined && material.kc11NPerMm2 !== null && material.mc !== undefined && material.mc !== null
      ? { kc11: material.kc11NPerMm2, mc: material.mc }
      : null;
  // Unit power u [J/mm³] equals the specific cutting force divided by 1000 (1 N/mm² = 1 mJ/mm³).
  const unitPower = (material.unitPowerJPerMm3 ?? 0) * 1000;
  const kr = material.radialForceRatio ?? RECOMMEND_DEFAULTS.radialForceRatio;
  if (material.radialForceRatio === undefined || material.radialForceRatio === null) {
    assumptions.push(`radial/tangential force ratio ${kr} (typical 0.2–0.5)`);
  }
  const tir = cutter.runoutTirMm ?? 0;
  if (cutter.runoutTirMm === undefined || cutter.runoutTirMm === null) assumptions.push("runout 0 mm (not measured; a dial-indicator reading of the mounted cutter makes the chip and load checks real)");
  const hone = cutter.edgeHoneMm ?? RECOMMEND_DEFAULTS.edgeHoneMm[cutter.toolMaterial];
  if (cutter.edgeHoneMm === undefined || cutter.edgeHoneMm === null) assumptions.push(`edge hone ${hone} mm (${cutter.toolMaterial} default)`);
  const youngs = cutter.youngsModulusGPa ?? RECOMMEND_DEFAULTS.youngsModulusGPa[cutter.toolMaterial];
  if (cutter.youngsModulusGPa === undefined || cutter.youngsModulusGPa === null) assumptions.push(`Young's modulus ${youngs} GPa (${cutter.toolMaterial} default)`);
  const minChip = Math.max(material.minChipThicknessMm ?? 0, hone);
  const toolCompliance = steppedToolDeflectionMm({
    forceN: 1,
    stickoutMm: cutter.stickoutMm,
    fluteLengthMm: cutter.fluteLengthMm,
    fluteDiameterMm: FLUTED_DIAMETER_RATIO * d,
    shankDiameterMm: cutter.shankDiameterMm,
    youngsModulusGPa: youngs,
  });
  // Runout: cutting edges on radii r_j = e·sin(2πj/z + π/z), e = TIR/2 (worst phase; see runoutChipLoadsMm).
  const runoutSteps = new Float64Array(z * z);
  const radius = (j: number): number => (tir / 2) * Math.sin((2 * Math.PI * (((j % z) + z) % z) + Math.PI) / z);
  for (let j = 0; j < z; j++) for (let m = 1; m <= z; m++) runoutSteps[j * z + m - 1] = radius(j) - radius(j - m);

  // Machine stiffness at the work position.
  let kx = machine.stiffnessNPerMm.x;
  let ky = machine.stiffnessNPerMm.y;
  let kMachineNote = "per-axis stiffness";
  const map = machine.stiffnessMap ?? [];
  const region = input.workRegion;
  if (map.length > 0 && region) {
    const notes: string[] = [];
    for (const ax of ["x", "y"] as const) {
      if (!map.some((p) => p.direction === ax)) continue;
      const worst = stiffnessOverRegion({ points: map, direction: ax, region });
      if (ax === "x") kx = worst.worstNPerMm;
      else ky = worst.worstNPerMm;
      notes.push(`${ax.toUpperCase()} ${fmt(worst.worstNPerMm)} N/mm at (${fmt(worst.at.xMm)}, ${fmt(worst.at.yMm)}) mm`);
      if (worst.outsideMeasuredArea) {
        warnings.push({
          id: "outside-stiffness-map",
          severity: "caution",
          message: `Part of the work region X ${fmt(region.xMinMm)}–${fmt(region.xMaxMm)} mm, Y ${fmt(region.yMinMm)}–${fmt(region.yMaxMm)} mm lies outside the area where ${ax.toUpperCase()} stiffness was measured; the nearest edge value is used there. Measure there for a real figure.`,
        });
      }
    }
    kMachineNote = `worst case of the stiffness map over X ${fmt(region.xMinMm)}–${fmt(region.xMaxMm)} mm, Y ${fmt(region.yMinMm)}–${fmt(region.yMaxMm)} mm: ${notes.join(", ")}`;
  } else if (map.length > 0) {
    const pos = input.workPosition;
    if (!pos) {
      assumptions.push("no work position given: the stiffness map was not used, the per-axis stiffness was");
    } else {
      const notes: string[] = [];
      for (const ax of ["x", "y"] as const) {
        if (!map.some((p) => p.direction === ax)) continue;
        const look = stiffnessMapLookup({ points: map, xMm: pos.xMm, yMm: pos.yMm, direction: ax });
        if (ax === "x") kx = look.stiffnessNPerMm;
        else ky = look.stiffnessNPerMm;
        notes.push(`${ax.toUpperCase()} ${fmt(look.stiffnessNPerMm)} N/mm (${look.method})`);
        if (look.outsideMeasuredArea) {
          warnings.push({
            id: "outside-stiffness-map",
            severity: "caution",
            message: `The work position (${fmt(pos.xMm)}, ${fmt(pos.yMm)}) mm lies outside the area where ${ax.toUpperCase()} stiffness was measured; the nearest edge value is used. Measure there for a real figure.`,
          });
        }
      }
      kMachineNote = `stiffness map at (${fmt(pos.xMm)}, ${fmt(pos.yMm)}) mm: ${notes.join(", ")}`;
    }
  }
  const kMachine = Math.min(kx, ky);

  const feedAxis = input.feedAxis ?? "any";
  const mf = machine.maxFeedMmPerMin;
  let feedCeiling: number;
  let feedCeilingLabel: string;
  const rampAngleDeg = input.engagement.rampAngleDeg ?? RECOMMEND_DEFAULTS.rampAngleDeg;
  const xy = feedAxis === "any" ? Math.min(mf.x, mf.y) : mf[feedAxis];
  const xyLabel = feedAxis === "any" ? "slower of X and Y" : `${feedAxis.toUpperCase()} axis`;
  if (rule.axial) {
    feedCeiling = mf.z;
    feedCeilingLabel = "Z axis";
  } else if (input.operation === "ramp") {
    const t = (rampAngleDeg * Math.PI) / 180;
    feedCeiling = Math.min(xy / Math.cos(t), mf.z / Math.sin(t));
    feedCeilingLabel = `ramp at ${fmt(rampAngleDeg)}° (${xyLabel} and Z)`;
    if (input.engagement.rampAngleDeg === undefined) assumptions.push(`ramp angle ${rampAngleDeg}°`);
  } else {
    feedCeiling = xy;
    feedCeilingLabel = xyLabel;
  }

  const range = material.cuttingSpeedMPerMin[cutter.toolMaterial]!;
  const vcTarget = input.preferences?.cuttingSpeedMPerMin ?? (range.minMPerMin + range.maxMPerMin) / 2;

  let fzNominal: number;
  let chipTableNote: string;
  if (input.preferences?.chipLoadMm !== undefined) {
    fzNominal = input.preferences.chipLoadMm;
    chipTableNote = "chip load chosen by the programmer";
  } else {
    const look = interpolateTable(
      material.chipLoad.map((p) => ({ x: p.diameterMm, y: p.chipLoadMm })),
      d,
    );
    fzNominal = look.value * rule.chipFactor;
    chipTableNote =
      `material table at Ø${fmt(d)} mm: ${fmt(look.value)} mm` + (rule.chipFactor !== 1 ? ` × ${rule.chipFactor} for ${rule.label} (common practice, no published source)` : "");
    if (look.outside) {
      warnings.push({
        id: "chip-table-extrapolated",
        severity: "caution",
        message: `The material's chip-load table does not reach Ø${fmt(d)} mm; its nearest entry (${fmt(look.value)} mm) is used. Add a row for this diameter.`,
      });
    }
  }

  const curve = machine.spindle.powerCurve;
  const powerAt =
    curve && curve.length > 0
      ? preparedTable(curve.map((p) => ({ x: p.rpm, y: p.powerW })))
      : (): number => machine.spindle.ratedPowerW;

  const safetyFactor = input.preferences?.stabilitySafetyFactor ?? RECOMMEND_DEFAULTS.stabilitySafetyFactor;
  const resonanceMargin = machine.resonanceMargin ?? RECOMMEND_DEFAULTS.resonanceMargin;
  let deflectionCeiling = machine.deflectionCeilingMm ?? RECOMMEND_DEFAULTS.deflectionCeilingMm;
  if (!Number.isFinite(deflectionCeiling)) deflectionCeiling = RECOMMEND_DEFAULTS.deflectionCeilingMm;

  return {
    input,
    rule,
    d,
    z,
    ae,
    immersion,
    apRequested: input.engagement.axialDepthMm,
    startRad: angles.startRad,
    exitRad: angles.exitRad,
    sinFactor,
    kienzle,
    unitPower,
    kr,
    tir,
    hone,
    minChip,
    youngs,
    toolCompliance,
    runoutSteps,
    kMachine,
    kMachineNote,
    deflectionCeiling,
    feedCeiling,
    feedCeilingLabel,
    vcMin: range.minMPerMin,
    vcMax: range.maxMPerMin,
    vcTarget,
    fzNominal,
    chipTableNote,
    rampAngleDeg,
    powerAt,
    safetyFactor,
    resonanceMargin,
    warnings,
    assumptions,
  };
}

interface SpeedCeiling {
  id: LimitId;
  label: string;
  rpm: number;
}

interface Forbidden {
  lo: number;
  hi: number;
  kind: "resonance" | "avoid-band";
  /** Plain-language name, built only when a message needs it */
  text: () => string;
}

function forbiddenIntervals(ctx: Context): Forbidden[] {
  const out: Forbidden[] = [];
  const toRpm = (hz: number): number => (60 * hz) / ctx.z;
  const m = ctx.resonanceMargin;
  if (m > 0) {
    for (const mode of ctx.input.machine.modes) {
      out.push({
        lo: toRpm(mode.frequencyHz * (1 - m)),
        hi: toRpm(mode.frequencyHz * (1 + m)),
        kind: "resonance",
        text: () => `the ${fmt(mode.frequencyHz)} Hz ${mode.direction.toUpperCase()} mode${mode.label ? ` (${mode.label})` : ""}`,
      });
    }
  }
  for (const b of ctx.input.machine.avoidBands ?? []) {
    out.push({ lo: toRpm(b.minHz), hi: toRpm(b.maxHz), kind: "avoid-band", text: () => `the avoided band ${fmt(b.minHz)}–${fmt(b.maxHz)} Hz${b.label ? ` (${b.label})` : ""}` });
  }
  return out;
}

/**
 * Computes a feeds-and-speeds recipe for a cutter, material, machine, operation and engagement,
 * checks it against every ceiling of that machine, reduces or moves it until the ceilings hold,
 * and explains every number.
 *
 * Order of work:
 *  1. Speed target: n = 1000·vc/(π·D_eff) at the middle of the material's speed range (or the
 *     preferred speed), capped by the spindle, the cutter maker's maximum and the rim-speed rule for
 *     large bits, raised to the spindle minimum.
 *  2. Chip: nominal chip load from the material table (× operation factor), raised by the radial
 *     chip-thinning factor 1/sin φe (and the ball/bull contact factor) so the maximum chip equals it.
 *     Deflection does not depend on speed, so it is settled first: chip reduced to no less than half
 *     (and never into rubbing), then depth.
 *  3. Speed choice: if at the target the tooth-passing frequency is within the resonance margin of a
 *     mode or in an avoided band, the depth is predicted to chatter (ZOA, X/Y modes, both feed axes
 *     unless given), or the feed, power or speed range is not met, the nearest speed that meets them
 *     is chosen (interval edges, then the lobe envelope); failing that, the speed that removes the
 *     most material once the depth is reduced. With dial speeds only the dial settings are candidates.
 *  4. Ceilings at that speed: feed (chip reduced), power (chip, then depth), stability (depth reduced
 *     to safety factor × the refined boundary).
 *  5. Checks: rubbing (least-loaded flute's chip vs max(material minimum, edge hone)), runout,
 *     stick-out, rim speed, climb milling with backlash, deflection-sensitive engagement, any limit
 *     that could not be held.
 *
 * Models: Kienzle force at the mean chip thickness (or unit power), linear mechanistic milling forces
 * (straight teeth, worst flute with runout), stepped-cantilever cutter on the softer machine axis,
 * zero-order (Altintas–Budak) stability with the measured X/Y modes; see docs/formulas.md.
 *
 * @param input see RecommendInput (all lengths mm, speeds rpm or m/min, feeds mm/min, forces N, power W)
 * @returns the recipe, limits, warnings and an explanation per number
 * @throws RecommendInputError listing every impossible field (never returns NaN or Infinity)
 */
export function recommend(input: RecommendInput): Recommendation {
  validateRecommendInput(input);
  const ctx = buildContext(input);
  const { cutter, machine } = input;
  const rule = ctx.rule;
  const z = ctx.z;
  const binding = new Set<LimitId>();
  const adjustments: string[] = [];

  // ---- 1. Speed ceilings -------------------------------------------------------------------
  const ceilings: SpeedCeiling[] = [{ id: "spindle-max-speed", label: "Spindle maximum speed", rpm: machine.spindle.maxRpm }];
  if (cutter.maxRpm !== undefined && cutter.maxRpm !== null) ceilings.push({ id: "cutter-max-speed", label: "Cutter maker's maximum speed", rpm: cutter.maxRpm });
  const rim = rimSpeedMaxRpm({ diameterMm: ctx.d });
  if (rim !== null) ceilings.push({ id: "rim-speed", label: "Rim-speed limit for this bit diameter", rpm: rim });
  const rpmHi = Math.min(...ceilings.map((c) => c.rpm));
  const rpmLo = machine.spindle.minRpm;
  if (rpmHi < rpmLo) {
    const low = ceilings.reduce((a, b) => (b.rpm < a.rpm ? b : a));
    const field = low.id === "cutter-max-speed" ? "cutter.maxRpm" : low.id === "rim-speed" ? "cutter.diameterMm" : "machine.spindle.maxRpm";
    throw new RecommendInputError({
      [field]: `${low.label} (${fmt(low.rpm)} rpm) is below the spindle's minimum speed (${fmt(rpmLo)} rpm): this cutter cannot run on this spindle`,
    });
  }
  const deffNominal = effectiveDiameter(ctx, ctx.apRequested).deff;
  const rpmTarget = (1000 * ctx.vcTarget) / (Math.PI * deffNominal);
  let n0 = rpmTarget;
  if (rpmTarget > rpmHi) {
    n0 = rpmHi;
    const active = ceilings.filter((c) => c.rpm === rpmHi);
    for (const c of active) binding.add(c.id);
    adjustments.push(`Speed capped at ${fmt(rpmHi)} rpm by the ${active.map((c) => c.label.toLowerCase()).join(" and ")} (the material's speed asks for ${fmt(rpmTarget)} rpm).`);
  } else if (rpmTarget < rpmLo) {
    n0 = rpmLo;
    binding.add("spindle-min-speed");
    adjustments.push(`Speed raised to the spindle's minimum ${fmt(rpmLo)} rpm (the material's speed asks for ${fmt(rpmTarget)} rpm).`);
  }
  const dials = machine.spindle.dialSpeeds;
  let dialCandidates: DialSpeed[] | null = null;
  if (dials && dials.length > 0) {
    dialCandidates = dials.filter((dl) => dl.rpm <= rpmHi * (1 + 1e-9));
    if (dialCandidates.length === 0) {
      throw new RecommendInputError({ "machine.spindle.dialSpeeds": `no dial setting is at or below ${fmt(rpmHi)} rpm, the highest speed this cutter may run` });
    }
  }

  // ---- 2. Chip, and the ceiling that does not depend on speed (deflection) ------------------
  const axialFactor0 = effectiveDiameter(ctx, ctx.apRequested).axialFactor;
  const fz0 = ctx.fzNominal / (ctx.sinFactor * axialFactor0);
  const ap0 = ctx.apRequested;
  let fz = fz0;
  let ap = ap0;
  // Lowest chip load the power and deflection reductions may reach: half the nominal (Ringdown
  // default), and never so low that the least-loaded flute (runout) would rub.
  const runoutShare = ctx.tir * Math.sin(Math.PI / z);
  const floorFz = Math.min(fz0, Math.max(RECOMMEND_DEFAULTS.chipFloorFraction * fz0, (1.1 * ctx.minChip) / (ctx.sinFactor * axialFactor0) + runoutShare));
  let ev = evaluate(ctx, n0, fz, ap);
  const reduceFor = (rpmAt: number, id: LimitId, label: string, measure: (e: CutEval) => number, ceiling: number, withForce: boolean): void => {
    const now = measure(ev);
    if (now <= ceiling) return;
    binding.add(id);
    const fzBefore = fz;
    const apBefore = ap;
    const lowest = Math.min(floorFz, fz);
    // Force and power grow as fz^(1 − mc) (Kienzle) and in proportion to the depth.
    const x = largestFeasible((v) => measure(evaluate(ctx, rpmAt, v, ap, withForce)), ceiling, lowest, fz, now, ctx.kienzle ? 1 - ctx.kienzle.mc : 1);
    if (x !== null) {
      fz = x;
      adjustments.push(`Feed per tooth reduced from ${fmt(fzBefore)} to ${fmt(fz)} mm to respect the ${label}.`);
    } else {
      fz = lowest;
      const y = largestFeasible((v) => measure(evaluate(ctx, rpmAt, fz, v, withForce)), ceiling, 1e-6 * ap0, ap, measure(evaluate(ctx, rpmAt, fz, ap, withForce)), 1);
      ap = y ?? 1e-6 * ap0;
      adjustments.push(
        (fz < fzBefore ? `Feed per tooth reduced from ${fmt(fzBefore)} to ${fmt(fz)} mm (the lowest this recipe allows) and a` : "A") +
          `xial depth reduced from ${fmt(apBefore)} to ${fmt(ap)} mm to respect the ${label}; take more, shallower passes.`,
      );
    }
    ev = evaluate(ctx, rpmAt, fz, ap);
  };
  // Force, and so deflection, does not depend on speed: settle it before choosing the speed.
  if (!rule.axial) {
    reduceFor(n0, "deflection", `deflection ceiling (${fmt(ctx.deflectionCeiling)} mm)`, (e) => e.totalDefl, ctx.deflectionCeiling, true);
  }
  const kt1 = ev.kt;

  // ---- 3. Speed choice against resonance, avoided bands, stability, feed, power and speed range
  const stab = buildStability(ctx, Math.min(rpmLo, ...(dialCandidates ?? []).map((dl) => dl.rpm)), rpmHi);
  const forbidden = forbiddenIntervals(ctx);
  const sf = ctx.safetyFactor;
  interface Flags {
    rpm: number;
    resonance: boolean;
    band: boolean;
    feed: boolean;
    power: boolean;
    vc: boolean;
    stable: boolean;
    aLim: number | null;
    /** The capped boundary search at this speed, when one was made */
    limit?: Limit | null;
  }
  const vcAt = (n: number): number => (Math.PI * deffNominal * n) / 1000;
  const mrrAt = (n: number): number => (rule.axial ? ((Math.PI * ctx.d * ctx.d) / 4) * fz * z * n : ap * ctx.ae * fz * z * n);
  // Speeds inside the material's range; when the spindle cannot reach it at all the flag is moot.
  const nVcLo = (1000 * ctx.vcMin) / (Math.PI * deffNominal);
  const nVcHi = (1000 * ctx.vcMax) / (Math.PI * deffNominal);
  const vcReachable = nVcHi >= rpmLo * (1 - 1e-9) && nVcLo <= rpmHi * (1 + 1e-9);
  // Depths beyond this are "stable enough": the speed search only needs the boundary below it.
  const capMm = (1.5 * ap) / sf;
  const flagsAt = (n: number, aLim?: number | null): Flags => {
    let resonance = true;
    let band = true;
    for (const f of forbidden) {
      if (n > f.lo && n < f.hi) {
        if (f.kind === "resonance") resonance = false;
        else band = false;
      }
    }
    const vc = vcAt(n);
    const found = aLim === undefined && stab ? limitAt(stab, ctx, n, kt1, false, capMm) : undefined;
    const lim = aLim !== undefined ? aLim : (found?.depth ?? null);
    return {
      limit: found,
      rpm: n,
      resonance,
      band,
      feed: fz * z * n <= ctx.feedCeiling * (1 + 1e-12),
      power: (kt1 * mrrAt(n)) / 60000 <= ctx.powerAt(n) * (1 + 1e-12),
      vc: !vcReachable || (vc >= ctx.vcMin * (1 - 1e-9) && vc <= ctx.vcMax * (1 + 1e-9)),
      stable: lim === null || ap <= sf * lim,
      aLim: lim,
    };
  };
  const allOk = (f: Flags): boolean => f.resonance && f.band && f.feed && f.power && f.vc && f.stable;
  const dist = (n: number): number => Math.abs(Math.log(n / n0));
  // Where the depth must come down anyway, prefer the speed that removes the most material:
  // removal ∝ min(feed, feed ceiling) × min(depth, safety factor × boundary).
  const removal = (f: Flags): number => Math.min(fz * z * f.rpm, ctx.feedCeiling) * Math.min(ap, f.aLim === null ? ap : sf * f.aLim);
  // Preference tiers, best first: everything holds; clear of modes/bands, stable and in the speed
  // range (feed and power then come from the chip); clear and in range (depth comes down: most
  // removal); clear and stable; clear (most removal); anything (nearest).
  const pick = (candidates: Flags[]): Flags => {
    const best: (Flags | null)[] = [null, null, null, null, null, null];
    for (const f of candidates) {
      const clear = f.resonance && f.band;
      for (let t = 0; t < 6; t++) {
        const inTier =
          t === 0 ? allOk(f) : t === 1 ? clear && f.stable && f.vc : t === 2 ? clear && f.vc : t === 3 ? clear && f.stable : t === 4 ? clear : true;
        if (!inTier) continue;
        const b = best[t] ?? null;
        if (b === null) best[t] = f;
        else if (t === 2 || t === 4) {
          const rf = removal(f);
          const rb = removal(b);
          if (rf > rb * (1 + 1e-9) || (Math.abs(rf - rb) <= 1e-9 * rb && dist(f.rpm) < dist(b.rpm))) best[t] = f;
        } else if (dist(f.rpm) < dist(b.rpm)) best[t] = f;
      }
    }
    return (best.find((b) => b !== null) ?? candidates[0])!;
  };

  let chosen: Flags;
  let dial: DialSpeed | null = null;
  // The cheap checks first; the chatter boundary at the target only when they pass.
  const cheapOk = (f: Flags): boolean => f.resonance && f.band && f.feed && f.power && f.vc;
  const startCheap = dialCandidates ? null : flagsAt(n0, null);
  const startFlags = startCheap && cheapOk(startCheap) ? flagsAt(n0) : null;
  if (startFlags && allOk(startFlags)) {
    chosen = startFlags;
  } else if (dialCandidates) {
    chosen = pick(dialCandidates.map((dl) => flagsAt(dl.rpm)));
  } else {
    // Without the chatter boundary the allowed speeds are intervals (speed range, feed, power,
    // modes, bands), so the nearest allowed speed is the asked one or an interval edge.
    const edges: number[] = [n0, rpmLo, rpmHi, nVcLo, nVcHi, ctx.feedCeiling / (fz * z)];
    for (const f of forbidden) edges.push(f.lo * (1 - 1e-6), f.hi * (1 + 1e-6));
    const c = (kt1 * mrrAt(1)) / 60000; // cutting power per rpm [W/rpm]
    const curve = machine.spindle.powerCurve;
    if (curve && curve.length > 0) {
      const pts = [...curve].sort((a, b) => a.rpm - b.rpm);
      edges.push(pts[0]!.powerW / c, pts[pts.length - 1]!.powerW / c);
      for (let i = 0; i + 1 < pts.length; i++) {
        const a = pts[i]!;
        const b = pts[i + 1]!;
        const slope = (b.powerW - a.powerW) / (b.rpm - a.rpm);
        if (c !== slope) {
          const n = (a.powerW - slope * a.rpm) / (c - slope);
          if (n >= a.rpm && n <= b.rpm) edges.push(n * (1 - 1e-9));
        }
      }
    } else edges.push(machine.spindle.ratedPowerW / c);
    const inRange = edges.filter((n) => Number.isFinite(n) && n >= rpmLo * (1 - 1e-12) && n <= rpmHi * (1 + 1e-12)).map((n) => Math.min(rpmHi, Math.max(rpmLo, n)));
    const cheap = inRange.map((n) => flagsAt(n, null));
    const best = pick(cheap);
    const bestFull = stab ? flagsAt(best.rpm) : best;
    if (bestFull.stable || !stab) {
      chosen = bestFull;
    } else {
      // The chatter boundary rules the nearest speed out: look at every speed at once through the
      // lower envelope of the lobes (boundaries above the cap are not traced).
      const count = 64;
      const candidates: Flags[] = [];
      const envs = stab.branches.map((br) => envelopeOverSpeeds(br, z, rpmLo, rpmHi, count, 400, capMm * kt1));
      const envAt = (n: number): number | null => {
        if (!(rpmHi > rpmLo)) return null;
        const x = ((n - rpmLo) / (rpmHi - rpmLo)) * (count - 1);
        const j = Math.min(count - 2, Math.max(0, Math.floor(x)));
        const t = x - j;
        let lim: number | null = null;
        for (const env of envs) {
          const v0 = env.limitingDepthMm[j]!;
          const v1 = env.limitingDepthMm[j + 1]!;
          // Where either neighbour has no boundary below the cap, the lower one is still an upper bound.
          const v = Number.isFinite(v0) && Number.isFinite(v1) ? v0 + t * (v1 - v0) : Number.isFinite(v0) ? v0 : v1;
          if (Number.isFinite(v) && (lim === null || v / kt1 < lim)) lim = v / kt1;
        }
        return lim;
      };
      if (rpmHi > rpmLo) for (let j = 0; j < count; j++) candidates.push(flagsAt(rpmLo + ((rpmHi - rpmLo) * j) / (count - 1), envAt(rpmLo + ((rpmHi - rpmLo) * j) / (count - 1))));
      for (const n of inRange) candidates.push(flagsAt(n, envAt(n)));
      candidates.push(startFlags ?? flagsAt(n0, envAt(n0)));
      const found = pick(candidates);
      // Confirm with the exact boundary at the chosen speed.
      chosen = found === startFlags ? found : flagsAt(found.rpm);
    }
  }
  if (Math.abs(chosen.rpm - n0) > 1e-9 * n0 || dialCandidates) {
    // Why the speed moved: the cheap flags at the target explain most moves; the boundary there is
    // only computed when they do not.
    const cheapBefore = startFlags ?? startCheap;
    const before = cheapBefore && (startFlags || !cheapOk(cheapBefore)) ? cheapBefore : flagsAt(n0);
    if (dialCandidates) {
      dial = dialCandidates.find((dl) => dl.rpm === chosen.rpm) ?? null;
    }
    if (Math.abs(chosen.rpm - n0) > 1e-9 * n0) {
      const reasons: string[] = [];
      const tp = (n: number): string => `${fmt((z * n) / 60)} Hz`;
      if (!before.resonance && chosen.resonance) {
        binding.add("resonance");
        const hit = forbidden.find((f) => f.kind === "resonance" && n0 > f.lo && n0 < f.hi);
        reasons.push(`the tooth-passing frequency ${tp(n0)} was within ${fmt(ctx.resonanceMargin * 100)} % of ${hit?.text() ?? "a mode"}`);
      }
      if (!before.band && chosen.band) {
        binding.add("avoid-band");
        const hit = forbidden.find((f) => f.kind === "avoid-band" && n0 > f.lo && n0 < f.hi);
        reasons.push(`the tooth-passing frequency ${tp(n0)} fell in ${hit?.text() ?? "an avoided band"}`);
      }
      if (!before.stable && chosen.stable) {
        binding.add("stability");
        reasons.push(`the ${fmt(ap)} mm depth is predicted to chatter at ${fmt(n0)} rpm (boundary ${fmt(before.aLim ?? 0)} mm) but not at the new speed`);
      } else if (!before.stable && !chosen.stable) {
        binding.add("stability");
        reasons.push(`the ${fmt(ap)} mm depth is predicted to chatter at every allowed speed; this one removes the most material once the depth is reduced (boundary ${fmt(chosen.aLim ?? 0)} mm)`);
      }
      if (!before.feed && chosen.feed) {
        binding.add("feed");
        reasons.push(`the feed the chip load needs exceeded the ${ctx.feedCeilingLabel} limit (${fmt(ctx.feedCeiling)} mm/min); a lower speed keeps the chip`);
      }
      if (!before.power && chosen.power) {
        binding.add("power");
        reasons.push("the spindle lacked power at that speed");
      }
      if (!before.vc && chosen.vc) reasons.push("the cutting speed was outside the material's range");
      if (dialCandidates) {
        adjustments.push(`Dial setting ${dial?.label ?? "?"} (${fmt(chosen.rpm)} rpm) chosen${reasons.length ? ` because ${reasons.join("; ")}` : " as the nearest setting"} (computed ${fmt(n0)} rpm).`);
      } else {
        adjustments.push(`Speed moved from ${fmt(n0)} to ${fmt(chosen.rpm)} rpm because ${reasons.length ? reasons.join("; ") : "it is the nearest speed that meets the most limits"}.`);
      }
    } else if (dialCandidates) {
      adjustments.push(`Dial setting ${dial?.label ?? "?"} (${fmt(chosen.rpm)} rpm) matches the computed speed.`);
    }
  }
  const rpm = chosen.rpm;
  if (dialCandidates) {
    ctx.warnings.push({
      id: "speed-snapped",
      severity: "caution",
      message: `This spindle has only dial speeds: setting ${dial?.label ?? "?"} (measured ${fmt(rpm)} rpm) is used; the computed speed was ${fmt(n0)} rpm. Feed follows the measured speed.`,
    });
  }

  // ---- 4. Speed-dependent ceilings at the chosen speed ---------------------------------------
  ev = evaluate(ctx, rpm, fz, ap);
  if (ev.feed > ctx.feedCeiling) {
    const before = fz;
    fz = ctx.feedCeiling / (z * rpm);
    binding.add("feed");
    adjustments.push(`Feed per tooth reduced from ${fmt(before)} to ${fmt(fz)} mm so the feed stays within the ${ctx.feedCeilingLabel} limit of ${fmt(ctx.feedCeiling)} mm/min.`);
    ev = evaluate(ctx, rpm, fz, ap);
  }
  reduceFor(rpm, "power", `spindle power (${fmt(ctx.powerAt(rpm))} W at ${fmt(rpm)} rpm)`, (e) => e.power, ctx.powerAt(rpm), false);
  // The boundary's crossing does not depend on Kt (a_lim ∝ 1/Kt): find and refine it once for Kt = 1.
  // A capped search at this speed already found the lowest crossing when it found any (the lowest
  // crossing is below every other): refine those hits instead of searching again.
  const known = chosen.rpm === rpm ? chosen.limit : undefined;
  const unitLimit: Limit | null = !stab
    ? null
    : known && known.hits
      ? limitFromHits(stab, ctx, rpm, 1, true, known.hits)
      : limitAt(stab, ctx, rpm, 1, true);
  const limitFor = (kt: number): Limit | null => (unitLimit ? { depth: unitLimit.depth / kt, fc: unitLimit.fc, axis: unitLimit.axis } : null);
  let limit = limitFor(ev.kt);
  if (stab && limit && ap > sf * limit.depth) {
    const before = ap;
    // Kt depends on the chip and, for ball and bull cutters, on the depth through the contact: iterate to settle.
    for (let i = 0; i < 6 && limit && ap > sf * limit.depth * (1 + 1e-9); i++) {
      ap = sf * limit.depth;
      ev = evaluate(ctx, rpm, fz, ap);
      limit = limitFor(ev.kt);
    }
    binding.add("stability");
    adjustments.push(
      `Axial depth reduced from ${fmt(before)} to ${fmt(ap)} mm: ${fmt(sf * 100)} % of the predicted stability boundary (${fmt(limit?.depth ?? 0)} mm) at ${fmt(rpm)} rpm.`,
    );
  }
  ev = evaluate(ctx, rpm, fz, ap);

  // ---- 4. Results, limits, warnings ---------------------------------------------------------
  const limits: LimitCheck[] = [];
  const add = (l: Omit<LimitCheck, "binding" | "holds"> & { holds?: boolean }): void => {
    const holds = l.holds ?? (l.kind === "max" ? l.value <= l.ceiling * (1 + 1e-9) : l.value >= l.ceiling * (1 - 1e-9));
    limits.push({
      id: l.id,
      label: l.label,
      value: l.value,
      ceiling: l.ceiling,
      unit: l.unit,
      kind: l.kind,
      binding: binding.has(l.id),
      holds,
      detail: l.detail,
    });
  };
  for (const c of ceilings) {
    add({ id: c.id, label: c.label, value: rpm, ceiling: c.rpm, unit: "rpm", kind: "max", detail: `${fmt(rpm)} rpm against ${fmt(c.rpm)} rpm.` });
  }
  add({ id: "spindle-min-speed", label: "Spindle minimum speed", value: rpm, ceiling: rpmLo, unit: "rpm", kind: "min", detail: `${fmt(rpm)} rpm against ${fmt(rpmLo)} rpm.` });
  add({
    id: "feed",
    label: `Feed rate (${ctx.feedCeilingLabel})`,
    value: ev.feed,
    ceiling: ctx.feedCeiling,
    unit: "mm/min",
    kind: "max",
    detail: `${fmt(ev.feed)} mm/min against the ${ctx.feedCeilingLabel} limit of ${fmt(ctx.feedCeiling)} mm/min.`,
  });
  add({
    id: "power",
    label: "Spindle power",
    value: ev.power,
    ceiling: ev.available,
    unit: "W",
    kind: "max",
    detail: `Cutting takes ${fmt(ev.power)} W; the spindle gives ${fmt(ev.available)} W at ${fmt(rpm)} rpm.`,
  });
  if (!rule.axial) {
    add({
      id: "deflection",
      label: "Deflection at the tool (cutter + machine)",
      value: ev.totalDefl,
      ceiling: ctx.deflectionCeiling,
      unit: "mm",
      kind: "max",
      detail: `Cutter ${fmt(ev.toolDefl)} mm + machine ${fmt(ev.machDefl)} mm under a ${fmt(ev.force)} N peak force.`,
    });
  }
  let nearestMode: NearestMode | null = null;
  for (const m of machine.modes) {
    const margin = Math.abs(ev.ftp - m.frequencyHz) / m.frequencyHz;
    if (!nearestMode || margin < nearestMode.margin) {
      nearestMode = { frequencyHz: m.frequencyHz, direction: m.direction as MachineAxis, label: m.label ?? null, margin };
    }
  }
  if (nearestMode && ctx.resonanceMargin > 0) {
    add({
      id: "resonance",
      label: "Tooth passing clear of machine modes",
      value: nearestMode.margin * 100,
      ceiling: ctx.resonanceMargin * 100,
      unit: "%",
      kind: "min",
      holds: nearestMode.margin >= ctx.resonanceMargin * (1 - 1e-6),
      detail: `Tooth passing ${fmt(ev.ftp)} Hz is ${fmt(nearestMode.margin * 100, 3)} % from the ${fmt(nearestMode.frequencyHz)} Hz ${nearestMode.direction.toUpperCase()} mode (keep ≥ ${fmt(ctx.resonanceMargin * 100)} %).`,
    });
  }
  const bands = machine.avoidBands ?? [];
  if (bands.length > 0) {
    let clearance = Number.MAX_VALUE;
    let which = bands[0]!;
    for (const b of bands) {
      const c = ev.ftp < b.minHz ? b.minHz - ev.ftp : ev.ftp > b.maxHz ? ev.ftp - b.maxHz : -Math.min(ev.ftp - b.minHz, b.maxHz - ev.ftp);
      if (c < clearance) {
        clearance = c;
        which = b;
      }
    }
    add({
      id: "avoid-band",
      label: "Tooth passing outside avoided bands",
      value: clearance,
      ceiling: 0,
      unit: "Hz",
      kind: "min",
      holds: clearance >= 0,
      detail:
        clearance >= 0
          ? `Tooth passing ${fmt(ev.ftp)} Hz is ${fmt(clearance)} Hz clear of the ${fmt(which.minHz)}–${fmt(which.maxHz)} Hz band.`
          : `Tooth passing ${fmt(ev.ftp)} Hz lies inside the ${fmt(which.minHz)}–${fmt(which.maxHz)} Hz band.`,
    });
  }
  const stability: StabilityResult = {
    checked: stab !== null,
    limitingDepthMm: limit ? limit.depth : null,
    depthMm: ap,
    depthRatio: limit ? limit.depth / ap : null,
    stable: !limit || ap <= sf * limit.depth * (1 + 1e-9),
    chatterFrequencyHz: limit ? limit.fc : null,
    feedAxis: limit ? limit.axis : null,
    safetyFactor: sf,
  };
  if (stab && limit) {
    add({
      id: "stability",
      label: `Depth below ${fmt(sf * 100)} % of the chatter boundary`,
      value: ap,
      ceiling: sf * limit.depth,
      unit: "mm",
      kind: "max",
      detail: `Boundary at ${fmt(rpm)} rpm: ${fmt(limit.depth)} mm (feeding along ${limit.axis.toUpperCase()}, chatter would be near ${fmt(limit.fc)} Hz).`,
    });
  }

  const w = ctx.warnings;
  const threshold = ctx.minChip;
  if (ev.runoutMin < threshold) {
    w.push({
      id: "rubbing",
      severity: "warning",
      message:
        `The lightest-loaded flute cuts a ${fmt(ev.runoutMin)} mm chip (after thinning${ctx.tir > 0 ? " and runout" : ""}), below ` +
        `${threshold === ctx.hone ? `the edge hone (${fmt(ctx.hone)} mm)` : `the material's minimum chip (${fmt(threshold)} mm)`}: it rubs instead of cutting, ` +
        "heats the edge and dulls it. Raise the feed per tooth or lower the speed.",
    });
  }
  if (ctx.tir > 0 && ev.loadFactor > 1.2) {
    w.push({
      id: "runout",
      severity: ev.runoutMin === 0 ? "warning" : "caution",
      message:
        `Runout of ${fmt(ctx.tir)} mm puts ${fmt(ev.loadFactor, 3)}× the programmed chip on one flute` +
        (ev.runoutMin === 0 ? " and leaves another flute not cutting at all" : "") +
        "; forces and deflection are computed for that flute. Check the collet and re-seat the cutter.",
    });
  }
  const stickRatio = cutter.stickoutMm / ctx.d;
  const stickMax = RECOMMEND_DEFAULTS.stickoutRatio[cutter.toolMaterial];
  if (stickRatio > stickMax) {
    w.push({
      id: "stickout",
      severity: "warning",
      message: `Stick-out is ${fmt(stickRatio, 3)}× the diameter (${cutter.toolMaterial} cutters should stay within about ${stickMax}×, common practice): choke up in the holder or use a shorter cutter.`,
    });
  }
  if (rim !== null) {
    w.push({
      id: "rim-speed",
      severity: "caution",
      message: `Large bit (Ø${fmt(ctx.d)} mm): never run it above ${fmt(rim)} rpm (rim-speed rule for router bits, common practice) or above its maker's marked maximum.`,
    });
  }
  const dir = input.millingDirection ?? "climb";
  if (!rule.axial && dir === "climb") {
    const fa = input.feedAxis ?? "any";
    const axes: MachineAxis[] = fa === "any" ? ["x", "y"] : [fa];
    const loose = axes.filter((a) => (machine.backlashMm?.[a] ?? 0) > 0);
    if (loose.length > 0) {
      w.push({
        id: "climb-backlash",
        severity: "warning",
        message: `Climb milling on an axis with measured backlash (${loose.map((a) => `${a.toUpperCase()} ${fmt(machine.backlashMm![a]!)} mm`).join(", ")}): the cutter can pull the axis through its backlash and grab. Use conventional milling for roughing or take lighter cuts.`,
      });
    }
  }
  if (ev.vc < ctx.vcMin * (1 - 1e-6) || ev.vc > ctx.vcMax * (1 + 1e-6)) {
    w.push({
      id: "cutting-speed-outside-range",
      severity: "caution",
      message: `Cutting speed ${fmt(ev.vc)} m/min is ${ev.vc < ctx.vcMin ? "below" : "above"} the material's ${cutter.toolMaterial} range (${fmt(ctx.vcMin)}–${fmt(ctx.vcMax)} m/min)${ev.vc < ctx.vcMin ? ": the spindle limits it; the chip load is kept" : ": expect heat and faster wear"}.`,
    });
  }
  if (!rule.axial && !stab) {
    w.push({
      id: "no-modes",
      severity: "caution",
      message: "No X or Y modes are measured for this machine, so chatter stability was not checked. A tap test or a recorded cut gives the modes.",
    });
  }
  const engagementChange = rule.axial ? 0 : ev.totalDefl / ctx.ae;
  if (!rule.axial && engagementChange > RECOMMEND_DEFAULTS.engagementSensitivity) {
    w.push({
      id: "engagement-sensitive",
      severity: "caution",
      message: `Under load the cutter moves ${fmt(ev.totalDefl)} mm, changing the ${fmt(ctx.ae)} mm stepover by ${fmt(engagementChange * 100, 3)} %. A shallower, wider cut at the same removal rate is far less sensitive (the change is deflection ÷ stepover).`,
    });
  }
  if (ap < ctx.apRequested * (1 - 1e-9)) {
    w.push({
      id: "depth-reduced",
      severity: "warning",
      message: `Axial depth reduced from ${fmt(ctx.apRequested)} to ${fmt(ap)} mm: reach the full depth in ${Math.ceil(ctx.apRequested / ap)} passes.`,
    });
  }
  for (const l of limits) {
    if (!l.holds) w.push({ id: "limit-not-held", severity: "warning", message: `${l.label} is not met: ${l.detail} No speed or reduction available to this machine satisfies it.` });
  }
  if (ctx.assumptions.length > 0) {
    w.push({ id: "assumption", severity: "caution", message: `Assumed (not given): ${ctx.assumptions.join("; ")}.` });
  }

  // ---- 5. Explanations ------------------------------------------------------------------------
  const bound = (...ids: LimitId[]): LimitId[] => ids.filter((id) => binding.has(id));
  const speedIds: LimitId[] = ["spindle-max-speed", "cutter-max-speed", "rim-speed", "spindle-min-speed", "resonance", "avoid-band"];
  const ex = (formula: string, inputs: Explanation["inputs"], boundBy: LimitId[], source: string, notes: string[] = []): Explanation => ({ formula, inputs, boundBy, source, notes });
  const movedNotes = adjustments.filter((a) => a.startsWith("Speed") || a.startsWith("Dial"));
  // Explanations are built on first read: re-checking a machine's recipes never reads them.
  const buildExplain = (): Record<ExplainedField, Explanation> => ({
    rpm: ex(
      "n = 1000 · vc / (π · D_eff), then capped by the speed ceilings and moved off modes, avoided bands and chatter",
      [
        { name: "target cutting speed vc", value: ctx.vcTarget, unit: "m/min" },
        { name: "effective diameter D_eff", value: deffNominal, unit: "mm" },
        { name: "computed speed", value: rpmTarget, unit: "rpm" },
        { name: "highest allowed speed", value: rpmHi, unit: "rpm" },
      ],
      bound(...speedIds, "stability", "feed", "power"),
      "Machinery's Handbook cutting-speed formula (from memory); vc target = middle of the material's range unless chosen",
      movedNotes,
    ),
    cuttingSpeedMPerMin: ex(
      "vc = π · D_eff · n / 1000",
      [
        { name: "effective diameter D_eff", value: ev.deff, unit: "mm" },
        { name: "spindle speed n", value: rpm, unit: "rpm" },
        { name: "material range", value: `${fmt(ctx.vcMin)}–${fmt(ctx.vcMax)}`, unit: "m/min" },
      ],
      bound(...speedIds),
      "Machinery's Handbook (from memory)",
    ),
    feedMmPerMin: ex(
      "vf = fz · z · n",
      [
        { name: "programmed feed per tooth fz", value: fz, unit: "mm" },
        { name: "flutes z", value: z, unit: "-" },
        { name: "spindle speed n", value: rpm, unit: "rpm" },
        { name: "feed ceiling", value: ctx.feedCeiling, unit: "mm/min" },
      ],
      bound("feed", "power", "deflection"),
      "Machinery's Handbook / SME formulas",
    ),
    chipLoadMm: ex(
      "nominal chip load = material table at the cutter diameter × operation factor (target maximum chip thickness)",
      [{ name: "source", value: ctx.chipTableNote, unit: "" }],
      [],
      "Shop's material table; operation factors: common practice, no published source",
    ),
    compensatedChipLoadMm: ex(
      "fz = h_target / (sin φe · sin κ), φe = arccos(1 − 2ae/D) (1 when ae ≥ D/2), κ = ball/bull contact angle; then reduced by ceilings",
      [
        { name: "target chip h_target", value: ctx.fzNominal, unit: "mm" },
        { name: "thinning factor", value: 1 / (ctx.sinFactor * axialFactor0), unit: "-" },
        { name: "stepover ae", value: ctx.ae, unit: "mm" },
        { name: "diameter D", value: ctx.d, unit: "mm" },
      ],
      bound("feed", "power", "deflection"),
      "Peripheral-milling geometry (Altintas, Manufacturing Automation, from memory)",
    ),
    maxChipThicknessMm: ex(
      "h_max = fz · sin φe · sin κ",
      [
        { name: "feed per tooth fz", value: fz, unit: "mm" },
        { name: "sin φe", value: ctx.sinFactor, unit: "-" },
        { name: "least-loaded flute with runout", value: ev.runoutMin, unit: "mm" },
        { name: "rubbing threshold max(minimum chip, hone)", value: ctx.minChip, unit: "mm" },
      ],
      bound("feed", "power", "deflection"),
      "Geometry; runout model: eccentric cutter, chips by flute (Schmitz & Smith, from memory)",
    ),
    axialDepthMm: ex(
      "asked depth, reduced when power, deflection or the chatter boundary required it",
      [
        { name: "asked depth", value: ctx.apRequested, unit: "mm" },
        { name: "stability boundary × safety factor", value: limit ? sf * limit.depth : "not checked", unit: limit ? "mm" : "" },
      ],
      bound("power", "deflection", "stability"),
      "Zero-order stability (Altintas & Budak 1995, from memory)",
    ),
    radialDepthMm: ex(
      rule.fullWidth || rule.axial ? "full diameter for this operation" : "as asked",
      [{ name: "stepover ae", value: ctx.ae, unit: "mm" }],
      [],
      "input",
    ),
    materialRemovalRateMm3PerMin: ex(
      rule.axial ? "Q = π D²/4 · vf" : "Q = ap · ae · vf",
      [
        { name: "axial depth ap", value: ap, unit: "mm" },
        { name: "radial depth ae", value: ctx.ae, unit: "mm" },
        { name: "feed vf", value: ev.feed, unit: "mm/min" },
      ],
      bound("feed", "power", "deflection", "stability"),
      "SME formulas (MRR = F · W · t)",
    ),
    specificCuttingForceNPerMm2: ex(
      ctx.kienzle ? "Kt = kc1.1 · h_m^(−mc), h_m = fz · (cos φst − cos φex)/(φex − φst) (mean chip)" : "Kt = 1000 · u (unit power u in J/mm³; 1 N/mm² = 0.001 J/mm³)",
      ctx.kienzle
        ? [
            { name: "kc1.1", value: ctx.kienzle.kc11, unit: "N/mm²" },
            { name: "mc", value: ctx.kienzle.mc, unit: "-" },
            { name: "mean chip h_m", value: ev.hMean, unit: "mm" },
          ]
        : [{ name: "unit power u", value: ctx.unitPower / 1000, unit: "J/mm³" }],
      [],
      "Kienzle & Victor (from memory); mean chip: Altintas (from memory)",
    ),
    cuttingForceN: ex(
      rule.axial
        ? "F = T / (z · D/4): tangential force per lip"
        : "peak of |Σ teeth (Ft, Fr)| over a revolution; Ft = Kt · ap · h, Fr = Kr · Ft, h = c · sin φ, c = fz × runout load factor",
      [
        { name: "Kt", value: ev.kt, unit: "N/mm²" },
        { name: "Kr", value: ctx.kr, unit: "-" },
        { name: "axial depth ap", value: ap, unit: "mm" },
        { name: "runout load factor", value: ev.loadFactor, unit: "-" },
      ],
      bound("power", "deflection"),
      "Altintas, Manufacturing Automation, ch. 2 (from memory); straight teeth (conservative)",
    ),
    powerW: ex(
      "Pc = Kt · Q / 60 000 (Kt in N/mm², Q in mm³/min)",
      [
        { name: "Kt", value: ev.kt, unit: "N/mm²" },
        { name: "removal rate Q", value: ev.mrr, unit: "mm³/min" },
        { name: "available at this speed", value: ev.available, unit: "W" },
      ],
      bound("power"),
      "Machinery's Handbook power method (Pc = Kp · Q, from memory); Pc/Q = kc(h_m)",
    ),
    torqueNm: ex(
      "T = Pc / (2π n / 60)",
      [
        { name: "power", value: ev.power, unit: "W" },
        { name: "speed", value: rpm, unit: "rpm" },
      ],
      bound("power"),
      "P = T · ω",
    ),
    toolDeflectionMm: ex(
      rule.axial ? "no lateral load in the model for an axial operation" : "δ = F/(3E) · [Lf³/I_f + (L³ − Lf³)/I_s], I = π d⁴/64, fluted section d = 0.8 · D, load at the tip",
      [
        { name: "force F", value: ev.force, unit: "N" },
        { name: "stick-out L", value: cutter.stickoutMm, unit: "mm" },
        { name: "flute length Lf", value: cutter.fluteLengthMm, unit: "mm" },
        { name: "Young's modulus E", value: ctx.youngs, unit: "GPa" },
      ],
      bound("deflection"),
      "Cantilever bending; equivalent diameter Kops & Vo, CIRP Annals 39(1) 1990",
    ),
    machineDeflectionMm: ex(
      rule.axial ? "no lateral load in the model for an axial operation" : "δ = F / k (softer of X and Y: the force turns with the cutter)",
      [
        { name: "force F", value: ev.force, unit: "N" },
        { name: "stiffness k", value: ctx.kMachine, unit: "N/mm" },
        { name: "from", value: ctx.kMachineNote, unit: "" },
      ],
      bound("deflection"),
      "Hooke's law; springs in series",
    ),
    totalDeflectionMm: ex(
      "δ = δ_cutter + δ_machine (same force, aligned: conservative)",
      [
        { name: "cutter", value: ev.toolDefl, unit: "mm" },
        { name: "machine", value: ev.machDefl, unit: "mm" },
        { name: "ceiling", value: ctx.deflectionCeiling, unit: "mm" },
      ],
      bound("deflection"),
      "Springs in series; ceiling 0.025 mm (0.001 in) is common practice, no published source",
      [`Changes the stepover by ${fmt(engagementChange * 100, 3)} % (δ / ae).`],
    ),
    toothPassingFrequencyHz: ex(
      "f_tp = z · n / 60",
      [
        { name: "flutes z", value: z, unit: "-" },
        { name: "speed n", value: rpm, unit: "rpm" },
      ],
      bound("resonance", "avoid-band"),
      "Smith & Tlusty 1990",
    ),
    nearestModeMargin: ex(
      "margin = |f_tp − fn| / fn for the closest mode",
      nearestMode
        ? [
            { name: "tooth passing", value: ev.ftp, unit: "Hz" },
            { name: "mode", value: nearestMode.frequencyHz, unit: "Hz" },
            { name: "required margin", value: ctx.resonanceMargin * 100, unit: "%" },
          ]
        : [{ name: "modes", value: "none measured", unit: "" }],
      bound("resonance"),
      "Ringdown default margin 10 %",
    ),
    limitingDepthMm: ex(
      "ZOA: a_lim = 2π/(N · Kt · Re λ), λ = eig([α][Φ(fc)]), n = 60 fc/(N (k + ε/2π)); worst feed axis",
      [
        { name: "Kt", value: ev.kt, unit: "N/mm²" },
        { name: "Kr", value: ctx.kr, unit: "-" },
        { name: "radial immersion", value: ctx.immersion, unit: "-" },
        { name: "safety factor", value: sf, unit: "-" },
      ],
      bound("stability"),
      "Altintas & Budak, CIRP Annals 44(1) 1995 (from memory)",
      stab ? [] : ["Not checked: no X/Y modes measured or an axial operation."],
    ),
  });

  const rec: Omit<Recommendation, "explain"> & { explain?: Recommendation["explain"] } = {
    ok: limits.every((l) => l.holds),
    operation: input.operation,
    rpm,
    spindleDial: dial,
    cuttingSpeedMPerMin: ev.vc,
    effectiveDiameterMm: ev.deff,
    feedMmPerMin: ev.feed,
    chipLoadMm: ctx.fzNominal,
    compensatedChipLoadMm: fz,
    chipThinningFactor: ev.thinning,
    maxChipThicknessMm: ev.hMax,
    meanChipThicknessMm: ev.hMean,
    runoutMaxChipMm: ev.runoutMax,
    runoutMinChipMm: ev.runoutMin,
    axialDepthMm: ap,
    radialDepthMm: ctx.ae,
    radialImmersion: ctx.immersion,
    engagementAngleDeg: ((ctx.exitRad - ctx.startRad) * 180) / Math.PI,
    materialRemovalRateMm3PerMin: ev.mrr,
    specificCuttingForceNPerMm2: ev.kt,
    cuttingForceN: ev.force,
    powerW: ev.power,
    availablePowerW: ev.available,
    torqueNm: ev.torque,
    toolDeflectionMm: ev.toolDefl,
    machineDeflectionMm: ev.machDefl,
    totalDeflectionMm: ev.totalDefl,
    deflectionCeilingMm: ctx.deflectionCeiling,
    machineStiffnessNPerMm: ctx.kMachine,
    engagementChangeFraction: engagementChange,
    toothPassingFrequencyHz: ev.ftp,
    spindleFrequencyHz: rpm / 60,
    nearestMode,
    stability,
    limits,
    warnings: w,
    adjustments,
    safetyNotes: SAFETY_NOTES,
  };
  Object.defineProperty(rec, "explain", {
    enumerable: true,
    configurable: true,
    get(): Recommendation["explain"] {
      const value = buildExplain();
      Object.defineProperty(rec, "explain", { value, enumerable: true, configurable: true, writable: true });
      return value;
    },
  });
  return rec as Recommendation;
}
