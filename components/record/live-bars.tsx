import { formatForce, formatPercent } from '@/lib/calc/units';
import { shareWithinBand } from '@/lib/stats/share-within-band';

/**
 * The latest load of each stud as a bar, against the run's target (a line) and acceptance band
 * (shaded), with the band's limits and how many studs are inside it (lib/stats shareWithinBand, the
 * one band rule).
 */
export function LiveBars({ latest, targetLoadN, bandPercent, units }: {
  latest: ReadonlyArray<{ position: number; loadN: number }>;
  targetLoadN: number;
  bandPercent: number;
  units: 'si' | 'us';
}) {
  if (!latest.length || !(targetLoadN > 0) || !(bandPercent > 0 && bandPercent < 100)) return null;
  const band = shareWithinBand(latest.map((l) => l.loadN), targetLoadN, bandPercent);
  const scale = Math.max(band.upper * 1.15, ...latest.map((l) => l.loadN));
  const at = (n: number) => `${Math.max(0, Math.min(100, (n / scale) * 100))}%`;
  const where = (n: number) => (n < band.lower ? 'below the band' : n > band.upper ? 'above the band' : 'in the band');

  return (
    <figure className="space-y-2">
      <figcaption className="text-sm" data-testid="live-band">
        Target <span className="num font-medium">{formatForce(targetLoadN, units)}</span>, band ±{formatPercent(bandPercent)}:{' '}
        <span className="num">{formatForce(band.lower, units)}</span> to <span className="num">{formatForce(band.upper, units)}</span> ·{' '}
        <span className="num font-medium">{band.count}</span> of <span className="num">{band.n}</span> studs in the band
      </figcaption>
      <ul className="grid gap-1 sm:grid-cols-2" aria-label="Latest load of each stud">
        {latest.map((l) => (
          <li key={l.position} className="flex items-center gap-2 text-sm" aria-label={`Stud ${l.position}: ${formatForce(l.loadN, units)}, ${where(l.loadN)}`}>
            <span className="num w-14">Stud {l.position}</span>
            <span className="relative h-3 flex-1 rounded bg-rule/50">
              <span data-testid="band-shade" className="absolute inset-y-0 bg-good/25" style={{ left: at(band.lower), width: `calc(${at(band.upper)} - ${at(band.lower)})` }} />
              <span className={`absolute inset-y-0 left-0 rounded ${where(l.loadN) === 'in the band' ? 'bg-good' : 'bg-accent'}`} style={{ width: at(l.loadN) }} />
              <span data-testid="target-line" className="absolute -inset-y-0.5 w-0.5 bg-ink" style={{ left: at(targetLoadN) }} />
            </span>
            <span className="num w-24 text-right">{formatForce(l.loadN, units)}</span>
          </li>
        ))}
      </ul>
    </figure>
  );
}
