/**
 * Demo library (all invented): machines with their modes, cutters, cutter assemblies and one
 * adjusted shop material, mostly for Quillfeather Fixture Works. Nothing here describes a real
 * machine, product or maker; "house stock" marks cutters bought unbranded.
 * Idempotent: records have fixed ids (demo-ids.ts) and are created only when missing, so edits
 * made through the app survive a restart.
 */
import {
  assemblyBodySchema,
  cutterBodySchema,
  machineBodySchema,
  materialBodySchema,
  type AssemblyBody,
  type CutterBody,
  type CutterStatus,
  type MachineBody,
} from "@ringdown/contracts";
import { inTransaction, type Tx } from "../db/sequelize.js";
import { AssemblyModel } from "../modules/assemblies/assembly.model.js";
import { CutterModel } from "../modules/cutters/cutter.model.js";
import { MachineModeModel } from "../modules/machines/machine-mode.model.js";
import { MachineModel } from "../modules/machines/machine.model.js";
import { MaterialModel } from "../modules/materials/material.model.js";
import { demoAssemblyIds, demoCutterIds, demoMachineIds, demoMaterialIds, demoShopIds } from "./demo-ids.js";

const Q = demoShopIds.quillfeather;
const O = demoShopIds.ostrander;

// ---------------------------------------------------------------- machines
// Invented but self-consistent: the static stiffness per direction is the modes' springs in series
// (Heron X: 1/(1/540 + 1/1900) = 420 N/mm; Y: 1/(1/410 + 1/1700) = 330 N/mm), and each low mode's
// stiffness and frequency give its moving mass (m = k/(2πf)²: X 540 000/(2π·23.8)² = 24 kg, Y 17 kg).
const machines: Array<{ id: string; shopId: string; body: MachineBody }> = [
  {
    id: demoMachineIds.heronRouter,
    shopId: Q,
    body: machineBodySchema.parse({
      name: "Heron — belt gantry router",
      kind: "gantry_router",
      spindle: {
        minRpm: 11200,
        maxRpm: 30100,
        powerW: 900,
        powerCurve: [],
        // Trim-router spindle with a numbered dial; each setting measured with an optical tachometer.
        dialSettings: [
          { label: "1", rpm: 11200, measured: true },
          { label: "2", rpm: 14600, measured: true },
          { label: "3", rpm: 18900, measured: true },
          { label: "4", rpm: 22700, measured: true },
          { label: "5", rpm: 26400, measured: true },
          { label: "6", rpm: 30100, measured: true },
        ],
      },
      axes: {
        // X is the long axis (gantry on two belts), Y the carriage on the beam, Z a lead screw.
        x: { drive: "belt", travelMm: 2500, maxFeedMmPerMin: 10000, accelerationMmPerS2: 800, backlashMm: 0.05, movingMassKg: 24, stiffnessNPerMm: 420 },
        y: { drive: "belt", travelMm: 1250, maxFeedMmPerMin: 10000, accelerationMmPerS2: 800, backlashMm: 0.04, movingMassKg: 17, stiffnessNPerMm: 330 },
        z: { drive: "lead_screw", travelMm: 150, maxFeedMmPerMin: 3000, accelerationMmPerS2: 400, backlashMm: 0.08, movingMassKg: 6, stiffnessNPerMm: 600 },
      },
      modes: [
        { direction: "x", frequencyHz: 23.8, dampingRatio: 0.035, stiffnessNPerMm: 540, source: "measured", note: "Gantry on its belts; tap test at mid-table" },
        { direction: "y", frequencyHz: 24.6, dampingRatio: 0.032, stiffnessNPerMm: 410, source: "measured", note: "Carriage on the beam belt; tap test at mid-beam" },
        { direction: "x", frequencyHz: 702, dampingRatio: 0.025, stiffnessNPerMm: 1900, source: "measured", note: "Spindle and tool; tap on a 6 mm cutter at 20 mm stick-out" },
        { direction: "y", frequencyHz: 688, dampingRatio: 0.027, stiffnessNPerMm: 1700, source: "measured", note: "Spindle and tool; tap on a 6 mm cutter at 20 mm stick-out" },
      ],
      deflectionCeilingMm: 0.05,
      avoidBands: [],
      modeMarginPct: 10,
      estimatedFields: ["axes.x.movingMassKg", "axes.y.movingMassKg", "axes.z.movingMassKg", "axes.z.stiffnessNPerMm"],
      notes:
        "Stiffness measured with a dial indicator and a spring scale at the collet nut, carriage at mid-beam. " +
        "Wood, plastics and the occasional aluminium plate; deflection ceiling relaxed to 0.05 mm for wood work.",
    }),
  },
  {
    id: demoMachineIds.wrenMill,
    shopId: Q,
    body: machineBodySchema.parse({
      name: "Wren — ball-screw bench mill",
      kind: "bench_mill",
      spindle: {
        minRpm: 100,
        maxRpm: 6000,
        powerW: 1100,
        // Constant torque below 3000 rpm on its inverter, constant power above.
        powerCurve: [
          { rpm: 500, powerW: 185 },
          { rpm: 1500, powerW: 550 },
          { rpm: 3000, powerW: 1100 },
          { rpm: 6000, powerW: 1100 },
        ],
        dialSettings: [],
      },
      axes: {
        x: { drive: "ball_screw", travelMm: 400, maxFeedMmPerMin: 2500, accelerationMmPerS2: 300, backlashMm: 0.01, movingMassKg: 32, stiffnessNPerMm: 5200 },
        y: { drive: "ball_screw", travelMm: 180, maxFeedMmPerMin: 2500, accelerationMmPerS2: 300, backlashMm: 0.012, movingMassKg: 45, stiffnessNPerMm: 3600 },
        z: { drive: "ball_screw", travelMm: 280, maxFeedMmPerMin: 1500, accelerationMmPerS2: 200, backlashMm: 0.01, movingMassKg: 18, stiffnessNPerMm: 7800 },
      },
      modes: [
        { direction: "x", frequencyHz: 452, dampingRatio: 0.04, stiffnessNPerMm: 9000, source: "measured", note: "Head nodding on the column; tap test on a 10 mm gauge pin" },
        { direction: "y", frequencyHz: 438, dampingRatio: 0.045, stiffnessNPerMm: 6500, source: "measured", note: "Head twisting; tap test on a 10 mm gauge pin" },
      ],
      deflectionCeilingMm: 0.02,
      avoidBands: [{ minHz: 96, maxHz: 104, note: "Coolant pump on the same bench" }],
      modeMarginPct: 10,
      estimatedFields: ["axes.x.movingMassKg", "axes.y.movingMassKg", "axes.z.movingMassKg"],
      notes: "Aluminium and brass fixture parts, some mild steel. Gibs adjusted this spring.",
    }),
  },
  {
    id: demoMachineIds.ostranderRouter,
    shopId: O,
    body: machineBodySchema.parse({
      name: "Sign router — rack and pinion",
      kind: "gantry_router",
      spindle: { minRpm: 6000, maxRpm: 24000, powerW: 3000, powerCurve: [], dialSettings: [] },
      axes: {
        x: { drive: "rack_pinion", travelMm: 3050, maxFeedMmPerMin: 20000, accelerationMmPerS2: 1500, backlashMm: 0.03, movingMassKg: 60, stiffnessNPerMm: 900 },
        y: { drive: "rack_pinion", travelMm: 1550, maxFeedMmPerMin: 20000, accelerationMmPerS2: 1500, backlashMm: 0.03, movingMassKg: 25, stiffnessNPerMm: 800 },
        z: { drive: "ball_screw", travelMm: 200, maxFeedMmPerMin: 5000, accelerationMmPerS2: 800, backlashMm: 0.01, movingMassKg: 12, stiffnessNPerMm: 2500 },
      },
      modes: [{ direction: "x", frequencyHz: 38, dampingRatio: 0.04, stiffnessNPerMm: 1400, source: "estimated", note: "Gantry on racks (estimate)" }],
      deflectionCeilingMm: 0.05,
      avoidBands: [],
      modeMarginPct: 10,
      estimatedFields: ["modes.0", "axes.x.stiffnessNPerMm", "axes.y.stiffnessNPerMm", "axes.z.stiffnessNPerMm"],
      notes: "PVC foam, acrylic and aluminium composite panels for signs.",
    }),
  },
];

