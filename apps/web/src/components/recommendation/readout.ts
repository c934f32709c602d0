/**
 * Maps the engine's Recommendation onto what the read-out shows: each number in the person's unit
 * system with its unit, each limit as a bar (value against ceiling, coloured by state), and the
 * binding limit in words. Pure functions, so the planner, the recipe page and the setup card show
 * exactly the same figures.
 */
import {
  toUnitSystem,
  type ExplainedField,
  type LimitCheck,
  type LimitId,
  type Quantity,
  type Recommendation,
  type UnitSystem,
} from "@ringdown/machining";
import { formatNumber } from "@/lib/format";

/** A number ready to show: digits and unit kept apart so the unit can be set lighter. */
export interface Shown {
  text: string;
  unit: string;
  /** Value in the shown unit (for sorting, tests, aria). */
  value: number;
}

/**
 * How a base value turns into a shown one: its quantity (converted between systems, with an
 * optional denominator kept as is, e.g. "/tooth"), or a unit that is the same in both systems.
 */
export type DisplayKind = { quantity: Quantity; per?: string } | { unit: string };

/**
 * Rounds for reading, not for computing: whole numbers from 1 000 up (a spindle speed of
 * "21 060 rpm", a feed of "2 640 mm/min"), three significant digits below (a chip of
 * "0.0231 mm", a deflection of "0.000984 in").
 */
export function formatReading(value: number, system: UnitSystem): string {
  if (!Number.isFinite(value)) return "—";
  if (Math.abs(value) >= 1000) return formatNumber(value, { fractionDigits: 0, system });
  if (value === 0) return "0";
  return formatNumber(value, { significantDigits: 3, system });
}

/** Expresses an engine (metric base) value in the person's unit system. */
export function show(value: number, kind: DisplayKind, system: UnitSystem): Shown {
  if ("unit" in kind) return { text: formatReading(value, system), unit: kind.unit, value };
  const converted = toUnitSystem({ value, quantity: kind.quantity, system });
  return { text: formatReading(converted.value, system), unit: `${converted.unit}${kind.per ?? ""}`, value: converted.value };
}

/** "21 060 rpm" as one string (narrow no-break space between number and unit). */
export function showText(value: number, kind: DisplayKind, system: UnitSystem): string {
  const s = show(value, kind, system);
  return s.unit ? `${s.text}\u202F${s.unit}` : s.text;
}

/** Which quantity each unit the engine's limits speak in belongs to. */
const LIMIT_UNIT_KINDS: Record<string, DisplayKind> = {
  rpm: { unit: "rpm" },
  "mm/min": { quantity: "feedRate" },
  W: { quantity: "power" },
  mm: { quantity: "length" },
  "%": { unit: "%" },
  Hz: { unit: "Hz" },
};

export function limitUnitKind(unit: string): DisplayKind {
  return LIMIT_UNIT_KINDS[unit] ?? { unit };
}

export type LimitState = "within" | "near" | "binding";

/** The state colours of the look (within, near a limit, binding or unsafe). */
export const LIMIT_STATE_COLOURS: Record<LimitState, string> = {
  within: "#2F7D5B",
  near: "#B7791F",
  binding: "#B83A2E",
};

export const LIMIT_STATE_WORDS: Record<LimitState, string> = {
  within: "within",
  near: "near the limit",
  binding: "binding",
};

/**
 * How close counts as "near": within 15 % of a ceiling (or of a floor). A display threshold of
 * ours, not a machining rule (common practice in gauges, no published source).
 */
export const NEAR_FRACTION = 0.15;

/**
 * A limit is binding when the engine says it reduced or moved the recipe, or when the final
 * recipe breaks it; near when the value is within NEAR_FRACTION of the ceiling (or floor);
 * otherwise within.
 */
export function limitState(limit: LimitCheck): LimitState {
  if (limit.binding || !limit.holds) return "binding";
  if (limit.kind === "max") {
    if (limit.ceiling > 0 && limit.value >= limit.ceiling * (1 - NEAR_FRACTION)) return "near";
    return "within";
  }
  // A floor: near when the value sits just above it. A floor of 0 (e.g. clearance from an avoided
  // band, in Hz) has no proportional "near"; it is within while it holds.
  if (limit.ceiling > 0 && limit.value <= limit.ceiling * (1 + NEAR_FRACTION)) return "near";
  return "within";
}

export interface LimitBar {
  id: LimitId;
  label: string;
  state: LimitState;
  colour: string;
  kind: "max" | "min";
  /** Bar fill, 0–1 of the track. */
  fill: number;
  /** Where the ceiling (or floor) mark sits, 0–1 of the track. */
  mark: number;
  /** True when the value runs past a ceiling (or below a floor). */
  over: boolean;
  value: Shown;
  ceiling: Shown;
  /** One line: "972 of 10 000 mm/min (10 %)" or "21 060 rpm, floor 8 000 rpm". */
  reading: string;
  detail: string;
}

