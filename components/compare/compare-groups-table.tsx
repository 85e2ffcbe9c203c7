import { formatNumber, formatPercent, formatStress, type UnitSystem } from '@/lib/calc/units';
import { groupColour } from '@/lib/charts/palette';
import type { GroupSummary } from '@/lib/analysis/compare-types';

const dash = '—';
const range = (lower: number, upper: number) => `${formatNumber(lower, 2)} – ${formatNumber(upper, 2)}`;

/** The group's gasket cell: mean average gasket stress (runs with gasket data), share reaching the seating stress. */
function gasketText(gasket: GroupSummary['gasket'], units: UnitSystem): string {
  if (!gasket || gasket.meanStressMpa === null) return 'no gasket data';
  const seated = gasket.seatedShare === null ? 'no seating stress set' : `${formatPercent(gasket.seatedShare * 100)} reach seating`;
  return `${formatStress(gasket.meanStressMpa, units)} (${gasket.runsWithGasket}) · ${seated}`;
}

/** Per group: runs, run-level figures, and the variance components with their intervals. */
export function CompareGroupsTable({ groups, units = 'si' }: { groups: GroupSummary[]; units?: UnitSystem }) {
  // Saved comparisons from before relaxation was compared have no runsWithHold.
  const held = groups.some((g) => (g.runsWithHold ?? 0) > 0);
  // Saved comparisons from before gasket stress was compared have no gasket figures.
  const gasketed = groups.some((g) => (g.gasket?.runsWithGasket ?? 0) > 0);
  const methods = [...new Set(groups.flatMap((g) => (g.components ? [g.components.betweenMethod] : [])))];
  return (
    <section aria-labelledby="groups-heading" className="relative overflow-x-auto rounded-card border border-rule bg-panel p-4">
      <h2 id="groups-heading" className="text-lg font-semibold">Groups</h2>
      <table className="mt-2 w-full text-sm">
        <thead className="text-left text-muted">
          <tr>
            <th className="py-1">Group</th><th className="text-right">Runs</th><th className="text-right">Studs</th>
            <th className="text-right">Mean run, % of target</th><th className="text-right">Typical run CV</th><th className="text-right">Mean within-run SD, % of target</th>
            <th className="text-right">Stud to stud SD (95 % interval)</th><th className="text-right">Run to run SD (95 % interval)</th>
            {held ? <th className="text-right">Relaxation, % lost in the hold (runs held)</th> : null}
            {gasketed ? <th className="text-right">Gasket stress after the last pass (runs)</th> : null}
          </tr>
        </thead>
        <tbody className="num">
          {groups.map((g) => (
            <tr key={g.key} className="border-t border-rule">
              <td className="py-1.5"><span className="mr-2 inline-block h-3 w-3 rounded-full align-middle" style={{ background: groupColour(g.colourIndex) }} aria-hidden="true" />{g.label}</td>
              <td className="text-right">{g.runs}</td>
              <td className="text-right">{g.studs}</td>
              <td className="text-right">{g.meanPercent === null ? dash : formatPercent(g.meanPercent)}</td>
              <td className="text-right">{g.geometricMeanRunCv === null ? dash : formatPercent(g.geometricMeanRunCv * 100)}</td>
              <td className="text-right">{g.meanWithinSdPercent === null ? dash : formatPercent(g.meanWithinSdPercent)}</td>
              <td className="text-right">{g.components ? `${formatNumber(g.components.withinRunSd.value, 2)} (${range(g.components.withinRunSd.lower, g.components.withinRunSd.upper)})` : dash}</td>
              <td className="text-right">{g.components ? `${formatNumber(g.components.betweenRunSd.value, 2)} (${range(g.components.betweenRunSd.lower, g.components.betweenRunSd.upper)})` : dash}</td>
              {held ? <td className="text-right" data-testid="group-relaxation">{g.meanRelaxationPercent == null ? dash : `${formatPercent(g.meanRelaxationPercent)} (${g.runsWithHold})`}</td> : null}
              {gasketed ? <td className="text-right" data-testid="group-gasket">{gasketText(g.gasket, units)}</td> : null}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-muted">
        Each run counts once. Typical run CV: the geometric mean of the runs&apos; own CVs. SDs in percentage points of target. Stud to stud: the scatter
        within a run, with an exact chi-square interval. Run to run: how much run averages differ beyond that, with a {methods.length ? methods.join(' or ') : 'modified large-sample interval'}.{held ? ' Relaxation: the mean over held runs of the % of final load lost by the last hold reading after the last pass.' : ''}
        {gasketed ? ' Gasket stress: the mean over runs with gasket data of the total final stud load ÷ the gasket contact area of the joint as recorded, and the share of runs whose average reaches the joint’s minimum seating stress.' : ''}
      </p>
    </section>
  );
}
