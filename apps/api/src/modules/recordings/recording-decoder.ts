import { parse } from "csv-parse/sync";
import wavefile from "wavefile";
import { RECORDING_LIMITS, type RecordingFormat } from "@ringdown/contracts";

/*
 * Reads an uploaded recording by its content (never by its name or declared type):
 *  - WAV: RIFF/WAVE with PCM 16 or 24 bit, or IEEE float 32 bit; mono or stereo (stereo is averaged to mono);
 *  - CSV time series: two columns, time [s] and value (any unit), evenly spaced in time;
 *  - CSV frequency response: three columns, frequency [Hz], real and imaginary receptance [mm/N].
 * Limits: RECORDING_LIMITS (docs/recordings.md).
 */

/** Why a file cannot be read: "unsupported" (not a format we read) or "invalid" (our format, but broken or out of limits). */
export class RecordingFileError extends Error {
  constructor(
    readonly kind: "unsupported" | "invalid",
    message: string,
  ) {
    super(message);
    this.name = "RecordingFileError";
  }
}

const unsupported = (message: string) => new RecordingFileError("unsupported", message);
const invalid = (message: string) => new RecordingFileError("invalid", message);

/** What the upload route stores about a file after checking it. */
export interface RecordingFileInfo {
  format: RecordingFormat;
  /** Samples per second [Hz]; null for a frequency response */
  sampleRateHz: number | null;
  channels: number | null;
  /** [s]; null for a frequency response */
  durationS: number | null;
}

export type DecodedRecording =
  | { format: "wav" | "csv_series"; sampleRateHz: number; channels: number; durationS: number; samples: Float64Array }
  | { format: "csv_frf"; frequencyHz: Float64Array; real: Float64Array; imag: Float64Array };

const { WaveFile } = wavefile;

const isRiffWave = (b: Buffer) => b.length >= 12 && b.toString("latin1", 0, 4) === "RIFF" && b.toString("latin1", 8, 12) === "WAVE";

const fmtRate = (hz: number) => `${Number((hz / 1000).toFixed(3))} kHz`;

function checkSampleRate(sampleRateHz: number): void {
  const { minSampleRateHz, maxSampleRateHz } = RECORDING_LIMITS;
  if (!(sampleRateHz >= minSampleRateHz && sampleRateHz <= maxSampleRateHz)) {
    throw invalid(`The sample rate is ${fmtRate(sampleRateHz)}; it must be between ${fmtRate(minSampleRateHz)} and ${fmtRate(maxSampleRateHz)}.`);
  }
}

function checkLength(frames: number, sampleRateHz: number): number {
  const durationS = frames / sampleRateHz;
  if (frames < RECORDING_LIMITS.minSeriesSamples) {
    throw invalid(`The recording holds ${frames} samples; at least ${RECORDING_LIMITS.minSeriesSamples} are needed.`);
  }
  if (durationS > RECORDING_LIMITS.maxDurationS) {
    throw invalid(`The recording lasts ${durationS.toFixed(1)} s; at most ${RECORDING_LIMITS.maxDurationS / 60} minutes are accepted.`);
  }
  return durationS;
}

// ---------------------------------------------------------------- WAV
type Wave = InstanceType<typeof WaveFile> & {
  fmt: { audioFormat: number; numChannels: number; sampleRate: number; bitsPerSample: number };
  data: { chunkSize: number; samples: Uint8Array };
};

function readWave(bytes: Buffer): { wave: Wave; channels: number; sampleRateHz: number; frames: number; fullScale: number } {
  const wave = new WaveFile() as Wave;
  try {
    wave.fromBuffer(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength));
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw invalid(`The WAV file cannot be read (${reason.replace(/\.$/, "")}); it may be truncated or damaged.`);
  }
  const { audioFormat, numChannels, sampleRate, bitsPerSample } = wave.fmt;
  const depth = wave.bitDepth;
  // 1 = PCM, 3 = IEEE float, 0xFFFE = WAVE_FORMAT_EXTENSIBLE (sub-format checked through the bit depth wavefile derives)
  const pcm = (audioFormat === 1 || audioFormat === 0xfffe) && (depth === "16" || depth === "24");
  const float = audioFormat === 3 && depth === "32f";
  if (!pcm && !float) {
    const what = audioFormat === 3 ? `${bitsPerSample}-bit float` : audioFormat === 1 || audioFormat === 0xfffe ? `${bitsPerSample}-bit PCM` : `encoding ${audioFormat}`;
    throw unsupported(`This WAV file holds ${what} samples; save it as 16-bit PCM, 24-bit PCM or 32-bit float.`);
  }
  if (numChannels !== 1 && numChannels !== 2) throw unsupported(`This WAV file has ${numChannels} channels; use a mono or stereo recording.`);
  checkSampleRate(sampleRate);
  const bytesPerFrame = (bitsPerSample / 8) * numChannels;
  if (wave.data.samples.length < wave.data.chunkSize) {
    throw invalid(
      `The WAV file is truncated: its header announces ${wave.data.chunkSize} bytes of samples but only ${wave.data.samples.length} are there. Upload the complete file.`,
    );
  }
  const frames = Math.floor(wave.data.samples.length / bytesPerFrame);
  const fullScale = float ? 1 : 2 ** (bitsPerSample - 1);
  return { wave, channels: numChannels, sampleRateHz: sampleRate, frames, fullScale };
}

