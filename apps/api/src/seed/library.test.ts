import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { assemblySchema, cutterSchema, machineSchema, materialSchema } from "@ringdown/contracts";
import { listAssemblies } from "../modules/assemblies/assemblies.repository.js";
import { listCutters } from "../modules/cutters/cutters.repository.js";
import { listMachines } from "../modules/machines/machines.repository.js";
import { findVisibleMaterial } from "../modules/materials/materials.repository.js";
import { ShopModel } from "../modules/shops/shop.model.js";
import { connectTestDatabase, disconnectTestDatabase } from "../test/harness.js";
import { demoAssemblyIds, demoCutterIds, demoMachineIds, demoMaterialIds, demoShopIds } from "./demo-ids.js";
import { demoLibraryCounts, seedLibrary } from "./library.js";

connectTestDatabase();
afterAll(disconnectTestDatabase);

const Q = demoShopIds.quillfeather;
const page = { page: 1, pageSize: 200, deleted: false } as const;

beforeAll(async () => {
  // The library needs only the shops (people come from their own seed module and test).
  await ShopModel.findOrCreate({ where: { id: Q }, defaults: { id: Q, name: "Quillfeather Fixture Works" } });
  await ShopModel.findOrCreate({ where: { id: demoShopIds.ostrander }, defaults: { id: demoShopIds.ostrander, name: "Ostrander Sign & Panel" } });
  await seedLibrary();
});

describe("demo library seed", () => {
  it("is idempotent and creates every record under its fixed id", async () => {
    expect(await seedLibrary()).toBe(0);
    const machines = (await listMachines(Q, { ...page })).items.map((m) => machineSchema.parse(m));
    expect(machines.map((m) => m.id).sort()).toEqual([demoMachineIds.heronRouter, demoMachineIds.wrenMill].sort());
    const cutters = (await listCutters(Q, { ...page, sort: "name", dir: "asc" })).items.map((c) => cutterSchema.parse(c));
    const assemblies = (await listAssemblies(Q, { ...page })).items.map((a) => assemblySchema.parse(a));
    const ostranderIds = [demoCutterIds.ostranderUpcut635, demoCutterIds.ostranderVee90];
    expect(cutters).toHaveLength(Object.keys(demoCutterIds).length - ostranderIds.length);
    expect(assemblies.length + 2).toBe(demoLibraryCounts.assemblies);
    expect(assemblies.map((a) => a.id)).toContain(demoAssemblyIds.heronFlat6);
    expect(cutters.map((c) => c.id)).not.toEqual(expect.arrayContaining(ostranderIds));
  });

  it("gives Quillfeather two machines of clearly different stiffness, with their modes", async () => {
    const machines = new Map((await listMachines(Q, { ...page })).items.map((m) => [m.id, m]));
    const router = machines.get(demoMachineIds.heronRouter)!;
    const mill = machines.get(demoMachineIds.wrenMill)!;

    expect(router.kind).toBe("gantry_router");
    expect([router.axes.x.drive, router.axes.y.drive]).toEqual(["belt", "belt"]);
    expect([router.axes.x.travelMm, router.axes.y.travelMm]).toEqual([2500, 1250]);
    for (const a of ["x", "y", "z"] as const) {
      expect(router.axes[a].stiffnessNPerMm).toBeGreaterThanOrEqual(300);
      expect(router.axes[a].stiffnessNPerMm).toBeLessThanOrEqual(600);
      expect(mill.axes[a].drive).toBe("ball_screw");
      expect(mill.axes[a].stiffnessNPerMm).toBeGreaterThanOrEqual(3000);
      expect(mill.axes[a].stiffnessNPerMm).toBeLessThanOrEqual(8000);
    }
    expect(router.spindle.dialSettings.length).toBeGreaterThanOrEqual(5);
    expect(router.spindle.dialSettings.every((d) => d.rpm >= router.spindle.minRpm && d.rpm <= router.spindle.maxRpm)).toBe(true);

    const hz = (m: typeof router) => m.modes.map((x) => x.frequencyHz);
    expect(hz(router).some((f) => f > 20 && f < 30)).toBe(true);
    expect(hz(router).some((f) => f > 650 && f < 750)).toBe(true);
    expect(hz(mill).some((f) => f > 400 && f < 500)).toBe(true);

    // Self-consistency, by hand (springs in series, domain-reference §9): per direction the static
    // stiffness is the modes' stiffnesses in series, 1/k = Σ 1/k_i.
    for (const a of ["x", "y"] as const) {
      const series = 1 / router.modes.filter((m) => m.direction === a).reduce((s, m) => s + 1 / m.stiffnessNPerMm, 0);
      expect(Math.abs(series - router.axes[a].stiffnessNPerMm) / router.axes[a].stiffnessNPerMm).toBeLessThan(0.01);
    }
  });

  it("gives a dozen cutters of every kind the demo needs, with no real brands", async () => {
    const cutters = (await listCutters(Q, { ...page, sort: "name", dir: "asc" })).items;
    expect(cutters.length).toBeGreaterThanOrEqual(12);
    const shapes = new Set(cutters.map((c) => c.shape));
    for (const s of ["flat", "ball", "vee", "compression", "up_spiral", "down_spiral", "drill"] as const) expect(shapes).toContain(s);
    expect(new Set(cutters.map((c) => c.toolMaterial))).toEqual(new Set(["carbide", "hss"]));
    expect(new Set(cutters.map((c) => c.status))).toEqual(new Set(["proposed", "approved", "retired"]));
    expect(cutters.every((c) => c.maker === "house stock" || c.maker === "")).toBe(true);
  });

  it("puts assemblies on the shop's own machines and cutters, including the poor collet", async () => {
    const assemblies = (await listAssemblies(Q, { ...page })).items;
    expect(assemblies.length).toBeGreaterThanOrEqual(8);
    expect(assemblies.every((a) => a.cutterStatus !== "retired")).toBe(true);
    expect(new Set(assemblies.map((a) => a.machineId))).toEqual(new Set([demoMachineIds.heronRouter, demoMachineIds.wrenMill]));
    const poor = assemblies.find((a) => a.id === demoAssemblyIds.heronUpcut3175PoorAdapter)!;
    expect(poor.runoutMm).toBe(0.08);
    expect(poor.cutterDiameterMm).toBe(3.175);
  });

  it("adds Quillfeather's adjusted copy of a global material", async () => {
    const copy = materialSchema.parse(await findVisibleMaterial(Q, demoMaterialIds.quillfeatherBirchPly18));
    expect(copy).toMatchObject({ shopId: Q, readOnly: false });
    const source = materialSchema.parse(await findVisibleMaterial(Q, copy.copiedFromId!));
    expect(source.readOnly).toBe(true);
    expect(copy.chipLoad.map((p) => p.maxMm)).toEqual(source.chipLoad.map((p) => Number((p.maxMm * 0.9).toFixed(3))));
  });
});
