'use client';

import type { PassSummary } from '@/lib/analysis/types';
import { gasketStressLevel, gasketStressSummary } from '@/lib/calc/gasket';
import { gasketLimitsSentence, LEVEL_CLASS, LEVEL_TEXT } from '@/components/gasket-stress-level';
import { formatNumber, formatStress, type UnitSystem } from '@/lib/calc/units';
import type { RunGasketDto } from '@/lib/data/run-report';
import { GASKET_STRESS_CAUTION } from '@/components/caution-block';

const positionsText = (positions: number[]) => (positions.length === 0 ? 'none' : positions.join(', '));

/**
 * Gasket stress through the run: the average after each pass and, per position, an estimate (each
 * stud's load over its share of the ring) against the gasket's seating and maximum stress.
 */
export function GasketStressPanel({ gasket, passes, finalLoadsN, units }: { gasket: RunGasketDto; passes: PassSummary[]; finalLoadsN: number[]; units: UnitSystem }) {
  const limits = { minSeatingMpa: gasket.minSeatingMpa, maxMpa: gasket.maxMpa };
  const stress = (mpa: number) => formatStress(mpa, units);
  const final = gasketStressSummary(finalLoadsN, gasket.areaMm2, limits);
  return (
    <section aria-labelledby="gasket-heading" className="rounded-card border border-rule bg-panel p-4">
      <h2 id="gasket-heading" className="text-lg font-semibold">Gasket stress</h2>
      <p className="mt-1 text-sm text-muted">
        Average = total stud load ÷ contact area. Per position: each stud&apos;s load over its share of the ring (an estimate; the flange spreads a stud&apos;s load over its neighbours).
        {gasketLimitsSentence(gasket, units)}
      </p>
      <div className="overflow-x-auto">
        <table className="mt-2 w-full text-sm">
          <thead className="text-left text-muted">
            <tr><th className="py-1">After pass</th><th className="px-3 text-right">Average</th><th className="px-3 text-right">Lowest position</th><th className="px-3 text-right">Highest position</th><th className="px-3">Below seating</th><th className="px-3">Above the maximum</th></tr>
          </thead>
          <tbody className="num">
            {passes.map((pass) => {
              const s = gasketStressSummary(pass.loadsAfterN, gasket.areaMm2, limits);
              const level = gasketStressLevel(s.averageMpa, limits);
              return (
                <tr key={pass.pass} className="border-t border-rule">
                  <td className="py-1.5">Pass {pass.pass}{pass.percentOfTarget === null ? '' : ` (${formatNumber(pass.percentOfTarget, 3)} %)`}</td>
                  <td className={`px-3 text-right ${LEVEL_CLASS[level]}`}>{stress(s.averageMpa)}</td>
                  <td className="px-3 text-right">{stress(Math.min(...s.positionsMpa))}</td>
                  <td className="px-3 text-right">{stress(Math.max(...s.positionsMpa))}</td>
                  <td className="px-3">{positionsText(s.belowSeating)}</td>
                  <td className="px-3">{positionsText(s.aboveMax)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <h3 className="mt-4 text-sm font-semibold">Final estimate by position</h3>
      <ul className="num mt-1 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-3 lg:grid-cols-4" data-testid="gasket-final-positions">
        {final.positionsMpa.map((mpa, i) => {
          const level = gasketStressLevel(mpa, limits);
          return (
            <li key={i}>
              Stud {i + 1}: {stress(mpa)} {level === 'unknown' ? null : <span className={`text-xs ${LEVEL_CLASS[level]}`}>{LEVEL_TEXT[level]}</span>}
            </li>
          );
        })}
      </ul>
      <p className="mt-3 text-xs text-muted">{GASKET_STRESS_CAUTION}</p>
    </section>
  );
}
