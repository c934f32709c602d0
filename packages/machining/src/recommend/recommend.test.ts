import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { chipThinningFactor } from "../speeds/chip-thinning-factor.js";
import { stabilityLimitAtRpm } from "../dynamics/stability-limit-at-rpm.js";
import { demoAluminium, demoCutter, demoInput, demoRouter } from "./fixtures/demo-inputs.fixture.js";
import { recommend } from "./recommend.js";
import { RecommendInputError } from "./recommend-input-error.js";
import type { ExplainedField, MachineInput, RecommendInput, Recommendation } from "./types.js";

/** A stiff, mode-free machine: only the rule under test can bind. */
const stiff: MachineInput = {
  ...demoRouter,
  stiffnessNPerMm: { x: 1e6, y: 1e6 },
  modes: [],
  spindle: { minRpm: 6000, maxRpm: 24000, ratedPowerW: 1e5 },
  maxFeedMmPerMin: { x: 1e6, y: 1e6, z: 1e6 },
  deflectionCeilingMm: 10,
};
const base: RecommendInput = { ...demoInput, machine: stiff, cutter: { ...demoCutter, runoutTirMm: 0 }, engagement: { axialDepthMm: 2, radialDepthMm: 3 } };
const limit = (r: Recommendation, id: string) => r.limits.find((l) => l.id === id);
const warned = (r: Recommendation, id: string) => r.warnings.some((w) => w.id === id);

function allNumbersFinite(value: unknown, path = "rec"): string[] {
  if (typeof value === "number") return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => allNumbersFinite(v, `${path}[${i}]`));
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => allNumbersFinite(v, `${path}.${k}`));
  return [];
}

describe("recommend — speed", () => {
  it("n = 1000·vc/(π·D) at the middle of the material's range when nothing binds (SPD-1 form: 425 m/min on Ø6 = 22 546.95 rpm)", () => {
    const r = recommend(base);
    expect(r.rpm).toBeCloseTo((1000 * 425) / (Math.PI * 6), 6);
    expect(r.cuttingSpeedMPerMin).toBeCloseTo(425, 9);
    expect(r.limits.filter((l) => l.binding)).toEqual([]);
    expect(r.ok).toBe(true);
  });

  it("a ball nose at shallow depth is sped up for its effective diameter (BN-1: D 10, ap 1 → D_eff 6 mm, 300 m/min → 15 915.5 rpm)", () => {
    const r = recommend({
      ...base,
      cutter: { ...base.cutter, shape: "ball", diameterMm: 10, shankDiameterMm: 10, fluteLengthMm: 20 },
      operation: "profile",
      engagement: { axialDepthMm: 1, radialDepthMm: 1 },
      preferences: { cuttingSpeedMPerMin: 300 },
    });
    expect(r.effectiveDiameterMm).toBeCloseTo(6, 9);
    expect(r.rpm).toBeCloseTo(15915.5, 1);
  });

  it("caps at the spindle's maximum and says that limit bound", () => {
    const r = recommend({ ...base, preferences: { cuttingSpeedMPerMin: 600 } });
    expect(r.rpm).toBe(24000);
    expect(limit(r, "spindle-max-speed")!.binding).toBe(true);
    expect(r.explain.rpm.boundBy).toContain("spindle-max-speed");
    expect(r.adjustments[0]).toMatch(/Speed capped at 24,000 rpm/);
  });

  it("respects the cutter maker's maximum", () => {
    const r = recommend({ ...base, cutter: { ...base.cutter, maxRpm: 15000 } });
    expect(r.rpm).toBe(15000);
    expect(limit(r, "cutter-max-speed")!.binding).toBe(true);
  });

  it("large router bits are held to the rim-speed rule (60 mm → 16 000 rpm; common practice, no published source) and warned about", () => {
    const r = recommend({
      ...base,
      cutter: { ...base.cutter, diameterMm: 60, shankDiameterMm: 12.7, fluteLengthMm: 20, stickoutMm: 30 },
      material: { ...demoAluminium, cuttingSpeedMPerMin: { carbide: { minMPerMin: 3200, maxMPerMin: 4000 } } },
      engagement: { axialDepthMm: 2, radialDepthMm: 10 },
    });
    expect(r.rpm).toBe(16000);
    expect(limit(r, "rim-speed")!.binding).toBe(true);
    expect(warned(r, "rim-speed")).toBe(true);
  });

  it("raises to the spindle minimum for a slow material and warns that the cutting speed is above range", () => {
    const r = recommend({ ...base, material: { ...demoAluminium, cuttingSpeedMPerMin: { carbide: { minMPerMin: 60, maxMPerMin: 80 } } } });
    expect(r.rpm).toBe(6000);
    expect(limit(r, "spindle-min-speed")!.binding).toBe(true);
    expect(warned(r, "cutting-speed-outside-range")).toBe(true);
  });

  it("snaps to the best dial setting and says so; the feed follows the dial's measured speed", () => {
    const dials = [
      { label: "1", rpm: 10000 },
      { label: "2", rpm: 14000 },
      { label: "3", rpm: 18200 },
      { label: "4", rpm: 21900 },
      { label: "5", rpm: 25000 },
    ];
    const r = recommend({ ...base, machine: { ...stiff, spindle: { ...stiff.spindle, maxRpm: 25000, dialSpeeds: dials } } });
    expect(r.spindleDial).toEqual({ label: "4", rpm: 21900 });
    expect(r.rpm).toBe(21900);
    expect(warned(r, "speed-snapped")).toBe(true);
    expect(r.feedMmPerMin).toBeCloseTo(r.compensatedChipLoadMm * 2 * 21900, 9);
  });

  it("moves the tooth-passing frequency out of a mode's ±10 % band and out of avoided bands", () => {
    const withMode = recommend({ ...base, machine: { ...stiff, modes: [{ direction: "z", frequencyHz: 760, dampingRatio: 0.03, stiffnessNPerMm: 5e5 }] } });
    expect(Math.abs(withMode.toothPassingFrequencyHz - 760) / 760).toBeGreaterThanOrEqual(0.1 - 1e-9);
    expect(limit(withMode, "resonance")!.binding).toBe(true);
    expect(withMode.nearestMode!.frequencyHz).toBe(760);
    const withBand = recommend({ ...base, machine: { ...stiff, avoidBands: [{ minHz: 700, maxHz: 780, label: "heard chatter" }] } });
    expect(withBand.toothPassingFrequencyHz < 700 || withBand.toothPassingFrequencyHz > 780).toBe(true);
    expect(limit(withBand, "avoid-band")!.binding).toBe(true);
    expect(withBand.adjustments.join(" ")).toMatch(/avoided band 700–780 Hz \(heard chatter\)/);
  });
});

