import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { contrastRatio } from "./contrast";

/** The palette as declared in the Tailwind theme, so this test cannot drift from it. */
function themeColours(): Record<string, string> {
  const css = readFileSync(join(dirname(fileURLToPath(import.meta.url)), "../index.css"), "utf8");
  const colours: Record<string, string> = {};
  for (const [, name, value] of css.matchAll(/--color-([a-z-]+):\s*(#[0-9a-f]{6})/gi)) {
    if (name && value) colours[name] = value;
  }
  return colours;
}

/** `top` at `alpha` over `bottom` (sRGB channel blend, as the browser composites it). */
function mix(top: string, bottom: string, alpha: number): string {
  const rgb = (hex: string) => [16, 8, 0].map((shift) => (Number.parseInt(hex.slice(1), 16) >> shift) & 0xff);
  const [a, b] = [rgb(top), rgb(bottom)];
  return `#${a.map((v, i) => Math.round(v * alpha + b[i]! * (1 - alpha)).toString(16).padStart(2, "0")).join("")}`;
}

describe("contrastRatio", () => {
  it("matches the WCAG definition's extremes", () => {
    // (1 + 0.05) / (0 + 0.05) = 21 exactly, by the WCAG 2.2 definition of contrast ratio.
    expect(contrastRatio("#000000", "#FFFFFF")).toBeCloseTo(21, 10);
    expect(contrastRatio("#33407A", "#33407A")).toBeCloseTo(1, 10);
  });

  it("matches a widely quoted value", () => {
    // #767676 on white ≈ 4.54:1, the lightest grey that passes AA for body text (from memory).
    expect(contrastRatio("#767676", "#FFFFFF")).toBeCloseTo(4.54, 2);
  });
});

describe("Ringdown's palette (WCAG 2.2 AA)", () => {
  const c = themeColours();

  it("declares every colour the pairs below use", () => {
    for (const name of ["paper", "surface", "rule-strong", "ink", "muted", "brand", "brand-strong", "limit", "ok", "measured"]) {
      expect(c[name], name).toMatch(/^#[0-9a-f]{6}$/i);
    }
  });

  // Text pairs: 4.5:1 (success criterion 1.4.3).
  const textPairs: Array<[string, string]> = [
    ["ink", "paper"],
    ["ink", "surface"],
    ["muted", "paper"],
    ["muted", "surface"],
    ["brand", "surface"],
    ["brand", "paper"],
    ["surface", "brand"],
    ["surface", "brand-strong"],
    ["limit", "surface"],
    ["surface", "limit"],
    ["ok", "surface"],
    ["measured", "surface"],
  ];
  it.each(textPairs)("%s text on %s reaches 4.5:1", (fg, bg) => {
    expect(contrastRatio(c[fg]!, c[bg]!)).toBeGreaterThanOrEqual(4.5);
  });

  // Badges: small text on the tone's tint (the tone at 10 % over surface or paper), 4.5:1.
  const badgeSource = readFileSync(join(dirname(fileURLToPath(import.meta.url)), "../components/ui/badge.tsx"), "utf8");
  const badges = [...badgeSource.matchAll(/^\s*(\w+): "border-\S+ bg-([a-z-]+)\/(\d+) text-(?:\[(#[0-9a-f]{6})\]|([a-z-]+))",$/gim)].map(
    ([, tone, tint, percent, hex, name]) => ({ tone: tone!, tint: c[tint!]!, alpha: Number(percent) / 100, text: hex ?? c[name!]! }),
  );
  it("reads every coloured badge tone", () => {
    expect(badges.map((b) => b.tone)).toEqual(expect.arrayContaining(["ok", "near", "limit", "measured"]));
  });
  it.each(badges.flatMap((b) => ["surface", "paper"].map((bg) => [b.tone, bg, b] as const)))("the %s badge on %s reaches 4.5:1", (_tone, bg, b) => {
    const behind = mix(b.tint, c[bg]!, b.alpha);
    expect(contrastRatio(b.text, behind)).toBeGreaterThanOrEqual(4.5);
  });

  // Boundaries of inputs: 3:1 (success criterion 1.4.11, non-text contrast).
  it.each([
    ["rule-strong", "surface"],
    ["rule-strong", "paper"],
  ])("%s input border on %s reaches 3:1", (fg, bg) => {
    expect(contrastRatio(c[fg]!, c[bg]!)).toBeGreaterThanOrEqual(3);
  });
});
