'use client';

import { CautionBlock } from '@/components/caution-block';
import type { CalculatorLtf, StudTransfer } from '@/lib/calc/tensioner-coverage';
import { formatForce, formatNumber, type UnitSystem } from '@/lib/calc/units';

const ltfText = (ltf: number | null) => (ltf === null ? '—' : formatNumber(ltf, 3));

/**
 * A tensioner run's load transfer: per stud, its last pull's applied load (tool pressurised), the
 * residual load the nut kept after release and the measured factor applied ÷ residual, beside the
 * factor the calculator's rule gives for this joint.
 */
export function TensionerPanel({ transfers, rule, units }: { transfers: StudTransfer[]; rule: CalculatorLtf; units: UnitSystem }) {
  const measured = transfers.flatMap((t) => (t.measuredLtf === null ? [] : [t.measuredLtf]));
  const mean = measured.length ? measured.reduce((a, b) => a + b, 0) / measured.length : null;
  return (
    <section aria-labelledby="tensioner-heading" className="space-y-3 rounded-card border border-rule bg-panel p-4">
      <h2 id="tensioner-heading" className="text-lg font-semibold">Tensioner load transfer</h2>
      <p className="text-sm text-muted">
        Each stud&apos;s last pull: the load while the tool held it (applied), the load it kept after the tool was released (residual), and the measured load transfer factor, applied ÷ residual.
        The calculator&apos;s rule for this joint, {rule.rule}, gives <span className="num font-medium text-ink" data-testid="rule-ltf">{ltfText(rule.ltf)}</span>
        {mean === null ? '.' : <>; the measured factors average <span className="num font-medium text-ink" data-testid="mean-ltf">{ltfText(mean)}</span>.</>}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <thead className="text-left text-muted">
            <tr><th className="py-1">Stud</th><th className="px-3">Pass</th><th className="px-3 text-right">Applied</th><th className="px-3 text-right">Residual</th><th className="px-3 text-right">Measured LTF</th><th className="px-3 text-right">Rule LTF</th></tr>
          </thead>
          <tbody className="num">
            {transfers.map((t) => (
              <tr key={t.position} className="border-t border-rule">
                <td className="py-1.5">{t.position}</td>
                <td className="px-3">{t.pass}</td>
                <td className="px-3 text-right">{formatForce(t.appliedN, units)}</td>
                <td className="px-3 text-right">{formatForce(t.residualN, units)}</td>
                <td className="px-3 text-right">{ltfText(t.measuredLtf)}</td>
                <td className="px-3 text-right">{ltfText(rule.ltf)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <CautionBlock variant="tensioner" />
    </section>
  );
}
