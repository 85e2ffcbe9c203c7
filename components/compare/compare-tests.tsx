import { formatNumber } from '@/lib/calc/units';
import type { ComparisonResult, ComparisonTest, EffectSize, PairComparison } from '@/lib/analysis/compare-types';

const formatP = (p: number) => (p < 0.001 ? '< 0.001' : formatNumber(p, 2));

function effectText(e: EffectSize): string {
  const unit = e.scale === 'ratio' ? '×' : ' points';
  return `${e.label}: ${formatNumber(e.estimate, 2)}${unit} (95 % interval ${formatNumber(e.lower, 2)} to ${formatNumber(e.upper, 2)}${unit})`;
}

function TestItem({ test }: { test: ComparisonTest }) {
  return (
    <li className="rounded-md border border-rule bg-paper p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2 text-xs text-muted">
        <span>{test.question}</span>
        <span className={`rounded-full border px-2 ${test.planned ? 'border-accent font-semibold' : 'border-rule'}`}>{test.planned ? 'Planned' : 'Exploratory'}</span>
      </div>
      <p className="font-medium">{test.reading}</p>
      {test.effect ? <p className="num mt-1 text-sm">{effectText(test.effect)}</p> : null}
      <p className="num mt-1 text-xs text-muted">p {formatP(test.pValue)}; Holm-adjusted p {formatP(test.adjustedPValue)}</p>
    </li>
  );
}

function PairsTable({ title, pairs }: { title: string; pairs: PairComparison[] }) {
  if (!pairs.length) return null;
  return (
    <div className="relative overflow-x-auto">
      <h3 className="font-medium">{title}</h3>
      <table className="mt-1 w-full text-sm">
        <thead className="text-left text-muted"><tr><th className="py-1">Pair</th><th className="text-right">Run CV ratio</th><th className="text-right">95 % interval</th><th className="text-right">Adjusted p</th></tr></thead>
        <tbody className="num">
          {pairs.map((p) => (
            <tr key={`${p.a}-${p.b}`} className="border-t border-rule">
              <td className="py-1.5">{p.a} ÷ {p.b}</td>
              <td className="text-right">{formatNumber(p.ratio, 2)}×</td>
              <td className="text-right">{formatNumber(p.lower, 2)} to {formatNumber(p.upper, 2)}</td>
              <td className={`text-right ${p.pValue < 0.05 ? 'font-semibold' : ''}`}>{formatP(p.pValue)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The tests with their effects (planned first), the pairs on run CV, and the operators-as-blocks estimates. */
export function CompareTests({ data }: { data: Pick<ComparisonResult, 'tests' | 'pairs' | 'traineeBlocks'> }) {
  const blocks = data.traineeBlocks;
  return (
    <section aria-labelledby="tests-heading" className="space-y-4 rounded-card border border-rule bg-panel p-4">
      <h2 id="tests-heading" className="text-lg font-semibold">Is the difference real?</h2>
      {data.tests.length === 0 ? <p className="text-sm text-muted">No test could run on these groups; see the notes above.</p> : null}
      <ul className="space-y-3">{data.tests.map((t) => <TestItem key={t.id} test={t} />)}</ul>
      <p className="text-xs text-muted">
        Every test takes one value per run, so runs, not studs, are counted. Run CV is compared on its logarithm, so differences read as ratios. Holm&apos;s correction
        adjusts the p-values for running these tests together.
      </p>
      <div className="grid gap-4 xl:grid-cols-2">
        <PairsTable title="Pairs, unequal variances (Games–Howell, 95 % family-wise)" pairs={data.pairs.gamesHowell} />
        <PairsTable title="Pairs, equal variances (Tukey–Kramer, 95 % family-wise)" pairs={data.pairs.tukeyKramer} />
      </div>
      {blocks ? (
        <div className="relative overflow-x-auto">
          <h3 className="font-medium">Operators as blocks</h3>
          <table className="mt-1 w-full text-sm">
            <thead className="text-left text-muted"><tr><th className="py-1">Group</th><th className="text-right">Run CV relative to {blocks.estimates[0]?.label}</th><th className="text-right">95 % interval</th></tr></thead>
            <tbody className="num">
              {blocks.estimates.map((e, i) => (
                <tr key={e.key} className="border-t border-rule"><td className="py-1.5">{e.label}</td><td className="text-right">{formatNumber(e.ratio, 2)}×</td><td className="text-right">{i === 0 ? 'reference' : `${formatNumber(e.lower, 2)} to ${formatNumber(e.upper, 2)}`}</td></tr>
              ))}
              {blocks.perAttempt ? (
                <tr className="border-t border-rule"><td className="py-1.5">Each further attempt</td><td className="text-right">{formatNumber(blocks.perAttempt.value, 3)}×</td><td className="text-right">{formatNumber(blocks.perAttempt.lower, 3)} to {formatNumber(blocks.perAttempt.upper, 3)}</td></tr>
              ) : null}
            </tbody>
          </table>
          <p className="mt-1 text-xs text-muted">
            A mixed model of ln run CV with each operator&apos;s own level as a random block ({blocks.operators} operators, {blocks.runs} runs), so an operator&apos;s skill is not
            counted as an effect of the group. The test compares the fits with and without the groups; the intervals are Wald intervals.
          </p>
        </div>
      ) : null}
    </section>
  );
}
