/**
 * The colour scale of the stiffness heat map: one hue, light where the bed is soft and dark where
 * it is stiff, so the softest place (the one that limits recipes) reads as "thin" at a glance
 * without borrowing the state colours (which mean within / near / over a limit).
 *
 * Colours are interpolated in OKLab (Björn Ottosson, "A perceptual color space for image
 * processing", 2020), where equal steps of t look like equal steps of lightness, unlike sRGB.
 */

/** Ends of the scale: soft (t = 0, warm paper tint) and stiff (t = 1, the measured-data accent). */
export const HEAT_SOFT = "#F3ECDC";
export const HEAT_STIFF = "#1F6F8B";

type Lab = readonly [number, number, number];

function srgbToLinear(c: number): number {
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function linearToSrgb(c: number): number {
  return c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055;
}

function parseHex(hex: string): [number, number, number] {
  const m = /^#?([0-9a-f]{6})$/i.exec(hex);
  if (!m) throw new RangeError(`heat scale requires a #RRGGBB colour (got ${hex})`);
  const n = Number.parseInt(m[1]!, 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/** sRGB hex → OKLab (L in 0…1). Matrices from Ottosson 2020. */
export function hexToOklab(hex: string): Lab {
  const [r, g, b] = parseHex(hex).map((v) => srgbToLinear(v / 255)) as [number, number, number];
  const l = Math.cbrt(0.4122214708 * r + 0.5363325363 * g + 0.0514459929 * b);
  const m = Math.cbrt(0.2119034982 * r + 0.6806995451 * g + 0.1073969566 * b);
  const s = Math.cbrt(0.0883024619 * r + 0.2817188376 * g + 0.6299787005 * b);
  return [
    0.2104542553 * l + 0.793617785 * m - 0.0040720468 * s,
    1.9779984951 * l - 2.428592205 * m + 0.4505937099 * s,
    0.0259040371 * l + 0.7827717662 * m - 0.808675766 * s,
  ];
}

/** OKLab → sRGB hex (channels clipped to the sRGB gamut). */
export function oklabToHex([L, a, b]: Lab): string {
  const l = (L + 0.3963377774 * a + 0.2158037573 * b) ** 3;
  const m = (L - 0.1055613458 * a - 0.0638541728 * b) ** 3;
  const s = (L - 0.0894841775 * a - 1.291485548 * b) ** 3;
  const rgb = [
    4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s,
    -1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s,
    -0.0041960863 * l - 0.7034186147 * m + 1.707614701 * s,
  ];
  return `#${rgb
    .map((c) => Math.round(Math.max(0, Math.min(1, linearToSrgb(c))) * 255))
    .map((v) => v.toString(16).padStart(2, "0"))
    .join("")
    .toUpperCase()}`;
}

const SOFT_LAB = hexToOklab(HEAT_SOFT);
const STIFF_LAB = hexToOklab(HEAT_STIFF);

/** Colour at position t of the scale (0 = softest, 1 = stiffest; clipped to 0…1). */
export function heatColour(t: number): string {
  const u = Number.isFinite(t) ? Math.max(0, Math.min(1, t)) : 0;
  return oklabToHex([0, 1, 2].map((i) => SOFT_LAB[i]! + (STIFF_LAB[i]! - SOFT_LAB[i]!) * u) as unknown as Lab);
}

/**
 * "Nice" tick values (1, 2, 2.5 or 5 × 10ⁿ steps) covering [min, max], at most about `count` of
 * them, all inside the range; [min] alone when the range is empty.
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return [];
  if (max < min) [min, max] = [max, min];
  if (max === min) return [min];
  const rough = (max - min) / Math.max(1, count - 1);
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = ([1, 2, 2.5, 5, 10].map((f) => f * power).find((s) => s >= rough) ?? 10 * power);
  const ticks: number[] = [];
  const first = Math.ceil(min / step - 1e-9) * step;
  for (let v = first; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

export interface HeatScale {
  min: number;
  max: number;
  /** Position of a value on the scale, 0 … 1 (0.5 when the range is empty) */
  position: (value: number) => number;
  colour: (value: number) => string;
  ticks: number[];
}

/** The scale over the values of a map (stiffness [N/mm]). */
export function heatScale(min: number, max: number, tickCount = 5): HeatScale {
  if (!Number.isFinite(min) || !Number.isFinite(max)) throw new RangeError("heatScale requires finite min and max");
  const lo = Math.min(min, max);
  const hi = Math.max(min, max);
  const span = hi - lo;
  const position = (value: number) => (span === 0 ? 0.5 : Math.max(0, Math.min(1, (value - lo) / span)));
  return { min: lo, max: hi, position, colour: (value) => heatColour(position(value)), ticks: niceTicks(lo, hi, tickCount) };
}
