import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { recordingDetailSchema, stiffnessMapSchema } from "@ringdown/contracts";
import { disconnectTestDatabase, makeTestApp } from "../test/harness.js";
import { LocalDirectoryStorage } from "../storage/local-directory-storage.js";
import { listBacklash } from "../modules/backlash/backlash.service.js";
import { listMachineModes } from "../modules/modes/modes.service.js";
import { machineRecordings, recordingDetail } from "../modules/recordings/recordings.service.js";
import { stiffnessMap } from "../modules/stiffness/stiffness.service.js";
import { getMachine } from "../modules/machines/machines.service.js";
import { demoMachineIds, demoShopIds } from "./demo-ids.js";
import { seedDemo } from "./index.js";
import { demoRecordingIds, seedVibration } from "./vibration.js";

makeTestApp();
let storageDir: string;
beforeAll(async () => {
  storageDir = await mkdtemp(path.join(tmpdir(), "ringdown-seed-vibration-"));
  await seedDemo();
  // Idempotent with its own storage too: a second run creates nothing.
  expect(await seedVibration(new LocalDirectoryStorage(storageDir))).toBe(0);
});
afterAll(async () => {
  await disconnectTestDatabase();
  await rm(storageDir, { recursive: true, force: true });
});

const Q = demoShopIds.quillfeather;

describe("demo vibration profiles", () => {
  it("the router's map is softest with the gantry mid-travel and the carriage mid-beam, and its worst case is the machine's value", async () => {
    const map = stiffnessMapSchema.parse(await stiffnessMap(Q, demoMachineIds.heronRouter, 21));
    const machine = await getMachine(Q, demoMachineIds.heronRouter);
    for (const d of ["x", "y", "z"] as const) {
      const dir = map.directions.find((m) => m.direction === d)!;
      expect(dir.pointCount).toBeGreaterThanOrEqual(3);
      // Seeded readings: 42 N / 0.10 mm = 420 N/mm (X), 33 N / 0.10 mm = 330 N/mm (Y), 60 N / 0.10 mm = 600 N/mm (Z).
      expect(dir.minNPerMm).toBeCloseTo(machine.axes[d].stiffnessNPerMm, 6);
    }
    const x = map.directions.find((m) => m.direction === "x")!;
    expect(x.softestAt).toEqual({ xMm: 1250, yMm: 625 });
    expect(x.maxNPerMm! / x.minNPerMm!).toBeGreaterThan(1.5);
    expect(map.readings.length).toBe(21);
  });

  it("both machines carry readings, backlash, modes and one analysed recording", async () => {
    for (const id of [demoMachineIds.heronRouter, demoMachineIds.wrenMill]) {
      const map = await stiffnessMap(Q, id, 5);
      expect(map.readings.length).toBeGreaterThanOrEqual(10);
      expect((await listBacklash(Q, id)).items.length).toBeGreaterThanOrEqual(3);
      expect((await listMachineModes(Q, id)).items.length).toBeGreaterThanOrEqual(2);
      const list = await machineRecordings(Q, id, undefined);
      expect(list.items.filter((r) => r.status === "done").length).toBeGreaterThanOrEqual(1);
    }
  });

  it("the router's cut shows tooth passing at 630 Hz and chatter at 694.3 Hz (how the seed made it), with 20 829 rpm suggested", async () => {
    const detail = recordingDetailSchema.parse(await recordingDetail(Q, demoMachineIds.heronRouter, demoRecordingIds.heronCut));
    if (detail.results?.kind !== "cut") throw new Error("expected cut results");
    expect(detail.results.toothPassingFrequencyHz!).toBeCloseTo(630, 0);
    expect(detail.results.chatterCandidates[0]!.frequencyHz).toBeCloseTo(694.3, 0);
    // 60 · 694.3 / 2 = 20 829 rpm (domain-reference CHT: n = 60 fc / (N j), j = 1).
    expect(detail.results.suggestedSpeeds.some((s) => Math.abs(s.rpm - 20829) < 10)).toBe(true);
  });

  it("the mill's tap test proposes a 447 Hz X mode with ζ 0.038 and the dial-indicator X stiffness", async () => {
    const detail = recordingDetailSchema.parse(await recordingDetail(Q, demoMachineIds.wrenMill, demoRecordingIds.wrenTap));
    if (detail.results?.kind !== "tap") throw new Error("expected tap results");
    // The unwindowed spectrum peak of a decay this damped reads a few tenths of a percent high: within 0.5 %.
    expect(detail.results.proposedMode.frequencyHz / 447).toBeCloseTo(1, 2);
    expect(detail.results.proposedMode.dampingRatio).toBeGreaterThan(0.034);
    expect(detail.results.proposedMode.dampingRatio).toBeLessThan(0.042);
    // 260 N / 0.05 mm = 5200 N/mm at the ends of X travel.
    expect(detail.results.proposedMode).toMatchObject({ direction: "x", stiffnessNPerMm: 5200, stiffnessSource: "dial_indicator_readings" });
    expect(detail.acceptedModeId).toBeNull();
  });
});
