import { mkdtemp, readdir, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  acceptDialRpmResponseSchema,
  acceptModeResponseSchema,
  apiErrorSchema,
  machineModeListSchema,
  machineSchema,
  recommendationResponseSchema,
  recordingAcceptedSchema,
  recordingDetailSchema,
  recordingListSchema,
  RECORDING_LIMITS,
  stiffnessReadingMutationSchema,
  type Machine,
  type RecordingDetail,
} from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";
import { startJobQueue, stopJobQueue } from "../../jobs/job-queue.js";
import { LocalDirectoryStorage } from "../../storage/local-directory-storage.js";
import { disconnectTestDatabase, makeTestApp } from "../../test/harness.js";
import { testDatabaseUrl } from "../../test/database-url.js";
import { startAnalysisWorker } from "../analysis/analysis.worker.js";
import { cutterBody, globalMaterialId, insertRecipeRow, machineBody, needsRecheck, teamShop, type Team } from "../machines/library-test-fixtures.js";
import { ringDownSignal, sdofFrfCsv, seriesCsv, toneSignal, wavBytes } from "./recording-fixtures.js";

/*
 * Recording uploads and their analysis over real HTTP, PostgreSQL, pg-boss and a storage
 * directory of this file's own. Signals are synthetic and described where they are made.
 */

let storageDir: string;
let app: ReturnType<typeof makeTestApp>;
let team: Team;
let machine: Machine;
let recipeId: string;
let assemblyId: string;

const shopPath = () => `/api/shops/${team.shopId}`;
const recordingsPath = (machineId = machine.id) => `${shopPath()}/machines/${machineId}/recordings`;

async function startWorker(): Promise<void> {
  const boss = await startJobQueue(testDatabaseUrl());
  await startAnalysisWorker(boss, { storage: new LocalDirectoryStorage(storageDir) }, 2);
}

beforeAll(async () => {
  storageDir = await mkdtemp(path.join(tmpdir(), "ringdown-recordings-"));
  app = makeTestApp({ storageDir });
  await startWorker();
  team = await teamShop(app, "rec");
  machine = machineSchema.parse(
    (
      await team.owner.agent.post(`${shopPath()}/machines`).send(
        machineBody({
          name: "Recording test router",
          spindle: { minRpm: 8000, maxRpm: 24000, powerW: 1500, dialSettings: [{ label: "3", rpm: 18000 }] },
        }),
      )
    ).body,
  );
  const cutter = (await team.owner.agent.post(`${shopPath()}/cutters`).send(cutterBody())).body as { id: string };
  assemblyId = (
    (await team.owner.agent.post(`${shopPath()}/assemblies`).send({ machineId: machine.id, cutterId: cutter.id, holder: "ER20", stickoutMm: 20, runoutMm: 0.01 }))
      .body as { id: string }
  ).id;
  recipeId = await insertRecipeRow({
    shopId: team.shopId,
    assemblyId,
    machineId: machine.id,
    cutterId: cutter.id,
    materialId: await globalMaterialId("hdpe"),
    authorId: team.owner.userId,
  });
});

afterAll(async () => {
  await stopJobQueue({ graceful: false });
  await disconnectTestDatabase();
  await rm(storageDir, { recursive: true, force: true });
});

async function storedFiles(): Promise<string[]> {
  const dir = path.join(storageDir, "shops", team.shopId, "recordings");
  return readdir(dir).catch(() => []);
}

async function recordingRows(): Promise<number> {
  const [rows] = await getSequelize().query("SELECT count(*) AS n FROM recordings WHERE shop_id = $1", { bind: [team.shopId] });
  return (rows[0] as { n: number }).n;
}

async function jobRows(): Promise<number> {
  const [rows] = await getSequelize().query("SELECT count(*) AS n FROM pgboss.job WHERE name = 'recording-analysis' AND data->>'recordingId' IN (SELECT id::text FROM recordings WHERE shop_id = $1)", {
    bind: [team.shopId],
  });
  return (rows[0] as { n: number }).n;
}

