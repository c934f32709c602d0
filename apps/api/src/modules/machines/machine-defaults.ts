/**
 * Starting values for a new machine by kind, for people who have not measured theirs yet. None is
 * a measurement: every defaulted field is listed in `estimatedFields`, and the app labels those
 * values as estimates until the shop measures the machine (dial indicator, tap test).
 *
 * Unless a comment names a reference row, a value is an estimate: common practice, no published
 * source (typical of machines of that kind; not data about any particular machine).
 */
import type { MachineBody, MachineKind } from "@ringdown/contracts";

type Defaults = Omit<MachineBody, "estimatedFields">;

const axis = (a: Defaults["axes"]["x"]) => a;

const gantryRouter: Defaults = {
  name: "New gantry router",
  kind: "gantry_router",
  // A 1.5 kW spindle running 8 000–24 000 rpm is the usual fit on light routers (estimate).
  spindle: { minRpm: 8000, maxRpm: 24000, powerW: 1500, powerCurve: [], dialSettings: [] },
  axes: {
    // Belts on X and Y, a lead screw on Z (estimate). Stiffness at the tool of a few hundred N/mm
    // (estimate); Y is the softer direction because the gantry rides on two belt spans.
    x: axis({ drive: "belt", travelMm: 800, maxFeedMmPerMin: 6000, accelerationMmPerS2: 500, backlashMm: 0.05, movingMassKg: 8, stiffnessNPerMm: 350 }),
    y: axis({ drive: "belt", travelMm: 800, maxFeedMmPerMin: 6000, accelerationMmPerS2: 500, backlashMm: 0.05, movingMassKg: 15, stiffnessNPerMm: 200 }),
    z: axis({ drive: "lead_screw", travelMm: 100, maxFeedMmPerMin: 1500, accelerationMmPerS2: 300, backlashMm: 0.05, movingMassKg: 3, stiffnessNPerMm: 600 }),
  },
  modes: [
    {
      // domain-reference BELT-3: dual-belt gantry, 2 spans of c_sp = 30 000 N over 1 m give
      // 240 000 N/m = 240 N/mm; with 10 kg moving, fn = √(240000/10)/(2π) = 24.656 Hz.
      // Damping ratio 0.03: estimate, common practice, no published source.
      direction: "y",
      frequencyHz: 24.656,
      dampingRatio: 0.03,
      stiffnessNPerMm: 240,
      source: "estimated",
      note: "Gantry on belts (estimate from a belt-stiffness model; measure with a tap test)",
    },
  ],
  // 0.025 mm (≈ 0.001 in) deflection at the tool and a 10 % margin from every mode: common
  // practice, no published source.
  deflectionCeilingMm: 0.025,
  avoidBands: [],
  modeMarginPct: 10,
  notes: "",
};

const benchMill: Defaults = {
  name: "New bench mill",
  kind: "bench_mill",
  // Small mill head with a variable-frequency drive: 100–5 000 rpm, 750 W (estimate).
  spindle: { minRpm: 100, maxRpm: 5000, powerW: 750, powerCurve: [], dialSettings: [] },
  axes: {
    // Ball screws on a small cast frame: thousands of N/mm at the tool (estimate).
    x: axis({ drive: "ball_screw", travelMm: 400, maxFeedMmPerMin: 2500, accelerationMmPerS2: 300, backlashMm: 0.01, movingMassKg: 30, stiffnessNPerMm: 5000 }),
    y: axis({ drive: "ball_screw", travelMm: 180, maxFeedMmPerMin: 2500, accelerationMmPerS2: 300, backlashMm: 0.01, movingMassKg: 45, stiffnessNPerMm: 4000 }),
    z: axis({ drive: "ball_screw", travelMm: 250, maxFeedMmPerMin: 1500, accelerationMmPerS2: 200, backlashMm: 0.01, movingMassKg: 18, stiffnessNPerMm: 8000 }),
  },
  modes: [
    {
      // Head/column bending mode of a small mill in the mid hundreds of Hz (estimate, common
      // practice, no published source).
      direction: "x",
      frequencyHz: 450,
      dampingRatio: 0.04,
      stiffnessNPerMm: 6000,
      source: "estimated",
      note: "Head and column (estimate; measure with a tap test)",
    },
  ],
  deflectionCeilingMm: 0.025,
  avoidBands: [],
  modeMarginPct: 10,
  notes: "",
};

