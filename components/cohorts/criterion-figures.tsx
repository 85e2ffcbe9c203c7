import { formatPercent } from '@/lib/calc/units';
import type { CriterionResult } from '@/lib/assessment/judge-run';

export function measuredText(result: CriterionResult): string {
  if (result.measured === null) return '—';
  if (result.unit === 'passes') return `${result.measured} of ${result.limit} passes`;
  return formatPercent(result.measured);
}

export function limitText(result: CriterionResult): string {
  if (result.unit === 'passes') return `all ${result.limit}`;
  return result.key === 'band' ? `±${result.limit}\u00a0%` : `≤ ${result.limit}\u00a0%`;
}

/** The per-criterion table of one judged run: measured, limit, met, and the reading. */
export function CriterionTable({ results, caption }: { results: CriterionResult[]; caption?: string }) {
  return (
    <div className="relative overflow-x-auto">
    <table className="w-full min-w-[30rem] text-sm">
      {caption ? <caption className="sr-only">{caption}</caption> : null}
      <thead className="text-left text-muted">
        <tr><th className="py-1">Criterion</th><th className="text-right">Measured</th><th className="text-right">Limit</th><th className="pl-3">Result</th></tr>
      </thead>
      <tbody>
        {results.map((r) => (
          <tr key={r.key} className="border-t border-rule align-top">
            <td className="py-1.5 pr-2">
              <div>{r.label}</div>
              <div className="text-xs text-muted">{r.sentence}</div>
            </td>
            <td className="num text-right">{measuredText(r)}</td>
            <td className="num text-right">{limitText(r)}</td>
            <td className={`pl-3 font-medium ${r.met ? 'text-good' : 'text-danger'}`}>{r.met ? 'Met' : 'Not met'}</td>
          </tr>
        ))}
      </tbody>
    </table>
    </div>
  );
}
