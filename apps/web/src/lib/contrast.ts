/**
 * Colour contrast per WCAG 2.2, definitions of "relative luminance" and
 * "contrast ratio": L = 0.2126 R + 0.7152 G + 0.0722 B on linearised sRGB
 * channels (c ≤ 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055)^2.4),
 * ratio = (L_lighter + 0.05) / (L_darker + 0.05), from 1 to 21.
 */
export function relativeLuminance(hex: string): number {
  const match = /^#?([0-9a-f]{6})$/i.exec(hex.trim());
  if (!match?.[1]) throw new RangeError(`relativeLuminance requires a #rrggbb colour, got "${hex}"`);
  const value = Number.parseInt(match[1], 16);
  const channel = (shift: number) => {
    const c = ((value >> shift) & 0xff) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * channel(16) + 0.7152 * channel(8) + 0.0722 * channel(0);
}

export function contrastRatio(foreground: string, background: string): number {
  const a = relativeLuminance(foreground);
  const b = relativeLuminance(background);
  return (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
}