// ---------------------------------------------------------------- cutters
type SeedCutter = { id: string; shopId: string; status: CutterStatus; body: CutterBody };
const cutter = (id: string, shopId: string, status: CutterStatus, body: Partial<CutterBody>): SeedCutter => ({
  id,
  shopId,
  status,
  body: cutterBodySchema.parse({ maker: "house stock", maxRpm: null, helixDeg: 0, cornerRadiusMm: 0, ...body }),
});

const cutters: SeedCutter[] = [
  cutter(demoCutterIds.flat6Carbide, Q, "approved", {
    name: "6 mm flat, 2-flute carbide", shape: "flat", diameterMm: 6, flutes: 2, fluteLengthMm: 22, overallLengthMm: 60,
    shankDiameterMm: 6, helixDeg: 30, toolMaterial: "carbide", maxRpm: 30000, partNumber: "QF-E6-2",
    notes: "General pocketing in hardwood and plastics.",
  }),
  cutter(demoCutterIds.upcut3175Single, Q, "approved", {
    name: "1/8 in single-flute up-cut", shape: "up_spiral", diameterMm: 3.175, flutes: 1, fluteLengthMm: 12.7,
    overallLengthMm: 38.1, shankDiameterMm: 3.175, helixDeg: 30, toolMaterial: "carbide", maxRpm: 30000,
    notes: "Acrylic and HDPE; the single flute clears melted chips.",
  }),
  cutter(demoCutterIds.compression635, Q, "approved", {
    name: "1/4 in compression, 2-flute", shape: "compression", diameterMm: 6.35, flutes: 2, fluteLengthMm: 22.2,
    overallLengthMm: 63.5, shankDiameterMm: 6.35, helixDeg: 20, toolMaterial: "carbide", maxRpm: 24000,
    notes: "Clean top and bottom edges on veneered plywood; plunge deeper than the up-cut length.",
  }),
  cutter(demoCutterIds.downcut635, Q, "approved", {
    name: "1/4 in down-cut, 2-flute", shape: "down_spiral", diameterMm: 6.35, flutes: 2, fluteLengthMm: 25.4,
    overallLengthMm: 63.5, shankDiameterMm: 6.35, helixDeg: 25, toolMaterial: "carbide", maxRpm: 24000,
    notes: "Shallow pockets with a crisp top edge; chips pack in deep slots.",
  }),
  cutter(demoCutterIds.flat127Carbide, Q, "approved", {
    name: "1/2 in flat, 2-flute carbide", shape: "flat", diameterMm: 12.7, flutes: 2, fluteLengthMm: 31.75,
    overallLengthMm: 76.2, shankDiameterMm: 12.7, helixDeg: 30, toolMaterial: "carbide", maxRpm: 18000,
    notes: "Surfacing and large pockets. Heavy for the router: keep engagement light.",
  }),
  cutter(demoCutterIds.ball6Carbide, Q, "approved", {
    name: "6 mm ball nose, 2-flute", shape: "ball", diameterMm: 6, flutes: 2, fluteLengthMm: 18, overallLengthMm: 60,
    shankDiameterMm: 6, helixDeg: 30, cornerRadiusMm: 3, toolMaterial: "carbide", maxRpm: 30000,
    notes: "3D finishing in hardwood and tooling board.",
  }),
  cutter(demoCutterIds.ball3Proposed, Q, "proposed", {
    name: "3 mm ball nose, 2-flute", shape: "ball", diameterMm: 3, flutes: 2, fluteLengthMm: 10, overallLengthMm: 38,
    shankDiameterMm: 3, helixDeg: 30, cornerRadiusMm: 1.5, toolMaterial: "carbide", maker: "",
    notes: "Proposed for fine relief work on the fixture nameplates.",
  }),
  cutter(demoCutterIds.vee60, Q, "approved", {
    name: "60° V-bit, 1/2 in", shape: "vee", diameterMm: 12.7, flutes: 2, fluteLengthMm: 11, overallLengthMm: 50.8,
    shankDiameterMm: 6.35, tipAngleDeg: 60, toolMaterial: "carbide", maxRpm: 24000,
    notes: "Engraving part numbers and V-carved labels.",
  }),
  cutter(demoCutterIds.chamfer90Hss, Q, "approved", {
    name: "90° chamfer mill, 10 mm HSS", shape: "chamfer", diameterMm: 10, flutes: 3, fluteLengthMm: 5,
    overallLengthMm: 50, shankDiameterMm: 10, tipAngleDeg: 90, toolMaterial: "hss", coating: "TiN",
    notes: "Edge breaks on aluminium fixture plates (bench mill).",
  }),
  cutter(demoCutterIds.flat6Hss3Flute, Q, "approved", {
    name: "6 mm flat, 3-flute HSS", shape: "flat", diameterMm: 6, flutes: 3, fluteLengthMm: 13, overallLengthMm: 57,
    shankDiameterMm: 6, helixDeg: 30, toolMaterial: "hss", coating: "TiN",
    notes: "Mild steel and brass on the bench mill.",
  }),
  cutter(demoCutterIds.flat10HssRetired, Q, "retired", {
    name: "10 mm flat, 4-flute HSS (worn set)", shape: "flat", diameterMm: 10, flutes: 4, fluteLengthMm: 22,
    overallLengthMm: 72, shankDiameterMm: 10, helixDeg: 30, toolMaterial: "hss", maker: "",
    notes: "Retired: the set is dull; replaced by the 8 mm carbide for aluminium.",
  }),
  cutter(demoCutterIds.drill5Hss, Q, "approved", {
    name: "5 mm jobber drill, HSS", shape: "drill", diameterMm: 5, flutes: 2, fluteLengthMm: 52, overallLengthMm: 86,
    shankDiameterMm: 5, helixDeg: 30, tipAngleDeg: 118, toolMaterial: "hss",
    notes: "Tapping holes for M6 fixture screws.",
  }),
  cutter(demoCutterIds.flat8AluCarbide, Q, "approved", {
    name: "8 mm flat, 3-flute carbide for aluminium", shape: "flat", diameterMm: 8, flutes: 3, fluteLengthMm: 20,
    overallLengthMm: 63, shankDiameterMm: 8, helixDeg: 45, cornerRadiusMm: 0.5, toolMaterial: "carbide", coating: "ZrN",
    maxRpm: 20000, partNumber: "QF-AL8-3", notes: "Polished flutes; use air blast or mist.",
  }),
  cutter(demoCutterIds.ostranderVee90, O, "approved", {
    name: "90° V-bit, 1/2 in", shape: "vee", diameterMm: 12.7, flutes: 2, fluteLengthMm: 6.35, overallLengthMm: 50.8,
    shankDiameterMm: 6.35, tipAngleDeg: 90, toolMaterial: "carbide", maxRpm: 24000, notes: "Sign lettering.",
  }),
  cutter(demoCutterIds.ostranderUpcut635, O, "approved", {
    name: "1/4 in single-flute up-cut", shape: "up_spiral", diameterMm: 6.35, flutes: 1, fluteLengthMm: 22.2,
    overallLengthMm: 63.5, shankDiameterMm: 6.35, helixDeg: 30, toolMaterial: "carbide", maxRpm: 24000,
    notes: "Cutting out PVC foam and acrylic letters.",
  }),
];