const kneeMill: Defaults = {
  name: "New knee mill",
  kind: "knee_mill",
  // Belt-head knee mill: 70–4 200 rpm, 2.2 kW (estimate).
  spindle: { minRpm: 70, maxRpm: 4200, powerW: 2200, powerCurve: [], dialSettings: [] },
  axes: {
    x: axis({ drive: "ball_screw", travelMm: 760, maxFeedMmPerMin: 3000, accelerationMmPerS2: 300, backlashMm: 0.01, movingMassKg: 150, stiffnessNPerMm: 15000 }),
    y: axis({ drive: "ball_screw", travelMm: 400, maxFeedMmPerMin: 3000, accelerationMmPerS2: 300, backlashMm: 0.01, movingMassKg: 250, stiffnessNPerMm: 12000 }),
    z: axis({ drive: "ball_screw", travelMm: 125, maxFeedMmPerMin: 1500, accelerationMmPerS2: 200, backlashMm: 0.01, movingMassKg: 40, stiffnessNPerMm: 20000 }),
  },
  modes: [
    {
      // Ram and head mode of a knee mill around a few hundred Hz (estimate).
      direction: "y",
      frequencyHz: 250,
      dampingRatio: 0.04,
      stiffnessNPerMm: 15000,
      source: "estimated",
      note: "Ram and head (estimate; measure with a tap test)",
    },
  ],
  deflectionCeilingMm: 0.025,
  avoidBands: [],
  modeMarginPct: 10,
  notes: "",
};

const machiningCentre: Defaults = {
  name: "New machining centre",
  kind: "machining_centre",
  // Small vertical machining centre: 100–10 000 rpm, 7.5 kW (estimate).
  spindle: { minRpm: 100, maxRpm: 10000, powerW: 7500, powerCurve: [], dialSettings: [] },
  axes: {
    x: axis({ drive: "ball_screw", travelMm: 760, maxFeedMmPerMin: 20000, accelerationMmPerS2: 3000, backlashMm: 0.005, movingMassKg: 300, stiffnessNPerMm: 40000 }),
    y: axis({ drive: "ball_screw", travelMm: 400, maxFeedMmPerMin: 20000, accelerationMmPerS2: 3000, backlashMm: 0.005, movingMassKg: 400, stiffnessNPerMm: 35000 }),
    z: axis({ drive: "ball_screw", travelMm: 500, maxFeedMmPerMin: 20000, accelerationMmPerS2: 3000, backlashMm: 0.005, movingMassKg: 200, stiffnessNPerMm: 50000 }),
  },
  modes: [
    {
      // Spindle/holder mode of a small machining centre near 800 Hz (estimate).
      direction: "x",
      frequencyHz: 800,
      dampingRatio: 0.03,
      stiffnessNPerMm: 30000,
      source: "estimated",
      note: "Spindle and holder (estimate; measure with a tap test)",
    },
  ],
  deflectionCeilingMm: 0.025,
  avoidBands: [],
  modeMarginPct: 10,
  notes: "",
};

/** Anything else: the bench mill's middle-of-the-road values under another name. */
const other: Defaults = { ...benchMill, name: "New machine", kind: "other", modes: benchMill.modes.map((m) => ({ ...m })) };

const byKind: Record<MachineKind, Defaults> = {
  gantry_router: gantryRouter,
  bench_mill: benchMill,
  knee_mill: kneeMill,
  machining_centre: machiningCentre,
  other,
};

/** Fields that identify or describe the machine rather than estimate a quantity. */
const notEstimates = new Set(["name", "kind", "notes"]);

/** Dot paths of every value in `defaults` (array items as a whole, e.g. "modes.0"). */
function leafPaths(value: unknown, prefix: string): string[] {
  if (Array.isArray(value)) return value.map((_, i) => `${prefix}.${i}`);
  if (value !== null && typeof value === "object") {
    return Object.entries(value).flatMap(([k, v]) => leafPaths(v, prefix ? `${prefix}.${k}` : k));
  }
  return [prefix];
}

/** A full machine body of defaults for `kind`, with every defaulted field listed as an estimate. */
export function machineDefaults(kind: MachineKind): MachineBody {
  const defaults = structuredClone(byKind[kind]);
  const estimatedFields = Object.entries(defaults)
    .filter(([key]) => !notEstimates.has(key))
    .flatMap(([key, value]) => leafPaths(value, key));
  return { ...defaults, estimatedFields };
}
