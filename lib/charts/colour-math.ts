/**
 * Small colour maths for the chart palette and its tests: sRGB hex ↔ linear RGB ↔ OKLab, WCAG 2
 * relative luminance and contrast ratio, and a simulation of dichromatic colour vision.
 *
 * References:
 * - sRGB transfer function: IEC 61966-2-1:1999 (the 0.04045 / 12.92 / 2.4 piecewise curve).
 * - OKLab: Björn Ottosson, "A perceptual color space for image processing" (2020), matrices M1, M2.
 * - Relative luminance and contrast ratio: W3C WCAG 2.2, definitions "relative luminance" and
 *   "contrast ratio" ((L1 + 0.05) / (L2 + 0.05)).
 * - Dichromat simulation: Viénot, Brettel & Mollon, "Digital video colourmaps for checking the
 *   legibility of displays by dichromats", Color Research & Application 24 (1999) 243–252
 *   (protanope and deuteranope matrices applied in linear RGB).
 *
 * Pure functions; no DOM.
 */

export type Rgb = readonly [number, number, number];
export type Oklab = readonly [number, number, number];

/** Parses `#rgb` or `#rrggbb` to 0..1 sRGB components. */
export function parseHex(hex: string): Rgb {
  const m = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(hex.trim());
  if (!m) throw new Error(`parseHex requires #rgb or #rrggbb (got ${hex})`);
  let h = m[1]!;
  if (h.length === 3) h = h.replace(/(.)/g, '$1$1');
  return [0, 2, 4].map((i) => parseInt(h.slice(i, i + 2), 16) / 255) as unknown as Rgb;
}

/** 0..1 sRGB components → `#rrggbb` (clamped). */
export function toHex(rgb: Rgb): string {
  return `#${rgb
    .map((c) => Math.round(Math.min(1, Math.max(0, c)) * 255).toString(16).padStart(2, '0'))
    .join('')}`;
}

const toLinear = (c: number): number => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
const fromLinear = (c: number): number => (c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055);

export function srgbToLinear(rgb: Rgb): Rgb {
  return [toLinear(rgb[0]), toLinear(rgb[1]), toLinear(rgb[2])];
}
export function linearToSrgb(lin: Rgb): Rgb {
  return [fromLinear(lin[0]), fromLinear(lin[1]), fromLinear(lin[2])];
}

/** Linear sRGB → OKLab (Ottosson 2020). */
export function linearToOklab([r, g, b]: Rgb): Oklab {
  const l = Math.cbrt(0.4122214708 * r + 0.5363325363 * g + 0.0514459929 * b);
  const m = Math.cbrt(0.2119034982 * r + 0.6806995451 * g + 0.1073969566 * b);
  const s = Math.cbrt(0.0883024619 * r + 0.2817188376 * g + 0.6299787005 * b);
  return [
    0.2104542553 * l + 0.793617785 * m - 0.0040720468 * s,
    1.9779984951 * l - 2.428592205 * m + 0.4505937099 * s,
    0.0259040371 * l + 0.7827717662 * m - 0.808675766 * s,
  ];
}

/** OKLab → linear sRGB (Ottosson 2020). */
export function oklabToLinear([L, a, b]: Oklab): Rgb {
  const l = (L + 0.3963377774 * a + 0.2158037573 * b) ** 3;
  const m = (L - 0.1055613458 * a - 0.0638541728 * b) ** 3;
  const s = (L - 0.0894841775 * a - 1.291485548 * b) ** 3;
  return [
    4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s,
    -1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s,
    -0.0041960863 * l - 0.7034186147 * m + 1.707614701 * s,
  ];
}

export const hexToOklab = (hex: string): Oklab => linearToOklab(srgbToLinear(parseHex(hex)));

/** Euclidean distance in OKLab (ΔE_OK; about 0.02 is a just-noticeable difference). */
export function oklabDistance(a: Oklab, b: Oklab): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/** Mixes two hex colours in OKLab: t = 0 gives `from`, t = 1 gives `to`. */
export function mixOklab(from: string, to: string, t: number): string {
  const a = hexToOklab(from);
  const b = hexToOklab(to);
  const mixed: Oklab = [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, a[2] + (b[2] - a[2]) * t];
  return toHex(linearToSrgb(oklabToLinear(mixed)));
}

/** WCAG 2 relative luminance of a hex colour. */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = srgbToLinear(parseHex(hex));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2 contrast ratio between two hex colours (1 to 21). */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

export type Dichromacy = 'protanopia' | 'deuteranopia';

// Viénot, Brettel & Mollon (1999), matrices for linear RGB.
const DICHROMAT: Record<Dichromacy, readonly (readonly [number, number, number])[]> = {
  protanopia: [
    [0.11238, 0.88762, 0],
    [0.11238, 0.88762, 0],
    [0.00401, -0.00401, 1],
  ],
  deuteranopia: [
    [0.29275, 0.70725, 0],
    [0.29275, 0.70725, 0],
    [-0.02234, 0.02234, 1],
  ],
};

/** The hex colour as a dichromat would see it (Viénot et al. 1999 simulation). */
export function simulateDichromacy(hex: string, kind: Dichromacy): string {
  const lin = srgbToLinear(parseHex(hex));
  const m = DICHROMAT[kind];
  const out = m.map((row) => row[0] * lin[0] + row[1] * lin[1] + row[2] * lin[2]) as unknown as Rgb;
  return toHex(linearToSrgb(out));
}
