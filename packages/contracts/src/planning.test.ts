import { describe, expect, it } from "vitest";
import { RecommendInputError, recommend } from "@ringdown/machining";
import {
  DEFAULT_VEE_ANGLE_DEG,
  engagedVeeDiameterMm,
  planRecipe,
  planningNotes,
  recommendationSchema,
  summarizeRecommendation,
  toRecommendInput,
  type PlanningInput,
} from "./planning.js";
import { recipeParamsSchema, recipeResultSummarySchema } from "./recipes.js";

/*
 * Fixtures are ILLUSTRATIVE (invented for the test): a light gantry router, a 6 mm two-flute
 * carbide end mill in a collet, and an aluminium entry with Kienzle constants.
 */
const machine: PlanningInput["machine"] = {
  name: "Test router",
  spindle: { minRpm: 8000, maxRpm: 24000, powerW: 1500, powerCurve: [], dialSettings: [] },
  axes: {
    x: { drive: "rack_pinion", travelMm: 1200, maxFeedMmPerMin: 10000, accelerationMmPerS2: null, backlashMm: 0.02, movingMassKg: null, stiffnessNPerMm: 1500 },
    y: { drive: "rack_pinion", travelMm: 800, maxFeedMmPerMin: 9000, accelerationMmPerS2: null, backlashMm: 0, movingMassKg: null, stiffnessNPerMm: 1200 },
    z: { drive: "ball_screw", travelMm: 150, maxFeedMmPerMin: 3000, accelerationMmPerS2: null, backlashMm: 0, movingMassKg: null, stiffnessNPerMm: 3000 },
  },
  modes: [{ direction: "x", frequencyHz: 780, dampingRatio: 0.03, stiffnessNPerMm: 4000, source: "measured", note: "spindle mount" }],
  deflectionCeilingMm: 0.03,
  avoidBands: [{ minHz: 400, maxHz: 420, note: "heard chatter" }],
  modeMarginPct: 12,
};
const assembly: PlanningInput["assembly"] = { stickoutMm: 24, runoutMm: 0.01 };
const cutter: PlanningInput["cutter"] = {
  shape: "flat",
  diameterMm: 6,
  flutes: 2,
  fluteLengthMm: 18,
  shankDiameterMm: 6,
  helixDeg: 30,
  cornerRadiusMm: 0,
  tipAngleDeg: null,
  toolMaterial: "carbide",
  maxRpm: 30000,
};
const material: PlanningInput["material"] = {
  name: "Aluminium (test)",
  cuttingSpeed: { carbide: { minMPerMin: 250, maxMPerMin: 600 }, hss: { minMPerMin: 60, maxMPerMin: 120 } },
  chipLoad: [
    { diameterMm: 3, minMm: 0.015, maxMm: 0.025 },
    { diameterMm: 6, minMm: 0.03, maxMm: 0.05 },
  ],
  kc11NPerMm2: 800,
  mc: 0.25,
  unitPowerJPerMm3: null,
  minChipThicknessMm: 0.005,
};
const params = recipeParamsSchema.parse({ axialDepthMm: 3, radialDepthMm: 1.5 });
const base: PlanningInput = { machine, assembly, cutter, material, operation: "profile", params };

