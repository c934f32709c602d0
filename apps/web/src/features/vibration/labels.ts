import type { RecordingKind, RecordingStatus, Role } from "@ringdown/contracts";

export const kindLabels: Record<RecordingKind, string> = {
  cut: "Recorded cut",
  tap: "Tap test",
  spindle_free: "Spindle running free",
  frf: "Frequency response (CSV)",
};

export const kindHints: Record<RecordingKind, string> = {
  cut: "The sound of a cut at a known speed: tooth-passing harmonics are told apart from chatter, and speeds that move out of it are suggested.",
  tap: "Tap the spindle or the part with a small hammer next to the microphone; the ring-down gives a mode's frequency and damping.",
  spindle_free: "The spindle running with no cut at one dial setting: its rotation frequency × 60 is the real speed of that setting.",
  frf: "A measured frequency response (frequency, real, imaginary in mm/N): a mode is fitted to its peak.",
};

export const kindOptions = (Object.keys(kindLabels) as RecordingKind[]).map((value) => ({ value, label: kindLabels[value] }));

export const statusLabels: Record<RecordingStatus, string> = {
  queued: "Waiting for analysis",
  analysing: "Analysing",
  done: "Analysed",
  failed: "Analysis failed",
};

export const formatLabels = { wav: "WAV", csv_series: "CSV time series", csv_frf: "CSV frequency response" } as const;

export const directionOptions = [
  { value: "x", label: "X" },
  { value: "y", label: "Y" },
  { value: "z", label: "Z" },
];

/** Owners and tooling managers change a machine's measured figures; everyone reads them and uploads recordings. */
export function canEditProfile(role: Role): boolean {
  return role === "owner" || role === "tooling_manager";
}
