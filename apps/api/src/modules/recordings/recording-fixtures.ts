/**
 * Synthetic recordings for tests, each made in a stated way so the expected analysis follows from
 * how it was made (not from the code under test). All signals are invented test data.
 */
import wavefile from "wavefile";

const { WaveFile } = wavefile;

/** mulberry32: a small seeded generator, so "noise" is the same on every run. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal values (Box–Muller) from a seeded generator. */
export function seededGaussian(seed: number): () => number {
  const u = seededRandom(seed);
  return () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

export interface Tone {
  frequencyHz: number;
  amplitude: number;
  phaseRad?: number;
}

/** Σ A·sin(2π f t + φ) + σ·N(0,1) (seeded), t = i/fs. */
export function toneSignal(input: { sampleRateHz: number; durationS: number; tones: Tone[]; noiseSigma?: number; noiseSeed?: number }): Float64Array {
  const n = Math.round(input.sampleRateHz * input.durationS);
  const noise = seededGaussian(input.noiseSeed ?? 1);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / input.sampleRateHz;
    let v = 0;
    for (const tone of input.tones) v += tone.amplitude * Math.sin(2 * Math.PI * tone.frequencyHz * t + (tone.phaseRad ?? 0));
    out[i] = v + (input.noiseSigma ?? 0) * noise();
  }
  return out;
}

/**
 * A tap test: silence, then at `tapAtS` a free decay A·e^(−ζ ωn t)·cos(ωd t) of one mode
 * (fn, ζ), plus seeded noise. ωd = ωn √(1 − ζ²).
 */
export function ringDownSignal(input: {
  sampleRateHz: number;
  durationS: number;
  tapAtS: number;
  naturalFrequencyHz: number;
  dampingRatio: number;
  amplitude: number;
  noiseSigma?: number;
  noiseSeed?: number;
}): Float64Array {
  const n = Math.round(input.sampleRateHz * input.durationS);
  const noise = seededGaussian(input.noiseSeed ?? 2);
  const wn = 2 * Math.PI * input.naturalFrequencyHz;
  const wd = wn * Math.sqrt(1 - input.dampingRatio ** 2);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / input.sampleRateHz - input.tapAtS;
    const decay = t >= 0 ? input.amplitude * Math.exp(-input.dampingRatio * wn * t) * Math.cos(wd * t) : 0;
    out[i] = decay + (input.noiseSigma ?? 0) * noise();
  }
  return out;
}

export type WavDepth = "16" | "24" | "32f";

/**
 * A WAV file of `channels` (mono: the signal; stereo: the signal on the left, `right` or the
 * signal on the right). Values are in full-scale units (±1); integers are rounded.
 */
export function wavBytes(signal: Float64Array, sampleRateHz: number, depth: WavDepth, right?: Float64Array): Buffer {
  const scale = depth === "32f" ? 1 : depth === "16" ? 32767 : 8388607;
  const convert = (s: Float64Array) => Array.from(s, (v) => (depth === "32f" ? v : Math.round(Math.max(-1, Math.min(1, v)) * scale)));
  const wav = new WaveFile();
  if (right) wav.fromScratch(2, sampleRateHz, depth, [convert(signal), convert(right)]);
  else wav.fromScratch(1, sampleRateHz, depth, convert(signal));
  return Buffer.from(wav.toBuffer());
}

/** "time_s,value" CSV of a signal sampled at fs. */
export function seriesCsv(signal: Float64Array, sampleRateHz: number): Buffer {
  const lines = ["time_s,value"];
  for (let i = 0; i < signal.length; i++) lines.push(`${(i / sampleRateHz).toFixed(8)},${signal[i]!.toPrecision(8)}`);
  return Buffer.from(`${lines.join("\n")}\n`);
}

/**
 * "frequency_hz,real,imag" CSV of the exact single-mode receptance G = 1/(k(1 − r² + 2iζr)) [mm/N],
 * r = f/fn, on fromHz … toHz in steps of stepHz.
 */
export function sdofFrfCsv(input: { naturalFrequencyHz: number; dampingRatio: number; stiffnessNPerMm: number; fromHz: number; toHz: number; stepHz: number }): Buffer {
  const lines = ["frequency_hz,real,imag"];
  for (let f = input.fromHz; f <= input.toHz + 1e-9; f += input.stepHz) {
    const r = f / input.naturalFrequencyHz;
    const a = 1 - r * r;
    const b = 2 * input.dampingRatio * r;
    const d = input.stiffnessNPerMm * (a * a + b * b);
    lines.push(`${f.toFixed(4)},${(a / d).toExponential(10)},${(-b / d).toExponential(10)}`);
  }
  return Buffer.from(`${lines.join("\n")}\n`);
}
