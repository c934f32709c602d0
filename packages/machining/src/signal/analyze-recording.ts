import { stableSpindleSpeedsRpm } from "../dynamics/stable-spindle-speeds-rpm.js";
import { requirePositive, requirePositiveInteger } from "../internal/require.js";
import { findSpectralPeaks, type SpectralPeak } from "./find-spectral-peaks.js";
import { welchSpectrum } from "./welch-spectrum.js";

/** What a spectral peak of a recorded cut is, given the spindle speed and flute count. */
export type PeakKind = "tooth-passing" | "spindle" | "chatter-candidate" | "unclassified";

/** A classified peak. */
export interface RecordingPeak extends SpectralPeak {
  kind: PeakKind;
  /** For tooth-passing peaks the harmonic h of f_tp; for spindle peaks the harmonic of the rotation frequency; else null */
  harmonic: number | null;
}

/** A spindle speed suggested to move out of chatter. */
export interface SpeedSuggestion {
  /** Suggested spindle speed [rpm] */
  rpm: number;
  /** Chatter frequency it answers [Hz] */
  chatterFrequencyHz: number;
  /** j: tooth-passing frequency = chatter frequency / j [-] */
  divisor: number;
}

/** Result of analysing a recording of a cut. */
export interface RecordingAnalysis {
  sampleRateHz: number;
  /** Record length [s] */
  durationS: number;
  /** Welch-averaged amplitude spectrum, 0 … fs/2 */
  spectrum: { frequencyHz: number[]; magnitude: number[] };
  /** Δf [Hz] */
  binWidthHz: number;
  /** FFT length [samples] */
  segmentLength: number;
  /** Averaged segments [-] */
  segments: number;
  /** Peaks, strongest first, classified when rpm and flutes are given */
  peaks: RecordingPeak[];
  /** Spindle speed used for classification: measured from the tooth-passing peak when it is found near the nominal one [rpm] */
  measuredRpm: number | null;
  /** Tooth-passing frequency at measuredRpm [Hz] */
  toothPassingFrequencyHz: number | null;
  /** Peaks that are not harmonics of the rotation: possible chatter, strongest first */
  chatterCandidates: RecordingPeak[];
  /** Speeds putting f_tp at the strongest chatter candidate / j, nearest to the current speed first */
  suggestedSpeeds: SpeedSuggestion[];
  /** Plain-language notes about the analysis */
  notes: string[];
}

/**
 * Analyses the sound (or acceleration) of a recorded cut: Welch-averaged spectrum, its peaks and,
 * when the spindle speed and flute count are known, which peaks are forced vibration at the
 * tooth-passing frequency and its harmonics (or at multiples of the rotation frequency: runout)
 * and which are chatter candidates, with spindle speeds that would move the tooth-passing
 * frequency onto the chatter frequency divided by 1, 2, 3 …
 *
 * Classification: spindle frequency fs = n/60, refined from the strongest peak within ±4 % of the
 * nominal tooth-passing frequency (routers slow down under load). A peak within
 * max(1.5·Δf, 0.5 % of f) of an integer multiple m·fs is forced: "tooth-passing" when m is a
 * multiple of the flute count, "spindle" otherwise. Other peaks are chatter candidates (chatter is
 * not a multiple of the rotation frequency). Suggested speeds: n_j = 60·fc/(N·j), j = 1 … 8, within
 * [minRpm, maxRpm] when given, sorted by closeness to the current speed.
 *
 * @param input.samples recorded signal (microphone or accelerometer) [any unit]
 * @param input.sampleRateHz fs [Hz]
 * @param input.rpm spindle speed during the recording [rpm] (optional)
 * @param input.flutes cutter flutes [-] (optional; needed with rpm for classification)
 * @param input.minRpm, input.maxRpm spindle range for suggestions [rpm] (optional)
 * @param input.segmentLength FFT length, power of two (default: bins ≤ 3 Hz)
 * @param input.maxPeaks peaks to report (default 12)
 * @returns spectrum, peaks, classification and suggestions
 * @throws RangeError for invalid samples or options (see welchSpectrum)
 * @source Chatter is not periodic with the spindle: Delio, Tlusty & Smith, "Use of audio signals for
 *   chatter detection and control", ASME J. Eng. Ind. 114(2), 1992 (from memory); Schmitz & Smith,
 *   Machining Dynamics, 2009 (from memory); speed selection: Smith & Tlusty 1990/1992.
 */
