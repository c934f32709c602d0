import { describe, expect, it } from "vitest";
import { hannWindow } from "./hann-window.js";

describe("hannWindow", () => {
  it("is the periodic Hann window: 0 at n = 0, 1 at N/2, coherent gain 0.5, ENBW 1.5 bins (Harris 1978, from memory; COMPUTED in domain-reference §17)", () => {
    const n = 1024;
    const w = hannWindow({ size: n });
    expect(w[0]).toBe(0);
    expect(w[n / 2]).toBeCloseTo(1, 15);
    const sum = w.reduce((a, b) => a + b, 0);
    const sumSq = w.reduce((a, b) => a + b * b, 0);
    expect(sum / n).toBeCloseTo(0.5, 12);
    expect((n * sumSq) / (sum * sum)).toBeCloseTo(1.5, 12);
  });
  it("overlapped by half, copies sum to a constant (why 50 % overlap suits Welch averaging)", () => {
    const w = hannWindow({ size: 64 });
    for (let i = 0; i < 32; i++) expect(w[i]! + w[i + 32]!).toBeCloseTo(1, 14);
  });
});
