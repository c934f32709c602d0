/**
 * Demo vibration profiles (all invented): dial-indicator stiffness readings across the bed,
 * reversal-test backlash readings and one analysed recording for each of Quillfeather's two
 * machines. The machines' modes come with the library seed.
 *
 * Readings are made self-consistent with the machines' recorded values: the softest measured
 * position of each direction gives exactly the stiffness the machine carries (the "worst case"
 * basis the API uses), so seeding changes no machine and flags no recipe.
 *
 * Recordings are synthesised here (a tone, tooth-passing harmonics and seeded noise written as a
 * 16-bit WAV), stored like an upload and analysed synchronously with the same code as the worker.
 */
import wavefile from "wavefile";
import type { Axis, Machine } from "@ringdown/contracts";
import { readConfig } from "../config/env.js";
import { inTransaction } from "../db/sequelize.js";
import { AnalysisFailure, analyseRecording } from "../modules/analysis/analyse-recording.js";
import { BacklashReadingModel } from "../modules/backlash/backlash-reading.model.js";
import { findMachine } from "../modules/machines/machines.repository.js";
import { decodeRecording } from "../modules/recordings/recording-decoder.js";
import { RecordingModel } from "../modules/recordings/recording.model.js";
import { StiffnessReadingModel } from "../modules/stiffness/stiffness-reading.model.js";
import { LocalDirectoryStorage } from "../storage/local-directory-storage.js";
import type { Storage } from "../storage/storage.js";
import { demoMachineIds, demoShopIds, demoUserIds } from "./demo-ids.js";

const Q = demoShopIds.quillfeather;
const heron = demoMachineIds.heronRouter;
const wren = demoMachineIds.wrenMill;

/** Fixed ids: 5e1b0c2a-7d3f-4e8a-9b60-<kind><index>. */
const fixedId = (kind: number, n: number) => `5e1b0c2a-7d3f-4e8a-9b60-${kind.toString(16)}${n.toString(16).padStart(11, "0")}`;

export const demoRecordingIds = {
  /** Heron: a cut in birch ply with chatter near the spindle mode */
  heronCut: fixedId(3, 1),
  /** Wren: a tap test on the spindle in X, not yet accepted as a mode */
  wrenTap: fixedId(3, 2),
} as const;

/** Parabola 0 at the ends of [0, span], 1 in the middle: how free spans and beams soften mid-travel. */
const midSpan = (pos: number, span: number) => 4 * (pos / span) * (1 - pos / span);
/** Dial readings are taken to 0.005 mm (half a division of a 0.01 mm indicator). */
const dial = (mm: number) => Math.round(mm * 200) / 200;

interface Reading {
  machineId: string;
  xMm: number;
  yMm: number;
  zMm: number;
  direction: Axis;
  forceN: number;
  deflectionMm: number;
  note: string;
  measuredAt: string;
}

function heronReadings(): Reading[] {
  const out: Reading[] = [];
  const xs = [100, 1250, 2400];
  const ys = [100, 625, 1150];
  for (const x of xs) {
    for (const y of ys) {
      // X push (42 N, weights on a cord over a pulley): the gantry on its two X belts is softest with
      // equal free spans (mid-travel), the beam twists most with the carriage at mid-beam.
      // 0.04 mm fixed + 0.04 mm belts + 0.02 mm beam at the centre = 0.10 mm → 420 N/mm, the machine's X value.
      out.push({
        machineId: heron,
        xMm: x,
        yMm: y,
        zMm: 0,
        direction: "x",
        forceN: 42,
        deflectionMm: dial(0.04 + 0.04 * midSpan(x, 2500) + 0.02 * midSpan(y, 1250)),
        note: x === 1250 ? "Gantry mid-travel: longest free belt spans on both sides" : "",
        measuredAt: "2026-01-17",
      });
      // Y push (33 N): the carriage on the beam belt, softest at mid-beam; the gantry racks a little at mid-travel.
      // 0.05 + 0.04 + 0.01 = 0.10 mm at the centre → 330 N/mm, the machine's Y value.
      out.push({
        machineId: heron,
        xMm: x,
        yMm: y,
        zMm: 0,
        direction: "y",
        forceN: 33,
        deflectionMm: dial(0.05 + 0.04 * midSpan(y, 1250) + 0.01 * midSpan(x, 2500)),
        note: y === 625 ? "Carriage at mid-beam" : "",
        measuredAt: "2026-01-17",
      });
    }
  }
  // Z push (60 N) on the lead-screw axis at three places along the beam: 0.10 mm at mid-beam → 600 N/mm.
  for (const y of ys) {
    out.push({
      machineId: heron,
      xMm: 1250,
      yMm: y,
      zMm: 50,
      direction: "z",
      forceN: 60,
      deflectionMm: dial(0.08 + 0.02 * midSpan(y, 1250)),
      note: "",
      measuredAt: "2026-01-18",
    });
  }
  return out;
}