type Fields = Record<string, string | number>;

function upload(bytes: Buffer, name: string, fields: Fields, who = team.owner) {
  const req = who.agent.post(recordingsPath());
  for (const [k, v] of Object.entries(fields)) req.field(k, String(v));
  return req.attach("file", bytes, name);
}

/** Polls the recording until the analysis has finished (done or failed), checking each answer against the contract. */
async function settled(id: string, who = team.owner): Promise<RecordingDetail> {
  const seen = new Set<string>();
  for (let i = 0; i < 600; i++) {
    const detail = recordingDetailSchema.parse((await who.agent.get(`${recordingsPath()}/${id}`)).body);
    seen.add(detail.status);
    if (detail.status === "done" || detail.status === "failed") return detail;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`recording ${id} did not finish; statuses seen: ${[...seen].join(", ")}`);
}

async function uploadAndWait(bytes: Buffer, name: string, fields: Fields): Promise<RecordingDetail> {
  const res = await upload(bytes, name, fields);
  if (res.status !== 202) throw new Error(`upload failed: ${res.status} ${JSON.stringify(res.body)}`);
  const { recording } = recordingAcceptedSchema.parse(res.body);
  expect(recording.status).toBe("queued");
  expect(recording.progress).toBe(0);
  return settled(recording.id);
}

// A cut: 8 kHz, 1 s, 0.4·sin(2π·600 t) + 0.3·sin(2π·730.2 t) + 0.02·N(0,1) (seed 1); 18 000 rpm, 2 flutes.
const cutSignal = toneSignal({
  sampleRateHz: 8000,
  durationS: 1,
  tones: [
    { frequencyHz: 600, amplitude: 0.4 },
    { frequencyHz: 730.2, amplitude: 0.3 },
  ],
  noiseSigma: 0.02,
  noiseSeed: 1,
});
const cutFields = { kind: "cut", rpm: 18000, flutes: 2 };

