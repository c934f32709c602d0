import type { Axis, Machine, ProposedMode, RecordingKind, RecordingPeakResult, RecordingResults, SpectrumSeries } from "@ringdown/contracts";
import {
  analyzeRecording,
  analyzeRingDown,
  decimateSpectrum,
  findSpectralPeaks,
  fitModeFromFrf,
  welchSpectrum,
  type SpectralPeak,
} from "@ringdown/machining";
import type { DecodedRecording } from "../recordings/recording-decoder.js";

/*
 * Turns a decoded recording into the results stored with it, by kind. Plain functions over the
 * engine: no database, no files (the worker feeds them), so they are tested directly.
 */

/** A reason the analysis cannot give a result, in words for the person who uploaded the file. */
export class AnalysisFailure extends Error {
  constructor(message: string) {
    super(message);
    this.name = "AnalysisFailure";
  }
}

/** Points per plotted series: enough for a sharp chart, small enough to send and store. */
export const SPECTRUM_POINTS = 8000;
/** Longest ring-down analysed after the tap [s]. */
export const RING_DOWN_WINDOW_S = 4;
/**
 * Below this fit quality (R² of ln amplitude against time) the record holds no usable ring-down:
 * noise, or a sound that does not decay. Common practice, no published source.
 */
export const MIN_RING_DOWN_FIT_QUALITY = 0.5;
/** A spindle running free is looked for within ±25 % of the nominal rotation frequency. */
export const ROTATION_SEARCH_FRACTION = 0.25;

export interface AnalysisContext {
  kind: RecordingKind;
  rpm: number | null;
  flutes: number | null;
  direction: Axis | null;
  dialSetting: string | null;
  machine: Pick<Machine, "spindle" | "axes">;
  /** The machine's stiffness from its dial-indicator readings in the recording's direction [N/mm], null without readings */
  measuredStiffnessNPerMm: number | null;
  /** Called with 0 … 1 as the work advances */
  progress?: (fraction: number) => Promise<void> | void;
}

const finite = (v: number) => (Number.isFinite(v) ? v : 0);

function spectrumSeries(
  frequencyHz: ArrayLike<number>,
  magnitude: ArrayLike<number>,
  binWidthHz: number,
  keep: ReadonlyArray<{ frequencyHz: number; magnitude: number }>,
): SpectrumSeries {
  const d = decimateSpectrum({ frequencyHz, magnitude, maxPoints: SPECTRUM_POINTS, keep });
  return { frequencyHz: d.frequencyHz, magnitude: d.magnitude.map(finite), originalPoints: frequencyHz.length, binWidthHz };
}

const peakResult = (p: SpectralPeak, kind: RecordingPeakResult["kind"], harmonic: number | null): RecordingPeakResult => ({
  frequencyHz: p.frequencyHz,
  magnitude: p.magnitude,
  aboveFloor: p.aboveFloor,
  kind,
  harmonic,
});

/** Multiples of `baseHz` up to `maxHz`, at most `count` of them [Hz]. */
function harmonics(baseHz: number | null, maxHz: number, count: number): number[] {
  if (!baseHz || !(baseHz > 0)) return [];
  const out: number[] = [];
  for (let h = 1; h <= count && h * baseHz <= maxHz; h++) out.push(h * baseHz);
  return out;
}

async function step(ctx: AnalysisContext, fraction: number): Promise<void> {
  await ctx.progress?.(fraction);
}

function needSeries(decoded: DecodedRecording): Extract<DecodedRecording, { samples: Float64Array }> {
  if (decoded.format === "csv_frf") throw new AnalysisFailure("This kind of recording needs a time signal (WAV or a time_s,value CSV), not a frequency response.");
  return decoded;
}