// ---------------------------------------------------------------- assemblies
type SeedAssembly = { id: string; shopId: string; body: AssemblyBody };
const assembly = (id: string, shopId: string, body: Omit<AssemblyBody, "notes"> & { notes?: string }): SeedAssembly => ({
  id,
  shopId,
  body: assemblyBodySchema.parse(body),
});
const heron = demoMachineIds.heronRouter;
const wren = demoMachineIds.wrenMill;

const assemblies: SeedAssembly[] = [
  assembly(demoAssemblyIds.heronFlat6, Q, {
    machineId: heron, cutterId: demoCutterIds.flat6Carbide, holder: "ER20 collet, 6 mm", stickoutMm: 20, runoutMm: 0.01,
  }),
  assembly(demoAssemblyIds.heronUpcut3175PoorAdapter, Q, {
    machineId: heron, cutterId: demoCutterIds.upcut3175Single, holder: "1/8 in sleeve adapter in the 1/4 in collet",
    stickoutMm: 15, runoutMm: 0.08,
    notes: "Indicated 0.08 mm TIR on the shank. Two cutters broken this month; a true 1/8 in collet is on order.",
  }),
  assembly(demoAssemblyIds.heronCompression635, Q, {
    machineId: heron, cutterId: demoCutterIds.compression635, holder: "ER20 collet, 1/4 in", stickoutMm: 25, runoutMm: 0.015,
  }),
  assembly(demoAssemblyIds.heronDowncut635, Q, {
    machineId: heron, cutterId: demoCutterIds.downcut635, holder: "ER20 collet, 1/4 in", stickoutMm: 24, runoutMm: 0.012,
  }),
  assembly(demoAssemblyIds.heronFlat127, Q, {
    machineId: heron, cutterId: demoCutterIds.flat127Carbide, holder: "ER20 collet, 1/2 in", stickoutMm: 32, runoutMm: 0.02,
  }),
  assembly(demoAssemblyIds.heronVee60, Q, {
    machineId: heron, cutterId: demoCutterIds.vee60, holder: "ER20 collet, 1/4 in", stickoutMm: 18, runoutMm: 0.01,
  }),
  assembly(demoAssemblyIds.heronBall6, Q, {
    machineId: heron, cutterId: demoCutterIds.ball6Carbide, holder: "ER20 collet, 6 mm", stickoutMm: 22, runoutMm: 0.01,
  }),
  assembly(demoAssemblyIds.wrenFlat6Hss, Q, {
    machineId: wren, cutterId: demoCutterIds.flat6Hss3Flute, holder: "ER25 collet chuck, 6 mm", stickoutMm: 18, runoutMm: 0.008,
  }),
  assembly(demoAssemblyIds.wrenFlat8Alu, Q, {
    machineId: wren, cutterId: demoCutterIds.flat8AluCarbide, holder: "ER25 collet chuck, 8 mm", stickoutMm: 22, runoutMm: 0.006,
  }),
  assembly(demoAssemblyIds.wrenDrill5, Q, {
    machineId: wren, cutterId: demoCutterIds.drill5Hss, holder: "Keyless drill chuck", stickoutMm: 45, runoutMm: 0.03,
  }),
  assembly(demoAssemblyIds.ostranderVee90, O, {
    machineId: demoMachineIds.ostranderRouter, cutterId: demoCutterIds.ostranderVee90, holder: "ER32 collet, 1/4 in",
    stickoutMm: 20, runoutMm: 0.01,
  }),
  assembly(demoAssemblyIds.ostranderUpcut635, O, {
    machineId: demoMachineIds.ostranderRouter, cutterId: demoCutterIds.ostranderUpcut635, holder: "ER32 collet, 1/4 in",
    stickoutMm: 25, runoutMm: 0.012,
  }),
];

