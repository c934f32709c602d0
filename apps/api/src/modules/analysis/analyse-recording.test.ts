import { describe, expect, it } from "vitest";
import { recordingResultsSchema, type CutResults, type FrfResults, type SpindleFreeResults, type TapResults } from "@ringdown/contracts";
import { decodeRecording } from "../recordings/recording-decoder.js";
import { ringDownSignal, sdofFrfCsv, toneSignal, wavBytes } from "../recordings/recording-fixtures.js";
import { AnalysisFailure, analyseRecording, SPECTRUM_POINTS, type AnalysisContext } from "./analyse-recording.js";

const machine: AnalysisContext["machine"] = {
  spindle: {
    minRpm: 8000,
    maxRpm: 24000,
    powerW: 1500,
    powerCurve: [],
    dialSettings: [{ label: "3", rpm: 18000, measured: false }],
  },
  axes: {
    x: { drive: "belt", travelMm: 600, maxFeedMmPerMin: 5000, accelerationMmPerS2: 500, backlashMm: 0.02, movingMassKg: 10, stiffnessNPerMm: 400 },
    y: { drive: "belt", travelMm: 600, maxFeedMmPerMin: 5000, accelerationMmPerS2: 500, backlashMm: 0.02, movingMassKg: 10, stiffnessNPerMm: 300 },
    z: { drive: "lead_screw", travelMm: 100, maxFeedMmPerMin: 2000, accelerationMmPerS2: 300, backlashMm: 0.02, movingMassKg: 5, stiffnessNPerMm: 800 },
  },
};
const ctx = (over: Partial<AnalysisContext>): AnalysisContext => ({
  kind: "cut",
  rpm: null,
  flutes: null,
  direction: null,
  dialSetting: null,
  machine,
  measuredStiffnessNPerMm: null,
  ...over,
});