function cut(decoded: DecodedRecording, ctx: AnalysisContext): RecordingResults {
  const s = needSeries(decoded);
  const a = analyzeRecording({
    samples: s.samples,
    sampleRateHz: s.sampleRateHz,
    ...(ctx.rpm !== null && ctx.flutes !== null ? { rpm: ctx.rpm, flutes: ctx.flutes } : {}),
    minRpm: ctx.machine.spindle.minRpm,
    maxRpm: ctx.machine.spindle.maxRpm,
  });
  const nyquist = s.sampleRateHz / 2;
  const rotationHz = a.measuredRpm !== null ? a.measuredRpm / 60 : null;
  return {
    kind: "cut",
    sampleRateHz: s.sampleRateHz,
    durationS: s.durationS,
    spectrum: spectrumSeries(a.spectrum.frequencyHz, a.spectrum.magnitude, a.binWidthHz, a.peaks),
    segments: a.segments,
    peaks: a.peaks.map((p) => peakResult(p, p.kind, p.harmonic)),
    measuredRpm: a.measuredRpm,
    toothPassingFrequencyHz: a.toothPassingFrequencyHz,
    spindleHarmonicsHz: harmonics(rotationHz, nyquist, 40),
    toothPassingHarmonicsHz: harmonics(a.toothPassingFrequencyHz, nyquist, 20),
    chatterCandidates: a.chatterCandidates.map((p) => peakResult(p, p.kind, p.harmonic)),
    suggestedSpeeds: a.suggestedSpeeds.map((sp) => ({ rpm: sp.rpm, chatterFrequencyHz: sp.chatterFrequencyHz, divisor: sp.divisor })),
    notes: a.notes,
  };
}

/** The decay after the tap: from 2 ms before the largest excursion, at most RING_DOWN_WINDOW_S long (and 2^21 samples). */
export function ringDownWindow(samples: Float64Array, sampleRateHz: number): Float64Array {
  let mean = 0;
  for (const v of samples) mean += v;
  mean /= samples.length;
  let at = 0;
  for (let i = 1; i < samples.length; i++) if (Math.abs(samples[i]! - mean) > Math.abs(samples[at]! - mean)) at = i;
  const start = Math.max(0, at - Math.round(0.002 * sampleRateHz));
  const length = Math.min(samples.length - start, Math.round(RING_DOWN_WINDOW_S * sampleRateHz), 2 ** 21);
  return samples.subarray(start, start + length);
}

function stiffnessFor(ctx: AnalysisContext, direction: Axis): Pick<ProposedMode, "stiffnessNPerMm" | "stiffnessSource"> {
  if (ctx.measuredStiffnessNPerMm !== null) return { stiffnessNPerMm: ctx.measuredStiffnessNPerMm, stiffnessSource: "dial_indicator_readings" };
  return { stiffnessNPerMm: ctx.machine.axes[direction].stiffnessNPerMm, stiffnessSource: "machine_value" };
}

