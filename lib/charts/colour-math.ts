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

export type Lab = readonly [number, number, number];

/** CIE 1976 L*a*b* of a hex colour under D65 (sRGB matrix of IEC 61966-2-1, white Xn = 0.95047, Zn = 1.08883). */
export function hexToLab(hex: string): Lab {
  const [r, g, b] = srgbToLinear(parseHex(hex));
  const x = (0.4124564 * r + 0.3575761 * g + 0.1804375 * b) / 0.95047;
  const y = 0.2126729 * r + 0.7151522 * g + 0.072175 * b;
  const z = (0.0193339 * r + 0.119192 * g + 0.9503041 * b) / 1.08883;
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : (24389 / 27 * t + 16) / 116);
  const [fx, fy, fz] = [f(x), f(y), f(z)];
  return [116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)];
}

const deg = (rad: number) => (rad * 180) / Math.PI;
const rad = (d: number) => (d * Math.PI) / 180;

/**
 * CIEDE2000 colour difference ΔE00 between two CIELAB colours (kL = kC = kH = 1), implemented as in
 * G. Sharma, W. Wu, E. N. Dalal, "The CIEDE2000 color-difference formula: implementation notes,
 * supplementary test data, and mathematical observations", Color Research & Application 30 (2005)
 * 21–30, equations (1)–(22), including their notes on the mean hue and hue difference.
 */
export function ciede2000(lab1: Lab, lab2: Lab): number {
  const [L1, a1, b1] = lab1;
  const [L2, a2, b2] = lab2;
  const C1 = Math.hypot(a1, b1);
  const C2 = Math.hypot(a2, b2);
  const Cbar7 = ((C1 + C2) / 2) ** 7;
  const G = 0.5 * (1 - Math.sqrt(Cbar7 / (Cbar7 + 25 ** 7)));
  const a1p = (1 + G) * a1;
  const a2p = (1 + G) * a2;
  const C1p = Math.hypot(a1p, b1);
  const C2p = Math.hypot(a2p, b2);
  const hue = (b: number, a: number) => (b === 0 && a === 0 ? 0 : (deg(Math.atan2(b, a)) + 360) % 360);
  const h1p = hue(b1, a1p);
  const h2p = hue(b2, a2p);
  const dLp = L2 - L1;
  const dCp = C2p - C1p;
  let dhp = 0;
  if (C1p * C2p !== 0) {
    dhp = h2p - h1p;
    if (dhp > 180) dhp -= 360;
    else if (dhp < -180) dhp += 360;
  }
  const dHp = 2 * Math.sqrt(C1p * C2p) * Math.sin(rad(dhp / 2));
  const Lbarp = (L1 + L2) / 2;
  const Cbarp = (C1p + C2p) / 2;
  let hbarp = h1p + h2p;
  if (C1p * C2p !== 0) {
    if (Math.abs(h1p - h2p) <= 180) hbarp = (h1p + h2p) / 2;
    else hbarp = h1p + h2p < 360 ? (h1p + h2p + 360) / 2 : (h1p + h2p - 360) / 2;
  }
  const T =
    1 - 0.17 * Math.cos(rad(hbarp - 30)) + 0.24 * Math.cos(rad(2 * hbarp)) + 0.32 * Math.cos(rad(3 * hbarp + 6)) - 0.2 * Math.cos(rad(4 * hbarp - 63));
  const dTheta = 30 * Math.exp(-(((hbarp - 275) / 25) ** 2));
  const Cbarp7 = Cbarp ** 7;
  const RC = 2 * Math.sqrt(Cbarp7 / (Cbarp7 + 25 ** 7));
  const SL = 1 + (0.015 * (Lbarp - 50) ** 2) / Math.sqrt(20 + (Lbarp - 50) ** 2);
  const SC = 1 + 0.045 * Cbarp;
  const SH = 1 + 0.015 * Cbarp * T;
  const RT = -Math.sin(rad(2 * dTheta)) * RC;
  return Math.sqrt((dLp / SL) ** 2 + (dCp / SC) ** 2 + (dHp / SH) ** 2 + RT * (dCp / SC) * (dHp / SH));
}

/** ΔE00 between two hex colours. */
export const hexDeltaE2000 = (a: string, b: string): number => ciede2000(hexToLab(a), hexToLab(b));

/** A colour drawn with `opacity` over `background`, composited in sRGB as browsers do for SVG fill-opacity. */
export function overBackground(hex: string, background: string, opacity: number): string {
  const f = parseHex(hex);
  const g = parseHex(background);
  return toHex([0, 1, 2].map((i) => f[i]! * opacity + g[i]! * (1 - opacity)) as unknown as Rgb);
}
