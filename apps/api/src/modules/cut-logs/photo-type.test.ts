import { describe, expect, it } from "vitest";
import { sniffPhotoType } from "./photo-type.js";

describe("sniffPhotoType", () => {
  it("reads JPEG, PNG and WebP from their signatures", () => {
    // Signatures from the formats' specifications: JPEG SOI FF D8 + marker FF; PNG 8-byte signature; RIFF….WEBP.
    expect(sniffPhotoType(Uint8Array.from([0xff, 0xd8, 0xff, 0xe0, 0, 0x10]))).toBe("image/jpeg");
    expect(sniffPhotoType(Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]))).toBe("image/png");
    expect(sniffPhotoType(Buffer.concat([Buffer.from("RIFF"), Buffer.from([0x24, 0, 0, 0]), Buffer.from("WEBPVP8 ")]))).toBe("image/webp");
  });

  it("refuses anything else, whatever it claims to be", () => {
    expect(sniffPhotoType(Buffer.from("<svg xmlns='http://www.w3.org/2000/svg'/>"))).toBeNull();
    expect(sniffPhotoType(Buffer.from("GIF89a........"))).toBeNull();
    // A RIFF file that is not WebP (e.g. WAVE audio).
    expect(sniffPhotoType(Buffer.concat([Buffer.from("RIFF"), Buffer.from([0x24, 0, 0, 0]), Buffer.from("WAVEfmt ")]))).toBeNull();
    // Too short to hold a signature, and a PNG signature with one byte wrong.
    expect(sniffPhotoType(Uint8Array.from([0xff, 0xd8]))).toBeNull();
    expect(sniffPhotoType(Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0b]))).toBeNull();
  });
});
