import { z } from "zod";
import { axisSchema, ceilingBandSchema, machineAxisSchema, modeSources } from "./library.js";

/*
 * A machine's vibration profile: dial-indicator stiffness and backlash readings, vibration modes,
 * ceilings, recordings (cut, tap test, spindle running free, frequency response) and their analysis.
 * Lengths in mm, forces in N, stiffness in N/mm, frequencies in Hz, speeds in rpm, receptance in mm/N.
 * Routes live under /api/shops/:shopId/machines/:machineId/ (see each schema), plus
 * POST /api/shops/:shopId/recordings/:id/accept-mode and …/accept-dial-rpm.
 *
 *   GET    stiffness-readings            → stiffnessReadingListSchema       (every member)
 *   POST   stiffness-readings            → 201 stiffnessReadingMutationSchema (owner, tooling manager)
 *   DELETE stiffness-readings/:id        → 200 stiffnessReadingMutationSchema (owner, tooling manager)
 *   GET    stiffness-map?cells=21        → stiffnessMapSchema
 *   GET    backlash-readings             → backlashReadingListSchema
 *   POST   backlash-readings             → 201 backlashReadingMutationSchema (owner, tooling manager)
 *   DELETE backlash-readings/:id         → 200 backlashReadingMutationSchema (owner, tooling manager)
 *   GET    modes                         → machineModeListSchema
 *   POST   modes                         → 201 modeMutationSchema (owner, tooling manager)
 *   PATCH  modes/:id                     → 200 modeMutationSchema (owner, tooling manager)
 *   DELETE modes/:id                     → 200 modeMutationSchema (the removed mode; owner, tooling manager)
 *   GET    ceilings                      → ceilingsSchema
 *   PUT    ceilings                      → 200 ceilingsMutationSchema (owner, tooling manager)
 *   GET    recordings?kind=              → recordingListSchema (newest first, without results)
 *   POST   recordings (multipart)        → 202 recordingAcceptedSchema (every member)
 *   GET    recordings/:id                → recordingDetailSchema (poll while queued / analysing)
 *   GET    recordings/:id/file           → the uploaded file as stored
 *   DELETE recordings/:id                → 204 (owner, tooling manager; modes accepted from it stay)
 *   POST   /api/shops/:shopId/recordings/:id/accept-mode      → 201 acceptModeResponseSchema (owner, tooling manager)
 *   POST   /api/shops/:shopId/recordings/:id/accept-dial-rpm  → 200 acceptDialRpmResponseSchema (owner, tooling manager)
 */

