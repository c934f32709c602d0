import { mkdirSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname } from "node:path";

// wavefile ships CommonJS for Node (its ES build is for bundlers): load it the CommonJS way.
const { WaveFile } = createRequire(import.meta.url)("wavefile") as typeof import("wavefile");

/**
 * The sound Chromium's fake microphone plays in the recording test (it loops the file): an invented
 * cut at 12 000 rpm with a 2-flute cutter, made of
 *  - the spindle rotation, 12 000 / 60 = 200 Hz (a little runout),
 *  - tooth passing, 2 × 200 = 400 Hz, with its 2nd and 3rd harmonics at 800 and 1200 Hz,
 *  - a chatter tone at 1370 Hz, which is not a multiple of 200 Hz (6.85 × the rotation),
 *  - a quiet pseudo-random hiss (fixed seed, so the file is the same every run).
 * The analysis should call 400/800/1200 Hz tooth passing, 1370 Hz possible chatter, and suggest
 * n = 60 · 1370 / (2 · j) rpm: 20 550 rpm (j = 2), 13 700 rpm (j = 3) … within the spindle's range.
 */
export const FAKE_CUT = {
  sampleRateHz: 48_000,
  durationS: 4,
  rpm: 12_000,
  flutes: 2,
  chatterHz: 1370,
  tones: [
    { hz: 200, amplitude: 0.05 },
    { hz: 400, amplitude: 0.22 },
    { hz: 800, amplitude: 0.11 },
    { hz: 1200, amplitude: 0.06 },
    { hz: 1370, amplitude: 0.18 },
  ],
  noiseAmplitude: 0.01,
} as const;

/** Writes the fake microphone's WAV (16-bit PCM, mono) and returns its path. */
export function writeFakeMicrophoneWav(path: string): string {
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, toneWav(FAKE_CUT));
  return path;
}

/** A mono 16-bit PCM WAV of summed sine tones and a quiet deterministic hiss. */
export function toneWav(sound: {
  sampleRateHz: number;
  durationS: number;
  tones: ReadonlyArray<{ hz: number; amplitude: number }>;
  noiseAmplitude: number;
}): Uint8Array {
  const { sampleRateHz, durationS, tones, noiseAmplitude } = sound;
  const n = sampleRateHz * durationS;
  const samples = new Int16Array(n);
  let seed = 0x2f6a7c1d;
  const random = () => {
    // xorshift32: a deterministic hiss.
    seed ^= seed << 13;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    return (seed >>> 0) / 0xffffffff - 0.5;
  };
  for (let i = 0; i < n; i++) {
    const t = i / sampleRateHz;
    let v = noiseAmplitude * 2 * random();
    for (const tone of tones) v += tone.amplitude * Math.sin(2 * Math.PI * tone.hz * t);
    samples[i] = Math.round(Math.max(-1, Math.min(1, v)) * 32767);
  }
  const wav = new WaveFile();
  wav.fromScratch(1, sampleRateHz, "16", samples);
  return wav.toBuffer();
}
