import { describe, expect, it } from "vitest";
import { demoInput } from "./fixtures/demo-inputs.fixture.js";
import { RecommendInputError } from "./recommend-input-error.js";
import { validateRecommendInput } from "./validate-recommend-input.js";

const fieldsOf = (raw: unknown): Record<string, string> => {
  try {
    validateRecommendInput(raw);
    return {};
  } catch (e) {
    expect(e).toBeInstanceOf(RecommendInputError);
    return (e as RecommendInputError).fields;
  }
};

describe("validateRecommendInput", () => {
  it("accepts the demo input", () => {
    expect(fieldsOf(demoInput)).toEqual({});
  });
  it("rejects non-objects and missing parts with paths", () => {
    expect(Object.keys(fieldsOf(null))).toEqual(["input"]);
    expect(Object.keys(fieldsOf({})).sort()).toEqual(["cutter", "engagement", "machine", "material", "operation"]);
  });
  it("checks types of JSON-ish input, not just ranges", () => {
    const f = fieldsOf({ ...demoInput, cutter: { ...demoInput.cutter, diameterMm: "6" }, machine: { ...demoInput.machine, maxFeedMmPerMin: { x: 1000, y: 1000 } } });
    expect(f["cutter.diameterMm"]).toMatch(/greater than 0/);
    expect(f["machine.maxFeedMmPerMin.z"]).toBeDefined();
  });
  it("explains full-width operations, depth beyond the flutes and missing Kienzle data", () => {
    const f = fieldsOf({
      ...demoInput,
      operation: "slot",
      engagement: { axialDepthMm: 30, radialDepthMm: 2 },
      material: { ...demoInput.material, kc11NPerMm2: undefined, mc: undefined },
    });
    expect(f["engagement.radialDepthMm"]).toMatch(/full diameter/);
    expect(f["engagement.axialDepthMm"]).toMatch(/deeper than the flute length/);
    expect(f["material.kc11NPerMm2"]).toMatch(/unit power/);
  });
  it("requires a speed range for the cutter's material and a corner radius for bull-nose cutters", () => {
    const f = fieldsOf({
      ...demoInput,
      cutter: { ...demoInput.cutter, toolMaterial: "hss", shape: "bull" },
      material: { ...demoInput.material, cuttingSpeedMPerMin: { carbide: { minMPerMin: 100, maxMPerMin: 200 } } },
    });
    expect(f["material.cuttingSpeedMPerMin.hss"]).toMatch(/no cutting-speed range/);
    expect(f["cutter.cornerRadiusMm"]).toMatch(/required/);
  });
});
