'use client';

import { useId, type ReactNode } from 'react';
import type { CalculatorResult } from '@/lib/calc/calculate';
import { formatArea, formatForce, formatNumber, formatPercent, formatPressure, formatStress, formatTorque, type UnitSystem } from '@/lib/calc/units';
import type { CalcWarning } from '@/lib/calc/warnings';

function Row({ label, value, note }: { label: string; value: ReactNode; note?: ReactNode }) {
  return (
    <div className="flex flex-wrap items-baseline justify-between gap-x-4 border-b border-rule py-1.5 last:border-b-0">
      <dt className="text-sm text-muted">{label}</dt>
      <dd className="num text-right font-mono text-base text-ink">
        {typeof value === 'string' ? <NoWrapParts text={value} /> : value}
        {note ? <span className="block font-sans text-xs text-muted">{note}</span> : null}
      </dd>
    </div>
  );
}

/** A value never breaks inside a number and its unit; "620 MPa · 85 %" may break only at the "·". */
function NoWrapParts({ text }: { text: string }) {
  const parts = text.split(' · ');
  return parts.map((part, i) => (
    <span key={i}>
      {i > 0 ? ' · ' : null}
      <span className="whitespace-nowrap" data-value-part="">{part}</span>
    </span>
  ));
}

const NOT_YET = <span className="font-sans text-sm text-muted">fix the inputs</span>;

/** The calculator's results beside the inputs: areas, preload, torque, tensioner load and the warnings. */
export function CalculatorResults({ result: r, units, nutFactorText }: { result: CalculatorResult; units: UnitSystem; nutFactorText: string }) {
  const titleId = useId();
  return (
    <section aria-labelledby={titleId} className="rounded-card border border-rule bg-panel p-4">
      <h2 id={titleId} className="text-lg font-semibold text-ink">
        Results
      </h2>
      <dl className="mt-2">
        <Row label="Tensile stress area" value={r.thread ? formatArea(r.thread.tensileStressAreaMm2, units) : NOT_YET} />
        <Row label="Root area" value={r.thread ? formatArea(r.thread.rootAreaMm2, units) : NOT_YET} />
        <Row label="Target preload" value={r.preload ? formatForce(r.preload.forceN, units) : NOT_YET} />
        <Row
          label="Stud stress, % of yield"
          value={
            r.preload
              ? `${formatStress(r.preload.stressMpa, units)} · ${formatPercent(r.preload.percentOfYield)}`
              : NOT_YET
          }
        />
        <Row
          label={`Torque, short form (K ${nutFactorText.trim() || '—'})`}
          value={r.shortForm ? formatTorque(r.shortForm.torqueNm, units) : NOT_YET}
        />
        <Row
          label="Torque, long form"
          value={r.longForm ? formatTorque(r.longForm.torqueNm, units) : NOT_YET}
          note={
            r.longForm
              ? `equivalent K ${formatNumber(r.longForm.equivalentNutFactor, 3)}; ${formatPercent(100 * r.longForm.pitchShare, { sig: 2 })} of it stretches the stud`
              : undefined
          }
        />
        <Row label="Load transfer factor" value={r.tensioner ? formatNumber(r.tensioner.ltf, 3) : NOT_YET} />
        <Row
          label="Tensioner applied load"
          value={r.tensioner ? `${formatForce(r.tensioner.appliedN, units)} · ${formatPercent(r.tensioner.appliedPercentOfYield)}` : NOT_YET}
          note={r.tensioner ? 'of yield, before the nut takes the load' : undefined}
        />
        <Row
          label="Tool pressure"
          value={
            r.tensioner?.pressureMpa != null ? (
              formatPressure(r.tensioner.pressureMpa, units)
            ) : (
              <span className="font-sans text-sm text-muted">enter a piston area</span>
            )
          }
        />
      </dl>
      <Warnings warnings={r.warnings} />
      <p className="mt-3 text-xs text-muted">
        Torque from a nut factor scatters widely on real joints. Targets here are for training; on plant follow the
        owner&rsquo;s procedures, local codes and qualified engineering judgement.
      </p>
    </section>
  );
}

const SEVERITY_CLASS: Record<CalcWarning['severity'], string> = {
  danger: 'border-l-danger text-danger',
  caution: 'border-l-caution text-caution',
  info: 'border-l-rule text-muted',
};
const SEVERITY_WORD: Record<CalcWarning['severity'], string> = { danger: 'Danger', caution: 'Check', info: 'Note' };

function Warnings({ warnings }: { warnings: CalcWarning[] }) {
  return (
    <div aria-live="polite" aria-label="Warnings" role="status" className="mt-3">
      {warnings.length === 0 ? (
        <p className="text-sm text-good">No warnings for these values.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {warnings.map((w) => (
            <li key={w.code} className={`border-l-4 bg-paper px-3 py-2 text-sm ${SEVERITY_CLASS[w.severity]}`}>
              <span className="font-semibold">{SEVERITY_WORD[w.severity]}: </span>
              <span className="text-ink">{w.message}</span>
              <span className="block text-xs text-muted">Source: {w.source}</span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