describe("toRecommendInput", () => {
  it("maps the machine's axes, modes, bands and margin onto the engine's fields", () => {
    const input = toRecommendInput(base);
    expect(input.machine.maxFeedMmPerMin).toEqual({ x: 10000, y: 9000, z: 3000 });
    expect(input.machine.stiffnessNPerMm).toEqual({ x: 1500, y: 1200 });
    expect(input.machine.backlashMm).toEqual({ x: 0.02, y: 0, z: 0 });
    expect(input.machine.modes).toEqual([{ direction: "x", frequencyHz: 780, dampingRatio: 0.03, stiffnessNPerMm: 4000, label: "spindle mount" }]);
    expect(input.machine.avoidBands).toEqual([{ minHz: 400, maxHz: 420, label: "heard chatter" }]);
    // 12 % → 0.12 (a percentage is a hundredth).
    expect(input.machine.resonanceMargin).toBeCloseTo(0.12, 12);
    expect(input.machine.spindle).toEqual({ minRpm: 8000, maxRpm: 24000, ratedPowerW: 1500 });
  });

  it("passes the measured stiffness map (X and Y readings) and uses it at the work position or over a marked region", () => {
    // Readings along the gantry: stiff at the ends, soft at mid-span (illustrative values); a Z push is not lateral.
    const mapped: PlanningInput["machine"] = {
      ...machine,
      stiffnessPoints: [
        { xMm: 0, yMm: 400, direction: "y", stiffnessNPerMm: 2400 },
        { xMm: 600, yMm: 400, direction: "y", stiffnessNPerMm: 600 },
        { xMm: 1200, yMm: 400, direction: "y", stiffnessNPerMm: 2400 },
        { xMm: 600, yMm: 400, direction: "z", stiffnessNPerMm: 900 },
      ],
    };
    const at = (x: number, region: PlanningInput["params"]["workRegion"] = null) =>
      planRecipe({ ...base, machine: mapped, params: { ...params, workPositionXMm: x, workPositionYMm: 400, workRegion: region } });
    const input = toRecommendInput({ ...base, machine: mapped });
    expect(input.machine.stiffnessMap).toHaveLength(3);
    expect(input.machine.stiffnessMap!.every((pt) => pt.direction === "y")).toBe(true);
    expect(input.workRegion).toBeUndefined();
    // Y comes from the map (compliance interpolated: hand calculation), X from the axis (no X readings).
    const end = at(0);
    const middle = at(600);
    expect(end.machineStiffnessNPerMm).toBeCloseTo(Math.min(1500, 2400), 9);
    expect(middle.machineStiffnessNPerMm).toBeCloseTo(600, 9);
    expect(at(300).machineStiffnessNPerMm).toBeCloseTo(Math.min(1500, 1 / ((1 / 2400 + 1 / 600) / 2)), 9);
    expect(middle.machineDeflectionMm).toBeGreaterThan(end.machineDeflectionMm);
    // A region over the left half: its worst case is mid-span, whatever the work position.
    const region = { xMinMm: 0, xMaxMm: 600, yMinMm: 300, yMaxMm: 500 };
    expect(toRecommendInput({ ...base, machine: mapped, params: { ...params, workRegion: region } }).workRegion).toEqual(region);
    const overRegion = at(0, region);
    expect(overRegion.machineStiffnessNPerMm).toBeCloseTo(600, 9);
    expect(overRegion.machineDeflectionMm).toBeCloseTo(middle.machineDeflectionMm, 12);
  });

  it("keeps the per-axis stiffness when the machine has no readings", () => {
    const input = toRecommendInput({ ...base, machine: { ...machine, stiffnessPoints: [] } });
    expect(input.machine.stiffnessMap).toBeUndefined();
    expect(planRecipe(base).machineStiffnessNPerMm).toBeCloseTo(1200, 9);
  });

  it("refuses a work region whose ends are swapped, naming the field", () => {
    const parsed = recipeParamsSchema.safeParse({ axialDepthMm: 3, radialDepthMm: 1.5, workRegion: { xMinMm: 500, xMaxMm: 100, yMinMm: 0, yMaxMm: 10 } });
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues.map((i) => i.path.join("."))).toEqual(["workRegion.xMaxMm"]);
    expect(recipeParamsSchema.parse({ axialDepthMm: 3, radialDepthMm: 1.5 }).workRegion).toBeNull();
  });

  it("takes stick-out and runout from the assembly and the middle of each chip-load range", () => {
    const input = toRecommendInput(base);
    expect(input.cutter).toMatchObject({ shape: "flat", diameterMm: 6, stickoutMm: 24, runoutTirMm: 0.01, helixAngleDeg: 30, maxRpm: 30000 });
    // (0.015 + 0.025) / 2 = 0.02 and (0.03 + 0.05) / 2 = 0.04, worked by hand.
    expect(input.material.chipLoad.map((p) => p.chipLoadMm)).toEqual([expect.closeTo(0.02, 12), expect.closeTo(0.04, 12)]);
    expect(input.material).toMatchObject({ kc11NPerMm2: 800, mc: 0.25 });
    expect(input.material.unitPowerJPerMm3).toBeUndefined();
  });

  it("passes dial settings and a power curve when the machine has them", () => {
    const dial = {
      ...machine,
      spindle: {
        ...machine.spindle,
        powerCurve: [{ rpm: 8000, powerW: 600 }, { rpm: 24000, powerW: 1500 }],
        dialSettings: [{ label: "1", rpm: 10000, measured: true }, { label: "6", rpm: 24000, measured: false }],
      },
    };
    const input = toRecommendInput({ ...base, machine: dial });
    expect(input.machine.spindle.dialSpeeds).toEqual([{ label: "1", rpm: 10000 }, { label: "6", rpm: 24000 }]);
    expect(input.machine.spindle.powerCurve).toHaveLength(2);
  });

  it("turns an rpm override into the cutting speed the engine converts back to that rpm", () => {
    // Machinery's Handbook speed formula (domain-reference SPD-1): n = 1000·vc/(π·D); vc = 300 m/min at Ø6 gives 15 915.494 rpm.
    const input = toRecommendInput({ ...base, params: { ...params, rpmOverride: 15915.494 } });
    expect(input.preferences?.cuttingSpeedMPerMin).toBeCloseTo(300, 4);
    // Without modes or avoided bands nothing moves the speed: the engine runs at exactly that rpm.
    const free = { ...base, machine: { ...machine, modes: [], avoidBands: [] }, params: { ...params, rpmOverride: 15915.494 } };
    expect(recommend(toRecommendInput(free)).rpm).toBeCloseTo(15915.494, 3);
  });

  it("uses the ball's contact diameter for an rpm override at shallow depth", () => {
    // Ball nose D = 10 mm at ap = 1 mm: D_eff = 2·√(1·9) = 6 mm (geometry, worked by hand).
    const ball = { ...cutter, shape: "ball" as const, diameterMm: 10, shankDiameterMm: 10, fluteLengthMm: 20 };
    const input = toRecommendInput({ ...base, cutter: ball, params: { ...params, axialDepthMm: 1, rpmOverride: 12000 } });
    // vc = π·6·12000/1000 = 226.19467 m/min.
    expect(input.preferences?.cuttingSpeedMPerMin).toBeCloseTo((Math.PI * 6 * 12000) / 1000, 9);
    expect(input.cutter.shape).toBe("ball");
  });

  it("maps a bull nose with its corner radius and a chip-load override", () => {
    const bull = { ...cutter, shape: "bull_nose" as const, cornerRadiusMm: 0.5 };
    const input = toRecommendInput({ ...base, cutter: bull, params: { ...params, chipLoadOverrideMm: 0.03 } });
    expect(input.cutter).toMatchObject({ shape: "bull", cornerRadiusMm: 0.5 });
    expect(input.preferences).toEqual({ chipLoadMm: 0.03 });
  });

  it("maps wood router bits to a straight cutter and says so", () => {
    for (const shape of ["compression", "up_spiral", "down_spiral"] as const) {
      const p = { ...base, cutter: { ...cutter, shape } };
      expect(toRecommendInput(p).cutter.shape).toBe("flat");
      expect(planningNotes(p).join(" ")).toMatch(/straight end mill/);
    }
  });

  it("computes a vee cutter as a straight cutter of the diameter engaged at depth", () => {
    // Cone of included angle θ: width at depth ap is 2·ap·tan(θ/2). 90° at 1.5 mm → 3 mm; 60° at 1.5 mm → 2·1.5·tan 30° = 1.7320508 mm.
    expect(engagedVeeDiameterMm({ diameterMm: 12, tipAngleDeg: 90, axialDepthMm: 1.5 })).toBeCloseTo(3, 12);
    expect(engagedVeeDiameterMm({ diameterMm: 12, tipAngleDeg: 60, axialDepthMm: 1.5 })).toBeCloseTo(1.7320508, 6);
    // Never beyond the cutter's diameter, never below 10 % of it.
    expect(engagedVeeDiameterMm({ diameterMm: 12, tipAngleDeg: 90, axialDepthMm: 20 })).toBe(12);
    expect(engagedVeeDiameterMm({ diameterMm: 12, tipAngleDeg: 90, axialDepthMm: 0.01 })).toBeCloseTo(1.2, 12);
    expect(DEFAULT_VEE_ANGLE_DEG).toBe(90);

    const vee = { ...cutter, shape: "vee" as const, diameterMm: 12, shankDiameterMm: 6, fluteLengthMm: 10, tipAngleDeg: null };
    const p: PlanningInput = { ...base, cutter: vee, params: { ...params, axialDepthMm: 1.5, radialDepthMm: 5 } };
    const input = toRecommendInput(p);
    expect(input.cutter.shape).toBe("flat");
    expect(input.cutter.diameterMm).toBeCloseTo(3, 12);
    // The stepover is held within the engaged width.
    expect(input.engagement.radialDepthMm).toBeCloseTo(3, 12);
    const notes = planningNotes(p).join(" ");
    expect(notes).toMatch(/vee cutter/);
    expect(notes).toMatch(/assumed/);
    expect(notes).toMatch(/stepover is limited/);
  });

  it("leaves the stepover out for full-width operations (the engine requires it)", () => {
    for (const operation of ["slot", "ramp"] as const) {
      const p = { ...base, operation };
      expect(toRecommendInput(p).engagement.radialDepthMm).toBeUndefined();
      expect(planningNotes(p).join(" ")).toMatch(/full diameter/);
      expect(() => recommend(toRecommendInput(p))).not.toThrow();
    }
    const drill = { ...base, operation: "drill" as const, cutter: { ...cutter, shape: "drill" as const, tipAngleDeg: 118 } };
    expect(toRecommendInput(drill).engagement.radialDepthMm).toBeUndefined();
  });
});