describe("recommend — chip", () => {
  it("compensates radial chip thinning: D 10, ae 1 → fz = 1.6667 × nominal, maximum chip = nominal (CT-1)", () => {
    const r = recommend({
      ...base,
      cutter: { ...base.cutter, diameterMm: 10, shankDiameterMm: 10, fluteLengthMm: 22, stickoutMm: 30 },
      engagement: { axialDepthMm: 3, radialDepthMm: 1 },
      preferences: { chipLoadMm: 0.05 },
    });
    expect(r.chipThinningFactor).toBeCloseTo(chipThinningFactor({ diameterMm: 10, radialDepthMm: 1 }), 12);
    expect(r.compensatedChipLoadMm).toBeCloseTo(0.05 * 1.6667, 4);
    expect(r.maxChipThicknessMm).toBeCloseTo(0.05, 12);
    expect(r.chipLoadMm).toBe(0.05);
  });

  it("interpolates the material's chip table by diameter and warns outside it", () => {
    const r = recommend({ ...base, cutter: { ...base.cutter, diameterMm: 9, shankDiameterMm: 9, fluteLengthMm: 20, stickoutMm: 30 }, engagement: { axialDepthMm: 2, radialDepthMm: 4.5 } });
    expect(r.chipLoadMm).toBeCloseTo(0.06, 12); // halfway between 0.04 @ 6 mm and 0.08 @ 12 mm
    const big = recommend({ ...base, cutter: { ...base.cutter, diameterMm: 16, shankDiameterMm: 16, fluteLengthMm: 30, stickoutMm: 45 }, engagement: { axialDepthMm: 2, radialDepthMm: 8 } });
    expect(big.chipLoadMm).toBe(0.08);
    expect(warned(big, "chip-table-extrapolated")).toBe(true);
  });

  it("runout puts fz + TIR on one of two flutes and the forces follow that flute", () => {
    const clean = recommend(base);
    const worn = recommend({ ...base, cutter: { ...base.cutter, runoutTirMm: 0.02 } });
    expect(worn.runoutMaxChipMm).toBeCloseTo(clean.maxChipThicknessMm + 0.02, 9);
    expect(worn.runoutMinChipMm).toBeCloseTo(clean.maxChipThicknessMm - 0.02, 9);
    expect(worn.cuttingForceN / clean.cuttingForceN).toBeCloseTo((worn.compensatedChipLoadMm + 0.02) / worn.compensatedChipLoadMm, 2);
    expect(warned(worn, "runout")).toBe(true);
  });

  it("warns of rubbing when the lightest flute's chip falls below the edge hone", () => {
    const r = recommend({ ...base, cutter: { ...base.cutter, edgeHoneMm: 0.035, runoutTirMm: 0.01 } });
    expect(r.runoutMinChipMm).toBeCloseTo(0.03, 12);
    expect(warned(r, "rubbing")).toBe(true);
    expect(r.warnings.find((w) => w.id === "rubbing")!.message).toMatch(/edge hone \(0\.035 mm\)/);
    expect(warned(recommend(base), "rubbing")).toBe(false);
  });
});

