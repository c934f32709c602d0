/** Photo types the cut log accepts, with the file extension stored under. */
export const PHOTO_TYPES = {
  "image/jpeg": "jpg",
  "image/png": "png",
  "image/webp": "webp",
} as const;
export type PhotoType = keyof typeof PHOTO_TYPES;

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/**
 * The image type of `bytes`, read from the file's own signature (never from its name or the
 * declared type), or null when it is none of JPEG, PNG or WebP.
 * Signatures: JPEG starts FF D8 FF (JPEG/JFIF, ISO/IEC 10918-1 SOI marker followed by a marker);
 * PNG starts 89 50 4E 47 0D 0A 1A 0A (PNG specification, ISO/IEC 15948 §5.2);
 * WebP is a RIFF container: "RIFF", a 4-byte length, then "WEBP" (RIFF/WebP container spec).
 */
export function sniffPhotoType(bytes: Uint8Array): PhotoType | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return "image/jpeg";
  if (bytes.length >= 8 && PNG_SIGNATURE.every((b, i) => bytes[i] === b)) return "image/png";
  if (bytes.length >= 12 && ascii(bytes, 0, 4) === "RIFF" && ascii(bytes, 8, 12) === "WEBP") return "image/webp";
  return null;
}

function ascii(bytes: Uint8Array, from: number, to: number): string {
  return String.fromCharCode(...bytes.subarray(from, to));
}
