import { deviationColour } from '@/lib/charts/palette';
import { percentText } from '@/lib/charts/chart-format';

export interface DeviationLegendProps {
  /** Band (± %) of the chart this legend belongs to; the scale spans −2 × band to +2 × band. */
  bandPercent: number;
  labels?: { below: string; on: string; above: string };
  className?: string;
  /** Larger type for the classroom projector. */
  large?: boolean;
}

const STOPS = [-1, -0.75, -0.5, -0.25, 0, 0.25, 0.5, 0.75, 1];

/**
 * The diverging deviation scale as a legend: a colour bar from −2 × band to +2 × band, ticks at
 * −2b, −b, 0, +b, +2b (the band edges marked), and the words below / on / above target.
 * Server-safe (no hooks).
 */
export function DeviationLegend({ bandPercent, labels, className = '', large = false }: DeviationLegendProps) {
  const words = labels ?? { below: 'below target', on: 'on target', above: 'above target' };
  const gradient = STOPS.map((t) => `${deviationColour(t * 2 * bandPercent, bandPercent)} ${((t + 1) / 2) * 100}%`).join(', ');
  const ticks = [-2, -1, 0, 1, 2].map((m) => ({
    m,
    left: `${((m + 2) / 4) * 100}%`,
    text: m === 0 ? `0${'\u00a0'}%` : percentText(m * bandPercent, { signed: true, decimals: Number.isInteger(bandPercent) ? 0 : 1 }),
  }));
  return (
    <div
      role="group"
      aria-label={`Colour scale: ${words.below} to ${words.above}, band ± ${percentText(bandPercent)}`}
      className={`w-full max-w-md text-muted ${large ? 'text-lg' : 'text-xs'} ${className}`}
    >
      <div className="relative mx-4">
        <div
          aria-hidden="true"
          data-testid="deviation-gradient"
          className={`rounded-sm border border-rule ${large ? 'h-5' : 'h-3'}`}
          style={{ background: `linear-gradient(to right, ${gradient})` }}
        />
        <div aria-hidden="true" className="absolute inset-y-0 border-x border-dashed border-ink" style={{ left: '25%', right: '25%' }} />
        <div className={`relative ${large ? 'h-7' : 'h-5'}`}>
          {ticks.map((t) => (
            <span
              key={t.m}
              data-testid="deviation-tick"
              className="num absolute top-0 -translate-x-1/2 whitespace-nowrap pt-0.5"
              style={{ left: t.left }}
            >
              {t.text}
            </span>
          ))}
        </div>
      </div>
      <div className="flex justify-between">
        <span>{words.below}</span>
        <span>{words.on}</span>
        <span>{words.above}</span>
      </div>
    </div>
  );
}