export function analyzeRecording(input: {
  samples: ArrayLike<number>;
  sampleRateHz: number;
  rpm?: number;
  flutes?: number;
  minRpm?: number;
  maxRpm?: number;
  segmentLength?: number;
  maxPeaks?: number;
}): RecordingAnalysis {
  const fn = "analyzeRecording";
  if (input.rpm !== undefined) requirePositive(fn, "rpm", input.rpm);
  if (input.flutes !== undefined) requirePositiveInteger(fn, "flutes", input.flutes);
  if (input.minRpm !== undefined) requirePositive(fn, "minRpm", input.minRpm);
  if (input.maxRpm !== undefined) requirePositive(fn, "maxRpm", input.maxRpm);
  const spec = welchSpectrum({
    samples: input.samples,
    sampleRateHz: input.sampleRateHz,
    ...(input.segmentLength !== undefined ? { segmentLength: input.segmentLength } : {}),
  });
  const found = findSpectralPeaks({
    frequencyHz: spec.frequencyHz,
    magnitude: spec.magnitude,
    maxPeaks: input.maxPeaks ?? 12,
  });
  const notes: string[] = [];
  const base = {
    sampleRateHz: input.sampleRateHz,
    durationS: input.samples.length / input.sampleRateHz,
    spectrum: { frequencyHz: spec.frequencyHz, magnitude: spec.magnitude },
    binWidthHz: spec.binWidthHz,
    segmentLength: spec.segmentLength,
    segments: spec.segments,
  };
  if (found.length === 0) notes.push("No peak stands clearly above the noise floor.");
  if (input.rpm === undefined || input.flutes === undefined) {
    if (found.length > 0) notes.push("Give the spindle speed and flute count to separate tooth-passing harmonics from chatter.");
    return {
      ...base,
      peaks: found.map((p) => ({ ...p, kind: "unclassified" as const, harmonic: null })),
      measuredRpm: null,
      toothPassingFrequencyHz: null,
      chatterCandidates: [],
      suggestedSpeeds: [],
      notes,
    };
  }
  const flutes = input.flutes;
  const nominalTp = (input.rpm * flutes) / 60;
  // Refine the rotation frequency from the strongest peak near the nominal tooth-passing frequency.
  let tp = nominalTp;
  const nearTp = found.find((p) => Math.abs(p.frequencyHz - nominalTp) <= 0.04 * nominalTp);
  if (nearTp) {
    tp = nearTp.frequencyHz;
    if (Math.abs(tp - nominalTp) > Math.max(spec.binWidthHz, 0.002 * nominalTp)) {
      notes.push(
        `Tooth passing measured at ${tp.toFixed(1)} Hz instead of ${nominalTp.toFixed(1)} Hz: the spindle ran at about ${((tp * 60) / flutes).toFixed(0)} rpm.`,
      );
    }
  } else {
    notes.push(`No peak found at the tooth-passing frequency (${nominalTp.toFixed(1)} Hz); classification uses the nominal speed.`);
  }
  const fs = tp / flutes;
  const peaks: RecordingPeak[] = found.map((p) => {
    const m = Math.round(p.frequencyHz / fs);
    const tol = Math.max(1.5 * spec.binWidthHz, 0.005 * p.frequencyHz);
    if (m >= 1 && Math.abs(p.frequencyHz - m * fs) <= tol) {
      return m % flutes === 0 ? { ...p, kind: "tooth-passing", harmonic: m / flutes } : { ...p, kind: "spindle", harmonic: m };
    }
    return { ...p, kind: "chatter-candidate", harmonic: null };
  });
  const chatterCandidates = peaks.filter((p) => p.kind === "chatter-candidate");
  const measuredRpm = fs * 60;
  const suggestedSpeeds: SpeedSuggestion[] = [];
  const strongest = chatterCandidates[0];
  if (strongest) {
    const lo = input.minRpm ?? 0;
    const hi = input.maxRpm ?? Number.MAX_VALUE;
    stableSpindleSpeedsRpm({ chatterFrequencyHz: strongest.frequencyHz, flutes, count: 8 }).forEach((rpm, i) => {
      if (rpm >= lo && rpm <= hi) suggestedSpeeds.push({ rpm, chatterFrequencyHz: strongest.frequencyHz, divisor: i + 1 });
    });
    suggestedSpeeds.sort((a, b) => Math.abs(Math.log(a.rpm / measuredRpm)) - Math.abs(Math.log(b.rpm / measuredRpm)));
    notes.push(
      `Strongest chatter candidate at ${strongest.frequencyHz.toFixed(1)} Hz (${(strongest.frequencyHz / fs).toFixed(2)} × the rotation frequency, not a whole multiple).`,
    );
    if (suggestedSpeeds.length === 0) notes.push("No speed that answers this chatter frequency lies inside the spindle's range.");
  } else if (found.length > 0) {
    notes.push("Every peak is a multiple of the rotation frequency: no sign of chatter in this recording.");
  }
  return { ...base, peaks, measuredRpm, toothPassingFrequencyHz: tp, chatterCandidates, suggestedSpeeds, notes };
}