describe("planRecipe and summarizeRecommendation", () => {
  it("summarises the engine's result with the programmed feed per tooth and the binding limit", () => {
    const rec = planRecipe(base);
    const summary = recipeResultSummarySchema.parse(summarizeRecommendation(rec));
    expect(summary.rpm).toBe(rec.rpm);
    expect(summary.chipLoadMm).toBe(rec.compensatedChipLoadMm);
    // Table feed vf = fz·z·n (Machinery's Handbook / SME, domain-reference FEED-1).
    expect(summary.feedMmPerMin).toBeCloseTo(summary.chipLoadMm * 2 * summary.rpm, 6);
    // MRR = ap·ae·vf (SME formulas, domain-reference §4), with the depths the engine used.
    expect(summary.materialRemovalRateMm3PerMin).toBeCloseTo(rec.axialDepthMm * rec.radialDepthMm * rec.feedMmPerMin, 6);
    expect(summary.axialDepthMm).toBe(rec.axialDepthMm);
    expect(summary.radialDepthMm).toBe(rec.radialDepthMm);
    const binding = rec.limits.filter((l) => l.binding).map((l) => l.label);
    expect(summary.bindingLimit).toBe(binding.length ? binding.join("; ") : null);
    expect(summary.stable).toBe(rec.stability.checked ? rec.stability.stable : null);
    expect(summary.warnings).toEqual(rec.warnings.map((w) => w.message));
    expect(recommendationSchema.safeParse(JSON.parse(JSON.stringify(rec))).success).toBe(true);
  });

  it("adds the mapping notes to the engine's warnings as assumptions", () => {
    const p = { ...base, cutter: { ...cutter, shape: "down_spiral" as const } };
    const rec = planRecipe(p);
    expect(rec.warnings.filter((w) => w.id === "assumption").map((w) => w.message)).toEqual(expect.arrayContaining(planningNotes(p)));
  });

  it("reports no stability result when the machine has no lateral modes", () => {
    const rec = planRecipe({ ...base, machine: { ...machine, modes: [] } });
    expect(summarizeRecommendation(rec).stable).toBeNull();
  });

  it("lets the engine's input errors through with field paths", () => {
    // Axial depth beyond the 18 mm flute length is impossible for a profile.
    const p = { ...base, params: { ...params, axialDepthMm: 25 } };
    expect(() => planRecipe(p)).toThrow(RecommendInputError);
    try {
      planRecipe(p);
    } catch (error) {
      expect((error as RecommendInputError).fields).toHaveProperty(["engagement.axialDepthMm"]);
    }
  });
});
