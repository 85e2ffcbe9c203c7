import type { PlotOptions } from '@observablehq/plot';

/**
 * Shared Plot settings for Evenload's look: ink from currentColor (so both themes work), a
 * transparent background, the page's font with tabular figures, thin rules, no arrows on labels.
 */
export const PLOT_STYLE = {
  background: 'transparent',
  color: 'currentColor',
  fontFamily: 'inherit',
  fontSize: '13px',
  fontVariantNumeric: 'tabular-nums',
  overflow: 'visible',
} as const;

export function basePlotOptions(options: PlotOptions): PlotOptions {
  return {
    height: 320,
    marginTop: 28,
    marginRight: 28,
    marginBottom: 44,
    marginLeft: 64,
    style: { ...PLOT_STYLE },
    ...options,
  };
}