function tap(decoded: DecodedRecording, ctx: AnalysisContext): RecordingResults {
  const s = needSeries(decoded);
  const direction = ctx.direction;
  if (!direction) throw new AnalysisFailure("A tap test needs the direction that was tapped (X, Y or Z).");
  const decay = ringDownWindow(s.samples, s.sampleRateHz);
  let ring;
  try {
    ring = analyzeRingDown({ samples: decay, sampleRateHz: s.sampleRateHz });
  } catch (error) {
    if (error instanceof RangeError) {
      throw new AnalysisFailure(
        `No clear ring-down was found after the tap (${error.message}). Tap once, firmly, with the microphone close to the spindle, and keep the room quiet for a few seconds after.`,
      );
    }
    throw error;
  }
  if (!(ring.fitQuality >= MIN_RING_DOWN_FIT_QUALITY)) {
    throw new AnalysisFailure(
      `No clear ring-down was found after the tap: the sound does not decay like a struck mode (fit quality ${ring.fitQuality.toFixed(2)}, at least ${MIN_RING_DOWN_FIT_QUALITY} needed). Tap once, firmly, with the microphone close to the spindle, and keep the room quiet for a few seconds after.`,
    );
  }
  const spec = welchSpectrum({ samples: decay, sampleRateHz: s.sampleRateHz });
  const stiffness = stiffnessFor(ctx, direction);
  const notes = [...ring.notes];
  notes.push(
    stiffness.stiffnessSource === "dial_indicator_readings"
      ? `Modal stiffness taken from the dial-indicator readings in ${direction.toUpperCase()} (the softest measured position).`
      : `No dial-indicator readings in ${direction.toUpperCase()} yet: the modal stiffness is the machine's recorded ${direction.toUpperCase()} stiffness. Measure it for a better mode.`,
  );
  if (ring.fitQuality < 0.9) notes.push(`The decay is not a clean exponential (fit quality ${ring.fitQuality.toFixed(2)}): several modes may ring together.`);
  return {
    kind: "tap",
    sampleRateHz: s.sampleRateHz,
    durationS: s.durationS,
    spectrum: spectrumSeries(spec.frequencyHz, spec.magnitude, spec.binWidthHz, []),
    ringDown: {
      frequencyHz: ring.frequencyHz,
      naturalFrequencyHz: ring.naturalFrequencyHz,
      dampingRatio: ring.dampingRatio,
      logDecrement: ring.logDecrement,
      cyclesUsed: ring.cyclesUsed,
      fitQuality: ring.fitQuality,
    },
    proposedMode: { direction, frequencyHz: ring.naturalFrequencyHz, dampingRatio: ring.dampingRatio, ...stiffness, source: "measured" },
    notes,
  };
}

function spindleFree(decoded: DecodedRecording, ctx: AnalysisContext): RecordingResults {
  const s = needSeries(decoded);
  const dial = ctx.dialSetting ? ctx.machine.spindle.dialSettings.find((d) => d.label === ctx.dialSetting) : undefined;
  const nominalRpm = dial?.rpm ?? ctx.rpm;
  if (!nominalRpm) throw new AnalysisFailure("Give the dial setting (or the nominal rpm) that was running, so the rotation peak can be found.");
  // Fine bins for a steady tone: segments of up to 4 s (bins ≤ 0.25 Hz), at most the record.
  const segmentLength = 2 ** Math.floor(Math.log2(Math.max(16, Math.min(s.samples.length, 4 * s.sampleRateHz))));
  const spec = welchSpectrum({ samples: s.samples, sampleRateHz: s.sampleRateHz, segmentLength });
  const nominalHz = nominalRpm / 60;
  const [rotation] = findSpectralPeaks({
    frequencyHz: spec.frequencyHz,
    magnitude: spec.magnitude,
    minFrequencyHz: nominalHz * (1 - ROTATION_SEARCH_FRACTION),
    maxFrequencyHz: Math.min(nominalHz * (1 + ROTATION_SEARCH_FRACTION), s.sampleRateHz / 2),
    maxPeaks: 1,
  });
  if (!rotation) {
    throw new AnalysisFailure(
      `No rotation peak stands out within ±${ROTATION_SEARCH_FRACTION * 100} % of ${nominalHz.toFixed(1)} Hz (${Math.round(nominalRpm)} rpm). Check the dial setting, or record closer to the spindle with nothing cutting.`,
    );
  }
  const all = findSpectralPeaks({ frequencyHz: spec.frequencyHz, magnitude: spec.magnitude, maxPeaks: 12 });
  const peaks = all.map((p) => {
    const m = Math.round(p.frequencyHz / rotation.frequencyHz);
    const tol = Math.max(1.5 * spec.binWidthHz, 0.005 * p.frequencyHz);
    return m >= 1 && Math.abs(p.frequencyHz - m * rotation.frequencyHz) <= tol ? peakResult(p, "spindle", m) : peakResult(p, "unclassified", null);
  });
  const measuredRpm = rotation.frequencyHz * 60;
  const differencePct = ((measuredRpm - nominalRpm) / nominalRpm) * 100;
  const notes = [
    `The spindle turns at ${rotation.frequencyHz.toFixed(2)} Hz × 60 = ${Math.round(measuredRpm)} rpm (${differencePct >= 0 ? "+" : ""}${differencePct.toFixed(1)} % against ${Math.round(nominalRpm)} rpm).`,
  ];
  if (!dial && ctx.dialSetting) notes.push(`The machine has no dial setting “${ctx.dialSetting}”; add it on the machine before applying the measured speed.`);
  return {
    kind: "spindle_free",
    sampleRateHz: s.sampleRateHz,
    durationS: s.durationS,
    spectrum: spectrumSeries(spec.frequencyHz, spec.magnitude, spec.binWidthHz, [rotation, ...all]),
    peaks,
    rotationFrequencyHz: rotation.frequencyHz,
    measuredRpm,
    dialSetting: ctx.dialSetting,
    nominalRpm,
    differencePct,
    notes,
  };
}

