import { OPERATION_RULES } from "./operation-rules.js";
import { RecommendInputError } from "./recommend-input-error.js";
import type { RecommendInput } from "./types.js";

const isObj = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null;
const finite = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/**
 * Checks every field of a recommend() input and throws one RecommendInputError that lists all
 * bad fields by path. Accepts unknown data (e.g. parsed JSON), so every type is checked too.
 */
export function validateRecommendInput(raw: unknown): asserts raw is RecommendInput {
  const errors: Record<string, string> = {};
  const bad = (path: string, msg: string): void => {
    if (!(path in errors)) errors[path] = msg;
  };
  const positive = (path: string, v: unknown, what = "a number greater than 0"): v is number => {
    if (!finite(v) || v <= 0) {
      bad(path, `must be ${what}`);
      return false;
    }
    return true;
  };
  const nonNegative = (path: string, v: unknown): v is number => {
    if (!finite(v) || v < 0) {
      bad(path, "must be a number of 0 or more");
      return false;
    }
    return true;
  };
  const optional = (v: unknown): boolean => v === undefined || v === null;

  if (!isObj(raw)) throw new RecommendInputError({ input: "must be an object with cutter, material, machine, operation and engagement" });
  const { cutter, material, machine, operation, engagement } = raw;

  // Operation
  const op = typeof operation === "string" && operation in OPERATION_RULES ? (operation as keyof typeof OPERATION_RULES) : null;
  if (!op) bad("operation", `must be one of ${Object.keys(OPERATION_RULES).join(", ")}`);

  // Cutter
  let diameter = NaN;
  let fluteLength = NaN;
  let toolMaterial: string | null = null;
  if (!isObj(cutter)) bad("cutter", "is required");
  else {
    const shapes = ["flat", "ball", "bull", "drill"];
    if (typeof cutter.shape !== "string" || !shapes.includes(cutter.shape)) bad("cutter.shape", `must be one of ${shapes.join(", ")}`);
    if (positive("cutter.diameterMm", cutter.diameterMm)) diameter = cutter.diameterMm;
    if (!(Number.isInteger(cutter.flutes) && (cutter.flutes as number) >= 1 && (cutter.flutes as number) <= 24)) {
      bad("cutter.flutes", "must be a whole number from 1 to 24");
    }
    if (positive("cutter.fluteLengthMm", cutter.fluteLengthMm)) fluteLength = cutter.fluteLengthMm;
    positive("cutter.stickoutMm", cutter.stickoutMm);
    positive("cutter.shankDiameterMm", cutter.shankDiameterMm);
    if (cutter.toolMaterial !== "carbide" && cutter.toolMaterial !== "hss") bad("cutter.toolMaterial", "must be carbide or hss");
    else toolMaterial = cutter.toolMaterial;
    if (!finite(cutter.helixAngleDeg) || cutter.helixAngleDeg < 0 || cutter.helixAngleDeg > 60) {
      bad("cutter.helixAngleDeg", "must be between 0 and 60 degrees");
    }
    if (cutter.shape === "bull") {
      if (!finite(cutter.cornerRadiusMm) || cutter.cornerRadiusMm <= 0) bad("cutter.cornerRadiusMm", "is required for a bull-nose cutter and must be greater than 0");
      else if (Number.isFinite(diameter) && cutter.cornerRadiusMm > diameter / 2) bad("cutter.cornerRadiusMm", "cannot exceed half the diameter");
    } else if (!optional(cutter.cornerRadiusMm)) {
      nonNegative("cutter.cornerRadiusMm", cutter.cornerRadiusMm);
    }
    if (!optional(cutter.maxRpm)) positive("cutter.maxRpm", cutter.maxRpm);
    if (!optional(cutter.edgeHoneMm)) {
      if (nonNegative("cutter.edgeHoneMm", cutter.edgeHoneMm) && cutter.edgeHoneMm > 0.2) bad("cutter.edgeHoneMm", "must be at most 0.2 mm");
    }
    if (!optional(cutter.runoutTirMm)) {
      if (nonNegative("cutter.runoutTirMm", cutter.runoutTirMm) && Number.isFinite(diameter) && cutter.runoutTirMm >= diameter / 4) {
        bad("cutter.runoutTirMm", "is implausibly large for this diameter (check the reading)");
      }
    }
    if (!optional(cutter.youngsModulusGPa)) positive("cutter.youngsModulusGPa", cutter.youngsModulusGPa);
    if (cutter.shape === "drill" && op && op !== "drill") bad("cutter.shape", "a drill can only be used for the drill operation");
  }

  // Material
  if (!isObj(material)) bad("material", "is required");
  else {
    if (typeof material.name !== "string" || material.name.trim() === "") bad("material.name", "is required");
    const speeds = material.cuttingSpeedMPerMin;
    if (!isObj(speeds)) bad("material.cuttingSpeedMPerMin", "is required (a range per tool material)");
    else {
      for (const [tm, range] of Object.entries(speeds)) {
        if (range === undefined) continue;
        const p = `material.cuttingSpeedMPerMin.${tm}`;
        if (tm !== "carbide" && tm !== "hss") bad(p, "tool material must be carbide or hss");
        else if (!isObj(range)) bad(p, "must be { minMPerMin, maxMPerMin }");
        else {
          const okMin = positive(`${p}.minMPerMin`, range.minMPerMin);
          const okMax = positive(`${p}.maxMPerMin`, range.maxMPerMin);
          if (okMin && okMax && (range.minMPerMin as number) > (range.maxMPerMin as number)) bad(`${p}.maxMPerMin`, "must not be below minMPerMin");
        }
      }
      if (toolMaterial && !isObj(speeds[toolMaterial])) {
        bad(`material.cuttingSpeedMPerMin.${toolMaterial}`, `has no cutting-speed range for ${toolMaterial} cutters`);
      }
    }
    if (!Array.isArray(material.chipLoad) || material.chipLoad.length === 0) bad("material.chipLoad", "needs at least one { diameterMm, chipLoadMm } point");
    else {
      material.chipLoad.forEach((pt: unknown, i: number) => {
        if (!isObj(pt)) bad(`material.chipLoad[${i}]`, "must be { diameterMm, chipLoadMm }");
        else {
          positive(`material.chipLoad[${i}].diameterMm`, pt.diameterMm);
          positive(`material.chipLoad[${i}].chipLoadMm`, pt.chipLoadMm);
        }
      });
    }
    if (!optional(material.minChipThicknessMm)) nonNegative("material.minChipThicknessMm", material.minChipThicknessMm);
    const hasKienzle = !optional(material.kc11NPerMm2) || !optional(material.mc);
    if (hasKienzle) {
      positive("material.kc11NPerMm2", material.kc11NPerMm2);
      if (!finite(material.mc) || material.mc < 0 || material.mc >= 1) bad("material.mc", "must be from 0 up to (not including) 1");
    } else if (!optional(material.unitPowerJPerMm3)) {
      positive("material.unitPowerJPerMm3", material.unitPowerJPerMm3);
    } else {
      bad("material.kc11NPerMm2", "give Kienzle kc1.1 and mc, or a unit power (unitPowerJPerMm3)");
    }
    if (!optional(material.radialForceRatio)) {
      if (nonNegative("material.radialForceRatio", material.radialForceRatio) && material.radialForceRatio > 3) bad("material.radialForceRatio", "must be at most 3");
    }
  }

  // Machine
  if (!isObj(machine)) bad("machine", "is required");
  else {
    const sp = machine.spindle;
    if (!isObj(sp)) bad("machine.spindle", "is required");
    else {
      const a = positive("machine.spindle.minRpm", sp.minRpm);
      const b = positive("machine.spindle.maxRpm", sp.maxRpm);
      if (a && b && (sp.maxRpm as number) < (sp.minRpm as number)) bad("machine.spindle.maxRpm", "must not be below minRpm");
      positive("machine.spindle.ratedPowerW", sp.ratedPowerW);
      if (!optional(sp.powerCurve)) {
        if (!Array.isArray(sp.powerCurve) || sp.powerCurve.length === 0) bad("machine.spindle.powerCurve", "must be a list of { rpm, powerW }");
        else
          sp.powerCurve.forEach((pt: unknown, i: number) => {
            if (!isObj(pt)) bad(`machine.spindle.powerCurve[${i}]`, "must be { rpm, powerW }");
            else {
              positive(`machine.spindle.powerCurve[${i}].rpm`, pt.rpm);
              positive(`machine.spindle.powerCurve[${i}].powerW`, pt.powerW);
            }
          });
      }
      if (!optional(sp.dialSpeeds)) {
        if (!Array.isArray(sp.dialSpeeds) || sp.dialSpeeds.length === 0) bad("machine.spindle.dialSpeeds", "must be a list of { label, rpm }");
        else
          sp.dialSpeeds.forEach((d: unknown, i: number) => {
            if (!isObj(d)) bad(`machine.spindle.dialSpeeds[${i}]`, "must be { label, rpm }");
            else {
              if (typeof d.label !== "string") bad(`machine.spindle.dialSpeeds[${i}].label`, "must be text");
              positive(`machine.spindle.dialSpeeds[${i}].rpm`, d.rpm);
            }
          });
      }
    }
    const mf = machine.maxFeedMmPerMin;
    if (!isObj(mf)) bad("machine.maxFeedMmPerMin", "is required ({ x, y, z })");
    else for (const ax of ["x", "y", "z"]) positive(`machine.maxFeedMmPerMin.${ax}`, mf[ax]);
    const st = machine.stiffnessNPerMm;
    if (!isObj(st)) bad("machine.stiffnessNPerMm", "is required ({ x, y })");
    else for (const ax of ["x", "y"]) positive(`machine.stiffnessNPerMm.${ax}`, st[ax]);
    if (!optional(machine.stiffnessMap)) {
      if (!Array.isArray(machine.stiffnessMap)) bad("machine.stiffnessMap", "must be a list of points");
      else
        machine.stiffnessMap.forEach((p: unknown, i: number) => {
          const path = `machine.stiffnessMap[${i}]`;
          if (!isObj(p)) bad(path, "must be { xMm, yMm, stiffnessNPerMm, direction }");
          else {
            if (!finite(p.xMm)) bad(`${path}.xMm`, "must be a number");
            if (!finite(p.yMm)) bad(`${path}.yMm`, "must be a number");
            positive(`${path}.stiffnessNPerMm`, p.stiffnessNPerMm);
            if (p.direction !== "x" && p.direction !== "y" && p.direction !== "z") bad(`${path}.direction`, "must be x, y or z");
          }
        });
    }
    if (!Array.isArray(machine.modes)) bad("machine.modes", "must be a list (empty when nothing was measured)");
    else
      machine.modes.forEach((m: unknown, i: number) => {
        const path = `machine.modes[${i}]`;
        if (!isObj(m)) bad(path, "must be { direction, frequencyHz, dampingRatio, stiffnessNPerMm }");
        else {
          if (m.direction !== "x" && m.direction !== "y" && m.direction !== "z") bad(`${path}.direction`, "must be x, y or z");
          positive(`${path}.frequencyHz`, m.frequencyHz);
          if (!finite(m.dampingRatio) || m.dampingRatio <= 0 || m.dampingRatio >= 1) bad(`${path}.dampingRatio`, "must be between 0 and 1 (exclusive)");
          positive(`${path}.stiffnessNPerMm`, m.stiffnessNPerMm);
        }
      });
    if (!optional(machine.deflectionCeilingMm)) positive("machine.deflectionCeilingMm", machine.deflectionCeilingMm);
    if (!optional(machine.backlashMm)) {
      if (!isObj(machine.backlashMm)) bad("machine.backlashMm", "must be { x?, y?, z? }");
      else
        for (const [ax, v] of Object.entries(machine.backlashMm)) {
          if (v === undefined) continue;
          if (ax !== "x" && ax !== "y" && ax !== "z") bad(`machine.backlashMm.${ax}`, "axis must be x, y or z");
          else nonNegative(`machine.backlashMm.${ax}`, v);
        }
    }
    if (!optional(machine.avoidBands)) {
      if (!Array.isArray(machine.avoidBands)) bad("machine.avoidBands", "must be a list of { minHz, maxHz }");
      else
        machine.avoidBands.forEach((b: unknown, i: number) => {
          const path = `machine.avoidBands[${i}]`;
          if (!isObj(b)) bad(path, "must be { minHz, maxHz }");
          else {
            const a = positive(`${path}.minHz`, b.minHz);
            const c = positive(`${path}.maxHz`, b.maxHz);
            if (a && c && (b.maxHz as number) <= (b.minHz as number)) bad(`${path}.maxHz`, "must be above minHz");
          }
        });
    }
    if (!optional(machine.resonanceMargin)) {
      if (!finite(machine.resonanceMargin) || machine.resonanceMargin < 0 || machine.resonanceMargin > 0.5) {
        bad("machine.resonanceMargin", "must be between 0 and 0.5");
      }
    }
  }

  // Engagement
  if (!isObj(engagement)) bad("engagement", "is required");
  else {
    if (positive("engagement.axialDepthMm", engagement.axialDepthMm) && op && !OPERATION_RULES[op].axial && Number.isFinite(fluteLength)) {
      if ((engagement.axialDepthMm as number) > fluteLength) bad("engagement.axialDepthMm", `is deeper than the flute length (${fluteLength} mm)`);
    }
    const ae = engagement.radialDepthMm;
    if (op && OPERATION_RULES[op].fullWidth) {
      if (!optional(ae) && Number.isFinite(diameter) && (!finite(ae) || Math.abs(ae - diameter) > 1e-6 * diameter)) {
        bad("engagement.radialDepthMm", `a ${OPERATION_RULES[op].label} engages the full diameter (${diameter} mm); leave it empty or choose profile/pocket for a partial stepover`);
      }
    } else if (op) {
      if (positive("engagement.radialDepthMm", ae, "given and greater than 0 for this operation") && Number.isFinite(diameter) && ae > diameter) {
        bad("engagement.radialDepthMm", `cannot exceed the cutter diameter (${diameter} mm)`);
      }
    }
    if (!optional(engagement.rampAngleDeg)) {
      if (!finite(engagement.rampAngleDeg) || engagement.rampAngleDeg <= 0 || engagement.rampAngleDeg >= 45) {
        bad("engagement.rampAngleDeg", "must be between 0 and 45 degrees (exclusive)");
      }
    }
  }

  // Options
  if (!optional(raw.workPosition)) {
    const wp = raw.workPosition;
    if (!isObj(wp) || !finite(wp.xMm) || !finite(wp.yMm)) bad("workPosition", "must be { xMm, yMm } numbers");
  }
  if (!optional(raw.workRegion)) {
    const r = raw.workRegion;
    if (!isObj(r) || !finite(r.xMinMm) || !finite(r.xMaxMm) || !finite(r.yMinMm) || !finite(r.yMaxMm)) {
      bad("workRegion", "must be { xMinMm, xMaxMm, yMinMm, yMaxMm } numbers");
    } else {
      if (r.xMaxMm < r.xMinMm) bad("workRegion.xMaxMm", "must not be less than workRegion.xMinMm");
      if (r.yMaxMm < r.yMinMm) bad("workRegion.yMaxMm", "must not be less than workRegion.yMinMm");
    }
  }
  if (!optional(raw.millingDirection) && raw.millingDirection !== "climb" && raw.millingDirection !== "conventional") {
    bad("millingDirection", "must be climb or conventional");
  }
  if (!optional(raw.feedAxis) && raw.feedAxis !== "x" && raw.feedAxis !== "y" && raw.feedAxis !== "any") bad("feedAxis", "must be x, y or any");
  const pref = raw.preferences;
  if (!optional(pref)) {
    if (!isObj(pref)) bad("preferences", "must be an object");
    else {
      if (!optional(pref.cuttingSpeedMPerMin)) positive("preferences.cuttingSpeedMPerMin", pref.cuttingSpeedMPerMin);
      if (!optional(pref.chipLoadMm)) positive("preferences.chipLoadMm", pref.chipLoadMm);
      if (!optional(pref.stabilitySafetyFactor)) {
        if (!finite(pref.stabilitySafetyFactor) || pref.stabilitySafetyFactor <= 0 || pref.stabilitySafetyFactor > 1) {
          bad("preferences.stabilitySafetyFactor", "must be greater than 0 and at most 1");
        }
      }
    }
  }
  if (Object.keys(errors).length > 0) throw new RecommendInputError(errors);
}