const uuid = z.string().uuid();
const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters`);
const finite = (what: string) => z.number({ error: `Enter ${what}` }).finite(`Enter ${what}`);
const positive = (what: string, unit: string, max: number) =>
  finite(what).gt(0, `${what} must be more than 0 ${unit}`).max(max, `${what} must be at most ${max} ${unit}`);

/** A measurement date: "YYYY-MM-DD" or a full ISO date-time. The server refuses dates in the future. */
export const measuredAtSchema = z.union([z.iso.date(), z.iso.datetime({ offset: true })], {
  error: "Enter the date of the measurement (YYYY-MM-DD)",
});

/** Result of the re-check rule: a measurement that moves stiffness or a mode by more than this flags the machine's recipes. */
export const RECHECK_THRESHOLD_PCT = 15;

/** What moved, by how much, and whether it crossed the re-check threshold. */
export const vibrationChangeSchema = z.object({
  /** Machine static stiffness or axis backlash in a direction, or a mode's frequency / modal stiffness, or a mode added / removed */
  what: z.enum(["stiffness", "backlash", "mode_frequency", "mode_stiffness", "mode_added", "mode_removed"]),
  direction: axisSchema,
  before: z.number().nullable(),
  after: z.number().nullable(),
  /** |after − before| / before × 100; null when a mode was added or removed */
  changePct: z.number().nullable(),
  unit: z.enum(["N/mm", "Hz", "mm"]),
  /** True when this change alone sets needs_recheck on the machine's recipes */
  material: z.boolean(),
});
export type VibrationChange = z.infer<typeof vibrationChangeSchema>;

/** Every mutation that can move stiffness or modes answers with these next to the changed row. */
export const recheckOutcomeSchema = z.object({
  changes: z.array(vibrationChangeSchema),
  /** Recipes on this machine (not deleted) marked `needsRecheck` by this request, already-marked ones included; 0 when no change was material */
  recipesFlagged: z.number().int().min(0),
});
export type RecheckOutcome = z.infer<typeof recheckOutcomeSchema>;

// ---------------------------------------------------------------- stiffness readings
/** POST …/stiffness-readings: a known force on the spindle and the dial-indicator deflection it caused. */
export const stiffnessReadingBodySchema = z.object({
  /** Work position of the spindle when the reading was taken, machine coordinates from the envelope's corner [mm] */
  xMm: finite("position X").min(0, "Position X cannot be negative: it is measured from the envelope's corner"),
  yMm: finite("position Y").min(0, "Position Y cannot be negative: it is measured from the envelope's corner"),
  zMm: finite("position Z").min(0, "Position Z cannot be negative: it is measured from the envelope's corner").default(0),
  /** Direction of the push and of the measured deflection */
  direction: axisSchema,
  forceN: finite("force").gt(0, "Force must be more than 0 N: push with a known load (spring scale or weights)").max(5000, "Force must be at most 5000 N"),
  deflectionMm: finite("deflection")
    .gt(0, "Deflection must be more than 0 mm: a loaded machine always deflects; if the dial did not move, use a larger force")
    .max(10, "Deflection must be at most 10 mm"),
  note: text(500).default(""),
  measuredAt: measuredAtSchema,
}).superRefine((b, ctx) => {
  // The reading sets the machine's stiffness (F/δ): it must be one a machine axis may have, or a
  // tiny deflection would store an absurd (even infinite) stiffness.
  if (b.forceN > 0 && b.deflectionMm > 0 && !machineAxisSchema.shape.stiffnessNPerMm.safeParse(b.forceN / b.deflectionMm).success) {
    ctx.addIssue({ code: "custom", path: ["deflectionMm"], message: "Force ÷ deflection is stiffer than any machine axis may be: check the dial reading and its units" });
  }
});
export type StiffnessReadingBody = z.infer<typeof stiffnessReadingBodySchema>;

export const stiffnessReadingSchema = z.object({
  id: uuid,
  machineId: uuid,
  xMm: z.number(),
  yMm: z.number(),
  zMm: z.number(),
  direction: axisSchema,
  forceN: z.number(),
  deflectionMm: z.number(),
  /** forceN / deflectionMm [N/mm] */
  stiffnessNPerMm: z.number(),
  note: z.string(),
  measuredAt: z.string(),
  createdAt: z.string(),
});
export type StiffnessReading = z.infer<typeof stiffnessReadingSchema>;
export const stiffnessReadingListSchema = z.object({ items: z.array(stiffnessReadingSchema) });
export type StiffnessReadingList = z.infer<typeof stiffnessReadingListSchema>;

/** How the machine's single per-direction stiffness is derived from the map. */
export const STIFFNESS_BASIS = "worst_case" as const;

/** The machine's per-direction static stiffness after the change [N/mm] */
export const machineStiffnessSchema = z.object({ x: z.number(), y: z.number(), z: z.number() });

/** POST / DELETE stiffness-readings answer. */
export const stiffnessReadingMutationSchema = recheckOutcomeSchema.extend({
  reading: stiffnessReadingSchema,
  machineStiffnessNPerMm: machineStiffnessSchema,
});
export type StiffnessReadingMutation = z.infer<typeof stiffnessReadingMutationSchema>;

// ---------------------------------------------------------------- stiffness map
/** GET …/stiffness-map?cells=N: N × N grid over the work envelope (default 21, 2–101). */
export const stiffnessMapQuerySchema = z.object({
  cells: z.coerce.number<string>().int().min(2, "At least 2 cells").max(101, "At most 101 cells").default(21),
});
export const stiffnessMapDirectionSchema = z.object({
  direction: axisSchema,
  /** Number of distinct measured positions in this direction */
  pointCount: z.number().int().min(0),
  /** "bilinear" | "linear" | "inverse-distance" | "single"; null without readings */
  method: z.enum(["single", "linear", "bilinear", "inverse-distance"]).nullable(),
  /** Grid stiffness [N/mm], rows along Y (stiffnessNPerMm[j][i] at yMm[j], xMm[i]); null without readings */
  stiffnessNPerMm: z.array(z.array(z.number())).nullable(),
  minNPerMm: z.number().nullable(),
  maxNPerMm: z.number().nullable(),
  /** Where the grid is softest [mm] */
  softestAt: z.object({ xMm: z.number(), yMm: z.number() }).nullable(),
  /** The machine's stiffness in this direction (worst case over the map when there are readings) [N/mm] */
  machineNPerMm: z.number(),
  /** Measured rectangle [mm]; outside it the edge value is held, not extrapolated */
  measuredArea: z.object({ xMinMm: z.number(), xMaxMm: z.number(), yMinMm: z.number(), yMaxMm: z.number() }).nullable(),
});
export const stiffnessMapSchema = z.object({
  machineId: uuid,
  /** Work envelope from the machine's axis travels [mm] */
  envelope: z.object({ xMm: z.number(), yMm: z.number(), zMm: z.number() }),
  /** Grid positions [mm] */
  xMm: z.array(z.number()),
  yMm: z.array(z.number()),
  /** "worst_case": the machine's per-direction stiffness is the lowest of the map (compliance interpolation keeps the extremes at measured points) */
  basis: z.literal(STIFFNESS_BASIS),
  directions: z.array(stiffnessMapDirectionSchema),
  readings: z.array(stiffnessReadingSchema),
});
export type StiffnessMap = z.infer<typeof stiffnessMapSchema>;

// ---------------------------------------------------------------- backlash readings
/** POST …/backlash-readings: dial-indicator reversal test on one axis (reading after reversing against the last approach). */
export const backlashReadingBodySchema = z.object({
  axis: axisSchema,
  backlashMm: finite("backlash").min(0, "Backlash cannot be negative").max(5, "Backlash must be at most 5 mm"),
  note: text(500).default(""),
  measuredAt: measuredAtSchema,
});
export type BacklashReadingBody = z.infer<typeof backlashReadingBodySchema>;
export const backlashReadingSchema = z.object({
  id: uuid,
  machineId: uuid,
  axis: axisSchema,
  backlashMm: z.number(),
  note: z.string(),
  measuredAt: z.string(),
  createdAt: z.string(),
});
export type BacklashReading = z.infer<typeof backlashReadingSchema>;
export const backlashReadingListSchema = z.object({ items: z.array(backlashReadingSchema) });
/** POST / DELETE answer: the machine's axis backlash is the latest reading per axis (unchanged when an axis has none). */
export const backlashReadingMutationSchema = recheckOutcomeSchema.extend({
  reading: backlashReadingSchema,
  machineBacklashMm: machineStiffnessSchema,
});
export type BacklashReadingMutation = z.infer<typeof backlashReadingMutationSchema>;

// ---------------------------------------------------------------- modes
export const modeSourceSchema = z.enum(modeSources);
const modeValueFields = {
  direction: axisSchema,
  frequencyHz: positive("frequency", "Hz", 50000),
  dampingRatio: finite("damping ratio").gt(0, "Damping ratio must be more than 0").lt(1, "Damping ratio must be below 1"),
  stiffnessNPerMm: positive("modal stiffness", "N/mm", 1e8),
  note: text(500).default(""),
};
/**
 * POST …/modes. Either the mode's values (source manual | measured | fitted), or `source: "estimated"`
 * with a moving mass: fn = √(k/m)/2π with k the given stiffness or, when left out, the machine's
 * stiffness in that direction.
 */
export const modeBodySchema = z.discriminatedUnion("source", [
  z.object({
    source: z.enum(["manual", "measured", "fitted"]),
    ...modeValueFields,
    measuredAt: measuredAtSchema.optional(),
  }),
  z.object({
    source: z.literal("estimated"),
    direction: axisSchema,
    massKg: positive("moving mass", "kg", 10000),
    stiffnessNPerMm: positive("stiffness", "N/mm", 1e8).optional(),
    dampingRatio: finite("damping ratio").gt(0, "Damping ratio must be more than 0").lt(1, "Damping ratio must be below 1").default(0.05),
    note: text(500).default(""),
  }),
]);
export type ModeBody = z.input<typeof modeBodySchema>;
/** PATCH …/modes/:id: fields sent replace the stored ones. */
export const modePatchBodySchema = z
  .object({
    direction: axisSchema,
    frequencyHz: modeValueFields.frequencyHz,
    dampingRatio: modeValueFields.dampingRatio,
    stiffnessNPerMm: modeValueFields.stiffnessNPerMm,
    source: modeSourceSchema,
    note: text(500),
    measuredAt: measuredAtSchema,
  })
  .partial();
export type ModePatchBody = z.infer<typeof modePatchBodySchema>;
export const machineModeRecordSchema = z.object({
  id: uuid,
  machineId: uuid,
  direction: axisSchema,
  frequencyHz: z.number(),
  dampingRatio: z.number(),
  stiffnessNPerMm: z.number(),
  source: modeSourceSchema,
  note: z.string(),
  /** For estimated modes, the moving mass used [kg] */
  massKg: z.number().nullable(),
  /** Recording this mode was accepted from */
  recordingId: uuid.nullable(),
  measuredAt: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type MachineModeRecord = z.infer<typeof machineModeRecordSchema>;
export const machineModeListSchema = z.object({ items: z.array(machineModeRecordSchema) });
export type MachineModeList = z.infer<typeof machineModeListSchema>;
export const modeMutationSchema = recheckOutcomeSchema.extend({ mode: machineModeRecordSchema });
export type ModeMutation = z.infer<typeof modeMutationSchema>;

// ---------------------------------------------------------------- ceilings
/** GET / PUT …/ceilings */
export const ceilingsBodySchema = z.object({
  deflectionCeilingMm: positive("deflection ceiling", "mm", 1).default(0.025),
  avoidBands: z.array(ceilingBandSchema).max(20, "At most 20 bands").default([]),
  modeMarginPct: positive("mode margin", "%", 50).default(10),
});
export type CeilingsBody = z.input<typeof ceilingsBodySchema>;
export const ceilingsSchema = z.object({
  machineId: uuid,
  deflectionCeilingMm: z.number(),
  avoidBands: z.array(z.object({ minHz: z.number(), maxHz: z.number(), note: z.string() })),
  modeMarginPct: z.number(),
});
export type Ceilings = z.infer<typeof ceilingsSchema>;
/** PUT …/ceilings answer: any change of a ceiling marks the machine's recipes for a re-check (as a machine edit does). */
export const ceilingsMutationSchema = ceilingsSchema.extend({ recipesFlagged: z.number().int().min(0) });
export type CeilingsMutation = z.infer<typeof ceilingsMutationSchema>;

// ---------------------------------------------------------------- recordings
export const recordingKinds = ["cut", "tap", "spindle_free", "frf"] as const;
export const recordingKindSchema = z.enum(recordingKinds);
export type RecordingKind = z.infer<typeof recordingKindSchema>;
/** Detected from the file's content (never from its name or declared type). */
export const recordingFormats = ["wav", "csv_series", "csv_frf"] as const;
export const recordingFormatSchema = z.enum(recordingFormats);
export type RecordingFormat = z.infer<typeof recordingFormatSchema>;
export const recordingStatuses = ["queued", "analysing", "done", "failed"] as const;
export const recordingStatusSchema = z.enum(recordingStatuses);
export type RecordingStatus = z.infer<typeof recordingStatusSchema>;

/** Upload limits (documented in docs/recordings.md; enforced by the server). */
export const RECORDING_LIMITS = {
  maxBytes: 25 * 1024 * 1024,
  maxDurationS: 600,
  minSampleRateHz: 4000,
  maxSampleRateHz: 192000,
  /** CSV time series: at least this many rows */
  minSeriesSamples: 256,
  /** CSV frequency response: rows */
  minFrfRows: 5,
  maxFrfRows: 200000,
} as const;

const blankToUndefined = (v: unknown) => (v === "" || v === null ? undefined : v);
const optionalNumber = (what: string, unit: string, min: number, max: number, int = false) =>
  z.preprocess(
    (v) => (blankToUndefined(v) === undefined ? undefined : typeof v === "string" ? Number(v.trim()) : v),
    z
      .number({ error: `Enter ${what}` })
      .finite(`Enter ${what}`)
      .min(min, `${what} must be at least ${min}${unit ? ` ${unit}` : ""}`)
      .max(max, `${what} must be at most ${max}${unit ? ` ${unit}` : ""}`)
      .refine((n) => !int || Number.isInteger(n), `${what} must be a whole number`)
      .optional(),
  );
const optionalText = (max: number) => z.preprocess(blankToUndefined, text(max).optional());

/**
 * Multipart fields sent with `file` on POST …/recordings (all strings on the wire).
 * cut: rpm and flutes classify tooth-passing harmonics and chatter (both recommended).
 * tap: direction (the dial-indicator stiffness in it completes the mode).
 * spindle_free: dialSetting (label of the spindle's dial setting that was running) or rpm (nominal).
 * frf: direction of the measured receptance.
 */
export const recordingUploadFieldsSchema = z
  .object({
    kind: recordingKindSchema,
    rpm: optionalNumber("spindle speed", "rpm", 1, 200000),
    flutes: optionalNumber("flutes", "", 1, 20, true),
    direction: z.preprocess(blankToUndefined, axisSchema.optional()),
    dialSetting: optionalText(20),
    note: optionalText(500),
  })
  .superRefine((f, ctx) => {
    if (f.kind === "cut" && (f.rpm === undefined) !== (f.flutes === undefined))
      ctx.addIssue({ code: "custom", path: [f.rpm === undefined ? "rpm" : "flutes"], message: "Give both spindle speed and flutes, or neither" });
    if ((f.kind === "tap" || f.kind === "frf") && f.direction === undefined)
      ctx.addIssue({ code: "custom", path: ["direction"], message: "Choose the direction the recording measured" });
    if (f.kind === "spindle_free" && f.dialSetting === undefined && f.rpm === undefined)
      ctx.addIssue({ code: "custom", path: ["dialSetting"], message: "Choose the dial setting that was running (or give its nominal rpm)" });
  });
export type RecordingUploadFields = z.input<typeof recordingUploadFieldsSchema>;

export const recordingListQuerySchema = z.object({ kind: recordingKindSchema.optional() });

/** A spectrum for plotting: at most ~8 k points per series, every reported peak kept exactly. */
export const spectrumSeriesSchema = z.object({
  frequencyHz: z.array(z.number()),
  /** Amplitude (cut, tap, spindle_free: signal units; frf: |G| in mm/N) */
  magnitude: z.array(z.number()),
  /** Number of points before downsampling for transport */
  originalPoints: z.number().int(),
  binWidthHz: z.number(),
});
export type SpectrumSeries = z.infer<typeof spectrumSeriesSchema>;

export const recordingPeakSchema = z.object({
  frequencyHz: z.number(),
  magnitude: z.number(),
  aboveFloor: z.number(),
  /** "tooth-passing" | "spindle" | "chatter-candidate" | "unclassified" */
  kind: z.enum(["tooth-passing", "spindle", "chatter-candidate", "unclassified"]),
  harmonic: z.number().int().nullable(),
});
export type RecordingPeakResult = z.infer<typeof recordingPeakSchema>;

export const proposedModeSchema = z.object({
  direction: axisSchema,
  frequencyHz: z.number(),
  dampingRatio: z.number(),
  /** null when no stiffness is known in that direction: the mode cannot be accepted until one is measured */
  stiffnessNPerMm: z.number().nullable(),
  /** Where the stiffness came from */
  stiffnessSource: z.enum(["modal_fit", "dial_indicator_readings", "machine_value"]).nullable(),
  source: z.enum(["measured", "fitted"]),
});
export type ProposedMode = z.infer<typeof proposedModeSchema>;

export const cutResultsSchema = z.object({
  kind: z.literal("cut"),
  sampleRateHz: z.number(),
  durationS: z.number(),
  spectrum: spectrumSeriesSchema,
  segments: z.number().int(),
  peaks: z.array(recordingPeakSchema),
  /** Speed measured from the tooth-passing peak [rpm]; null without rpm/flutes */
  measuredRpm: z.number().nullable(),
  toothPassingFrequencyHz: z.number().nullable(),
  /** Harmonic markers for the chart, up to the spectrum's end [Hz] */
  spindleHarmonicsHz: z.array(z.number()),
  toothPassingHarmonicsHz: z.array(z.number()),
  chatterCandidates: z.array(recordingPeakSchema),
  /** Within the machine's spindle range, nearest to the cut's speed first */
  suggestedSpeeds: z.array(z.object({ rpm: z.number(), chatterFrequencyHz: z.number(), divisor: z.number().int() })),
  notes: z.array(z.string()),
});
export const tapResultsSchema = z.object({
  kind: z.literal("tap"),
  sampleRateHz: z.number(),
  durationS: z.number(),
  spectrum: spectrumSeriesSchema,
  ringDown: z.object({
    frequencyHz: z.number(),
    naturalFrequencyHz: z.number(),
    dampingRatio: z.number(),
    logDecrement: z.number(),
    cyclesUsed: z.number().int(),
    fitQuality: z.number(),
  }),
  proposedMode: proposedModeSchema,
  notes: z.array(z.string()),
});
export const spindleFreeResultsSchema = z.object({
  kind: z.literal("spindle_free"),
  sampleRateHz: z.number(),
  durationS: z.number(),
  spectrum: spectrumSeriesSchema,
  peaks: z.array(recordingPeakSchema),
  /** Rotation frequency found [Hz]; measuredRpm = rotationFrequencyHz × 60 */
  rotationFrequencyHz: z.number(),
  measuredRpm: z.number(),
  dialSetting: z.string().nullable(),
  /** Rpm the dial setting (or the upload) claimed [rpm] */
  nominalRpm: z.number().nullable(),
  /** (measured − nominal) / nominal × 100 */
  differencePct: z.number().nullable(),
  notes: z.array(z.string()),
});
export const frfResultsSchema = z.object({
  kind: z.literal("frf"),
  /** |G| [mm/N] over frequency */
  spectrum: spectrumSeriesSchema,
  fittedMode: z.object({
    frequencyHz: z.number(),
    dampingRatio: z.number(),
    stiffnessNPerMm: z.number(),
    peakFrequencyHz: z.number(),
    lowerHalfPowerHz: z.number(),
    upperHalfPowerHz: z.number(),
  }),
  proposedMode: proposedModeSchema,
  notes: z.array(z.string()),
});
export const recordingResultsSchema = z.discriminatedUnion("kind", [cutResultsSchema, tapResultsSchema, spindleFreeResultsSchema, frfResultsSchema]);
export type RecordingResults = z.infer<typeof recordingResultsSchema>;
export type CutResults = z.infer<typeof cutResultsSchema>;
export type TapResults = z.infer<typeof tapResultsSchema>;
export type SpindleFreeResults = z.infer<typeof spindleFreeResultsSchema>;
export type FrfResults = z.infer<typeof frfResultsSchema>;

export const recordingSummarySchema = z.object({
  id: uuid,
  machineId: uuid,
  kind: recordingKindSchema,
  format: recordingFormatSchema,
  originalName: z.string(),
  sizeBytes: z.number().int(),
  /** From the file: WAV header or CSV time step; null for FRF files */
  sampleRateHz: z.number().nullable(),
  durationS: z.number().nullable(),
  channels: z.number().int().nullable(),
  rpm: z.number().nullable(),
  flutes: z.number().int().nullable(),
  direction: axisSchema.nullable(),
  dialSetting: z.string().nullable(),
  note: z.string(),
  status: recordingStatusSchema,
  /** 0 … 1 */
  progress: z.number().min(0).max(1),
  /** Why the analysis failed, in plain words (status failed) */
  failureReason: z.string().nullable(),
  /** Mode created from this recording by accept-mode */
  acceptedModeId: uuid.nullable(),
  /** Dial setting updated from this recording by accept-dial-rpm */
  dialRpmApplied: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
  analysedAt: z.string().nullable(),
});
export type RecordingSummary = z.infer<typeof recordingSummarySchema>;
export const recordingListSchema = z.object({ items: z.array(recordingSummarySchema) });
export type RecordingList = z.infer<typeof recordingListSchema>;
/** GET …/recordings/:id */
export const recordingDetailSchema = recordingSummarySchema.extend({ results: recordingResultsSchema.nullable() });
export type RecordingDetail = z.infer<typeof recordingDetailSchema>;
/** POST …/recordings → 202 */
export const recordingAcceptedSchema = z.object({ recording: recordingSummarySchema });

/** POST /api/shops/:shopId/recordings/:id/accept-mode (tap or frf, status done). Optional overrides. */
export const acceptModeBodySchema = z.object({
  direction: axisSchema.optional(),
  note: text(500).optional(),
});
export const acceptModeResponseSchema = modeMutationSchema.extend({ recording: recordingSummarySchema });
export type AcceptModeResponse = z.infer<typeof acceptModeResponseSchema>;

/** POST /api/shops/:shopId/recordings/:id/accept-dial-rpm (spindle_free, status done): sets the dial setting's rpm to the measured one and marks it measured. */
export const acceptDialRpmBodySchema = z.object({ dialSetting: optionalText(20) });
export const acceptDialRpmResponseSchema = z.object({
  recording: recordingSummarySchema,
  dialSetting: z.object({ label: z.string(), rpm: z.number(), measured: z.boolean(), previousRpm: z.number().nullable() }),
});
export type AcceptDialRpmResponse = z.infer<typeof acceptDialRpmResponseSchema>;