function decodeWave(bytes: Buffer): DecodedRecording {
  const { wave, channels, sampleRateHz, frames, fullScale } = readWave(bytes);
  const durationS = checkLength(frames, sampleRateHz);
  const raw = wave.getSamples(false, Float64Array) as unknown as Float64Array | Float64Array[];
  const lanes = Array.isArray(raw) ? raw : [raw];
  const samples = new Float64Array(frames);
  // Stereo to mono by averaging the channels; values scaled to full scale = 1.
  const scale = 1 / (fullScale * lanes.length);
  for (const lane of lanes) for (let i = 0; i < frames; i++) samples[i]! += lane[i]! * scale;
  for (let i = 0; i < frames; i++) {
    if (!Number.isFinite(samples[i]!)) throw invalid(`Sample ${i + 1} of the WAV file is not a finite number.`);
  }
  return { format: "wav", sampleRateHz, channels, durationS, samples };
}

// ---------------------------------------------------------------- CSV
function textOf(bytes: Buffer): string {
  const head = bytes.subarray(0, Math.min(bytes.length, 4096));
  if (head.includes(0)) throw unsupported("The file is neither a WAV recording nor a CSV text file.");
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes).replace(/^\uFEFF/, "");
  } catch {
    throw unsupported("The file is neither a WAV recording nor a CSV text file (it is not UTF-8 text).");
  }
}

/** "1.5", "-2e-3" or, with semicolons between fields, a decimal comma "1,5". */
function numberOf(cell: string, decimalComma: boolean): number {
  const text = decimalComma ? cell.replace(",", ".") : cell;
  return text.trim() === "" ? Number.NaN : Number(text);
}

interface CsvTable {
  header: string[] | null;
  rows: string[][];
  /** 1-based line number of the first data row (for messages) */
  firstLine: number;
  decimalComma: boolean;
}

function readCsv(text: string): CsvTable {
  const firstLine = text.split(/\r?\n/).find((l) => l.trim() !== "" && !l.trimStart().startsWith("#")) ?? "";
  const counts = { ",": firstLine.split(",").length, ";": firstLine.split(";").length, "\t": firstLine.split("\t").length };
  const delimiter = (Object.entries(counts) as Array<[string, number]>).sort((a, b) => b[1] - a[1])[0]![0];
  if (counts[delimiter as keyof typeof counts] < 2) {
    throw unsupported("The file is neither a WAV recording nor a CSV with columns separated by commas, semicolons or tabs.");
  }
  let records: string[][];
  try {
    records = parse(text, { delimiter, comment: "#", skip_empty_lines: true, trim: true, relax_quotes: false }) as string[][];
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw invalid(`The CSV cannot be read: ${reason}`);
  }
  if (records.length === 0) throw invalid("The CSV holds no rows.");
  const decimalComma = delimiter === ";";
  const first = records[0]!;
  const header = first.every((c) => Number.isFinite(numberOf(c, decimalComma))) ? null : first.map((c) => c.toLowerCase());
  const rows = header ? records.slice(1) : records;
  return { header, rows, firstLine: header ? 2 : 1, decimalComma };
}

function columnsOf(table: CsvTable, index: number, name: string): Float64Array {
  const out = new Float64Array(table.rows.length);
  table.rows.forEach((row, i) => {
    const v = numberOf(row[index] ?? "", table.decimalComma);
    if (!Number.isFinite(v)) throw invalid(`Row ${i + table.firstLine}: ${name} “${row[index] ?? ""}” is not a number.`);
    out[i] = v;
  });
  return out;
}

