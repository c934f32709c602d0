import { recommend, type LimitCheck, type RecommendInput } from "@ringdown/machining";
import { describe, expect, it } from "vitest";
import {
  engagementAdvice,
  formatReading,
  heldBackBy,
  LIMIT_STATE_COLOURS,
  limitBar,
  limitBars,
  limitState,
  readoutGroups,
  show,
} from "./readout";

/*
 * Invented demo input (a light gantry router, a 6 mm two-flute carbide cutter, a wrought
 * aluminium entry). The engine's own numbers are not re-derived here; these tests check that the
 * read-out maps them faithfully: unit conversion against the exact definitions of the inch and the
 * horsepower, colours by state, and the binding limit named in words.
 */
const input: RecommendInput = {
  cutter: {
    shape: "flat",
    diameterMm: 6,
    flutes: 2,
    fluteLengthMm: 18,
    stickoutMm: 24,
    shankDiameterMm: 6,
    toolMaterial: "carbide",
    helixAngleDeg: 30,
    maxRpm: 30000,
    runoutTirMm: 0.005,
  },
  material: {
    name: "Wrought aluminium (demo)",
    cuttingSpeedMPerMin: { carbide: { minMPerMin: 250, maxMPerMin: 600 } },
    chipLoad: [
      { diameterMm: 3, chipLoadMm: 0.02 },
      { diameterMm: 12, chipLoadMm: 0.08 },
    ],
    kc11NPerMm2: 800,
    mc: 0.25,
  },
  machine: {
    spindle: { minRpm: 8000, maxRpm: 24000, ratedPowerW: 1500 },
    maxFeedMmPerMin: { x: 10000, y: 10000, z: 3000 },
    stiffnessNPerMm: { x: 1500, y: 1200 },
    modes: [{ direction: "x", frequencyHz: 780, dampingRatio: 0.03, stiffnessNPerMm: 4000, label: "spindle mount" }],
  },
  operation: "profile",
  engagement: { axialDepthMm: 6, radialDepthMm: 1.5 },
  workPosition: { xMm: 420, yMm: 300 },
};

const limit = (over: Partial<LimitCheck>): LimitCheck => ({
  id: "feed",
  label: "Feed rate",
  value: 500,
  ceiling: 1000,
  unit: "mm/min",
  kind: "max",
  binding: false,
  holds: true,
  detail: "",
  ...over,
});

describe("limit state and colour", () => {
  it("uses the look's three state colours", () => {
    expect(LIMIT_STATE_COLOURS).toEqual({ within: "#2F7D5B", near: "#B7791F", binding: "#B83A2E" });
  });

  it("is within well below a ceiling, near within 15 % of it, binding when it bound or broke", () => {
    expect(limitState(limit({ value: 500 }))).toBe("within");
    expect(limitState(limit({ value: 849 }))).toBe("within");
    expect(limitState(limit({ value: 850 }))).toBe("near");
    expect(limitState(limit({ value: 999, binding: true }))).toBe("binding");
    expect(limitState(limit({ value: 1200, holds: false }))).toBe("binding");
  });

  it("treats a floor the other way round: near just above it", () => {
    const floor = limit({ id: "spindle-min-speed", unit: "rpm", kind: "min", ceiling: 8000 });
    expect(limitState({ ...floor, value: 20000 })).toBe("within");
    expect(limitState({ ...floor, value: 9000 })).toBe("near");
    expect(limitState({ ...floor, value: 7000, holds: false })).toBe("binding");
  });

  it("gives a floor of 0 (clearance from an avoided band) no proportional 'near'", () => {
    expect(limitState(limit({ id: "avoid-band", unit: "Hz", kind: "min", ceiling: 0, value: 3 }))).toBe("within");
  });
});

describe("limit bars", () => {
  it("fills to value/ceiling and reads '500 of 1 000 mm/min (50 %)'", () => {
    const bar = limitBar(limit({}), "metric");
    expect(bar.fill).toBeCloseTo(0.5, 12);
    expect(bar.mark).toBe(1);
    expect(bar.over).toBe(false);
    expect(bar.reading).toBe("500 of 1\u2009000\u202Fmm/min (50\u202F%)");
  });

  it("moves the ceiling mark inside the track when the value runs past it", () => {
    const bar = limitBar(limit({ value: 1250, holds: false }), "metric");
    expect(bar.fill).toBe(1);
    expect(bar.mark).toBeCloseTo(0.8, 12);
    expect(bar.over).toBe(true);
    expect(bar.colour).toBe("#B83A2E");
  });

  it("converts a feed ceiling to in/min for imperial readers (1 in = 25.4 mm exactly, 1959 international inch)", () => {
    const bar = limitBar(limit({ value: 2540, ceiling: 10160 }), "imperial");
    expect(bar.value.unit).toBe("in/min");
    expect(bar.value.value).toBeCloseTo(100, 10);
    expect(bar.ceiling.value).toBeCloseTo(400, 10);
  });

  it("colours the engine's binding limit red and sorts it first", () => {
    const rec = recommend(input);
    const bars = limitBars(rec, "metric");
    const bindingIds = rec.limits.filter((l) => l.binding || !l.holds).map((l) => l.id);
    expect(bindingIds.length).toBeGreaterThan(0);
    expect(bars.slice(0, bindingIds.length).map((b) => b.id).sort()).toEqual([...bindingIds].sort());
    for (const b of bars.slice(0, bindingIds.length)) expect(b.colour).toBe("#B83A2E");
    expect(bars).toHaveLength(rec.limits.length);
  });
});

