import { recommend, type RecommendInput } from "@ringdown/machining";
import { render, screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { describe, expect, it } from "vitest";
import { LimitBars } from "./limit-bars";
import { ReadoutNumbers } from "./readout-numbers";
import { SafetyBand } from "./safety-band";

// Invented demo input: a light router, a 6 mm two-flute carbide cutter, a wrought aluminium entry.
const input: RecommendInput = {
  cutter: { shape: "flat", diameterMm: 6, flutes: 2, fluteLengthMm: 18, stickoutMm: 24, shankDiameterMm: 6, toolMaterial: "carbide", helixAngleDeg: 30, maxRpm: 30000 },
  material: {
    name: "Wrought aluminium (demo)",
    cuttingSpeedMPerMin: { carbide: { minMPerMin: 250, maxMPerMin: 600 } },
    chipLoad: [{ diameterMm: 6, chipLoadMm: 0.04 }],
    kc11NPerMm2: 800,
    mc: 0.25,
  },
  machine: {
    spindle: { minRpm: 8000, maxRpm: 24000, ratedPowerW: 1500 },
    maxFeedMmPerMin: { x: 10000, y: 10000, z: 3000 },
    stiffnessNPerMm: { x: 1500, y: 1200 },
    modes: [{ direction: "x", frequencyHz: 780, dampingRatio: 0.03, stiffnessNPerMm: 4000 }],
  },
  operation: "profile",
  engagement: { axialDepthMm: 6, radialDepthMm: 1.5 },
  workPosition: { xMm: 420, yMm: 300 },
};

describe("limit bars", () => {
  it("draws one meter per limit, each filled in its state colour and read out in words", () => {
    const rec = recommend(input);
    render(<LimitBars rec={rec} system="metric" />);
    const list = screen.getByRole("list", { name: "Limits" });
    const meters = within(list).getAllByRole("meter");
    expect(meters).toHaveLength(rec.limits.length);
    const binding = rec.limits.find((l) => l.binding)!;
    const meter = within(list).getByRole("meter", { name: binding.label });
    expect(meter.getAttribute("aria-valuetext")).toMatch(/binding$/);
    // jsdom reports colours as rgb(): #B83A2E = rgb(184, 58, 46).
    expect((meter.firstElementChild as HTMLElement).style.backgroundColor).toBe("rgb(184, 58, 46)");
  });
});

describe("read-out numbers", () => {
  it("shows each number with its unit and explains it on focus", async () => {
    const user = userEvent.setup();
    const rec = recommend(input);
    render(<ReadoutNumbers rec={rec} system="imperial" />);
    const feed = screen.getByRole("button", { name: "Feed: why?" });
    expect(feed).toHaveTextContent("in/min");
    await user.tab();
    expect(screen.getByRole("button", { name: "Spindle speed: why?" })).toHaveFocus();
    expect(screen.getByRole("tooltip")).toHaveTextContent(rec.explain.rpm.formula);
    await user.keyboard("{Escape}");
    expect(screen.queryByRole("tooltip")).not.toBeInTheDocument();
  });
});

describe("safety band", () => {
  it("always lists the engine's cautions", () => {
    render(<SafetyBand />);
    const band = screen.getByRole("complementary", { name: "Safety" });
    expect(band).toHaveTextContent("Never exceed the cutter maker's or the spindle maker's limits");
    expect(within(band).getAllByRole("listitem").length).toBeGreaterThanOrEqual(3);
  });
});