function wrenReadings(): Reading[] {
  const out: Reading[] = [];
  // Bench mill: the table is stiffest centred under the spindle and softer at the ends of travel
  // (more overhang on the saddle). Loads from a screw jack and a load cell; 0.05 mm at the ends.
  const xs = [20, 200, 380];
  const ys = [20, 160];
  for (const x of xs) {
    for (const y of ys) {
      const overhang = 1 - midSpan(x, 400);
      out.push({ machineId: wren, xMm: x, yMm: y, zMm: 0, direction: "x", forceN: 260, deflectionMm: dial(0.04 + 0.01 * overhang), note: "", measuredAt: "2026-02-03" });
      out.push({ machineId: wren, xMm: x, yMm: y, zMm: 0, direction: "y", forceN: 180, deflectionMm: dial(0.04 + 0.01 * overhang), note: "", measuredAt: "2026-02-03" });
    }
  }
  out.push({ machineId: wren, xMm: 200, yMm: 90, zMm: 100, direction: "z", forceN: 390, deflectionMm: 0.05, note: "Quill retracted", measuredAt: "2026-02-03" });
  return out;
}

const backlash: Array<{ machineId: string; axis: Axis; backlashMm: number; note: string; measuredAt: string }> = [
  // An older, worse reading before the belts were re-tensioned, then the current one (the machine's value).
  { machineId: heron, axis: "x", backlashMm: 0.09, note: "Before re-tensioning the X belts", measuredAt: "2025-10-04" },
  { machineId: heron, axis: "x", backlashMm: 0.05, note: "After re-tensioning", measuredAt: "2026-01-17" },
  { machineId: heron, axis: "y", backlashMm: 0.04, note: "", measuredAt: "2026-01-17" },
  { machineId: heron, axis: "z", backlashMm: 0.08, note: "Lead-screw nut; anti-backlash spring is weak", measuredAt: "2026-01-18" },
  { machineId: wren, axis: "x", backlashMm: 0.01, note: "", measuredAt: "2026-02-03" },
  { machineId: wren, axis: "y", backlashMm: 0.012, note: "", measuredAt: "2026-02-03" },
  { machineId: wren, axis: "z", backlashMm: 0.01, note: "", measuredAt: "2026-02-03" },
];

/** mulberry32 + Box–Muller: repeatable noise for the synthetic recordings. */
function gaussian(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

function wav16(samples: Float64Array, sampleRateHz: number): Buffer {
  const wav = new wavefile.WaveFile();
  wav.fromScratch(1, sampleRateHz, "16", Array.from(samples, (v) => Math.round(Math.max(-1, Math.min(1, v)) * 32767)));
  return Buffer.from(wav.toBuffer());
}

/**
 * Heron cutting birch ply with the 6 mm 2-flute cutter at dial 3 (18 900 rpm): tooth passing
 * 630 Hz with harmonics 1260 and 1890 Hz, a runout line at the 315 Hz rotation, and a strong tone at
 * 694.3 Hz — not a multiple of 315 Hz — just below the spindle-and-tool mode (chatter). 48 kHz, 3 s,
 * noise 0.02·N(0,1) with seed 11.
 */
function heronCutWav(): Buffer {
  const fs = 48000;
  const n = fs * 3;
  const noise = gaussian(11);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / fs;
    out[i] =
      0.05 * Math.sin(2 * Math.PI * 315 * t) +
      0.3 * Math.sin(2 * Math.PI * 630 * t) +
      0.12 * Math.sin(2 * Math.PI * 1260 * t + 0.4) +
      0.05 * Math.sin(2 * Math.PI * 1890 * t + 1.1) +
      0.35 * Math.sin(2 * Math.PI * 694.3 * t) * (0.8 + 0.2 * Math.sin(2 * Math.PI * 3 * t)) +
      0.02 * noise();
  }
  return wav16(out, fs);
}

/** A tap on Wren's spindle in X: silence, then a 447 Hz mode ringing down with ζ = 0.038. 44.1 kHz, 1.5 s, noise 0.002·N(0,1), seed 12. */
function wrenTapWav(): Buffer {
  const fs = 44100;
  const n = Math.round(fs * 1.5);
  const noise = gaussian(12);
  const wn = 2 * Math.PI * 447;
  const zeta = 0.038;
  const wd = wn * Math.sqrt(1 - zeta * zeta);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / fs - 0.25;
    out[i] = (t >= 0 ? 0.6 * Math.exp(-zeta * wn * t) * Math.cos(wd * t) : 0) + 0.002 * noise();
  }
  return wav16(out, fs);
}