describe("upload each format and analyse it", () => {
  it.each([
    ["16-bit PCM WAV", () => wavBytes(cutSignal, 8000, "16"), "cut-16.wav", "wav", 1],
    ["24-bit PCM WAV", () => wavBytes(cutSignal, 8000, "24"), "cut-24.wav", "wav", 1],
    ["32-bit float WAV", () => wavBytes(cutSignal, 8000, "32f"), "cut-float.wav", "wav", 1],
    // Stereo: the cut on the left, the same cut at half level on the right; the average keeps both tones.
    ["stereo WAV", () => wavBytes(cutSignal, 8000, "16", cutSignal.map((v) => v / 2)), "cut-stereo.wav", "wav", 2],
    ["CSV time series", () => seriesCsv(cutSignal, 8000), "cut.csv", "csv_series", 1],
  ] as const)("%s: 202 queued, then done with the tooth-passing peak and the chatter candidate", async (_label, make, name, format, channels) => {
    const detail = await uploadAndWait(make(), name, cutFields);
    expect(detail).toMatchObject({ status: "done", progress: 1, format, channels, sampleRateHz: expect.closeTo(8000, 6), kind: "cut", rpm: 18000, flutes: 2, originalName: name });
    expect(detail.durationS).toBeCloseTo(1, 6);
    expect(detail.failureReason).toBeNull();
    expect(detail.analysedAt).not.toBeNull();
    const results = detail.results!;
    if (results.kind !== "cut") throw new Error("expected cut results");
    // fs 8 kHz → Welch bins of 8000/4096 = 1.95 Hz; interpolated peaks within 0.2 bin.
    expect(results.toothPassingFrequencyHz!).toBeCloseTo(600, 0);
    expect(results.chatterCandidates[0]!.frequencyHz).toBeCloseTo(730.2, 0);
    expect(results.suggestedSpeeds.some((s) => Math.abs(s.rpm - 21906) < 20)).toBe(true);
  });

  it("a frequency-response CSV is fitted; accepting the fitted mode adds it to the machine, flags its recipes and changes the server's recommendation", async () => {
    const recommend = async () =>
      recommendationResponseSchema.parse(
        (
          await team.programmer.agent
            .post(`${shopPath()}/recommendations`)
            .send({ assemblyId, materialId: await globalMaterialId("hdpe"), operation: "slot", params: { axialDepthMm: 3, radialDepthMm: 6 } })
        ).body,
      );
    const before = await recommend();
    const ftp = before.recommendation.toothPassingFrequencyHz;
    // The exact receptance of one soft mode right at the tooth-passing frequency of the recommended speed:
    // fn = f_tp, ζ = 0.02, k = 150 N/mm, sampled every 0.25 Hz over ±40 % (domain-reference DMP-2 for the fit).
    const csv = sdofFrfCsv({ naturalFrequencyHz: ftp, dampingRatio: 0.02, stiffnessNPerMm: 150, fromHz: ftp * 0.6, toHz: ftp * 1.4, stepHz: 0.25 });
    const detail = await uploadAndWait(csv, "frf-x.csv", { kind: "frf", direction: "x" });
    expect(detail.status).toBe("done");
    if (detail.results?.kind !== "frf") throw new Error("expected FRF results");
    expect(detail.results.fittedMode.frequencyHz / ftp).toBeCloseTo(1, 3);
    expect(detail.results.fittedMode.dampingRatio).toBeCloseTo(0.02, 3);
    expect(detail.results.fittedMode.stiffnessNPerMm / 150).toBeCloseTo(1, 2);

    expect(await needsRecheck(recipeId)).toBe(false);
    const accepted = acceptModeResponseSchema.parse((await team.tooling_manager.agent.post(`${shopPath()}/recordings/${detail.id}/accept-mode`).send({})).body);
    expect(accepted.mode).toMatchObject({ direction: "x", source: "fitted", recordingId: detail.id });
    expect(accepted.mode.frequencyHz).toBeCloseTo(detail.results.fittedMode.frequencyHz, 9);
    expect(accepted.recording.acceptedModeId).toBe(accepted.mode.id);
    expect(accepted.changes[0]).toMatchObject({ what: "mode_added", direction: "x", material: true });
    expect(accepted.recipesFlagged).toBe(1);
    expect(await needsRecheck(recipeId)).toBe(true);
    const modes = machineModeListSchema.parse((await team.operator.agent.get(`${shopPath()}/machines/${machine.id}/modes`)).body).items;
    expect(modes.some((m) => m.id === accepted.mode.id)).toBe(true);

    const after = await recommend();
    // The machine's speed dial keeps the spindle at setting 3 (18 000 rpm, f_tp = 600 Hz), now right on the new
    // soft X mode: the server's stability limit falls from a depth no cut reaches to a few millimetres, and it
    // warns that the tooth-passing frequency is not clear of the mode.
    expect(after.summary.rpm).toBe(before.summary.rpm);
    expect(before.recommendation.stability.limitingDepthMm!).toBeGreaterThan(100);
    expect(after.recommendation.stability.limitingDepthMm!).toBeLessThan(before.recommendation.stability.limitingDepthMm! / 10);
    const modeWarning = (r: typeof after) => r.recommendation.warnings.find((w) => /from the \d+ Hz X mode/.test(w.message));
    expect(modeWarning(before)).toBeUndefined();
    expect(modeWarning(after)).toMatchObject({ severity: "warning" });

    // Accepting twice is refused; so is accepting from a cut recording.
    const again = await team.owner.agent.post(`${shopPath()}/recordings/${detail.id}/accept-mode`).send({});
    expect(again.status).toBe(409);
    expect(apiErrorSchema.parse(again.body).error.message).toBe("The mode from this recording is already among the machine's modes.");
  });

  it("a tap test gives a measured mode whose stiffness comes from the dial-indicator readings", async () => {
    // 50 N / 0.2 mm = 250 N/mm in Y at the middle of the table.
    const r = await team.owner.agent
      .post(`${shopPath()}/machines/${machine.id}/stiffness-readings`)
      .send({ xMm: 300, yMm: 300, direction: "y", forceN: 50, deflectionMm: 0.2, measuredAt: "2026-03-01" });
    stiffnessReadingMutationSchema.parse(r.body);
    // Made as: 8 kHz, 2 s, tap at 0.3 s, fn = 140 Hz, ζ = 0.025, amplitude 0.7, 0.001·N(0,1) (seed 2).
    const tap = ringDownSignal({ sampleRateHz: 8000, durationS: 2, tapAtS: 0.3, naturalFrequencyHz: 140, dampingRatio: 0.025, amplitude: 0.7, noiseSigma: 0.001 });
    const detail = await uploadAndWait(wavBytes(tap, 8000, "16"), "tap-y.wav", { kind: "tap", direction: "y" });
    if (detail.results?.kind !== "tap") throw new Error(`expected tap results, got ${detail.status}: ${detail.failureReason}`);
    expect(detail.results.ringDown.naturalFrequencyHz).toBeCloseTo(140, 0);
    expect(detail.results.ringDown.dampingRatio).toBeGreaterThan(0.0225);
    expect(detail.results.ringDown.dampingRatio).toBeLessThan(0.0275);
    expect(detail.results.proposedMode).toMatchObject({ direction: "y", stiffnessNPerMm: 250, stiffnessSource: "dial_indicator_readings", source: "measured" });
    // Programmers and operators cannot change the machine's modes.
    expect((await team.programmer.agent.post(`${shopPath()}/recordings/${detail.id}/accept-mode`).send({})).status).toBe(403);
    const accepted = acceptModeResponseSchema.parse((await team.owner.agent.post(`${shopPath()}/recordings/${detail.id}/accept-mode`).send({ note: "Tap on the collet nut" })).body);
    expect(accepted.mode).toMatchObject({ source: "measured", direction: "y", stiffnessNPerMm: 250, note: "Tap on the collet nut" });
  });

  it("a recording of the spindle running free measures the real rpm of a dial setting, which can then be applied", async () => {
    // Made as: 8 kHz, 4 s, 0.3·sin(2π·295 t) + 0.005·N(0,1) (seed 1): dial "3" says 18 000 rpm, the spindle turns at 295 × 60 = 17 700 rpm.
    const signal = toneSignal({ sampleRateHz: 8000, durationS: 4, tones: [{ frequencyHz: 295, amplitude: 0.3 }], noiseSigma: 0.005 });
    const detail = await uploadAndWait(wavBytes(signal, 8000, "16"), "dial-3.wav", { kind: "spindle_free", dialSetting: "3" });
    if (detail.results?.kind !== "spindle_free") throw new Error(`expected spindle results, got ${detail.status}: ${detail.failureReason}`);
    expect(Math.abs(detail.results.measuredRpm - 17700)).toBeLessThan(3);
    const applied = acceptDialRpmResponseSchema.parse((await team.owner.agent.post(`${shopPath()}/recordings/${detail.id}/accept-dial-rpm`).send({})).body);
    expect(applied.dialSetting).toEqual({ label: "3", rpm: Math.round(detail.results.measuredRpm), measured: true, previousRpm: 18000 });
    expect(applied.recording.dialRpmApplied).toBe(true);
    const after = machineSchema.parse((await team.owner.agent.get(`${shopPath()}/machines/${machine.id}`)).body);
    expect(after.spindle.dialSettings).toEqual([{ label: "3", rpm: Math.round(detail.results.measuredRpm), measured: true }]);
  });

  it("a tap test without a ring-down fails with the reason", async () => {
    const noise = toneSignal({ sampleRateHz: 8000, durationS: 1, tones: [], noiseSigma: 0.1, noiseSeed: 9 });
    const detail = await uploadAndWait(wavBytes(noise, 8000, "16"), "noise.wav", { kind: "tap", direction: "x" });
    expect(detail.status).toBe("failed");
    expect(detail.results).toBeNull();
    expect(detail.failureReason).toMatch(/^No clear ring-down was found after the tap/);
    const res = await team.owner.agent.post(`${shopPath()}/recordings/${detail.id}/accept-mode`).send({});
    expect(res.status).toBe(409);
  });

  it("lists the machine's recordings newest first, without results, serves the stored file and deletes it", async () => {
    const bytes = wavBytes(cutSignal, 8000, "16");
    const detail = await uploadAndWait(bytes, "to-delete.wav", cutFields);
    const list = recordingListSchema.parse((await team.operator.agent.get(recordingsPath())).body);
    expect(list.items[0]!.id).toBe(detail.id);
    expect(list.items[0]).not.toHaveProperty("results");
    const onlyFrf = recordingListSchema.parse((await team.operator.agent.get(recordingsPath()).query({ kind: "frf" })).body);
    expect(onlyFrf.items.every((r) => r.kind === "frf")).toBe(true);

    const file = await team.operator.agent.get(`${recordingsPath()}/${detail.id}/file`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => cb(null, Buffer.concat(chunks)));
    });
    expect(file.status).toBe(200);
    expect(file.headers["content-type"]).toBe("audio/wav");
    expect(Buffer.compare(file.body as Buffer, bytes)).toBe(0);

    expect((await team.programmer.agent.delete(`${recordingsPath()}/${detail.id}`)).status).toBe(403);
    const filesBefore = (await storedFiles()).length;
    expect((await team.owner.agent.delete(`${recordingsPath()}/${detail.id}`)).status).toBe(204);
    expect((await storedFiles()).length).toBe(filesBefore - 1);
    expect((await team.owner.agent.get(`${recordingsPath()}/${detail.id}`)).status).toBe(404);
  });
});

