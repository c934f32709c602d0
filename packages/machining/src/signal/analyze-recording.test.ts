import { describe, expect, it } from "vitest";
import { analyzeRecording } from "./analyze-recording.js";
import { tones } from "./signals.fixture.js";

const fs = 48000;

/** A synthetic cut: 2 flutes at `rpm`, tooth-passing harmonics, a runout line and optional chatter. */
function cut(rpm: number, chatterHz: number | null, seconds = 2) {
  const f = rpm / 60;
  const parts = [
    { hz: 2 * f, amp: 1 },
    { hz: 4 * f, amp: 0.5 },
    { hz: 6 * f, amp: 0.25 },
    { hz: f, amp: 0.2 },
  ];
  if (chatterHz) parts.push({ hz: chatterHz, amp: 1.2 });
  return tones(seconds * fs, fs, parts, 0.05, 11);
}

describe("analyzeRecording", () => {
  it("CHT-2: separates tooth passing (600 Hz and harmonics), runout (300 Hz) and chatter (730.2 Hz), and suggests 21 906 then 10 953 rpm (domain-reference CHT-2, FFT-5)", () => {
    const a = analyzeRecording({ samples: cut(18000, 730.2), sampleRateHz: fs, rpm: 18000, flutes: 2 });
    const kindAt = (hz: number) => a.peaks.find((p) => Math.abs(p.frequencyHz - hz) < 3);
    expect(kindAt(600)?.kind).toBe("tooth-passing");
    expect(kindAt(600)?.harmonic).toBe(1);
    expect(kindAt(1200)?.kind).toBe("tooth-passing");
    expect(kindAt(1200)?.harmonic).toBe(2);
    expect(kindAt(300)?.kind).toBe("spindle");
    expect(kindAt(730.2)?.kind).toBe("chatter-candidate");
    expect(a.chatterCandidates[0]!.frequencyHz).toBeCloseTo(730.2, 0);
    expect(a.suggestedSpeeds[0]!.rpm).toBeCloseTo(21906, -1);
    expect(a.suggestedSpeeds[0]!.divisor).toBe(1);
    expect(a.suggestedSpeeds.some((s) => Math.abs(s.rpm - 10953) < 10 && s.divisor === 2)).toBe(true);
    expect(a.toothPassingFrequencyHz).toBeCloseTo(600, 0);
  });

  it("keeps suggestions inside the spindle's range", () => {
    const a = analyzeRecording({ samples: cut(18000, 730.2), sampleRateHz: fs, rpm: 18000, flutes: 2, minRpm: 8000, maxRpm: 20000 });
    expect(a.suggestedSpeeds.every((s) => s.rpm >= 8000 && s.rpm <= 20000)).toBe(true);
    expect(a.suggestedSpeeds[0]!.rpm).toBeCloseTo(10953, -1);
  });

  it("measures the real spindle speed when the router slowed under load (17 700 rpm against 18 000 nominal)", () => {
    const a = analyzeRecording({ samples: cut(17700, null), sampleRateHz: fs, rpm: 18000, flutes: 2 });
    expect(a.measuredRpm).toBeCloseTo(17700, -1);
    expect(a.chatterCandidates).toEqual([]);
    expect(a.peaks.every((p) => p.kind !== "chatter-candidate")).toBe(true);
    expect(a.notes.join(" ")).toMatch(/spindle ran at about 17[67]\d\d rpm/);
  });

  it("without speed and flutes it only lists peaks", () => {
    const a = analyzeRecording({ samples: cut(18000, 730.2, 1), sampleRateHz: fs });
    expect(a.peaks.length).toBeGreaterThan(3);
    expect(a.peaks.every((p) => p.kind === "unclassified")).toBe(true);
    expect(a.spectrum.frequencyHz.length).toBe(a.spectrum.magnitude.length);
    expect(a.durationS).toBeCloseTo(1, 12);
  });

  it("rejects a fractional flute count", () => {
    expect(() => analyzeRecording({ samples: cut(18000, null, 1), sampleRateHz: fs, rpm: 18000, flutes: 1.5 })).toThrow("analyzeRecording requires flutes to be an integer >= 1");
  });
});
