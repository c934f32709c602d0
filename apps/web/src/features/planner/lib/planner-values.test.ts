import { describe, expect, it } from "vitest";
import { convertTypedLengths, lengthInputText, parsePlannerValues, readNumber, valuesFromParams, type PlannerValues } from "./planner-values";

const base: PlannerValues = {
  machineId: "m",
  assemblyId: "a",
  materialId: "t",
  operation: "profile",
  axialDepth: "6",
  radialDepth: "1.5",
  workX: "420",
  workY: "300",
  useRegion: false,
  regionXFrom: "",
  regionXTo: "",
  regionYFrom: "",
  regionYTo: "",
  millingDirection: "climb",
  rpmOverride: "",
  chipLoadOverride: "",
};

describe("reading typed numbers", () => {
  it("accepts plain decimals and a decimal comma, refuses the rest", () => {
    expect(readNumber("1.5")).toBe(1.5);
    expect(readNumber(" 1,5 ")).toBe(1.5);
    expect(readNumber(".25")).toBe(0.25);
    expect(readNumber("")).toBeNull();
    expect(readNumber("1.5mm")).toBeNull();
    expect(readNumber("1 000")).toBeNull();
  });
});

describe("planner values to recipe parameters", () => {
  it("passes metric lengths through in mm and leaves empty overrides to the engine", () => {
    const { params, errors } = parsePlannerValues(base, { system: "metric" });
    expect(errors).toEqual({});
    expect(params).toEqual({
      axialDepthMm: 6,
      radialDepthMm: 1.5,
      workPositionXMm: 420,
      workPositionYMm: 300,
      workRegion: null,
      millingDirection: "climb",
      rpmOverride: null,
      chipLoadOverrideMm: null,
    });
  });

  it("reads a marked work region in the person's units and refuses one past the travel or with its ends swapped", () => {
    const region = { ...base, workX: "10", workY: "5", useRegion: true, regionXFrom: "0", regionXTo: "10", regionYFrom: "2", regionYTo: "4" };
    // 1 in = 25.4 mm (1959 international inch).
    const { params } = parsePlannerValues(region, { system: "imperial", travelXMm: 1200, travelYMm: 800 });
    expect(params!.workRegion!.xMinMm).toBe(0);
    expect(params!.workRegion!.xMaxMm).toBeCloseTo(254, 12);
    expect(params!.workRegion!.yMinMm).toBeCloseTo(50.8, 12);
    expect(params!.workRegion!.yMaxMm).toBeCloseTo(101.6, 12);
    const bad = parsePlannerValues({ ...region, regionXTo: "1300", regionYFrom: "500", regionYTo: "100", regionXFrom: "" }, { system: "metric", travelXMm: 1200, travelYMm: 800 });
    expect(bad.params).toBeNull();
    expect(bad.errors).toEqual({
      regionXFrom: "Enter the region's first X",
      regionXTo: "X is beyond the machine's travel (1\u2009200\u202Fmm)",
      regionYTo: "The region's last Y must not be below its first Y",
    });
    // Unticked, the region's fields are not read.
    const unticked = parsePlannerValues({ ...region, useRegion: false, regionXTo: "junk" }, { system: "metric" });
    expect(unticked.errors).toEqual({});
    expect(unticked.params!.workRegion).toBeNull();
    // And back from saved parameters.
    expect(valuesFromParams(params!, "metric")).toMatchObject({ useRegion: true, regionXFrom: "0", regionXTo: "254", regionYFrom: "50.8", regionYTo: "101.6" });
  });

  it("converts inches to mm by the exact factor (1 in = 25.4 mm, 1959 international inch)", () => {
    const { params } = parsePlannerValues(
      { ...base, axialDepth: "0.25", radialDepth: "0.05", workX: "10", workY: "0", chipLoadOverride: "0.001" },
      { system: "imperial" },
    );
    expect(params!.axialDepthMm).toBeCloseTo(6.35, 12);
    expect(params!.radialDepthMm).toBeCloseTo(1.27, 12);
    expect(params!.workPositionXMm).toBeCloseTo(254, 12);
    expect(params!.chipLoadOverrideMm).toBeCloseTo(0.0254, 12);
  });

  it("says which field is wrong, in the person's units", () => {
    const { params, errors } = parsePlannerValues(
      { ...base, axialDepth: "", radialDepth: "abc", workX: "-1", rpmOverride: "0" },
      { system: "metric" },
    );
    expect(params).toBeNull();
    expect(errors.axialDepth).toBe("Enter the axial depth");
    expect(errors.radialDepth).toBe("Enter the radial depth as a number");
    expect(errors.workX).toBe("The work position X cannot be negative");
    expect(errors.rpmOverride).toBe("The spindle speed must be from 1 to 200 000 rpm");
  });

  it("keeps the work position on the machine's table", () => {
    const { errors } = parsePlannerValues({ ...base, workX: "1300" }, { system: "metric", travelXMm: 1200, travelYMm: 800 });
    expect(errors.workX).toBe("X is beyond the machine's travel (1\u2009200\u202Fmm)");
    const imperial = parsePlannerValues({ ...base, workY: "40" }, { system: "imperial", travelXMm: 1200, travelYMm: 800 });
    // 800 mm / 25.4 = 31.496… in
    expect(imperial.errors.workY).toBe("Y is beyond the machine's travel (31.5\u202Fin)");
  });

  it("does not ask for a stepover in a slot, and records the depth in its place", () => {
    const { params, errors } = parsePlannerValues({ ...base, operation: "slot", radialDepth: "" }, { system: "metric" });
    expect(errors).toEqual({});
    expect(params!.radialDepthMm).toBe(6);
  });

  it("round-trips saved parameters into typed values", () => {
    const params = parsePlannerValues({ ...base, rpmOverride: "18000", chipLoadOverride: "0.03" }, { system: "metric" }).params!;
    for (const system of ["metric", "imperial"] as const) {
      const again = parsePlannerValues({ ...base, ...valuesFromParams(params, system) }, { system }).params!;
      expect(again.axialDepthMm).toBeCloseTo(params.axialDepthMm, 3);
      expect(again.chipLoadOverrideMm).toBeCloseTo(0.03, 4);
      expect(again.rpmOverride).toBe(18000);
    }
    expect(lengthInputText(25.4, "imperial")).toBe("1");
  });
});

describe("switching unit systems", () => {
  it("rewrites typed lengths so the cut stays the same (1 in = 25.4 mm)", () => {
    const out = convertTypedLengths({ axialDepth: "6.35", radialDepth: "", workX: "254", workY: "abc", chipLoadOverride: "0.0254" }, "metric", "imperial");
    expect(out).toEqual({ axialDepth: "0.25", workX: "10", chipLoadOverride: "0.001" });
    expect(convertTypedLengths({ axialDepth: "1", radialDepth: "1", workX: "1", workY: "1", chipLoadOverride: "" }, "metric", "metric")).toEqual({});
  });
});