describe("refused uploads leave nothing behind", () => {
  const good = () => wavBytes(cutSignal, 8000, "16");
  const truncated = () => good().subarray(0, 9000);

  it.each([
    ["a truncated WAV", () => truncated(), "cut.wav", cutFields, 400, /^The WAV file is truncated: its header announces 16000 bytes of samples but only 8956 are there/],
    ["a PNG image", () => Buffer.from("89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c489", "hex"), "photo.wav", cutFields, 415, /neither a WAV recording nor a CSV/],
    ["a file over 25 MB", () => Buffer.alloc(RECORDING_LIMITS.maxBytes + 1, 0x41), "big.csv", cutFields, 413, /^The recording is larger than 25 MB\.$/],
    ["a CSV with a broken row", () => Buffer.from(`time_s,value\n${Array.from({ length: 300 }, (_, i) => `${i / 8000},${i === 150 ? "abc" : Math.sin(i)}`).join("\n")}\n`), "bad.csv", cutFields, 400, /^Row 152: value “abc” is not a number\.$/],
    ["an unevenly sampled CSV", () => Buffer.from(`time_s,value\n${Array.from({ length: 300 }, (_, i) => `${(i + (i >= 200 ? 1 : 0)) / 8000},${Math.sin(i)}`).join("\n")}\n`), "uneven.csv", cutFields, 400, /^Row 202: the time step is 0.0002500 s where the others are 0.0001250 s; the series must be evenly sampled\.$/],
    ["a CSV with other columns", () => Buffer.from("a,b,c,d\n1,2,3,4\n"), "odd.csv", cutFields, 400, /^A CSV must have the columns time_s,value/],
    ["a WAV for a frequency response", () => good(), "cut.wav", { kind: "frf", direction: "x" }, 400, /^A frequency-response upload must be a CSV/],
    ["a frequency response as a cut", () => sdofFrfCsv({ naturalFrequencyHz: 500, dampingRatio: 0.05, stiffnessNPerMm: 1000, fromHz: 400, toHz: 600, stepHz: 1 }), "frf.csv", cutFields, 400, /This file is a frequency response/],
    ["a WAV at 2 kHz", () => wavBytes(toneSignal({ sampleRateHz: 2000, durationS: 1, tones: [{ frequencyHz: 100, amplitude: 0.5 }] }), 2000, "16"), "low.wav", cutFields, 400, /^The sample rate is 2 kHz; it must be between 4 kHz and 192 kHz\.$/],
    ["a tap test without a direction", () => good(), "tap.wav", { kind: "tap" }, 400, /^Some fields need attention\.$/],
    ["an unknown dial setting", () => good(), "free.wav", { kind: "spindle_free", dialSetting: "9" }, 400, /^Unknown dial setting\.$/],
    ["rpm without flutes", () => good(), "cut.wav", { kind: "cut", rpm: 18000 }, 400, /^Some fields need attention\.$/],
  ] as const)("%s is refused and leaves no row, job or file", async (_label, make, name, fields, status, message) => {
    const rowsBefore = await recordingRows();
    const jobsBefore = await jobRows();
    const filesBefore = (await storedFiles()).length;
    const res = await upload(make(), name, fields as Fields);
    expect(res.status).toBe(status);
    expect(apiErrorSchema.parse(res.body).error.message).toMatch(message);
    expect(await recordingRows()).toBe(rowsBefore);
    expect(await jobRows()).toBe(jobsBefore);
    expect((await storedFiles()).length).toBe(filesBefore);
  });

  it("names the field of a bad upload: file missing, direction missing", async () => {
    const noFile = await team.owner.agent.post(recordingsPath()).field("kind", "cut");
    expect(noFile.status).toBe(400);
    expect(apiErrorSchema.parse(noFile.body).error.fields).toEqual({ file: "Attach a WAV or CSV file" });
    const noDirection = await upload(good(), "tap.wav", { kind: "tap" });
    expect(apiErrorSchema.parse(noDirection.body).error.fields).toEqual({ direction: "Choose the direction the recording measured" });
    const json = await team.owner.agent.post(recordingsPath()).send({ kind: "cut" });
    expect(json.status).toBe(400);
  });

  it("refuses an 8-bit WAV as an unsupported encoding (415)", async () => {
    const wavefile = (await import("wavefile")).default;
    const w = new wavefile.WaveFile();
    w.fromScratch(1, 8000, "8", Array.from(cutSignal, (v) => Math.round(128 + 100 * v)));
    const res = await upload(Buffer.from(w.toBuffer()), "eight.wav", cutFields);
    expect(res.status).toBe(415);
    expect(apiErrorSchema.parse(res.body).error.message).toBe("This WAV file holds 8-bit PCM samples; save it as 16-bit PCM, 24-bit PCM or 32-bit float.");
  });
});

