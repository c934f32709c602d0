import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { toUnitSystem } from "./to-unit-system.js";

describe("toUnitSystem", () => {
  it("shows each base quantity in the metric or inch unit", () => {
    expect(toUnitSystem({ value: 0.025, quantity: "length", system: "metric" })).toEqual({ value: 0.025, unit: "mm" });
    const d = toUnitSystem({ value: 0.025, quantity: "length", system: "imperial" });
    expect(d.unit).toBe("in");
    expect(d.value).toBeCloseTo(unit(0.025, "mm").toNumber("inch"), 15);
    expect(toUnitSystem({ value: 300, quantity: "cuttingSpeed", system: "imperial" }).unit).toBe("sfm");
    expect(toUnitSystem({ value: 300, quantity: "cuttingSpeed", system: "imperial" }).value).toBeCloseTo(unit(300, "m/minute").toNumber("ft/minute"), 9);
    expect(toUnitSystem({ value: 1500, quantity: "power", system: "imperial" }).value).toBeCloseTo(unit(1500, "W").toNumber("hp"), 9);
    expect(toUnitSystem({ value: 600, quantity: "frequency", system: "imperial" })).toEqual({ value: 600, unit: "Hz" });
  });
  it("rejects an unknown system", () => {
    expect(() => toUnitSystem({ value: 1, quantity: "length", system: "nautical" as never })).toThrow('toUnitSystem requires system to be "metric" or "imperial"');
  });
});
