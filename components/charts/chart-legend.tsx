import type { ChartLegend } from '@/lib/charts/chart-spec';
import { DeviationLegend } from './deviation-legend';

function Swatch({ colour, shape }: { colour: string; shape: string }) {
  return (
    <svg aria-hidden="true" width="22" height="12" viewBox="0 0 22 12" className="shrink-0 overflow-visible">
      {shape === 'dot' && <circle cx="11" cy="6" r="4.5" style={{ fill: colour, stroke: 'currentColor', strokeWidth: 0.75 }} />}
      {shape === 'line' && <line x1="1" x2="21" y1="6" y2="6" style={{ stroke: colour, strokeWidth: 2 }} />}
      {shape === 'dashed-line' && <line x1="1" x2="21" y1="6" y2="6" strokeDasharray="4 3" style={{ stroke: colour, strokeWidth: 1.5 }} />}
      {shape === 'bar' && <rect x="4" y="1" width="14" height="10" style={{ fill: colour }} />}
      {shape === 'band' && <rect x="1" y="2" width="20" height="8" style={{ fill: colour, opacity: 0.6 }} />}
    </svg>
  );
}

/** The legend a chart builder asks for: the deviation scale, or a row of swatches. Server-safe. */
export function ChartLegendView({ legend, large = false }: { legend: ChartLegend; large?: boolean }) {
  if (legend.kind === 'deviation') return <DeviationLegend bandPercent={legend.bandPercent} labels={legend.labels} large={large} />;
  return (
    <ul aria-label="Legend" className={`flex flex-wrap gap-x-5 gap-y-1 text-muted ${large ? 'text-lg' : 'text-sm'}`}>
      {legend.items.map((item) => (
        <li key={item.label} className="flex items-center gap-2">
          <Swatch colour={item.colour} shape={item.shape} />
          <span>{item.label}</span>
        </li>
      ))}
    </ul>
  );
}