// ---------------------------------------------------------------- shop materials
async function seedShopMaterials(tx: Tx): Promise<number> {
  if (await MaterialModel.findByPk(demoMaterialIds.quillfeatherBirchPly18, { transaction: tx })) return 0;
  const source = await MaterialModel.findOne({ where: { globalKey: "plywood-birch" }, transaction: tx });
  if (!source) throw new Error("the global material library is missing (it is loaded by migrate())");
  const body = materialBodySchema.parse({
    name: "Birch plywood 18 mm (our supplier)",
    group: source.materialGroup,
    hardness: source.hardness,
    cuttingSpeed: source.cuttingSpeed,
    // The supplier's sheets have a harder glue line: the upper chip loads trimmed by ~10 %.
    chipLoad: source.chipLoad.map((p) => ({ ...p, maxMm: Number((p.maxMm * 0.9).toFixed(3)) })),
    kc11NPerMm2: source.kc11NPerMm2,
    mc: source.mc,
    unitPowerJPerMm3: source.unitPowerJPerMm3,
    minChipThicknessMm: source.minChipThicknessMm,
    sourceNote: `Copied from the global “${source.name}”; upper chip loads trimmed 10 % after test cuts in our sheets (shop note). ${source.sourceNote}`,
  });
  await MaterialModel.create(
    {
      id: demoMaterialIds.quillfeatherBirchPly18,
      shopId: Q,
      copiedFromId: source.id,
      name: body.name,
      materialGroup: body.group,
      hardness: body.hardness,
      cuttingSpeed: body.cuttingSpeed,
      chipLoad: body.chipLoad,
      kc11NPerMm2: body.kc11NPerMm2,
      mc: body.mc,
      unitPowerJPerMm3: body.unitPowerJPerMm3,
      minChipThicknessMm: body.minChipThicknessMm,
      sourceNote: body.sourceNote,
    },
    { transaction: tx },
  );
  return 1;
}

