import { describe, expect, it } from 'vitest';
import {
  ciede2000,
  contrastRatio,
  hexDeltaE2000,
  hexToLab,
  overBackground,
  hexToOklab,
  mixOklab,
  oklabDistance,
  relativeLuminance,
  simulateDichromacy,
} from '@/lib/charts/colour-math';
import {
  DEVIATION_HEX,
  deviationColour,
  deviationColourHex,
  deviationPosition,
  GROUP_COLOURS,
  groupColour,
} from '@/lib/charts/palette';
import { readFileSync } from 'node:fs';
import path from 'node:path';

const BACKGROUNDS = { lightPaper: '#f6f3ec', lightPanel: '#fffdf8', darkPaper: '#151c26', darkPanel: '#1c2531' };
const visions = ['normal', 'protanopia', 'deuteranopia'] as const;
const seen = (hex: string, v: (typeof visions)[number]) => hexToOklab(v === 'normal' ? hex : simulateDichromacy(hex, v));
const worstDistance = (a: string, b: string) => Math.min(...visions.map((v) => oklabDistance(seen(a, v), seen(b, v))));

describe('colour maths', () => {
  it('relative luminance of white is 1 and black 0, contrast 21:1 (WCAG 2.2 definitions)', () => {
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 10);
    expect(relativeLuminance('#000000')).toBe(0);
    expect(contrastRatio('#000', '#fff')).toBeCloseTo(21, 10);
  });
  it('WCAG contrast of #767676 on white is 4.54:1 (the well-known minimum AA grey; value from memory, common practice)', () => {
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
  });
  it('OKLab of white is L = 1, a = b = 0 and of sRGB red is (0.6280, 0.2249, 0.1258) (Ottosson 2020 reference values)', () => {
    const [L, a, b] = hexToOklab('#ffffff');
    expect(L).toBeCloseTo(1, 4);
    expect(Math.abs(a)).toBeLessThan(1e-4);
    expect(Math.abs(b)).toBeLessThan(1e-4);
    const red = hexToOklab('#ff0000');
    expect(red[0]).toBeCloseTo(0.628, 3);
    expect(red[1]).toBeCloseTo(0.2249, 3);
    expect(red[2]).toBeCloseTo(0.1258, 3);
  });
  it('the dichromat simulations keep greys grey and make L and M equal (Viénot et al. 1999: identical first two rows)', () => {
    for (const kind of ['protanopia', 'deuteranopia'] as const) {
      expect(simulateDichromacy('#808080', kind)).toBe('#808080');
      const [r, g] = [1, 3].map((i) => parseInt(simulateDichromacy('#d04020', kind).slice(i, i + 2), 16));
      expect(r).toBe(g);
    }
  });
});

describe('CIELAB and CIEDE2000', () => {
  it('CIELAB of white is (100, 0, 0) and of sRGB red (53.24, 80.09, 67.20) (D65; values from memory, common practice)', () => {
    const [L, a, b] = hexToLab('#ffffff');
    expect(L).toBeCloseTo(100, 3);
    expect(Math.abs(a) + Math.abs(b)).toBeLessThan(1e-3);
    const red = hexToLab('#ff0000');
    expect(red[0]).toBeCloseTo(53.24, 1);
    expect(red[1]).toBeCloseTo(80.09, 1);
    expect(red[2]).toBeCloseTo(67.2, 1);
  });
  // Sharma, Wu & Dalal (2005), Table 1 test pairs 1, 7 and 17 (values from memory of the table).
  it.each([
    [[50, 2.6772, -79.7751], [50, 0, -82.7485], 2.0425],
    [[50, 0, 0], [50, -1, 2], 2.3669],
    [[50, 2.5, 0], [73, 25, -18], 27.1492],
  ] as const)('ΔE00 of %j and %j is %f', (p, q, expected) => {
    expect(ciede2000(p, q)).toBeCloseTo(expected, 4);
    expect(ciede2000(q, p)).toBeCloseTo(expected, 4);
  });
  it('composites a colour over a background as SVG fill-opacity does (sRGB mix)', () => {
    expect(overBackground('#000000', '#ffffff', 0.5)).toBe('#808080');
    expect(overBackground('#457cfd', '#1c2531', 1)).toBe('#457cfd');
  });
});