describe("numbers in the person's unit system", () => {
  it("reads whole numbers from 1 000 up and three significant digits below", () => {
    expect(formatReading(21059.98, "metric")).toBe("21\u2009060");
    expect(formatReading(21059.98, "imperial")).toBe("21,060");
    expect(formatReading(0.0230940, "metric")).toBe("0.0231");
    expect(formatReading(972.72, "metric")).toBe("973");
  });

  it("shows the engine's feed, chip load and power converted by the exact inch and horsepower factors", () => {
    const rec = recommend(input);
    const groups = readoutGroups(rec, "imperial");
    const rows = new Map(groups.flatMap((g) => g.rows).map((r) => [r.key, r]));
    expect(rows.get("rpm")!.shown.unit).toBe("rpm");
    expect(rows.get("rpm")!.shown.value).toBe(rec.rpm);
    expect(rows.get("feed")!.shown.unit).toBe("in/min");
    expect(rows.get("feed")!.shown.value).toBeCloseTo(rec.feedMmPerMin / 25.4, 9);
    expect(rows.get("fz")!.shown.unit).toBe("in/tooth");
    expect(rows.get("fz")!.shown.value).toBeCloseTo(rec.chipLoadMm / 25.4, 12);
    // 1 hp = 550 ft·lbf/s = 745.69987158227022 W (definition of mechanical horsepower).
    expect(rows.get("power")!.shown.unit).toBe("hp");
    expect(rows.get("power")!.shown.value).toBeCloseTo(rec.powerW / 745.69987158227022, 9);
    // 1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N.
    expect(rows.get("force")!.shown.value).toBeCloseTo(rec.cuttingForceN / 4.4482216152605, 9);
  });

  it("gives every number a unit and points each at the engine's explanation", () => {
    const rec = recommend(input);
    for (const system of ["metric", "imperial"] as const) {
      for (const row of readoutGroups(rec, system).flatMap((g) => g.rows)) {
        if (Number.isFinite(row.shown.value)) expect(row.shown.unit, row.key).not.toBe("");
        if (row.explain) expect(rec.explain[row.explain].formula.length, row.key).toBeGreaterThan(0);
      }
    }
  });

  it("says when the engine took less depth than asked", () => {
    const rec = recommend(input);
    const rows = readoutGroups(rec, "metric", { requestedAxialDepthMm: 6, requestedRadialDepthMm: 1.5 }).flatMap((g) => g.rows);
    const ap = rows.find((r) => r.key === "ap")!;
    expect(rec.axialDepthMm).toBeLessThan(6);
    expect(ap.note).toBe("asked 6\u202Fmm");
    expect(rows.find((r) => r.key === "ae")!.note).toBeUndefined();
  });

  it("shows rpm and Hz the same in both systems", () => {
    expect(show(18000, { unit: "rpm" }, "imperial")).toEqual({ text: "18,000", unit: "rpm", value: 18000 });
    expect(show(702, { unit: "Hz" }, "metric").unit).toBe("Hz");
  });
});

describe("the binding limit in words", () => {
  it("names each binding limit, with the work position for deflection", () => {
    const rec = recommend(input);
    const words = heldBackBy(rec, { workPositionXMm: 420, workPositionYMm: 300 }, "metric");
    const deflection = rec.limits.find((l) => l.id === "deflection")!;
    if (deflection.binding) expect(words).toContain("deflection at the tool (cutter + machine) at X 420\u202Fmm, Y 300\u202Fmm");
    for (const l of rec.limits.filter((x) => x.binding)) expect(words).toContain(l.label.slice(1));
  });

  it("is null when nothing bound the recipe", () => {
    const rec = recommend({ ...input, engagement: { axialDepthMm: 0.2, radialDepthMm: 0.3 } });
    const anyBinding = rec.limits.some((l) => l.binding || !l.holds);
    expect(heldBackBy(rec, { workPositionXMm: 0, workPositionYMm: 0 }, "metric") === null).toBe(!anyBinding);
  });

  it("passes the engine's deep-narrow vs shallow-wide advice through when it gives it", () => {
    const rec = recommend(input);
    const advice = engagementAdvice(rec);
    const w = rec.warnings.find((x) => x.id === "engagement-sensitive");
    expect(advice).toBe(w ? w.message : null);
  });
});