function frf(decoded: DecodedRecording, ctx: AnalysisContext): RecordingResults {
  if (decoded.format !== "csv_frf") throw new AnalysisFailure("A frequency-response recording must be a CSV with the columns frequency_hz,real,imag.");
  const direction = ctx.direction;
  if (!direction) throw new AnalysisFailure("A frequency response needs the direction it was measured in (X, Y or Z).");
  let fit;
  try {
    fit = fitModeFromFrf({ frequencyHz: decoded.frequencyHz, real: decoded.real, imag: decoded.imag });
  } catch (error) {
    if (error instanceof RangeError) throw new AnalysisFailure(`No mode could be fitted to this frequency response (${error.message}).`);
    throw error;
  }
  const magnitude = Array.from(decoded.real, (re, i) => Math.hypot(re, decoded.imag[i]!));
  const n = decoded.frequencyHz.length;
  const binWidthHz = n > 1 ? (decoded.frequencyHz[n - 1]! - decoded.frequencyHz[0]!) / (n - 1) : 0;
  const z = fit.dampingRatio;
  // |G| at the peak of one mode: 1 / (2ζ√(1 − ζ²) k)
  const peakMagnitude = 1 / (2 * z * Math.sqrt(1 - z * z) * fit.stiffnessNPerMm);
  return {
    kind: "frf",
    spectrum: spectrumSeries(decoded.frequencyHz, magnitude, binWidthHz, [{ frequencyHz: fit.peakFrequencyHz, magnitude: peakMagnitude }]),
    fittedMode: {
      frequencyHz: fit.frequencyHz,
      dampingRatio: fit.dampingRatio,
      stiffnessNPerMm: fit.stiffnessNPerMm,
      peakFrequencyHz: fit.peakFrequencyHz,
      lowerHalfPowerHz: fit.lowerHalfPowerHz,
      upperHalfPowerHz: fit.upperHalfPowerHz,
    },
    proposedMode: {
      direction,
      frequencyHz: fit.frequencyHz,
      dampingRatio: fit.dampingRatio,
      stiffnessNPerMm: fit.stiffnessNPerMm,
      stiffnessSource: "modal_fit",
      source: "fitted",
    },
    notes: [
      `Peak-picking fit of the largest resonance: half-power points ${fit.lowerHalfPowerHz.toFixed(1)} and ${fit.upperHalfPowerHz.toFixed(1)} Hz.`,
    ],
  };
}

/** Runs the analysis for the recording's kind; throws AnalysisFailure with a reason for people. */
export async function analyseRecording(decoded: DecodedRecording, ctx: AnalysisContext): Promise<RecordingResults> {
  await step(ctx, 0.5);
  const run = { cut, tap, spindle_free: spindleFree, frf }[ctx.kind];
  const results = run(decoded, ctx);
  await step(ctx, 0.9);
  return results;
}