describe("analysis of a recorded cut (synthetic signal with a known tone and a known tooth-passing frequency)", () => {
  // How the signal was made: fs = 48 000 Hz, 2.0 s, written as a 16-bit mono WAV (full scale 32 767);
  //   0.40·sin(2π·600 t)     tooth passing: 2 flutes at 18 000 rpm → 600 Hz (domain-reference TPF-1)
  //   0.15·sin(2π·1200 t)    its second harmonic
  //   0.50·sin(2π·730.2 t)   a tone that is not a multiple of the 300 Hz rotation (domain-reference FFT-5)
  //   0.025·N(0,1)           Gaussian noise, mulberry32 seed 1 (Box–Muller)
  // Expectation (domain-reference FFT-4/FFT-5, COMPUTED there for the same fs, a 16 384-point Hann
  // window and parabolic interpolation): 600 Hz is read as 599.959 Hz, 730.2 Hz as 730.242 Hz, each
  // within ±0.15 Hz; 730.2/300 = 2.434 is not a whole multiple → chatter candidate; 600/300 = 2 →
  // tooth passing. Speeds answering 730.2 Hz with 2 flutes (CHT-2): 21 906 rpm (j = 1), 10 953 rpm (j = 2).
  const signal = toneSignal({
    sampleRateHz: 48000,
    durationS: 2,
    tones: [
      { frequencyHz: 600, amplitude: 0.4 },
      { frequencyHz: 1200, amplitude: 0.15 },
      { frequencyHz: 730.2, amplitude: 0.5 },
    ],
    noiseSigma: 0.025,
    noiseSeed: 1,
  });

  it("finds the tooth-passing frequency and its harmonic, flags the 730 Hz tone as chatter and suggests 21 906 and 10 953 rpm", async () => {
    const decoded = decodeRecording(wavBytes(signal, 48000, "16"));
    const results = recordingResultsSchema.parse(await analyseRecording(decoded, ctx({ kind: "cut", rpm: 18000, flutes: 2 }))) as CutResults;
    expect(results.kind).toBe("cut");
    expect(results.sampleRateHz).toBe(48000);
    expect(results.durationS).toBeCloseTo(2, 9);

    const tp = results.peaks.find((p) => p.kind === "tooth-passing" && p.harmonic === 1)!;
    expect(tp.frequencyHz).toBeGreaterThan(599.959 - 0.15);
    expect(tp.frequencyHz).toBeLessThan(599.959 + 0.15);
    expect(results.toothPassingFrequencyHz).toBeCloseTo(tp.frequencyHz, 9);
    expect(results.measuredRpm! / 18000).toBeGreaterThan(0.999);
    expect(results.measuredRpm! / 18000).toBeLessThan(1.001);
    expect(results.peaks.some((p) => p.kind === "tooth-passing" && p.harmonic === 2 && Math.abs(p.frequencyHz - 1200) < 0.3)).toBe(true);

    const chatter = results.chatterCandidates[0]!;
    expect(chatter.frequencyHz).toBeGreaterThan(730.242 - 0.15);
    expect(chatter.frequencyHz).toBeLessThan(730.242 + 0.15);
    expect(results.chatterCandidates.every((c) => c.kind === "chatter-candidate")).toBe(true);

    // n = 60 fc / (N j): within 0.15 Hz of 730.2 Hz → within 60·0.15/2 = 4.5 rpm of 21 906 and 2.3 rpm of 10 953.
    const rpms = results.suggestedSpeeds.map((s) => s.rpm);
    expect(rpms.some((r) => Math.abs(r - 21906) < 5)).toBe(true);
    expect(rpms.some((r) => Math.abs(r - 10953) < 3)).toBe(true);
    // Only speeds inside the machine's 8 000–24 000 rpm range.
    expect(rpms.every((r) => r >= 8000 && r <= 24000)).toBe(true);

    // Markers for the chart: rotation harmonics every 300 Hz, tooth-passing harmonics every 600 Hz.
    expect(results.spindleHarmonicsHz[0]).toBeCloseTo(tp.frequencyHz / 2, 6);
    expect(results.toothPassingHarmonicsHz[1]).toBeCloseTo(2 * tp.frequencyHz, 6);
  });

  it("sends at most ~8 k spectrum points and keeps every reported peak exactly", async () => {
    const decoded = decodeRecording(wavBytes(signal, 48000, "16"));
    const results = (await analyseRecording(decoded, ctx({ kind: "cut", rpm: 18000, flutes: 2 }))) as CutResults;
    expect(results.spectrum.originalPoints).toBe(16384 / 2 + 1);
    expect(results.spectrum.frequencyHz.length).toBeLessThanOrEqual(SPECTRUM_POINTS + 2 + results.peaks.length);
    for (const p of results.peaks) {
      const i = results.spectrum.frequencyHz.indexOf(p.frequencyHz);
      expect(i).toBeGreaterThanOrEqual(0);
      expect(results.spectrum.magnitude[i]).toBe(p.magnitude);
    }
  });

  it("without rpm and flutes leaves the peaks unclassified and suggests nothing", async () => {
    const decoded = decodeRecording(wavBytes(signal, 48000, "16"));
    const results = (await analyseRecording(decoded, ctx({ kind: "cut" }))) as CutResults;
    expect(results.peaks.length).toBeGreaterThanOrEqual(3);
    expect(results.peaks.every((p) => p.kind === "unclassified")).toBe(true);
    expect(results.suggestedSpeeds).toEqual([]);
  });
});

describe("analysis of a tap test", () => {
  // Made as: 8 kHz, 3 s, silence until 0.5 s, then 0.8·e^(−ζωn t)·cos(ωd t) with fn = 180 Hz, ζ = 0.02,
  // + 0.001·N(0,1) (mulberry32 seed 2). Expected: fn ≈ 180 Hz and ζ ≈ 0.02 (domain-reference DMP-6: the
  // log decrement of an exact decay returns its ζ); tolerances ±1 Hz and ±10 % for the noise.
  const signal = ringDownSignal({ sampleRateHz: 8000, durationS: 3, tapAtS: 0.5, naturalFrequencyHz: 180, dampingRatio: 0.02, amplitude: 0.8, noiseSigma: 0.001 });

  it("gives frequency and damping of the mode, completed by the dial-indicator stiffness in that direction", async () => {
    const decoded = decodeRecording(wavBytes(signal, 8000, "24"));
    const results = recordingResultsSchema.parse(
      await analyseRecording(decoded, ctx({ kind: "tap", direction: "y", measuredStiffnessNPerMm: 275 })),
    ) as TapResults;
    expect(results.ringDown.naturalFrequencyHz).toBeGreaterThan(179);
    expect(results.ringDown.naturalFrequencyHz).toBeLessThan(181);
    expect(results.ringDown.dampingRatio).toBeGreaterThan(0.018);
    expect(results.ringDown.dampingRatio).toBeLessThan(0.022);
    expect(results.proposedMode).toEqual({
      direction: "y",
      frequencyHz: results.ringDown.naturalFrequencyHz,
      dampingRatio: results.ringDown.dampingRatio,
      stiffnessNPerMm: 275,
      stiffnessSource: "dial_indicator_readings",
      source: "measured",
    });
  });

  it("falls back on the machine's stiffness without readings, and says so", async () => {
    const decoded = decodeRecording(wavBytes(signal, 8000, "16"));
    const results = (await analyseRecording(decoded, ctx({ kind: "tap", direction: "x" }))) as TapResults;
    expect(results.proposedMode.stiffnessNPerMm).toBe(400);
    expect(results.proposedMode.stiffnessSource).toBe("machine_value");
    expect(results.notes.join(" ")).toMatch(/No dial-indicator readings in X/);
  });

  it("fails with a reason when there is no ring-down (pure noise)", async () => {
    const noise = toneSignal({ sampleRateHz: 8000, durationS: 1, tones: [], noiseSigma: 0.1, noiseSeed: 7 });
    await expect(analyseRecording(decodeRecording(wavBytes(noise, 8000, "16")), ctx({ kind: "tap", direction: "x" }))).rejects.toBeInstanceOf(AnalysisFailure);
  });
});