const clamp01 = (x: number) => Math.min(1, Math.max(0, x));
const NNBSP = "\u202F";

/** One limit as a horizontal bar, in the person's unit system. */
export function limitBar(limit: LimitCheck, system: UnitSystem): LimitBar {
  const kind = limitUnitKind(limit.unit);
  const value = show(limit.value, kind, system);
  const ceiling = show(limit.ceiling, kind, system);
  const state = limitState(limit);
  const unit = value.unit ? `${NNBSP}${value.unit}` : "";
  let fill: number;
  let mark: number;
  let over: boolean;
  let reading: string;
  if (limit.kind === "max") {
    // The track runs from 0 to the ceiling (or to the value when it runs past).
    const top = Math.max(limit.ceiling, limit.value, Number.MIN_VALUE);
    fill = clamp01(limit.value / top);
    mark = clamp01(limit.ceiling / top);
    over = limit.value > limit.ceiling * (1 + 1e-9);
    const pct = limit.ceiling > 0 ? Math.round((limit.value / limit.ceiling) * 100) : null;
    reading = `${value.text} of ${ceiling.text}${unit}${pct === null ? "" : ` (${formatNumber(pct, { fractionDigits: 0 })}${NNBSP}%)`}`;
  } else {
    // A floor: the track runs from 0 to twice the floor (or past the value), the mark at the floor.
    const top = Math.max(limit.ceiling * 2, limit.value * 1.1, Number.MIN_VALUE);
    fill = clamp01(limit.value / top);
    mark = clamp01(limit.ceiling / top);
    over = limit.value < limit.ceiling * (1 - 1e-9);
    reading = `${value.text}${unit}, at least ${ceiling.text}${unit}`;
  }
  return {
    id: limit.id,
    label: limit.label,
    state,
    colour: LIMIT_STATE_COLOURS[state],
    kind: limit.kind,
    fill,
    mark,
    over,
    value,
    ceiling,
    reading,
    detail: limit.detail,
  };
}

/** Worst state first, then the order the engine gave. */
export function limitBars(rec: Recommendation, system: UnitSystem): LimitBar[] {
  const rank: Record<LimitState, number> = { binding: 0, near: 1, within: 2 };
  return rec.limits
    .map((l, i) => ({ bar: limitBar(l, system), i }))
    .sort((a, b) => rank[a.bar.state] - rank[b.bar.state] || a.i - b.i)
    .map((x) => x.bar);
}

export interface WorkContext {
  workPositionXMm: number;
  workPositionYMm: number;
}

/**
 * The binding limits called out in words, e.g. "deflection at the tool (cutter + machine) at
 * X 420 mm, Y 300 mm". Null when nothing held the recipe back.
 */
export function heldBackBy(rec: Recommendation, where: WorkContext, system: UnitSystem): string | null {
  const binding = rec.limits.filter((l) => l.binding || !l.holds);
  if (binding.length === 0) return null;
  const at = `X ${showText(where.workPositionXMm, { quantity: "length" }, system)}, Y ${showText(where.workPositionYMm, { quantity: "length" }, system)}`;
  return binding
    .map((l) => {
      const label = l.label.charAt(0).toLowerCase() + l.label.slice(1);
      return l.id === "deflection" ? `${label} at ${at}` : label;
    })
    .join("; ");
}

/** Limits the final recipe breaks (the engine could not bring it within them). */
export function brokenLimits(rec: Recommendation): LimitCheck[] {
  return rec.limits.filter((l) => !l.holds);
}

/** The numbers of the read-out, in order, with the explanation that goes with each. */
export interface ReadoutRow {
  key: string;
  label: string;
  shown: Shown;
  /** Key into rec.explain, when the engine explains this number. */
  explain: ExplainedField | null;
  /** A smaller second line, e.g. the dial setting or the requested depth. */
  note?: string;
}

export interface ReadoutGroup {
  title: string;
  rows: ReadoutRow[];
}

export interface ReadoutContext {
  /** Depths the person asked for [mm], to say when the engine took less. */
  requestedAxialDepthMm?: number;
  requestedRadialDepthMm?: number;
}

