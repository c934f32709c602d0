import type { Recommendation } from "@ringdown/machining";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { describe, expect, it, vi } from "vitest";
import { StabilityPanel } from "./stability-panel";

// The read-out needs only these fields of the engine's result here (no X/Y modes: no chart).
const rec = {
  operation: "profile",
  rpm: 12_000,
  axialDepthMm: 3,
  radialImmersion: 0.25,
  specificCuttingForceNPerMm2: 600,
  stability: { checked: false, stable: true, limitingDepthMm: null, depthMm: 3, depthRatio: null, chatterFrequencyHz: null, feedAxis: null, safetyFactor: 0.8 },
} as unknown as Recommendation;

const machine = {
  name: "Invented test router",
  modes: [{ direction: "z" as const, frequencyHz: 820, dampingRatio: 0.04, stiffnessNPerMm: 3000, source: "measured" as const, note: "spindle nodding" }],
  avoidBands: [{ minHz: 1150, maxHz: 1250, note: "dust hood" }],
  modeMarginPct: 10,
  spindle: { minRpm: 6000, maxRpm: 24_000, powerW: 1500, powerCurve: [], dialSettings: [] },
};

describe("StabilityPanel", () => {
  it("warns about tooth-passing harmonics on a mode or in a band and offers the nearest clear speed", async () => {
    const onUseRpm = vi.fn();
    render(<StabilityPanel machine={machine} flutes={2} rec={rec} system="metric" onUseRpm={onUseRpm} />);

    // 12 000 rpm × 2 flutes / 60 = 400 Hz; 2 × 400 = 800 Hz is 2.4 % from 820 Hz; 3 × 400 = 1200 Hz is in 1150–1250 Hz.
    const warnings = screen.getByRole("list", { name: "Resonance warnings" });
    // (the matcher folds the thin and narrow no-break spaces into plain spaces)
    expect(warnings).toHaveTextContent(/2nd harmonic of tooth passing \(800 Hz\) is 2\.4 % from the 820 Hz Z mode \(spindle nodding\)/);
    expect(warnings).toHaveTextContent(/3rd harmonic of tooth passing \(1 200 Hz\) falls in the avoided band 1 150–1 250 Hz \(dust hood\)/);

    // Clear of every harmonic up to the 3rd (worked by hand): the 2nd harmonic is 10 % (the margin,
    // which may be met) below the mode at n = 0.9 · 820 · 60 / (2 · 2) = 11 070 rpm, and nothing else
    // is hit there (3 × 369 Hz = 1107 Hz is below the band).
    const use = screen.getByRole("button", { name: /^Use 11[\u2009 ]?0[67]0\u202frpm$/ });
    await userEvent.click(use);
    expect(onUseRpm).toHaveBeenCalledTimes(1);
    const offered = onUseRpm.mock.calls[0]![0] as number;
    expect(offered).toBeGreaterThanOrEqual(11_060);
    expect(offered).toBeLessThanOrEqual(11_070);
    expect(screen.getByText(/no X or Y mode yet/)).toBeInTheDocument();
  });

  it("says nothing about resonance when every harmonic is clear", () => {
    render(<StabilityPanel machine={{ ...machine, modes: [], avoidBands: [] }} flutes={2} rec={rec} system="metric" />);
    expect(screen.queryByRole("list", { name: "Resonance warnings" })).not.toBeInTheDocument();
    expect(screen.queryByRole("button", { name: /^Use / })).not.toBeInTheDocument();
  });
});