interface DemoRecording {
  id: string;
  machineId: string;
  kind: "cut" | "tap";
  name: string;
  rpm: number | null;
  flutes: number | null;
  direction: Axis | null;
  note: string;
  bytes: () => Buffer;
  createdAt: Date;
}

const recordings: DemoRecording[] = [
  {
    id: demoRecordingIds.heronCut,
    machineId: heron,
    kind: "cut",
    name: "heron-birch-ply-dial3.wav",
    rpm: 18900,
    flutes: 2,
    direction: null,
    note: "Full-width slot in 18 mm birch ply, 6 mm 2-flute at dial 3; loud squeal from 8 mm depth",
    bytes: heronCutWav,
    createdAt: new Date("2026-02-11T10:42:00Z"),
  },
  {
    id: demoRecordingIds.wrenTap,
    machineId: wren,
    kind: "tap",
    name: "wren-tap-x.wav",
    rpm: null,
    flutes: null,
    direction: "x",
    note: "Tap on a 10 mm gauge pin in the collet, phone on the table",
    bytes: wrenTapWav,
    createdAt: new Date("2026-02-12T15:05:00Z"),
  },
];

async function storeOnce(storage: Storage, key: string, bytes: Buffer): Promise<void> {
  if (await storage.get(key)) return;
  await storage.put(key, bytes, "audio/wav");
}

/** Stiffness of the softest measured position in a direction [N/mm] (what the API would set). */
function worstCase(readings: Reading[], machineId: string, direction: Axis): number {
  return Math.min(...readings.filter((r) => r.machineId === machineId && r.direction === direction).map((r) => r.forceN / r.deflectionMm));
}

/** Returns how many records it created (0 on a second run). Runs after the library seed. */
export async function seedVibration(storage: Storage = new LocalDirectoryStorage(readConfig().storageDir)): Promise<number> {
  const readings = [...heronReadings(), ...wrenReadings()];
  let created = 0;
  await inTransaction(async (transaction) => {
    for (const [i, r] of readings.entries()) {
      const id = fixedId(1, i + 1);
      const [, isNew] = await StiffnessReadingModel.findOrCreate({
        where: { id },
        defaults: { id, shopId: Q, ...r, measuredAt: new Date(`${r.measuredAt}T12:00:00Z`), createdBy: demoUserIds.imke },
        transaction,
      });
      if (isNew) created++;
    }
    for (const [i, b] of backlash.entries()) {
      const id = fixedId(2, i + 1);
      const [, isNew] = await BacklashReadingModel.findOrCreate({
        where: { id },
        defaults: { id, shopId: Q, ...b, measuredAt: new Date(`${b.measuredAt}T12:00:00Z`), createdBy: demoUserIds.imke },
        transaction,
      });
      if (isNew) created++;
    }
  });

  for (const rec of recordings) {
    if (await RecordingModel.findByPk(rec.id)) continue;
    const machine: Machine | null = await findMachine(Q, rec.machineId);
    if (!machine) continue;
    const bytes = rec.bytes();
    const storageKey = `shops/${Q}/recordings/${rec.id}.wav`;
    await storeOnce(storage, storageKey, bytes);
    const decoded = decodeRecording(bytes);
    if (decoded.format !== "wav") throw new Error("demo recording is not a WAV");
    let results;
    try {
      results = await analyseRecording(decoded, {
        kind: rec.kind,
        rpm: rec.rpm,
        flutes: rec.flutes,
        direction: rec.direction,
        dialSetting: null,
        machine,
        measuredStiffnessNPerMm: rec.direction ? worstCase(readings, rec.machineId, rec.direction) : null,
      });
    } catch (error) {
      if (error instanceof AnalysisFailure) throw new Error(`demo recording ${rec.name} does not analyse: ${error.message}`);
      throw error;
    }
    await RecordingModel.create({
      id: rec.id,
      shopId: Q,
      machineId: rec.machineId,
      kind: rec.kind,
      format: "wav",
      storageKey,
      originalName: rec.name,
      sizeBytes: bytes.length,
      sampleRateHz: decoded.sampleRateHz,
      durationS: decoded.durationS,
      channels: decoded.channels,
      rpm: rec.rpm,
      flutes: rec.flutes,
      direction: rec.direction,
      dialSetting: null,
      note: rec.note,
      status: "done",
      progress: 1,
      results,
      attempts: 1,
      createdBy: demoUserIds.teodor,
      createdAt: rec.createdAt,
      updatedAt: rec.createdAt,
      startedAt: rec.createdAt,
      analysedAt: rec.createdAt,
    });
    created++;
  }
  return created;
}
