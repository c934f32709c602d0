/** Fixed ids of the invented demo records, so every seed module can refer to them and stay idempotent. */
export const demoShopIds = {
  quillfeather: "6d1c2a57-3f0e-4b8a-9c41-0a7f5e2b9d01",
  ostrander: "6d1c2a57-3f0e-4b8a-9c41-0a7f5e2b9d02",
} as const;

export const demoUserIds = {
  maren: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a01",
  imke: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a02",
  teodor: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a03",
  sunniva: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a04",
  callum: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a05",
  halvard: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a06",
} as const;

/** Demo machines (seed/library.ts). */
export const demoMachineIds = {
  /** Quillfeather: belt-driven gantry router, 2500 × 1250 mm, trim-router spindle with a speed dial. */
  heronRouter: "c7b2e4d1-8a3f-4c6e-9d10-2f5a7b9c0e01",
  /** Quillfeather: ball-screw bench mill, much stiffer. */
  wrenMill: "c7b2e4d1-8a3f-4c6e-9d10-2f5a7b9c0e02",
  /** Ostrander: rack-and-pinion sign router. */
  ostranderRouter: "c7b2e4d1-8a3f-4c6e-9d10-2f5a7b9c0e03",
} as const;

/** Demo cutters (seed/library.ts). */
export const demoCutterIds = {
  flat6Carbide: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b01",
  upcut3175Single: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b02",
  compression635: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b03",
  downcut635: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b04",
  flat127Carbide: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b05",
  ball6Carbide: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b06",
  ball3Proposed: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b07",
  vee60: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b08",
  chamfer90Hss: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b09",
  flat6Hss3Flute: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b10",
  flat10HssRetired: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b11",
  drill5Hss: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b12",
  flat8AluCarbide: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b13",
  /** Ostrander */
  ostranderVee90: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b21",
  ostranderUpcut635: "d4a9f0b3-6e2c-4a7d-8b15-3c6e8f1a2b22",
} as const;

/** Demo cutter assemblies (seed/library.ts): cutter × holder × machine, with stick-out and runout. */
export const demoAssemblyIds = {
  /** Heron router */
  heronFlat6: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c01",
  /** The poor one: 1/8 in cutter in a sleeve adapter, 0.08 mm TIR. */
  heronUpcut3175PoorAdapter: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c02",
  heronCompression635: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c03",
  heronDowncut635: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c04",
  heronFlat127: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c05",
  heronVee60: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c06",
  heronBall6: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c07",
  /** Wren bench mill */
  wrenFlat6Hss: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c08",
  wrenFlat8Alu: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c09",
  wrenDrill5: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c10",
  /** Ostrander */
  ostranderVee90: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c21",
  ostranderUpcut635: "e8c1d2f3-4b5a-4e6f-9a70-4d7f9a2b3c22",
} as const;

/** Shop-owned demo materials (copies of global rows, adjusted). Global rows are found by `global_key`. */
export const demoMaterialIds = {
  /** Quillfeather's copy of "plywood-birch" for the 18 mm sheets they buy. */
  quillfeatherBirchPly18: "f2d3e4a5-7c8b-4d9e-8f01-5e8a0b3c4d01",
} as const;