/** Returns how many records it created (0 on a second run). Runs after people and shops. */
export async function seedLibrary(): Promise<number> {
  return inTransaction(async (transaction) => {
    let created = await seedShopMaterials(transaction);
    for (const m of machines) {
      const { modes, ...columns } = m.body;
      const [, isNew] = await MachineModel.findOrCreate({
        where: { id: m.id },
        defaults: { id: m.id, shopId: m.shopId, ...columns },
        transaction,
      });
      if (!isNew) continue;
      created++;
      await MachineModeModel.bulkCreate(
        modes.map((mode) => ({ ...mode, shopId: m.shopId, machineId: m.id })),
        { transaction },
      );
      created += modes.length;
    }
    for (const c of cutters) {
      const [, isNew] = await CutterModel.findOrCreate({
        where: { id: c.id },
        defaults: { id: c.id, shopId: c.shopId, status: c.status, ...c.body },
        transaction,
      });
      if (isNew) created++;
    }
    for (const a of assemblies) {
      const [, isNew] = await AssemblyModel.findOrCreate({
        where: { id: a.id },
        defaults: { id: a.id, shopId: a.shopId, ...a.body },
        transaction,
      });
      if (isNew) created++;
    }
    return created;
  });
}

/** Counts for tests and the seed's README. */
export const demoLibraryCounts = {
  machines: machines.length,
  modes: machines.reduce((n, m) => n + m.body.modes.length, 0),
  cutters: cutters.length,
  assemblies: assemblies.length,
  shopMaterials: 1,
};
