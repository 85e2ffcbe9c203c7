'use client';

import { useMemo, useState } from 'react';
import { formatDecimals, formatNumber } from '@/lib/calc/units';
import type { Planner } from '@/lib/analysis/compare-types';
import { runsPerGroupForCvRatio } from '@/lib/stats/runs-per-group-for-cv-ratio';

/** The planner in words: runs per group needed to tell a chosen CV ratio apart, from this selection's own scatter of ln run CV. */
export function ComparePlanner({ planner }: { planner: Planner | null }) {
  const [ratio, setRatio] = useState(1.5);
  const plan = useMemo(() => {
    if (!planner || !(ratio > 1)) return null;
    try {
      return runsPerGroupForCvRatio({ ratio, sdLogCv: planner.sdLogCv, alpha: 0.05, power: 0.8 });
    } catch {
      return null;
    }
  }, [planner, ratio]);
  return (
    <section aria-labelledby="planner-heading" className="rounded-card border border-rule bg-panel p-4">
      <h2 id="planner-heading" className="text-lg font-semibold">How many runs to plan</h2>
      {planner ? (
        <>
          <label className="mt-2 block text-sm" htmlFor="planner-ratio">
            <span className="text-muted">Difference in run CV to tell apart (×)</span>
            <input id="planner-ratio" type="number" min={1.05} max={5} step={0.05} value={ratio} onChange={(e) => setRatio(Number(e.target.value))} className="ml-2 w-20 rounded-md border border-rule bg-paper px-2 py-1" />
          </label>
          <p className="mt-2 font-medium" data-testid="planner-sentence">
            {plan
              ? `To tell a ${formatDecimals(ratio, 2, 0)}× difference in CV apart, plan about ${plan.perGroup} runs per group.`
              : 'Choose a difference above 1× to see how many runs it needs.'}
          </p>
          <p className="mt-1 text-xs text-muted">
            From the scatter of run CVs in this selection (SD of ln run CV {formatNumber(planner.sdLogCv, 3)}, pooled within groups over {planner.df} degrees of freedom), for a two-sided test at the 5 % level with 80 % power.
          </p>
        </>
      ) : (
        <p className="mt-2 text-sm text-muted">At least one group with two runs is needed to estimate how much run CVs scatter.</p>
      )}
    </section>
  );
}
