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
 * may move or cap two candidates onto the same value) and numbers the rest from low to high.
 */
function collect(base: PlanningInput, parameter: LadderParameter, candidates: RecipeParams[]): { rungs: LadderRung[]; rubbing: number } {
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
  return {
    rungs: kept.map((k, i) => rungOf(i, k.params, k.rec)),
    rubbing: kept.filter((k) => k.rec.warnings.some((w) => w.id === "rubbing")).length,
  };
}

/**
 * Plans a ladder of `count` rungs for the recipe described by `base` (its current parameters).
 *  - rpm: from the lowest to the highest speed the spindle, the cutter maker and the rim-speed rule
 *    allow, narrowed to the material's cutting-speed range where that range overlaps; dial spindles
 *    use their dial settings. The chip load per tooth is kept (the feed follows the speed).
 *  - feed: chip load from 60 % to 140 % of the recipe's, at the recipe's speed, the top capped where
 *    the feed, power or deflection ceiling starts to reduce it.
 *  - depth: axial depth from half the recipe's to twice it (within the flute length), the top capped
 *    where power, deflection or chatter stability starts to reduce it.
 * @throws RecommendInputError from the engine when the recipe itself cannot be computed
 */
export function planLadder(base: PlanningInput, parameter: LadderParameter, count: number): LadderPlan {
  const baseRec = planRecipe(base);
  const p = base.params;

  if (parameter === "rpm") {
    const ceilings = baseRec.limits.filter((l) => l.unit === "rpm" && l.kind === "max").map((l) => l.ceiling);
    const floor = baseRec.limits.find((l) => l.id === "spindle-min-speed")?.ceiling ?? base.machine.spindle.minRpm;
    const hi = Math.min(...ceilings);
    const range = base.material.cuttingSpeed[base.cutter.toolMaterial];
    const toRpm = (vc: number): number => (1000 * vc) / (Math.PI * baseRec.effectiveDiameterMm);
    let lo = Math.max(floor, toRpm(range.minMPerMin));
    let top = Math.min(hi, toRpm(range.maxMPerMin));
    let note = `Spindle speed from ${fmt(lo)} to ${fmt(top)} rpm: the material's cutting-speed range within the spindle's and the cutter's limits; chip load per tooth kept.`;
    if (!(top > lo)) {
      lo = floor;
      top = hi;
      note = `Spindle speed across the spindle's usable range, ${fmt(lo)} to ${fmt(top)} rpm (the material's cutting-speed range lies outside it); chip load per tooth kept.`;
    }
    const dials = base.machine.spindle.dialSettings.map((d) => d.rpm).filter((n) => n >= lo * (1 - 1e-9) && n <= top * (1 + 1e-9));
    const speeds = dials.length > 0 ? pickEvenly([...new Set(dials)].sort((a, b) => a - b), count) : geometricSteps(lo, top, count);
    if (dials.length > 0) note = `Dial settings from ${fmt(Math.min(...speeds))} to ${fmt(Math.max(...speeds))} rpm; chip load per tooth kept.`;
    const chip = p.chipLoadOverrideMm ?? baseRec.chipLoadMm;
    const { rungs } = collect(base, "rpm", speeds.map((n) => ({ ...p, rpmOverride: n, chipLoadOverrideMm: chip })));
    return { rungs, window: windowOf(rungs, (r) => r.params.rpm, "rpm"), note: withMoved(note, rungs.length, speeds.length) };
  }

  if (parameter === "feed") {
    const nominal = p.chipLoadOverrideMm ?? baseRec.chipLoadMm;
    const pinnedSpeed = { ...p, rpmOverride: baseRec.rpm };
    const lo = FEED_SPAN.low * nominal;
    let hi = FEED_SPAN.high * nominal;
    const top = planRecipe({ ...base, params: { ...pinnedSpeed, chipLoadOverrideMm: hi } });
    // The engine reduced the chip at the top: the ceilings end the window there.
    if (top.maxChipThicknessMm < hi * (1 - 1e-6)) hi = Math.max(top.maxChipThicknessMm, lo * 1.05);
    const chips = geometricSteps(lo, hi, count);
    const { rungs, rubbing } = collect(base, "feed", chips.map((c) => ({ ...pinnedSpeed, chipLoadOverrideMm: c })));
    const note =
      `Chip load from ${fmt(lo)} to ${fmt(hi)} mm per tooth at ${fmt(baseRec.rpm)} rpm (${FEED_SPAN.low * 100}–${FEED_SPAN.high * 100} % of the recipe's, ` +
      `capped where a ceiling reduces it).` +
      (rubbing > 0 ? ` ${rubbing} low rung${rubbing > 1 ? "s" : ""} may rub rather than cut: watch for heat.` : "");
    return { rungs, window: windowOf(rungs, (r) => r.chipLoadMm ?? 0, "mm"), note: withMoved(note, rungs.length, chips.length) };
  }

  // depth
  const fluteLimit = base.operation === "drill" ? Number.POSITIVE_INFINITY : base.cutter.fluteLengthMm;
  const pinned = { ...p, rpmOverride: baseRec.rpm, chipLoadOverrideMm: p.chipLoadOverrideMm ?? baseRec.chipLoadMm };
  const lo = DEPTH_SPAN.low * p.axialDepthMm;
  let hi = Math.min(DEPTH_SPAN.high * p.axialDepthMm, fluteLimit);
  const top = planRecipe({ ...base, params: { ...pinned, axialDepthMm: hi } });
  // The engine took depth (or chip) off at the top: the window ends where the cut was still whole.
  if (top.axialDepthMm < hi * (1 - 1e-6) || top.compensatedChipLoadMm < baseRec.compensatedChipLoadMm * (1 - 1e-6)) {
    hi = Math.max(Math.min(top.axialDepthMm, hi), baseRec.axialDepthMm, lo * 1.05);
  }
  const depths = geometricSteps(lo, hi, count);
  const { rungs } = collect(base, "depth", depths.map((d) => ({ ...pinned, axialDepthMm: d })));
  const note = `Axial depth from ${fmt(lo)} to ${fmt(hi)} mm at ${fmt(baseRec.rpm)} rpm (half the recipe's depth up to where power, deflection or chatter stability would reduce it).`;
  return { rungs, window: windowOf(rungs, (r) => r.params.axialDepthMm, "mm"), note: withMoved(note, rungs.length, depths.length) };
}

function pickEvenly<T>(values: T[], count: number): T[] {
  if (values.length <= count) return values;
  return Array.from({ length: count }, (_, i) => values[Math.round((i * (values.length - 1)) / (count - 1))]!);
}

function windowOf(rungs: LadderRung[], value: (r: LadderRung) => number, unit: string): LadderPlan["window"] {
  const values = rungs.map(value);
  return { min: values.length ? Math.min(...values) : 0, max: values.length ? Math.max(...values) : 0, unit };
}

function withMoved(note: string, kept: number, asked: number): string {
  return kept < asked
    ? `${note} ${asked - kept} candidate${asked - kept > 1 ? "s" : ""} fell on the same value after the engine moved or capped ${asked - kept > 1 ? "them" : "it"} (modes, avoided bands or ceilings), or broke a ceiling, and ${asked - kept > 1 ? "were" : "was"} left out.`
    : note;
}