function decodeSeries(table: CsvTable): DecodedRecording {
  const n = table.rows.length;
  if (n < RECORDING_LIMITS.minSeriesSamples) throw invalid(`The time series holds ${n} rows; at least ${RECORDING_LIMITS.minSeriesSamples} are needed.`);
  const time = columnsOf(table, 0, "time");
  const samples = columnsOf(table, 1, "value");
  const steps: number[] = [];
  for (let i = 1; i < n; i++) {
    const dt = time[i]! - time[i - 1]!;
    if (!(dt > 0)) throw invalid(`Row ${i + table.firstLine}: time must increase from one row to the next.`);
    steps.push(dt);
  }
  const sorted = [...steps].sort((a, b) => a - b);
  const dt = sorted[Math.floor(sorted.length / 2)]!;
  // Even sampling within 1 % of the median step (rounded times in a CSV jitter a little).
  const bad = steps.findIndex((s) => Math.abs(s - dt) > 0.01 * dt);
  if (bad >= 0) {
    throw invalid(
      `Row ${bad + 1 + table.firstLine}: the time step is ${steps[bad]!.toPrecision(4)} s where the others are ${dt.toPrecision(4)} s; the series must be evenly sampled.`,
    );
  }
  const sampleRateHz = 1 / dt;
  checkSampleRate(sampleRateHz);
  const durationS = checkLength(n, sampleRateHz);
  return { format: "csv_series", sampleRateHz, channels: 1, durationS, samples };
}

function decodeFrf(table: CsvTable): DecodedRecording {
  const n = table.rows.length;
  const { minFrfRows, maxFrfRows } = RECORDING_LIMITS;
  if (n < minFrfRows) throw invalid(`The frequency response holds ${n} rows; at least ${minFrfRows} are needed.`);
  if (n > maxFrfRows) throw invalid(`The frequency response holds ${n} rows; at most ${maxFrfRows} are accepted.`);
  const frequencyHz = columnsOf(table, 0, "frequency");
  const real = columnsOf(table, 1, "real part");
  const imag = columnsOf(table, 2, "imaginary part");
  for (let i = 0; i < n; i++) {
    if (frequencyHz[i]! < 0) throw invalid(`Row ${i + table.firstLine}: frequency cannot be negative.`);
    if (i > 0 && !(frequencyHz[i]! > frequencyHz[i - 1]!)) throw invalid(`Row ${i + table.firstLine}: frequency must increase from one row to the next.`);
  }
  return { format: "csv_frf", frequencyHz, real, imag };
}

function decodeCsv(bytes: Buffer): DecodedRecording {
  const table = readCsv(textOf(bytes));
  const width = (table.header ?? table.rows[0] ?? []).length;
  const h = table.header;
  const looksSeries = h ? /time|^t(_s)?$|^s$/.test(h[0]!) : true;
  const looksFrf = h ? /freq|^f(_hz)?$|hz/.test(h[0]!) && /re/.test(h[1] ?? "") && /im/.test(h[2] ?? "") : true;
  if (width === 2 && looksSeries) return decodeSeries(table);
  if (width === 3 && looksFrf) return decodeFrf(table);
  const found = h ? `found the columns “${h.join(", ")}”` : `found ${width} columns`;
  throw invalid(`A CSV must have the columns time_s,value (a time series) or frequency_hz,real,imag (a frequency response in mm/N); ${found}.`);
}

/** Decodes a whole recording, checking format and limits; throws RecordingFileError with a message for people. */
export function decodeRecording(bytes: Buffer): DecodedRecording {
  if (bytes.length === 0) throw invalid("The file is empty.");
  if (bytes.length > RECORDING_LIMITS.maxBytes) throw invalid(`The file is larger than ${RECORDING_LIMITS.maxBytes / (1024 * 1024)} MB.`);
  if (isRiffWave(bytes)) return decodeWave(bytes);
  if (bytes.length >= 4 && bytes.toString("latin1", 0, 4) === "RIFF") throw unsupported("This RIFF file is not a WAV recording.");
  return decodeCsv(bytes);
}

/**
 * Checks a file at upload: a WAV's header, encoding, limits and completeness (without converting
 * its samples); a CSV completely. Throws RecordingFileError.
 */
export function inspectRecording(bytes: Buffer): RecordingFileInfo {
  if (bytes.length > 0 && isRiffWave(bytes)) {
    const { channels, sampleRateHz, frames } = readWave(bytes);
    return { format: "wav", sampleRateHz, channels, durationS: checkLength(frames, sampleRateHz) };
  }
  const decoded = decodeRecording(bytes);
  if (decoded.format === "csv_frf") return { format: "csv_frf", sampleRateHz: null, channels: null, durationS: null };
  return { format: decoded.format, sampleRateHz: decoded.sampleRateHz, channels: decoded.channels, durationS: decoded.durationS };
}
