import { stabilityLimitAtRpm, stabilityLobes } from "@ringdown/machining";
import { describe, expect, it } from "vitest";
import { depthAt, isStableAt, lobeEnvelope, modesForFeed, nearestSafeSpeed, stablePockets, toothPassingHits, type LobeCurve, type MachineModeLike } from "./stability";

// An invented light router: a soft gantry mode across the beam (Y) and a stiffer one along X.
const modes: MachineModeLike[] = [
  { direction: "x", frequencyHz: 620, dampingRatio: 0.03, stiffnessNPerMm: 2500 },
  { direction: "y", frequencyHz: 410, dampingRatio: 0.04, stiffnessNPerMm: 1400 },
  { direction: "z", frequencyHz: 900, dampingRatio: 0.05, stiffnessNPerMm: 6000 },
];
const cut = { flutes: 2, radialImmersion: 0.5, specificForceNPerMm2: 700, radialForceRatio: 0.3, minRpm: 6000, maxRpm: 24000 };

describe("modesForFeed", () => {
  it("keeps X and Y as they are for a feed along X, swaps them for a feed along Y, and leaves Z out", () => {
    expect(modesForFeed(modes, "x").map((m) => [m.direction, m.frequencyHz])).toEqual([["x", 620], ["y", 410]]);
    expect(modesForFeed(modes, "y").map((m) => [m.direction, m.frequencyHz])).toEqual([["y", 620], ["x", 410]]);
  });
});

describe("lobeEnvelope", () => {
  const curve = lobeEnvelope({ ...cut, modes, speeds: 200 })!;

  it("is the lower of the two feed directions at every speed (compared with the engine run per direction)", () => {
    const common = { ...cut, speeds: 200, millingDirection: "climb" as const };
    const x = stabilityLobes({ ...common, modes: modesForFeed(modes, "x") });
    const y = stabilityLobes({ ...common, modes: modesForFeed(modes, "y") });
    expect(curve.rpm).toHaveLength(200);
    for (let i = 0; i < 200; i++) {
      const a = x[i]!.limitingDepthMm ?? Infinity;
      const b = y[i]!.limitingDepthMm ?? Infinity;
      const expected = Math.min(a, b);
      expect(curve.limitingDepthMm[i] ?? Infinity).toBe(expected);
      if (Number.isFinite(expected)) expect(curve.feedAxis[i]).toBe(a <= b ? "x" : "y");
    }
  });

  it("agrees with the engine's single-speed boundary (a separate code path) within 3 %", () => {
    for (const rpm of [9000, 13_500, 20_000]) {
      const limits = (["x", "y"] as const).map(
        (feed) => stabilityLimitAtRpm({ ...cut, modes: modesForFeed(modes, feed), rpm }).limitingDepthMm ?? Infinity,
      );
      const expected = Math.min(...limits);
      const fine = lobeEnvelope({ ...cut, modes, speeds: 1801 })!;
      const got = depthAt(fine, rpm)!;
      expect(Math.abs(got - expected) / expected).toBeLessThan(0.03);
    }
  });

  it("gives nothing to draw without an X or Y mode, or for a single-speed spindle", () => {
    expect(lobeEnvelope({ ...cut, modes: [modes[2]!] })).toBeNull();
    expect(lobeEnvelope({ ...cut, modes, minRpm: 18_000, maxRpm: 18_000 })).toBeNull();
  });
});

// A hand-made curve: boundaries 1, 3, 0.5, none, 2 mm at 1000 … 5000 rpm.
const handCurve: LobeCurve = {
  rpm: [1000, 2000, 3000, 4000, 5000],
  limitingDepthMm: [1, 3, 0.5, null, 2],
  feedAxis: ["x", "x", "y", null, "x"],
};

describe("depthAt and isStableAt", () => {
  it("interpolates linearly and reads a missing boundary cautiously", () => {
    expect(depthAt(handCurve, 1500)).toBeCloseTo(2, 12);
    expect(depthAt(handCurve, 2500)).toBeCloseTo(1.75, 12);
    expect(depthAt(handCurve, 3500)).toBe(0.5);
    expect(depthAt(handCurve, 4500)).toBe(2);
    expect(depthAt(handCurve, 4000)).toBe(null);
    expect(depthAt(handCurve, 900)).toBeUndefined();
  });
  it("applies the safety factor: 0.8 × 3 mm = 2.4 mm allowed at 2000 rpm", () => {
    expect(isStableAt(handCurve, 2000, 2.4, 0.8)).toBe(true);
    expect(isStableAt(handCurve, 2000, 2.5, 0.8)).toBe(false);
    expect(isStableAt(handCurve, 6000, 0.1, 0.8)).toBe(false);
  });
});

