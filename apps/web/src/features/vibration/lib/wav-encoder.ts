/**
 * WAV (RIFF, WAVE_FORMAT_PCM) encoding of audio captured in the browser, so a recording made with
 * the microphone reaches the server in the format its parser reads: 16-bit signed little-endian
 * PCM, channels interleaved, a 44-byte header (the canonical layout: "RIFF" size "WAVE", a
 * 16-byte "fmt " chunk, then "data").
 *
 * Samples come as floats in [−1, 1] (what the Web Audio API hands over); values outside are
 * clipped, NaN becomes 0. Scaling is asymmetric so that −1 → −32768 and +1 → +32767 exactly.
 */

const HEADER_BYTES = 44;
const BYTES_PER_SAMPLE = 2;

/** Largest sample rate accepted [Hz]; the server refuses more than 192 kHz anyway. */
const MAX_SAMPLE_RATE_HZ = 768_000;

/** One float sample in [−1, 1] as a 16-bit integer. */
export function floatToInt16(sample: number): number {
  if (!Number.isFinite(sample)) return 0;
  const s = Math.max(-1, Math.min(1, sample));
  return s < 0 ? Math.round(s * 0x8000) : Math.round(s * 0x7fff);
}

/**
 * Encodes channels of float samples as a 16-bit PCM WAV file.
 * @param channels one Float32Array per channel, all of the same length (a single array for mono)
 * @param sampleRateHz samples per second per channel [Hz]
 * @throws RangeError on an empty channel list, channels of different lengths or a bad sample rate
 */
export function encodeWav16(channels: Float32Array | readonly Float32Array[], sampleRateHz: number): ArrayBuffer {
  const list: readonly Float32Array[] = channels instanceof Float32Array ? [channels] : channels;
  if (list.length === 0) throw new RangeError("encodeWav16 requires at least one channel");
  if (list.length > 8) throw new RangeError("encodeWav16 requires at most 8 channels");
  if (!Number.isInteger(sampleRateHz) || sampleRateHz <= 0 || sampleRateHz > MAX_SAMPLE_RATE_HZ) {
    throw new RangeError("encodeWav16 requires sampleRateHz to be a whole number > 0");
  }
  const frames = list[0]!.length;
  if (list.some((c) => c.length !== frames)) throw new RangeError("encodeWav16 requires channels of equal length");

  const channelCount = list.length;
  const blockAlign = channelCount * BYTES_PER_SAMPLE;
  const dataBytes = frames * blockAlign;
  const buffer = new ArrayBuffer(HEADER_BYTES + dataBytes);
  const view = new DataView(buffer);
  const ascii = (offset: number, text: string) => {
    for (let i = 0; i < text.length; i++) view.setUint8(offset + i, text.charCodeAt(i));
  };

  ascii(0, "RIFF");
  view.setUint32(4, 36 + dataBytes, true);
  ascii(8, "WAVE");
  ascii(12, "fmt ");
  view.setUint32(16, 16, true); // fmt chunk size
  view.setUint16(20, 1, true); // WAVE_FORMAT_PCM
  view.setUint16(22, channelCount, true);
  view.setUint32(24, sampleRateHz, true);
  view.setUint32(28, sampleRateHz * blockAlign, true); // byte rate
  view.setUint16(32, blockAlign, true);
  view.setUint16(34, 16, true); // bits per sample
  ascii(36, "data");
  view.setUint32(40, dataBytes, true);

  let offset = HEADER_BYTES;
  for (let i = 0; i < frames; i++) {
    for (let c = 0; c < channelCount; c++) {
      view.setInt16(offset, floatToInt16(list[c]![i]!), true);
      offset += BYTES_PER_SAMPLE;
    }
  }
  return buffer;
}

/** Joins captured blocks of samples into one array. */
export function concatSamples(blocks: readonly Float32Array[]): Float32Array {
  let total = 0;
  for (const b of blocks) total += b.length;
  const out = new Float32Array(total);
  let at = 0;
  for (const b of blocks) {
    out.set(b, at);
    at += b.length;
  }
  return out;
}

/** Size of the WAV file encodeWav16 makes for this many frames [bytes]. */
export function wav16Bytes(frames: number, channelCount = 1): number {
  return HEADER_BYTES + frames * channelCount * BYTES_PER_SAMPLE;
}