/** Every number the read-out shows, grouped, in the person's unit system. */
export function readoutGroups(rec: Recommendation, system: UnitSystem, context: ReadoutContext = {}): ReadoutGroup[] {
  const len: DisplayKind = { quantity: "length" };
  const perTooth: DisplayKind = { quantity: "length", per: "/tooth" };
  const row = (key: string, label: string, value: number, kind: DisplayKind, explain: ExplainedField | null, note?: string): ReadoutRow => {
    const r: ReadoutRow = { key, label, shown: show(value, kind, system), explain };
    if (note) r.note = note;
    return r;
  };
  const reduced = (asked: number | undefined, used: number) =>
    asked !== undefined && used < asked * (1 - 1e-6) ? `asked ${showText(asked, len, system)}` : undefined;

  const mode = rec.nearestMode;
  const stability = rec.stability;
  let stabilityText: string;
  if (!stability.checked) stabilityText = "not checked";
  else if (stability.limitingDepthMm === null) stabilityText = "no boundary found";
  else stabilityText = stability.stable ? "stable" : "chatter likely";

  return [
    {
      title: "Speed and feed",
      rows: [
        row("rpm", "Spindle speed", rec.rpm, { unit: "rpm" }, "rpm", rec.spindleDial ? `dial ${rec.spindleDial.label}` : undefined),
        row("vc", "Cutting speed", rec.cuttingSpeedMPerMin, { quantity: "cuttingSpeed" }, "cuttingSpeedMPerMin"),
        row("feed", "Feed", rec.feedMmPerMin, { quantity: "feedRate" }, "feedMmPerMin"),
        row("fz", "Chip load, nominal", rec.chipLoadMm, perTooth, "chipLoadMm"),
        row(
          "fzc",
          "Chip load, thinning-compensated",
          rec.compensatedChipLoadMm,
          perTooth,
          "compensatedChipLoadMm",
          `thinning factor ×${formatNumber(rec.chipThinningFactor, { significantDigits: 3 })}`,
        ),
      ],
    },
    {
      title: "Engagement",
      rows: [
        row("ap", "Axial depth", rec.axialDepthMm, len, "axialDepthMm", reduced(context.requestedAxialDepthMm, rec.axialDepthMm)),
        row("ae", "Radial depth", rec.radialDepthMm, len, "radialDepthMm", reduced(context.requestedRadialDepthMm, rec.radialDepthMm)),
        row("arc", "Engaged arc", rec.engagementAngleDeg, { unit: "°" }, null, `${formatNumber(rec.radialImmersion * 100, { significantDigits: 3 })}\u202F% of the diameter`),
        row("mrr", "Removal rate", rec.materialRemovalRateMm3PerMin, { quantity: "volumeRate" }, "materialRemovalRateMm3PerMin"),
      ],
    },
    {
      title: "Load",
      rows: [
        row("force", "Peak cutting force", rec.cuttingForceN, { quantity: "force" }, "cuttingForceN"),
        row("power", "Cutting power", rec.powerW, { quantity: "power" }, "powerW", `of ${showText(rec.availablePowerW, { quantity: "power" }, system)} available`),
        row("torque", "Spindle torque", rec.torqueNm, { quantity: "torque" }, "torqueNm"),
      ],
    },
    {
      title: "Deflection",
      rows: [
        row("dtool", "Cutter", rec.toolDeflectionMm, len, "toolDeflectionMm"),
        row("dmach", "Machine", rec.machineDeflectionMm, len, "machineDeflectionMm"),
        row("dtotal", "Total at the tool", rec.totalDeflectionMm, len, "totalDeflectionMm", `ceiling ${showText(rec.deflectionCeilingMm, len, system)}`),
      ],
    },
    {
      title: "Vibration",
      rows: [
        row("ftp", "Tooth-passing frequency", rec.toothPassingFrequencyHz, { unit: "Hz" }, "toothPassingFrequencyHz"),
        mode
          ? row(
              "mode",
              "Nearest mode",
              mode.frequencyHz,
              { unit: "Hz" },
              "nearestModeMargin",
              `${mode.direction.toUpperCase()}${mode.label ? ` · ${mode.label}` : ""} · ${formatNumber(mode.margin * 100, { significantDigits: 3 })}\u202F% away`,
            )
          : { key: "mode", label: "Nearest mode", shown: { text: "none measured", unit: "", value: Number.NaN }, explain: null },
        stability.checked && stability.limitingDepthMm !== null
          ? row("stab", "Chatter boundary at this speed", stability.limitingDepthMm, len, "limitingDepthMm", stabilityText)
          : { key: "stab", label: "Stability at this speed", shown: { text: stabilityText, unit: "", value: Number.NaN }, explain: null },
      ],
    },
  ];
}

/** The warning that carries the deep-narrow vs shallow-wide advice, when the engine gives it. */
export function engagementAdvice(rec: Recommendation): string | null {
  return rec.warnings.find((w) => w.id === "engagement-sensitive")?.message ?? null;
}
