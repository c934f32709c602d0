/**
 * Builds a test-cut ladder: rungs that step one parameter (spindle speed, chip load → feed, or
 * axial depth) through the window the engine allows for this recipe on its machine. Every rung is
 * computed by the engine from its own recipe parameters, and a rung is kept only when the engine
 * reports every ceiling held, so no rung asks for more than the machine, spindle or cutter allow.
 */
import { planRecipe, summarizeRecommendation, type LadderParameter, type LadderRung, type PlanningInput, type RecipeParams } from "@ringdown/contracts";
import type { Recommendation } from "@ringdown/machining";

export interface LadderPlan {
  rungs: LadderRung[];
  window: { min: number; max: number; unit: string };
  note: string;
}

/** Share of the recipe's chip load at the bottom and top of a feed ladder [-] (common practice, no published source). */
export const FEED_SPAN = { low: 0.6, high: 1.4 } as const;
/** Share of the recipe's depth at the bottom of a depth ladder, and the most it asks for at the top [-] (common practice, no published source). */
export const DEPTH_SPAN = { low: 0.5, high: 2 } as const;
/** Rungs closer than this (relative) to a kept rung are dropped as duplicates [-]. */
const DISTINCT = 0.01;
/** Candidates tried per rung wanted: the engine may move several onto one value. */
const OVERSAMPLE = 3;

const fmt = (v: number): string => String(Number(v.toPrecision(4)));

/** n values from lo to hi, evenly spaced on a log scale (equal ratios between rungs). */
export function geometricSteps(lo: number, hi: number, n: number): number[] {
  if (n === 1 || hi <= lo) return [lo];
  return Array.from({ length: n }, (_, i) => lo * Math.pow(hi / lo, i / (n - 1)));
}

function safe(rec: Recommendation): boolean {
  return rec.ok && rec.limits.every((l) => l.holds);
}

function rungOf(index: number, params: RecipeParams, rec: Recommendation): LadderRung {
  return {
    index,
    params: { rpm: rec.rpm, feedMmPerMin: rec.feedMmPerMin, axialDepthMm: rec.axialDepthMm, radialDepthMm: rec.radialDepthMm },
    chipLoadMm: rec.compensatedChipLoadMm,
    recipeParams: params,
    result: summarizeRecommendation(rec),
    score: null,
    cutLogId: null,
  };
}

/** The value a rung steps, read from the engine's result. */
function stepped(parameter: LadderParameter, rec: Recommendation): number {
  if (parameter === "rpm") return rec.rpm;
  if (parameter === "feed") return rec.maxChipThicknessMm;
  return rec.axialDepthMm;
}

/**
 * Runs each candidate through the engine, keeps the safe ones, drops near-duplicates (the engine
 * may move or cap two candidates onto the same value, e.g. off a machine mode), and picks `count`
 * of the rest spread evenly from low to high, numbered in that order.
 */
function collect(base: PlanningInput, parameter: LadderParameter, candidates: RecipeParams[], count: number): { rungs: LadderRung[]; rubbing: number } {
  const kept: Array<{ value: number; params: RecipeParams; rec: Recommendation }> = [];
  for (const params of candidates) {
    const rec = planRecipe({ ...base, params });
    if (!safe(rec)) continue;
    const value = stepped(parameter, rec);
    if (kept.some((k) => Math.abs(k.value - value) <= DISTINCT * Math.max(k.value, value))) continue;
    // Pin what the engine chose, so the rung's parameters reproduce exactly this rung.
    const pinned: RecipeParams =
      parameter === "rpm"
        ? { ...params, rpmOverride: rec.rpm }
        : parameter === "depth"
          ? { ...params, axialDepthMm: rec.axialDepthMm }
          : params;
    const check = pinned === params ? rec : planRecipe({ ...base, params: pinned });
    if (!safe(check)) continue;
    kept.push({ value: stepped(parameter, check), params: pinned, rec: check });
  }
  kept.sort((a, b) => a.value - b.value);
  const chosen = pickEvenly(kept, count);
  return {
    rungs: chosen.map((k, i) => rungOf(i, k.params, k.rec)),
    rubbing: chosen.filter((k) => k.rec.warnings.some((w) => w.id === "rubbing")).length,
  };
}

/**
 * Plans a ladder of `count` rungs for the recipe described by `base` (its current parameters).
 * Every rung starts from what the engine actually gives the recipe now (its speed, chip and depth,
 * which may be less than asked) and changes only the stepped parameter:
 *  - rpm: from the lowest to the highest speed the spindle, the cutter maker and the rim-speed rule
 *    allow, narrowed to the material's cutting-speed range where that range overlaps; dial spindles
 *    use their dial settings. The chip per tooth is kept (the feed follows the speed).
 *  - feed: chip per tooth from 60 % to 140 % of the recipe's, the top capped where the feed, power
 *    or deflection ceiling starts to reduce it.
 *  - depth: axial depth from half the recipe's up to twice it (within the flute length), the top
 *    capped where power, deflection or chatter stability would take chip or depth off.
 * @throws RecommendInputError from the engine when the recipe itself cannot be computed
 */
