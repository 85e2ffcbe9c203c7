'use client';

import * as Plot from '@observablehq/plot';
import { useEffect, useRef } from 'react';

/** One Observable Plot chart: built in useEffect from the given options and replaced when they change. */
export function PlotFigure({ options, label }: { options: Plot.PlotOptions; label: string }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const plot = Plot.plot({ ...options, style: { background: 'transparent', color: 'var(--el-ink)', fontSize: '13px' } });
    ref.current?.replaceChildren(plot);
    return () => plot.remove();
  }, [options]);
  return <div ref={ref} role="img" aria-label={label} className="overflow-x-auto" />;
}