describe('group palette', () => {
  it('has eight distinct hex colours and wraps slots', () => {
    expect(GROUP_COLOURS).toHaveLength(8);
    expect(new Set(GROUP_COLOURS).size).toBe(8);
    expect(groupColour(8)).toBe(GROUP_COLOURS[0]);
    expect(groupColour(-1)).toBe(GROUP_COLOURS[7]);
  });

  it.each(Object.entries(BACKGROUNDS))('every slot reaches 3:1 against %s (WCAG 2.2 SC 1.4.11 non-text contrast)', (_, bg) => {
    for (const c of GROUP_COLOURS) expect(contrastRatio(c, bg)).toBeGreaterThanOrEqual(3);
  });

  // Thresholds and their reasons: lib/charts/palette.ts. The panels are app/globals.css's --el-panel.
  const PANELS = { light: '#fffdf8', dark: '#1c2531' } as const;
  const pairs = () => GROUP_COLOURS.flatMap((a, i) => GROUP_COLOURS.slice(i + 1).map((b) => [a, b] as const));

  it('any two of the eight slots differ by CIEDE2000 ΔE00 ≥ 15 as solid colours', () => {
    const smallest = Math.min(...pairs().map(([a, b]) => hexDeltaE2000(a, b)));
    expect(smallest).toBeGreaterThanOrEqual(15);
  });

  it.each(Object.entries(PANELS))('any two slots differ by ΔE00 ≥ 10 as 55 %% dots over the %s panel', (_, panel) => {
    const smallest = Math.min(...pairs().map(([a, b]) => hexDeltaE2000(overBackground(a, panel, 0.55), overBackground(b, panel, 0.55))));
    expect(smallest).toBeGreaterThanOrEqual(10);
  });

  it('any two slots differ by ΔE00 ≥ 8 for protan and deutan vision (Viénot et al. 1999 simulation)', () => {
    for (const kind of ['protanopia', 'deuteranopia'] as const) {
      const smallest = Math.min(...pairs().map(([a, b]) => hexDeltaE2000(simulateDichromacy(a, kind), simulateDichromacy(b, kind))));
      expect(smallest).toBeGreaterThanOrEqual(8);
    }
  });

  it('no group colour is close to the deviation hues or the accent (ΔE_OK ≥ 0.1)', () => {
    const reserved = [...Object.values(DEVIATION_HEX.light), ...Object.values(DEVIATION_HEX.dark), '#0e7c72', '#3cc1b2']
      .filter((c) => c !== DEVIATION_HEX.light.on && c !== DEVIATION_HEX.dark.on);
    for (const c of GROUP_COLOURS) for (const r of reserved) expect(oklabDistance(hexToOklab(c), hexToOklab(r))).toBeGreaterThanOrEqual(0.1);
  });
});

describe('deviation scale', () => {
  it('maps on target to the neutral and ± 2 × band to the below and above hues (saturating beyond)', () => {
    expect(deviationColour(0, 5)).toBe('var(--el-on)');
    expect(deviationColour(-10, 5)).toBe('var(--el-below)');
    expect(deviationColour(10, 5)).toBe('var(--el-above)');
    expect(deviationColour(-40, 5)).toBe('var(--el-below)');
    expect(deviationColour(25, 5)).toBe('var(--el-above)');
  });

  it('puts the band edge half-way and is symmetric about the target', () => {
    expect(deviationColour(5, 5)).toBe('color-mix(in oklab, var(--el-above) 50%, var(--el-on))');
    expect(deviationColour(-5, 5)).toBe('color-mix(in oklab, var(--el-below) 50%, var(--el-on))');
    for (const d of [0.7, 2.5, 4, 8.3]) {
      expect(deviationColour(-d, 5).replace('below', 'X')).toBe(deviationColour(d, 5).replace('above', 'X'));
      expect(deviationPosition(-d, 5)).toBeCloseTo(-deviationPosition(d, 5), 12);
    }
  });

  // That Plot draws these strings as literal fills is checked under jsdom in
  // tests/components/charts-plot-figure.test.tsx (Plot's isColor is not a public export).

  it('rejects a band that is not positive and draws a missing reading in the muted colour', () => {
    expect(() => deviationColour(1, 0)).toThrow('deviationColour requires a band above 0 % (got 0)');
    expect(deviationColour(Number.NaN, 5)).toBe('var(--el-muted)');
  });

  it('DEVIATION_HEX matches app/globals.css for both themes', () => {
    const css = readFileSync(path.resolve(__dirname, '../../app/globals.css'), 'utf8');
    const [light, dark] = css.split('prefers-color-scheme: dark');
    for (const [theme, block] of [['light', light!], ['dark', dark!]] as const) {
      for (const stop of ['below', 'on', 'above'] as const) {
        expect(block).toContain(`--el-${stop}: ${DEVIATION_HEX[theme][stop]};`);
      }
    }
  });

  it('deviationColourHex hits the stops at the ends and the OKLab mid-point at the band edge', () => {
    expect(deviationColourHex(0, 5)).toBe(DEVIATION_HEX.light.on);
    expect(deviationColourHex(-10, 5)).toBe(DEVIATION_HEX.light.below);
    expect(deviationColourHex(10, 5, 'dark')).toBe(DEVIATION_HEX.dark.above);
    expect(deviationColourHex(5, 5)).toBe(mixOklab(DEVIATION_HEX.light.on, DEVIATION_HEX.light.above, 0.5));
  });

  it('below and above stay apart for protan and deutan readers in both themes (ΔE_OK ≥ 0.15)', () => {
    for (const theme of ['light', 'dark'] as const) {
      expect(worstDistance(DEVIATION_HEX[theme].below, DEVIATION_HEX[theme].above)).toBeGreaterThanOrEqual(0.15);
    }
  });
});
