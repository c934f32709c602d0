import { describe, expect, it } from "vitest";
import { afterRemoval, clearEstimate, estimatesUnder, isEstimated } from "./estimates";

// The shape of `estimatedFields` a new gantry router starts with (GET …/machines/defaults).
const defaults = ["spindle.minRpm", "spindle.maxRpm", "spindle.powerW", "axes.x.drive", "axes.x.stiffnessNPerMm", "axes.y.stiffnessNPerMm", "modes.0", "modes.1", "deflectionCeilingMm"];

describe("machine estimates", () => {
  it("knows a value is estimated itself or as part of an estimated whole", () => {
    expect(isEstimated(defaults, "spindle.maxRpm")).toBe(true);
    expect(isEstimated(defaults, "modes.0.frequencyHz")).toBe(true);
    expect(isEstimated(defaults, "axes.z.stiffnessNPerMm")).toBe(false);
    // "spindle.max" is not a parent of "spindle.maxRpm".
    expect(isEstimated(["spindle.max"], "spindle.maxRpm")).toBe(false);
  });

  it("counts the estimates in a section", () => {
    expect(estimatesUnder(defaults, "axes")).toBe(3);
    expect(estimatesUnder(defaults, "axes.x")).toBe(2);
    expect(estimatesUnder(defaults, "modes")).toBe(2);
  });

  it("drops an estimate once the person sets that value, and only that one", () => {
    expect(clearEstimate(defaults, "spindle.maxRpm")).toEqual(defaults.filter((p) => p !== "spindle.maxRpm"));
    // Editing one number of an estimated mode makes the mode the person's.
    expect(clearEstimate(defaults, "modes.1.dampingRatio")).not.toContain("modes.1");
    expect(clearEstimate(defaults, "modes.1.dampingRatio")).toContain("modes.0");
  });

  it("renumbers list estimates after an item is removed", () => {
    expect(afterRemoval(["modes.0", "modes.1", "modes.2.note", "spindle.powerW"], "modes", 1)).toEqual(["modes.0", "modes.1.note", "spindle.powerW"]);
    expect(afterRemoval(["modes.0"], "modes", 0)).toEqual([]);
  });
});