describe("recommend — ceilings", () => {
  it("feed ceiling: keeps the chip by slowing down inside the material's speed range", () => {
    // 0.04 mm × 2 flutes × 22 547 rpm = 1804 mm/min wanted; 1500 mm/min allowed → 18 750 rpm, still 353 m/min.
    const r = recommend({ ...base, machine: { ...stiff, maxFeedMmPerMin: { x: 1500, y: 1500, z: 1000 } } });
    expect(r.feedMmPerMin).toBeLessThanOrEqual(1500 * (1 + 1e-9));
    expect(r.rpm).toBeLessThan(22547);
    expect(limit(r, "feed")!.binding).toBe(true);
    expect(r.compensatedChipLoadMm).toBeCloseTo(recommend(base).compensatedChipLoadMm, 12);
    expect(r.cuttingSpeedMPerMin).toBeGreaterThanOrEqual(250 * (1 - 1e-9));
  });

  it("feed ceiling below what the speed range allows: the chip load comes down", () => {
    const r = recommend({ ...base, machine: { ...stiff, maxFeedMmPerMin: { x: 500, y: 500, z: 200 } } });
    expect(r.feedMmPerMin).toBeCloseTo(500, 6);
    expect(r.compensatedChipLoadMm).toBeLessThan(recommend(base).compensatedChipLoadMm);
  });

  it("power ceiling: cutting power stays within the spindle's curve at the chosen speed", () => {
    const r = recommend({ ...base, machine: { ...stiff, spindle: { ...stiff.spindle, ratedPowerW: 150 } } });
    expect(r.powerW).toBeLessThanOrEqual(150 * (1 + 1e-6));
    expect(limit(r, "power")!.binding).toBe(true);
    expect(r.torqueNm).toBeCloseTo(r.powerW / ((2 * Math.PI * r.rpm) / 60), 12);
  });

  it("deflection ceiling defaults to 0.025 mm (common practice, no published source) and is held", () => {
    const machine = { ...stiff, stiffnessNPerMm: { x: 800, y: 800 } } as MachineInput;
    delete (machine as { deflectionCeilingMm?: number }).deflectionCeilingMm;
    const r = recommend({ ...base, machine });
    expect(r.deflectionCeilingMm).toBe(0.025);
    expect(r.totalDeflectionMm).toBeLessThanOrEqual(0.025 * (1 + 1e-6));
    expect(r.totalDeflectionMm).toBeCloseTo(r.toolDeflectionMm + r.machineDeflectionMm, 15);
    expect(r.machineDeflectionMm).toBeCloseTo(r.cuttingForceN / 800, 12);
    expect(limit(r, "deflection")!.binding).toBe(true);
    expect(r.explain.totalDeflectionMm.boundBy).toEqual(["deflection"]);
    expect(warned(r, "depth-reduced") || r.compensatedChipLoadMm < recommend(base).compensatedChipLoadMm).toBe(true);
  });

  it("machine stiffness follows the work position through the stiffness map", () => {
    const map = [
      { xMm: 0, yMm: 0, stiffnessNPerMm: 4000, direction: "y" as const },
      { xMm: 1000, yMm: 0, stiffnessNPerMm: 1000, direction: "y" as const },
    ];
    const machine: MachineInput = { ...stiff, stiffnessNPerMm: { x: 1e6, y: 1e6 }, stiffnessMap: map };
    const nearEnd = recommend({ ...base, machine, workPosition: { xMm: 0, yMm: 0 } });
    const middle = recommend({ ...base, machine, workPosition: { xMm: 500, yMm: 0 } });
    expect(nearEnd.machineStiffnessNPerMm).toBeCloseTo(4000, 9);
    expect(middle.machineStiffnessNPerMm).toBeCloseTo(1 / ((1 / 4000 + 1 / 1000) / 2), 9);
    expect(middle.machineDeflectionMm).toBeGreaterThan(nearEnd.machineDeflectionMm);
    const outside = recommend({ ...base, machine, workPosition: { xMm: 1400, yMm: 0 } });
    expect(warned(outside, "outside-stiffness-map")).toBe(true);
  });

  it("a marked work region uses the worst case of the stiffness map over it, whatever the work position", () => {
    const map = [
      { xMm: 0, yMm: 0, stiffnessNPerMm: 4000, direction: "y" as const },
      { xMm: 1000, yMm: 0, stiffnessNPerMm: 1000, direction: "y" as const },
    ];
    const machine: MachineInput = { ...stiff, stiffnessNPerMm: { x: 1e6, y: 1e6 }, stiffnessMap: map };
    const region = { xMinMm: 0, xMaxMm: 500, yMinMm: 0, yMaxMm: 0 };
    const overRegion = recommend({ ...base, machine, workPosition: { xMm: 0, yMm: 0 }, workRegion: region });
    const atSoftest = recommend({ ...base, machine, workPosition: { xMm: 500, yMm: 0 } });
    // Hand calculation: compliance midway is the mean of 1/4000 and 1/1000 mm/N.
    expect(overRegion.machineStiffnessNPerMm).toBeCloseTo(1 / ((1 / 4000 + 1 / 1000) / 2), 9);
    expect(overRegion.machineDeflectionMm).toBeCloseTo(atSoftest.machineDeflectionMm, 12);
    expect(String(overRegion.explain.machineDeflectionMm?.inputs.find((i) => i.name === "from")?.value)).toMatch(/worst case of the stiffness map over X 0–500 mm/);
    expect(() => recommend({ ...base, machine, workRegion: { xMinMm: 10, xMaxMm: 0, yMinMm: 0, yMaxMm: 0 } })).toThrow(/workRegion.xMaxMm/);
  });

  it("stability: a deep slot on a flexible spindle is brought under 80 % of the ZOA boundary at the chosen speed", () => {
    const modes = [
      { direction: "x" as const, frequencyHz: 900, dampingRatio: 0.02, stiffnessNPerMm: 2000 },
      { direction: "y" as const, frequencyHz: 950, dampingRatio: 0.02, stiffnessNPerMm: 2000 },
    ];
    const r = recommend({ ...base, machine: { ...stiff, modes }, operation: "slot", engagement: { axialDepthMm: 6 }, preferences: { chipLoadMm: 0.03 } });
    expect(r.stability.checked).toBe(true);
    expect(r.stability.stable).toBe(true);
    expect(r.axialDepthMm).toBeLessThanOrEqual(0.8 * r.stability.limitingDepthMm! * (1 + 1e-6));
    expect(limit(r, "stability")!.binding).toBe(true);
    // The same boundary from the public stability function, worst of feeding along X and along Y.
    const feedX = stabilityLimitAtRpm({ modes, flutes: 2, radialImmersion: 1, specificForceNPerMm2: r.specificCuttingForceNPerMm2, radialForceRatio: 0.3, rpm: r.rpm });
    const feedY = stabilityLimitAtRpm({
      modes: modes.map((m) => ({ ...m, direction: m.direction === "x" ? ("y" as const) : ("x" as const) })),
      flutes: 2,
      radialImmersion: 1,
      specificForceNPerMm2: r.specificCuttingForceNPerMm2,
      radialForceRatio: 0.3,
      rpm: r.rpm,
    });
    expect(r.stability.limitingDepthMm!).toBeCloseTo(Math.min(feedX.limitingDepthMm!, feedY.limitingDepthMm!), 4);
  });

  it("without measured modes stability is not checked and the programmer is told", () => {
    const r = recommend(base);
    expect(r.stability.checked).toBe(false);
    expect(r.stability.limitingDepthMm).toBeNull();
    expect(warned(r, "no-modes")).toBe(true);
  });
});