describe("analysis of the spindle running free", () => {
  // Made as: 22.05 kHz, 5 s, 0.3·sin(2π·292.5 t) + 0.1·sin(2π·585 t) + 0.01·N(0,1) (seed 3): the dial says
  // 18 000 rpm (300 Hz) but the spindle turns at 292.5 Hz → 292.5 × 60 = 17 550 rpm (rotation frequency × 60).
  it("measures the real speed of the dial setting", async () => {
    const signal = toneSignal({
      sampleRateHz: 22050,
      durationS: 5,
      tones: [
        { frequencyHz: 292.5, amplitude: 0.3 },
        { frequencyHz: 585, amplitude: 0.1 },
      ],
      noiseSigma: 0.01,
      noiseSeed: 3,
    });
    const results = recordingResultsSchema.parse(
      await analyseRecording(decodeRecording(wavBytes(signal, 22050, "32f")), ctx({ kind: "spindle_free", dialSetting: "3" })),
    ) as SpindleFreeResults;
    expect(results.nominalRpm).toBe(18000);
    // Bins of 22050/65536 = 0.336 Hz; parabolic interpolation within 0.05 Hz → ±3 rpm.
    expect(Math.abs(results.measuredRpm - 17550)).toBeLessThan(3);
    expect(results.rotationFrequencyHz * 60).toBeCloseTo(results.measuredRpm, 9);
    expect(results.differencePct).toBeCloseTo(((results.measuredRpm - 18000) / 18000) * 100, 9);
    expect(results.peaks.find((p) => Math.abs(p.frequencyHz - 585) < 0.5)?.harmonic).toBe(2);
  });
});

describe("analysis of a frequency response", () => {
  // Made as: the exact receptance 1/(k(1 − r² + 2iζr)) with fn = 500 Hz, ζ = 0.05, k = 2000 N/mm, 200–800 Hz
  // in 0.5 Hz steps. Expected (domain-reference DMP-2: half-power points 473.055 and 523.181 Hz for this
  // mode; the exact inversion returns fn and ζ): fn 500 Hz, ζ 0.05, k 2000 N/mm.
  it("fits the mode and proposes it as a fitted mode", async () => {
    const decoded = decodeRecording(sdofFrfCsv({ naturalFrequencyHz: 500, dampingRatio: 0.05, stiffnessNPerMm: 2000, fromHz: 200, toHz: 800, stepHz: 0.5 }));
    const results = recordingResultsSchema.parse(await analyseRecording(decoded, ctx({ kind: "frf", direction: "x" }))) as FrfResults;
    expect(results.fittedMode.frequencyHz).toBeCloseTo(500, 0);
    expect(results.fittedMode.dampingRatio).toBeCloseTo(0.05, 3);
    expect(results.fittedMode.stiffnessNPerMm / 2000).toBeCloseTo(1, 2);
    expect(results.fittedMode.lowerHalfPowerHz).toBeCloseTo(473.055, 0);
    expect(results.fittedMode.upperHalfPowerHz).toBeCloseTo(523.181, 0);
    expect(results.proposedMode).toMatchObject({ direction: "x", source: "fitted", stiffnessSource: "modal_fit" });
  });

  it("refuses a time signal for a frequency-response analysis", async () => {
    const decoded = decodeRecording(wavBytes(toneSignal({ sampleRateHz: 8000, durationS: 1, tones: [{ frequencyHz: 100, amplitude: 0.5 }] }), 8000, "16"));
    await expect(analyseRecording(decoded, ctx({ kind: "frf", direction: "x" }))).rejects.toThrow(/CSV with the columns frequency_hz,real,imag/);
  });
});