describe("the queue", () => {
  it("keeps jobs in PostgreSQL while no worker runs, and a worker started later analyses them", async () => {
    await stopJobQueue({ graceful: true });
    // A queue client without a worker (as in an API process with RUN_WORKER=false).
    await startJobQueue(testDatabaseUrl());
    const res = await upload(wavBytes(cutSignal, 8000, "16"), "while-down.wav", cutFields, team.operator);
    expect(res.status).toBe(202);
    const { recording } = recordingAcceptedSchema.parse(res.body);
    await new Promise((r) => setTimeout(r, 1500));
    expect(recordingDetailSchema.parse((await team.owner.agent.get(`${recordingsPath()}/${recording.id}`)).body).status).toBe("queued");
    await stopJobQueue({ graceful: true });
    await startWorker();
    const detail = await settled(recording.id);
    expect(detail.status).toBe("done");
  });

  it("answers 404 for another shop's recording and for its machine", async () => {
    const other = await teamShop(app, "rec-other");
    const foreignMachine = machineSchema.parse((await other.owner.agent.post(`/api/shops/${other.shopId}/machines`).send(machineBody())).body);
    const mine = recordingListSchema.parse((await team.owner.agent.get(recordingsPath())).body).items[0]!;
    expect((await other.owner.agent.get(`/api/shops/${other.shopId}/machines/${foreignMachine.id}/recordings/${mine.id}`)).status).toBe(404);
    expect((await other.owner.agent.post(`/api/shops/${other.shopId}/recordings/${mine.id}/accept-mode`).send({})).status).toBe(404);
    expect((await team.owner.agent.get(`${recordingsPath(foreignMachine.id)}`)).status).toBe(404);
  });
});