describe("recommend — shop-floor checks", () => {
  it("stick-out past 4×D for carbide and 2×D for HSS (common practice, no published source)", () => {
    expect(warned(recommend({ ...base, cutter: { ...base.cutter, stickoutMm: 30 } }), "stickout")).toBe(true);
    expect(warned(recommend({ ...base, cutter: { ...base.cutter, stickoutMm: 20 } }), "stickout")).toBe(false);
    const hss = { ...base.cutter, toolMaterial: "hss" as const, stickoutMm: 15 };
    expect(warned(recommend({ ...base, cutter: hss }), "stickout")).toBe(true);
  });

  it("climb milling on an axis with measured backlash is cautioned; conventional milling is not", () => {
    const machine = { ...stiff, backlashMm: { x: 0.08, y: 0 } };
    const climb = recommend({ ...base, machine });
    expect(warned(climb, "climb-backlash")).toBe(true);
    expect(climb.warnings.find((w) => w.id === "climb-backlash")!.message).toMatch(/X 0\.08 mm/);
    expect(warned(recommend({ ...base, machine, millingDirection: "conventional" }), "climb-backlash")).toBe(false);
    expect(warned(recommend({ ...base, machine, feedAxis: "y" }), "climb-backlash")).toBe(false);
  });

  it("deep-narrow vs shallow-wide at equal removal: the same deflection changes the narrow stepover far more (worked check of the issue)", () => {
    const soft: MachineInput = { ...stiff, stiffnessNPerMm: { x: 4000, y: 4000 }, deflectionCeilingMm: 1 };
    const prefs = { chipLoadMm: 0.03, cuttingSpeedMPerMin: 400 };
    const deepNarrow = recommend({ ...base, machine: soft, engagement: { axialDepthMm: 5, radialDepthMm: 0.1 }, preferences: prefs });
    const shallowWide = recommend({ ...base, machine: soft, engagement: { axialDepthMm: 1, radialDepthMm: 0.5 }, preferences: prefs });
    expect(deepNarrow.engagementChangeFraction).toBeCloseTo(deepNarrow.totalDeflectionMm / 0.1, 12);
    expect(shallowWide.engagementChangeFraction).toBeCloseTo(shallowWide.totalDeflectionMm / 0.5, 12);
    expect(deepNarrow.engagementChangeFraction).toBeGreaterThan(3 * shallowWide.engagementChangeFraction);
    expect(warned(deepNarrow, "engagement-sensitive")).toBe(true);
    expect(warned(shallowWide, "engagement-sensitive")).toBe(false);
  });

  it("every recipe carries the safety notes", () => {
    const r = recommend(base);
    expect(r.safetyNotes.join(" ")).toMatch(/eye protection/);
    expect(r.safetyNotes.join(" ")).toMatch(/cutter maker's/);
  });
});

describe("recommend — operations", () => {
  it("drill: axial, Z feed ceiling, no lateral deflection, no milling stability", () => {
    const r = recommend({ ...base, cutter: { ...base.cutter, shape: "drill" }, operation: "drill", engagement: { axialDepthMm: 12 }, machine: { ...stiff, maxFeedMmPerMin: { x: 1e6, y: 1e6, z: 300 } } });
    expect(r.feedMmPerMin).toBeLessThanOrEqual(300 * (1 + 1e-9));
    expect(r.materialRemovalRateMm3PerMin).toBeCloseTo(((Math.PI * 36) / 4) * r.feedMmPerMin, 6);
    expect(r.totalDeflectionMm).toBe(0);
    expect(r.stability.checked).toBe(false);
    expect(r.limits.some((l) => l.id === "deflection")).toBe(false);
  });

  it("ramp: full width, feed bounded by the Z axis through the ramp angle", () => {
    const r = recommend({ ...base, operation: "ramp", engagement: { axialDepthMm: 1, rampAngleDeg: 5 }, machine: { ...stiff, maxFeedMmPerMin: { x: 1e6, y: 1e6, z: 50 } } });
    expect(r.radialDepthMm).toBe(6);
    expect(r.feedMmPerMin * Math.sin((5 * Math.PI) / 180)).toBeLessThanOrEqual(50 * (1 + 1e-9));
  });

  it("unit power instead of Kienzle: Kt = 1000·u and Pc = u·Q (PWR-1 form)", () => {
    const r = recommend({ ...base, material: { ...demoAluminium, kc11NPerMm2: undefined, mc: undefined, unitPowerJPerMm3: 0.8 } });
    expect(r.specificCuttingForceNPerMm2).toBe(800);
    expect(r.powerW).toBeCloseTo((0.8 * r.materialRemovalRateMm3PerMin) / 60, 9);
  });
});

describe("recommend — explanation and output hygiene", () => {
  const fields: ExplainedField[] = [
    "rpm",
    "cuttingSpeedMPerMin",
    "feedMmPerMin",
    "chipLoadMm",
    "compensatedChipLoadMm",
    "maxChipThicknessMm",
    "axialDepthMm",
    "radialDepthMm",
    "materialRemovalRateMm3PerMin",
    "specificCuttingForceNPerMm2",
    "cuttingForceN",
    "powerW",
    "torqueNm",
    "toolDeflectionMm",
    "machineDeflectionMm",
    "totalDeflectionMm",
    "toothPassingFrequencyHz",
    "nearestModeMargin",
    "limitingDepthMm",
  ];

  it("explains every output number with a formula, its inputs (with units) and the limits that bound it", () => {
    const r = recommend(demoInput);
    for (const f of fields) {
      const e = r.explain[f];
      expect(e.formula.length).toBeGreaterThan(5);
      expect(e.inputs.length).toBeGreaterThan(0);
      expect(e.source.length).toBeGreaterThan(0);
      for (const id of e.boundBy) expect(r.limits.find((l) => l.id === id)?.binding).toBe(true);
    }
  });

  it("the demo router recipe holds every limit and reports what bound it", () => {
    const r = recommend(demoInput);
    expect(r.ok).toBe(true);
    expect(r.limits.every((l) => l.holds)).toBe(true);
    expect(r.limits.some((l) => l.binding)).toBe(true);
    expect(r.adjustments.length).toBeGreaterThan(0);
    expect(allNumbersFinite(r)).toEqual([]);
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it("builds the explanations on first read, yet they travel with the object (JSON, spread, structured clone)", () => {
    const r = recommend(demoInput);
    expect(Object.keys(r)).toContain("explain");
    expect(JSON.parse(JSON.stringify(r)).explain.rpm.formula).toMatch(/1000 · vc/);
    expect({ ...recommend(demoInput) }.explain.feedMmPerMin.formula).toBe("vf = fz · z · n");
    expect(structuredClone(recommend(demoInput)).explain.powerW.inputs.length).toBeGreaterThan(1);
    expect(r.explain).toBe(r.explain);
  });

  it("lists every bad field of an impossible input in one typed error", () => {
    try {
      recommend({ ...demoInput, cutter: { ...demoCutter, diameterMm: -6, flutes: 0 }, engagement: { axialDepthMm: 0 }, machine: { ...demoRouter, modes: [{ direction: "x", frequencyHz: 700, dampingRatio: 1.5, stiffnessNPerMm: 100 }] } });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(RecommendInputError);
      const fields = (e as RecommendInputError).fields;
      expect(Object.keys(fields).sort()).toEqual(["cutter.diameterMm", "cutter.flutes", "engagement.axialDepthMm", "engagement.radialDepthMm", "machine.modes[0].dampingRatio"]);
    }
  });

  it("refuses a cutter whose maximum is below the spindle's minimum, naming the field", () => {
    expect(() => recommend({ ...base, cutter: { ...base.cutter, maxRpm: 3000 } })).toThrow(RecommendInputError);
    try {
      recommend({ ...base, cutter: { ...base.cutter, maxRpm: 3000 } });
    } catch (e) {
      expect((e as RecommendInputError).fields["cutter.maxRpm"]).toMatch(/cannot run on this spindle/);
    }
  });

  it("never returns NaN or Infinity, and every limit either holds or is reported (property over the valid input space)", () => {
    const cutterArb = fc.record({
      shape: fc.constantFrom("flat" as const, "ball" as const, "bull" as const),
      diameterMm: fc.double({ min: 0.5, max: 40, noNaN: true }),
      flutes: fc.integer({ min: 1, max: 6 }),
      stickRatio: fc.double({ min: 1, max: 8, noNaN: true }),
      toolMaterial: fc.constantFrom("carbide" as const, "hss" as const),
      runout: fc.double({ min: 0, max: 0.05, noNaN: true }),
    });
    const cutArb = fc.record({
      op: fc.constantFrom("slot" as const, "profile" as const, "adaptive" as const, "pocket" as const, "finish" as const, "ramp" as const, "plunge" as const),
      apFrac: fc.double({ min: 0.02, max: 1, noNaN: true }),
      aeFrac: fc.double({ min: 0.01, max: 1, noNaN: true }),
      dir: fc.constantFrom("climb" as const, "conventional" as const),
      axis: fc.constantFrom("x" as const, "y" as const, "any" as const),
    });
    const machineArb = fc.record({
      k: fc.double({ min: 50, max: 1e5, noNaN: true }),
      fn: fc.double({ min: 15, max: 3000, noNaN: true }),
      zeta: fc.double({ min: 0.005, max: 0.2, noNaN: true }),
      kMode: fc.double({ min: 50, max: 1e5, noNaN: true }),
      power: fc.double({ min: 50, max: 5000, noNaN: true }),
      feed: fc.double({ min: 100, max: 30000, noNaN: true }),
      dials: fc.boolean(),
    });
    fc.assert(
      fc.property(cutterArb, cutArb, machineArb, (c, cut, m) => {
        const d = c.diameterMm;
        const input: RecommendInput = {
          cutter: {
            shape: c.shape,
            diameterMm: d,
            flutes: c.flutes,
            fluteLengthMm: 3 * d,
            stickoutMm: Math.max(c.stickRatio * d, 3 * d),
            shankDiameterMm: d,
            toolMaterial: c.toolMaterial,
            helixAngleDeg: 30,
            cornerRadiusMm: c.shape === "bull" ? d / 5 : undefined,
            runoutTirMm: Math.min(c.runout, d / 5),
          },
          material: demoAluminium,
          machine: {
            spindle: {
              minRpm: 5000,
              maxRpm: 24000,
              ratedPowerW: m.power,
              dialSpeeds: m.dials ? [6000, 9000, 12000, 15000, 18000, 21000, 24000].map((rpm, i) => ({ label: String(i + 1), rpm })) : undefined,
            },
            maxFeedMmPerMin: { x: m.feed, y: m.feed, z: m.feed / 3 },
            stiffnessNPerMm: { x: m.k, y: m.k * 0.8 },
            modes: [
              { direction: "x", frequencyHz: m.fn, dampingRatio: m.zeta, stiffnessNPerMm: m.kMode },
              { direction: "y", frequencyHz: m.fn * 1.1, dampingRatio: m.zeta, stiffnessNPerMm: m.kMode * 0.9 },
              { direction: "y", frequencyHz: 25, dampingRatio: 0.05, stiffnessNPerMm: m.k },
            ],
            backlashMm: { x: 0.02 },
          },
          operation: cut.op,
          engagement: { axialDepthMm: cut.apFrac * 3 * d, radialDepthMm: ["slot", "ramp", "plunge"].includes(cut.op) ? undefined : cut.aeFrac * d },
          millingDirection: cut.dir,
          feedAxis: cut.axis,
        };
        const r = recommend(input);
        expect(allNumbersFinite(r)).toEqual([]);
        expect(r.rpm).toBeGreaterThan(0);
        expect(r.feedMmPerMin).toBeGreaterThan(0);
        for (const l of r.limits) if (!l.holds) expect(r.warnings.some((w) => w.id === "limit-not-held" && w.message.includes(l.label))).toBe(true);
        expect(r.ok).toBe(r.limits.every((l) => l.holds));
      }),
      { numRuns: 150 },
    );
  });
});
