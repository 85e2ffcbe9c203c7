import { formatNumber, formatPercent } from '@/lib/calc/units';
import { formatDate } from '@/lib/format/format-date';
import type { FigureHistoryEntry } from '@/lib/data/calibration-correction';

const kN = (v: unknown) => (typeof v === 'number' ? `${formatNumber(v / 1000, 4)} kN` : '—');
const cv = (v: unknown) => (typeof v === 'number' ? formatPercent(v * 100) : '—');

/** The run's figures before each calibration correction that recomputed it. Server-safe. */
export function FigureHistory({ entries }: { entries: FigureHistoryEntry[] }) {
  if (entries.length === 0) return null;
  return (
    <section aria-labelledby="figure-history" className="rounded-card border border-rule bg-panel p-4 text-sm">
      <h2 id="figure-history" className="font-semibold">Recomputed after a calibration correction</h2>
      <table className="mt-2 text-left">
        <thead className="text-muted">
          <tr><th className="pr-4 font-medium">Corrected</th><th className="pr-4 font-medium">Why</th><th className="pr-4 font-medium">Final mean before → after</th><th className="pr-4 font-medium">CV before → after</th></tr>
        </thead>
        <tbody className="num">
          {entries.map((e, i) => (
            <tr key={i} className="border-t border-rule">
              <td className="pr-4">{formatDate(e.correctedAt)}</td>
              <td className="pr-4">{e.reason}</td>
              <td className="pr-4">{kN(e.oldFigures.finalMeanN)} → {kN(e.newFigures.finalMeanN)}</td>
              <td className="pr-4">{cv(e.oldFigures.finalCv)} → {cv(e.newFigures.finalCv)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
