'use client';

import { useEffect, useId, useRef, useState } from 'react';
import * as Plot from '@observablehq/plot';
import type { PlotOptions } from '@observablehq/plot';
import type { ChartFit, ChartLegend, ChartTable } from '@/lib/charts/chart-spec';
import { ChartLegendView } from './chart-legend';

export interface PlotFigureProps {
  /** Memoised Plot options (a new object rebuilds the plot). */
  options: PlotOptions;
  title: string;
  /** The text alternative: one or two sentences saying what the chart shows. */
  description: string;
  /** The numbers behind the chart, offered under "Show the numbers". */
  table?: ChartTable;
  legend?: ChartLegend;
  /** Places the labels for the drawn width (from the chart builder). */
  fit?: ChartFit;
  /** Classroom projector: larger type and marks. */
  large?: boolean;
  className?: string;
}

const DEFAULT_WIDTH = 640;

/**
 * One Observable Plot chart in a <figure>: visible title, the plot as role="img" described by the
 * visible description, the legend, and an optional "Show the numbers" table. Plot runs in an effect
 * (never in render); the plot is removed on clean-up. Use as `<PlotFigure {...chart} />` with a
 * builder result from lib/charts held in useMemo.
 */
export function PlotFigure({ options, title, description, table, legend, fit, large = false, className = '' }: PlotFigureProps) {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState<number | undefined>(undefined);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const node = ref.current;
    if (!node || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver((entries) => {
      const next = Math.round(entries[0]?.contentRect.width ?? 0);
      if (next > 0) setWidth((prev) => (prev !== undefined && Math.abs(prev - next) < 8 ? prev : next));
    });
    observer.observe(node);
    return () => observer.disconnect();
  }, []);

  useEffect(() => {
    const node = ref.current;
    if (!node) return;
    const style = typeof options.style === 'object' && options.style !== null ? options.style : {};
    const sized: PlotOptions = {
      ...options,
      width: options.width ?? width ?? DEFAULT_WIDTH,
      height: large && options.height ? Math.round(options.height * 1.35) : options.height,
      style: large ? { ...style, fontSize: '20px' } : options.style,
    };
    const fontPx = large ? 20 : Number.parseFloat(String((style as { fontSize?: string }).fontSize ?? '13')) || 13;
    const plot = Plot.plot({
      ...(fit ? fit(sized, { width: sized.width!, fontPx }) : sized),
      ariaLabel: title,
      ariaDescription: description,
    });
    node.replaceChildren(plot);
    return () => plot.remove();
  }, [options, fit, width, large, title, description]);

  return (
    <figure aria-labelledby={titleId} className={`rounded-card border border-rule bg-panel p-4 text-ink ${className}`}>
      <figcaption id={titleId} className={`font-semibold ${large ? 'text-2xl' : 'text-base'}`}>
        {title}
      </figcaption>
      <p id={descriptionId} className={`mt-1 text-muted ${large ? 'text-lg' : 'text-sm'}`}>
        {description}
      </p>
      <div
        ref={ref}
        role="img"
        aria-labelledby={titleId}
        aria-describedby={descriptionId}
        className="mt-3 w-full overflow-x-auto"
        data-testid="plot-container"
      />
      {legend && (
        <div className="mt-3">
          <ChartLegendView legend={legend} large={large} />
        </div>
      )}
      {table && table.rows.length > 0 && (
        <details className="no-print mt-3 text-sm">
          <summary className="cursor-pointer text-ink">Show the numbers</summary>
          <div className="relative mt-2 overflow-x-auto">
            <table className="num w-full border-collapse text-left">
              <caption className="sr-only">{title}</caption>
              <thead>
                <tr>
                  {table.columns.map((c) => (
                    <th key={c} scope="col" className="border-b border-rule px-2 py-1 font-medium text-muted">
                      {c}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {table.rows.map((row, i) => (
                  <tr key={i} className="border-b border-rule last:border-b-0">
                    {row.map((cell, j) => (
                      <td key={j} className="whitespace-nowrap px-2 py-1">
                        {cell}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </details>
      )}
    </figure>
  );
}
