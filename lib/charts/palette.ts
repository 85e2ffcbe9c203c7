import { AppError } from '@/lib/http/errors';
import { mixOklab } from './colour-math';

/**
 * Evenload's chart colours.
 *
 * Group colours (`GROUP_COLOURS`): eight slots of our own, chosen by a max-min search over OKLCH
 * colours (lightness 0.50–0.77, chroma 0.08–0.20) under these computed conditions (checked in
 * tests/charts/palette.test.ts with the formulas of lib/charts/colour-math.ts):
 * - every slot has a WCAG 2 contrast ratio ≥ 3 (non-text graphics, WCAG 2.2 SC 1.4.11) against the
 *   paper and panel of both themes (#f6f3ec, #fffdf8 light; #151c26, #1c2531 dark), so one fixed hex
 *   works in light and dark without theme variables;
 * - any two slots differ by CIEDE2000 ΔE00 ≥ 15 as solid colours (lines, boxes, legend swatches),
 *   ≥ 10 as the 55 %-opacity dots of the comparison charts composited over each theme's panel, and
 *   ≥ 8 for protanopia and deuteranopia as simulated by Viénot, Brettel & Mollon (1999). The old
 *   palette's closest pair was ΔE00 8.8 (two purples); ΔE00 ≈ 1 is a just-noticeable difference
 *   for large patches side by side, and small, scattered marks need several times more, so 15 and
 *   10 leave a wide margin and are what the search could reach for eight colours in the narrow
 *   lightness range that the two-theme contrast allows;
 * - every slot stays ≥ 0.1 ΔE_OK from the deviation hues and the accent of both themes, so a group
 *   colour is never read as "below target", "above target" or "the active stud".
 * Hex values (not CSS variables) because a group colour means the same in both themes.
 *
 * Deviation scale (`deviationColour`): one diverging scale for load deviation from target, built
 * from the theme variables --el-below, --el-on and --el-above (app/globals.css). Between the ends it
 * returns a CSS `color-mix(in oklab, …)` of the variables, so the scale follows the light or dark
 * theme by itself. Observable Plot passes such strings through as literal colours (its `isColor`
 * accepts `var(…)` and `color-mix(…)`; checked in tests). Where a real value is needed (export,
 * canvas), `deviationColourHex` mixes the same stops in OKLab from the hex values of globals.css.
 */

/** Eight categorical colours for comparison groups (slot = ComparisonGroupData.colourIndex). */
export const GROUP_COLOURS = [
  '#9550bb', // purple
  '#7c9217', // olive green
  '#f04b64', // coral red
  '#457cfd', // bright blue
  '#3f9a6f', // sea green
  '#996179', // mauve
  '#4692a5', // steel teal
  '#88723a', // bronze
] as const;

/** The colour of a group's slot (wraps after eight). */
export function groupColour(colourIndex: number): string {
  const n = GROUP_COLOURS.length;
  const slot = ((Math.trunc(colourIndex) % n) + n) % n;
  return GROUP_COLOURS[slot]!;
}

/** Theme references for ink, rules and emphasis: follow light and dark themes by themselves. */
export const THEME = {
  ink: 'currentColor',
  muted: 'var(--el-muted)',
  rule: 'var(--el-rule)',
  paper: 'var(--el-paper)',
  panel: 'var(--el-panel)',
  accent: 'var(--el-accent)',
  below: 'var(--el-below)',
  on: 'var(--el-on)',
  above: 'var(--el-above)',
} as const;

/** Hex values of the deviation stops, copied from app/globals.css (keep in step with it). */
export const DEVIATION_HEX = {
  light: { below: '#2f67b1', on: '#d8d3c8', above: '#c4621b' },
  dark: { below: '#6f9fe0', on: '#55606e', above: '#ec9350' },
} as const;

/** Colour for a missing or non-finite reading (drawn, never silently dropped). */
export const NO_READING_COLOUR = 'var(--el-muted)';

/**
 * Position on the diverging scale, −1 (2 × band or more below target) … 0 (on target) … +1
 * (2 × band or more above). Non-finite deviations give NaN.
 * @throws {AppError} invalid_input when the band is not a positive number.
 */
export function deviationPosition(percentDeviation: number, bandPercent: number): number {
  if (!Number.isFinite(bandPercent) || bandPercent <= 0) {
    throw new AppError('invalid_input', `deviationColour requires a band above 0 % (got ${bandPercent})`, {
      field: 'bandPercent',
    });
  }
  if (!Number.isFinite(percentDeviation)) return Number.NaN;
  return Math.max(-1, Math.min(1, percentDeviation / (2 * bandPercent)));
}

/**
 * The colour of a load deviation from target (percentDeviation = (load − target) / target × 100)
 * with a band of ± bandPercent: below target → the --el-below hue, on target → the neutral --el-on,
 * above → the --el-above hue, saturating at ± 2 × band (so the band edge is the half-way tint).
 * Mix shares are rounded to whole percent so equal deviations give equal strings.
 *
 * @example
 * deviationColour(0, 5);   // 'var(--el-on)'
 * deviationColour(-10, 5); // 'var(--el-below)'
 * deviationColour(5, 5);   // 'color-mix(in oklab, var(--el-above) 50%, var(--el-on))'
 */
export function deviationColour(percentDeviation: number, bandPercent: number): string {
  const t = deviationPosition(percentDeviation, bandPercent);
  if (Number.isNaN(t)) return NO_READING_COLOUR;
  const share = Math.round(Math.abs(t) * 100);
  if (share === 0) return THEME.on;
  const end = t < 0 ? THEME.below : THEME.above;
  if (share === 100) return end;
  return `color-mix(in oklab, ${end} ${share}%, ${THEME.on})`;
}

/** The same scale as `deviationColour` as a real hex value for one theme (OKLab mix of the stops). */
export function deviationColourHex(
  percentDeviation: number,
  bandPercent: number,
  theme: keyof typeof DEVIATION_HEX = 'light',
): string {
  const t = deviationPosition(percentDeviation, bandPercent);
  const stops = DEVIATION_HEX[theme];
  if (Number.isNaN(t)) return theme === 'light' ? '#5b6676' : '#a3adbb';
  return mixOklab(stops.on, t < 0 ? stops.below : stops.above, Math.abs(t));
}