describe("stablePockets", () => {
  it("finds the runs of speeds where the depth holds, nearest to the current speed first", () => {
    // 0.8 mm at a factor of 0.8 needs a boundary ≥ 1 mm: 1000–2000 rpm, then 4000–5000 rpm.
    const pockets = stablePockets(handCurve, 0.8, 0.8, 3000);
    expect(pockets).toEqual([
      { minRpm: 1000, maxRpm: 2000, bestRpm: 2000, maxAllowedDepthMm: 2.4000000000000004, distanceRpm: 1000 },
      { minRpm: 4000, maxRpm: 5000, bestRpm: 4000, maxAllowedDepthMm: null, distanceRpm: 1000 },
    ]);
    expect(stablePockets(handCurve, 0.8, 0.8, 4800)[0]!.minRpm).toBe(4000);
    expect(stablePockets(handCurve, 5, 0.8, 3000)).toEqual([{ minRpm: 4000, maxRpm: 4000, bestRpm: 4000, maxAllowedDepthMm: null, distanceRpm: 1000 }]);
  });
});

describe("toothPassingHits", () => {
  it("finds harmonics of the tooth-passing frequency near a mode or inside a band", () => {
    // 12 000 rpm, 2 flutes: f_tp = 2 · 12 000 / 60 = 400 Hz; 2·f_tp = 800 Hz is 2.44 % below 820 Hz;
    // 3·f_tp = 1200 Hz lies in the 1150–1250 Hz band (worked by hand).
    const hits = toothPassingHits({
      rpm: 12_000,
      flutes: 2,
      modes: [{ direction: "y", frequencyHz: 820, dampingRatio: 0.03, stiffnessNPerMm: 2000, note: "gantry rocking" }],
      bands: [{ minHz: 1150, maxHz: 1250, note: "spindle fan" }],
      marginPct: 10,
    });
    expect(hits.map((h) => [h.harmonic, h.kind, h.frequencyHz])).toEqual([
      [2, "mode", 800],
      [3, "band", 1200],
    ]);
    expect(hits[0]!.offsetPct).toBeCloseTo((20 / 820) * 100, 10);
    expect(hits[0]!.label).toBe("gantry rocking");
  });
  it("finds nothing when every harmonic is clear", () => {
    expect(toothPassingHits({ rpm: 12_000, flutes: 2, modes: [{ direction: "x", frequencyHz: 1000, dampingRatio: 0.03, stiffnessNPerMm: 2000 }], bands: [], marginPct: 10, harmonics: 2 })).toEqual([]);
  });
});

describe("nearestSafeSpeed", () => {
  const mode400: MachineModeLike = { direction: "x", frequencyHz: 400, dampingRatio: 0.03, stiffnessNPerMm: 2000 };
  const base = { depthMm: 1, safetyFactor: 0.8, flutes: 2, modes: [mode400], bands: [], marginPct: 10, harmonics: 1, minRpm: 6000, maxRpm: 24_000 };

  it("steps out of the speeds that put the tooth-passing frequency within the margin of a mode", () => {
    // f_tp within 10 % of 400 Hz ⇔ 360 < f_tp < 440 Hz ⇔ 10 800 < n < 13 200 rpm for 2 flutes.
    const offer = nearestSafeSpeed({ ...base, currentRpm: 12_500, curve: null })!;
    expect(offer.rpm).toBeGreaterThanOrEqual(13_200);
    expect(offer.rpm).toBeLessThan(13_300);
    expect(offer.dialLabel).toBeNull();
  });

  it("picks among dial settings when the spindle has them", () => {
    const offer = nearestSafeSpeed({
      ...base,
      currentRpm: 12_000,
      curve: null,
      dialSettings: [
        { label: "2", rpm: 9000 },
        { label: "3", rpm: 12_000 },
        { label: "4", rpm: 16_000 },
      ],
    })!;
    expect(offer).toEqual({ rpm: 9000, limitingDepthMm: null, dialLabel: "2" });
  });

  it("keeps to stable speeds of the curve with a 1 % tolerance", () => {
    const curve: LobeCurve = { rpm: [6000, 12_000, 18_000, 24_000], limitingDepthMm: [0.5, 0.5, 3, 3], feedAxis: ["x", "x", "x", "x"] };
    // 1 mm needs a boundary of 1.25 mm: between 12 000 and 18 000 rpm the boundary passes 1.25 mm at
    // 12 000 + 6000 · (0.75 / 2.5) = 13 800 rpm; 1 % below the offer must still hold: 13 800 / 0.99 ≈ 13 939 rpm.
    const offer = nearestSafeSpeed({ ...base, modes: [], currentRpm: 12_000, curve })!;
    expect(offer.rpm).toBeGreaterThanOrEqual(13_939);
    expect(offer.rpm).toBeLessThan(14_100);
    expect(nearestSafeSpeed({ ...base, modes: [], depthMm: 5, currentRpm: 12_000, curve })).toBeNull();
  });
});