export function planLadder(base: PlanningInput, parameter: LadderParameter, count: number): LadderPlan {
  const baseRec = planRecipe(base);
  // The recipe as the engine runs it now; each ladder varies one of these three.
  const held: RecipeParams = {
    ...base.params,
    rpmOverride: baseRec.rpm,
    chipLoadOverrideMm: baseRec.maxChipThicknessMm,
    axialDepthMm: baseRec.axialDepthMm,
  };
  const run = (params: RecipeParams): Recommendation => planRecipe({ ...base, params });

  if (parameter === "rpm") {
    const ceilings = baseRec.limits.filter((l) => l.unit === "rpm" && l.kind === "max").map((l) => l.ceiling);
    const floor = baseRec.limits.find((l) => l.id === "spindle-min-speed")?.ceiling ?? base.machine.spindle.minRpm;
    const hi = Math.min(...ceilings);
    const range = base.material.cuttingSpeed[base.cutter.toolMaterial];
    const toRpm = (vc: number): number => (1000 * vc) / (Math.PI * baseRec.effectiveDiameterMm);
    let lo = Math.max(floor, toRpm(range.minMPerMin));
    let top = Math.min(hi, toRpm(range.maxMPerMin));
    let note = `Spindle speed from ${fmt(lo)} to ${fmt(top)} rpm: the material's cutting-speed range within the spindle's and the cutter's limits; chip per tooth (${fmt(baseRec.maxChipThicknessMm)} mm) and depth (${fmt(baseRec.axialDepthMm)} mm) kept.`;
    if (!(top > lo)) {
      lo = floor;
      top = hi;
      note = `Spindle speed across the spindle's usable range, ${fmt(lo)} to ${fmt(top)} rpm (the material's cutting-speed range lies outside it); chip per tooth and depth kept.`;
    }
    const dials = base.machine.spindle.dialSettings.map((d) => d.rpm).filter((n) => n >= lo * (1 - 1e-9) && n <= top * (1 + 1e-9));
    const speeds = dials.length > 0 ? [...new Set(dials)].sort((a, b) => a - b) : geometricSteps(lo, top, OVERSAMPLE * count);
    if (dials.length > 0) note = `Dial settings from ${fmt(Math.min(...speeds))} to ${fmt(Math.max(...speeds))} rpm; chip per tooth and depth kept.`;
    const { rungs } = collect(base, "rpm", speeds.map((n) => ({ ...held, rpmOverride: n })), count);
    return { rungs, window: windowOf(rungs, (r) => r.params.rpm, "rpm"), note: withFewer(note, rungs.length, count) };
  }

  if (parameter === "feed") {
    const chip = baseRec.maxChipThicknessMm;
    const lo = FEED_SPAN.low * chip;
    let hi = FEED_SPAN.high * chip;
    const top = run({ ...held, chipLoadOverrideMm: hi });
    // The engine reduced the chip at the top: a ceiling ends the window there.
    if (top.maxChipThicknessMm < hi * (1 - 1e-6)) hi = Math.max(top.maxChipThicknessMm, chip);
    const chips = geometricSteps(lo, hi, OVERSAMPLE * count);
    const { rungs, rubbing } = collect(base, "feed", chips.map((c) => ({ ...held, chipLoadOverrideMm: c })), count);
    const note =
      `Chip per tooth from ${fmt(lo)} to ${fmt(hi)} mm at ${fmt(baseRec.rpm)} rpm and ${fmt(baseRec.axialDepthMm)} mm deep ` +
      `(${FEED_SPAN.low * 100} % of the recipe's chip up to ${FEED_SPAN.high * 100} % or where a ceiling reduces it).` +
      (rubbing > 0 ? ` ${rubbing} low rung${rubbing > 1 ? "s" : ""} may rub rather than cut: watch for heat.` : "");
    return { rungs, window: windowOf(rungs, (r) => r.params.feedMmPerMin, "mm/min"), note: withFewer(note, rungs.length, count) };
  }

  // depth
  const depth = baseRec.axialDepthMm;
  const fluteLimit = base.operation === "drill" ? Number.POSITIVE_INFINITY : base.cutter.fluteLengthMm;
  const lo = DEPTH_SPAN.low * depth;
  const whole = (d: number): boolean => {
    const rec = run({ ...held, axialDepthMm: d });
    return safe(rec) && rec.axialDepthMm >= d * (1 - 1e-6) && rec.compensatedChipLoadMm >= baseRec.compensatedChipLoadMm * (1 - 1e-6);
  };
  // Deepest cut (up to twice the recipe's) the engine takes whole, at the same speed and chip: bisection.
  let hi = Math.min(DEPTH_SPAN.high * depth, fluteLimit);
  if (!whole(hi)) {
    let ok = depth;
    let bad = hi;
    for (let i = 0; i < 14 && bad - ok > 1e-4 * depth; i++) {
      const mid = (ok + bad) / 2;
      if (whole(mid)) ok = mid;
      else bad = mid;
    }
    hi = ok;
  }
  const depths = geometricSteps(lo, hi, OVERSAMPLE * count);
  const { rungs } = collect(base, "depth", depths.map((d) => ({ ...held, axialDepthMm: d })), count);
  const note =
    `Axial depth from ${fmt(lo)} to ${fmt(hi)} mm at ${fmt(baseRec.rpm)} rpm and ${fmt(baseRec.maxChipThicknessMm)} mm chip ` +
    `(half the recipe's depth up to twice it, or to where power, deflection or chatter stability would reduce the cut).`;
  return { rungs, window: windowOf(rungs, (r) => r.params.axialDepthMm, "mm"), note: withFewer(note, rungs.length, count) };
}

function pickEvenly<T>(values: T[], count: number): T[] {
  if (values.length <= count) return values;
  return Array.from({ length: count }, (_, i) => values[Math.round((i * (values.length - 1)) / (count - 1))]!);
}

function windowOf(rungs: LadderRung[], value: (r: LadderRung) => number, unit: string): LadderPlan["window"] {
  const values = rungs.map(value);
  return { min: values.length ? Math.min(...values) : 0, max: values.length ? Math.max(...values) : 0, unit };
}

function withFewer(note: string, got: number, wanted: number): string {
  return got < wanted
    ? `${note} Only ${got} distinct safe rung${got === 1 ? "" : "s"} fit this window: the engine moved or capped the others onto the same values (machine modes, avoided bands or ceilings).`
    : note;
}
