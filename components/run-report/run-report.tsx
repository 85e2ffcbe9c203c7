'use client';

import { useState } from 'react';
import type { FormState } from '@/lib/http/form-state';
import type { RunAnalysis } from '@/lib/analysis/types';
import { formatForce, formatPercent, formatNumber } from '@/lib/calc/units';
import type { RunCommentDto, RunHeaderDto } from '@/lib/data/run-report';
import { formatDateTime } from '@/lib/format/format-date';
import type { Role } from '@/models/user';
import { CommentPanel } from './comment-panel';
import { FIGURE_EXPLANATIONS } from './figure-explanations';
import { ReviewPanel } from './review-panel';
import { GasketStressPanel } from './gasket-stress-panel';
import { HoldPanel } from './hold-panel';
import { TensionerPanel } from './tensioner-panel';
import type { StudTransfer } from '@/lib/calc/tensioner-coverage';
import type { RunRelaxation } from '@/lib/analysis/relaxation';
import { RunCharts } from './run-charts';
import { ATTEMPT_KIND_LABEL, type AttemptKind } from '@/lib/qualification/attempt-kind';
import { PrintHeader, PrintSignature } from '@/components/ui/print-signature';

const TOOL_LABELS: Record<string, string> = {
  manual_torque_wrench: 'Manual torque wrench',
  hydraulic_torque_wrench: 'Hydraulic torque wrench',
  hydraulic_tensioner: 'Hydraulic tensioner',
  other: 'Other tool',
};
const STATUS_LABELS: Record<string, string> = { draft: 'Draft', recording: 'Recording', complete: 'Complete', set_aside: 'Set aside', needs_review: 'Needs review' };

interface Props {
  header: RunHeaderDto;
  analysis: RunAnalysis;
  comments: RunCommentDto[];
  units: 'si' | 'us';
  role: Role;
  /** How the run came in and whether it counts as an assessed attempt. */
  attempt: { kind: AttemptKind; sourceLine: string };
  commentAction: ((state: FormState, formData: FormData) => Promise<FormState>) | null;
  /** Confirm a run held for review; null for those who may not decide. */
  reviewAction: ((state: FormState, formData: FormData) => Promise<FormState>) | null;
  /** The one set-aside action, shown on the needs-review panel while the run is held; null otherwise. */
  setAsideAction: ((state: FormState, formData: FormData) => Promise<FormState>) | null;
  relaxation: RunRelaxation;
  holdAction: ((state: FormState, formData: FormData) => Promise<FormState>) | null;
  /** A tensioner run's applied and residual load per stud (empty for other tools). */
  transfers: StudTransfer[];
  /** When the page was made, for the printed header: taken on the server, so hydration sees the same text. */
  printedOn: string;
}

export function RunReport({ header, analysis, comments, units: preferredUnits, role, attempt, commentAction, reviewAction, setAsideAction, relaxation, holdAction, transfers, printedOn }: Props) {
  const [units, setUnits] = useState(preferredUnits);
  const f = analysis.figures;
  const target = header.targetLoadN;
  const force = (n: number) => formatForce(n, units);
  const pct = (p: number) => formatPercent(p);
  const showHints = role === 'trainee';
  const figures = [
    { key: 'mean', label: 'Mean final load', value: force(f.meanN), hint: FIGURE_EXPLANATIONS.mean },
    { key: 'sd', label: 'SD', value: force(f.sdN), hint: FIGURE_EXPLANATIONS.sd },
    { key: 'cv', label: role === 'trainee' ? 'Evenness (CV)' : 'CV', value: pct(f.cv * 100), hint: FIGURE_EXPLANATIONS.cv },
    { key: 'rangeOverMean', label: 'Range / mean', value: pct(f.rangeOverMean * 100), hint: FIGURE_EXPLANATIONS.rangeOverMean },
    { key: 'largestDeviation', label: 'Largest deviation from target', value: pct(f.largestDeviationPercent), hint: FIGURE_EXPLANATIONS.largestDeviation },
    { key: 'shareWithinBand', label: `Studs within ±${formatNumber(header.bandPercent, 2)} %`, value: pct(f.shareWithinBand * 100), hint: FIGURE_EXPLANATIONS.shareWithinBand },
    { key: 'cp', label: 'Cp', value: f.cp === null ? '—' : formatNumber(f.cp, 3), hint: FIGURE_EXPLANATIONS.cp },
    { key: 'cpk', label: 'Cpk', value: f.cpk === null ? '—' : formatNumber(f.cpk, 3), hint: FIGURE_EXPLANATIONS.cpk },
  ];

  return (
    <article className="print-sheet space-y-6" aria-labelledby="run-title">
      <PrintHeader title={`Run report ${header.id}`} printedOn={printedOn} />
      <header className="space-y-3">
        <div className="flex flex-wrap items-start gap-3">
          <div>
            <p className="text-sm text-muted">Run {header.id} · {formatDateTime(header.recordedAt)}</p>
            <h1 id="run-title" className="text-2xl font-semibold">{header.method.name}</h1>
          </div>
          <div className="no-print ml-auto flex flex-wrap items-center gap-2">
            <fieldset className="flex rounded-md border border-rule text-sm" aria-label="Units">
              {(['si', 'us'] as const).map((u) => (
                <label key={u} className={`cursor-pointer px-3 py-1.5 ${units === u ? 'bg-ink text-paper' : ''}`}>
                  <input type="radio" name="units" value={u} checked={units === u} onChange={() => setUnits(u)} className="sr-only" />
                  {u === 'si' ? 'SI (kN)' : 'US (lbf)'}
                </label>
              ))}
            </fieldset>
            <a href={`/api/runs/${header.id}/export?format=csv&units=${units}`} className="rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60" download>
              Export CSV
            </a>
            <button type="button" onClick={() => window.print()} className="rounded-md bg-accent px-3 py-1.5 text-sm text-accent-ink">Print sheet</button>
          </div>
        </div>
        {header.status === 'set_aside' ? (
          <p role="note" className="rounded-md border border-caution/60 bg-panel p-3 text-sm">
            <strong>Set aside:</strong> {header.setAsideReason ?? 'no reason given'}. This run is kept but left out of statistics.
          </p>
        ) : null}
        {header.review ? <ReviewPanel review={header.review} status={header.status} action={reviewAction} setAsideAction={setAsideAction} /> : null}
        <dl className="grid gap-x-6 gap-y-2 rounded-card border border-rule bg-panel p-4 text-sm sm:grid-cols-2 lg:grid-cols-4">
          <Item term="Joint" value={`${header.joint.name}`} detail={`${header.studCount} studs · ${header.joint.thread} · ${header.joint.studGrade} · ${header.joint.gasketType}${header.joint.versionNumber === null ? '' : ` · as recorded (version ${header.joint.versionNumber})`}`} />
          <Item term="Method" value={TOOL_LABELS[header.method.toolKind] ?? header.method.toolKind} detail={`Passes at ${header.method.passPercents.map((p) => `${p} %`).join(', ')}`} />
          <Item term="Lubricant" value={header.lubricant.name} detail={`Nominal nut factor K = ${formatNumber(header.lubricant.nominalNutFactor, 2)}${header.hardware.lotCode ? ` · lot ${header.hardware.lotCode}` : ''}`} />
          {header.hardware.setName || header.hardware.gasketCondition ? (
            <Item term="Hardware" value={header.hardware.setName ?? 'Not recorded'}
              detail={[header.hardware.useNumber === null ? null : `use ${header.hardware.useNumber} of the set`, header.hardware.gasketCondition ? `${header.hardware.gasketCondition} gasket` : null].filter(Boolean).join(' · ')} />
          ) : null}
          <Item term="Operator" value={header.operator.label} detail={header.cohort ? header.cohort.name : 'No cohort'} />
          <Item term="Target load" value={force(target)} detail={`Band ±${formatNumber(header.bandPercent, 2)} %: ${force(target * (1 - header.bandPercent / 100))} to ${force(target * (1 + header.bandPercent / 100))}`} />
          <Item term="Source" value={attempt.sourceLine} detail={`${ATTEMPT_KIND_LABEL[attempt.kind]} · Status: ${STATUS_LABELS[header.status] ?? header.status}`} />
          <Item term="Steps" value={String(analysis.steps.length)} detail={`${analysis.passes.length} passes`} />
          {header.notes ? <Item term="Notes" value={header.notes} /> : null}
        </dl>
      </header>

      <section aria-labelledby="figures-heading">
        <h2 id="figures-heading" className="text-lg font-semibold">{role === 'trainee' ? 'How even were your final loads?' : 'The figures'}</h2>
        <dl className="mt-2 grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          {figures.map((figure) => (
            <div key={figure.key} className="rounded-card border border-rule bg-panel p-3" title={figure.hint}>
              <dt className="text-sm text-muted">{figure.label}</dt>
              <dd className="num text-xl font-semibold">{figure.value}</dd>
              {showHints ? <dd className="mt-1 text-xs text-muted">{figure.hint}</dd> : null}
            </div>
          ))}
        </dl>
      </section>

      <RunCharts analysis={analysis} units={units} />

      <section aria-labelledby="final-table-heading" className="rounded-card border border-rule bg-panel p-4">
        <h2 id="final-table-heading" className="text-lg font-semibold">Final loads by stud</h2>
        <div className="relative overflow-x-auto">
          <table className="mt-2 w-full text-sm">
            <thead className="text-left text-muted">
              <tr><th className="py-1">Position</th><th className="px-3 text-right">Final load</th><th className="px-3 text-right">% of target</th><th className="px-3 text-right">Drift since last tightened</th><th className="px-3">Band</th></tr>
            </thead>
            <tbody className="num">
              {analysis.finalLoadsN.map((load, index) => {
                const percent = (load / target) * 100;
                const inBand = Math.abs(percent - 100) <= header.bandPercent;
                const drift = analysis.drift[index];
                return (
                  <tr key={index} className="border-t border-rule">
                    <td className="py-1.5">Stud {index + 1}</td>
                    <td className="px-3 text-right">{force(load)}</td>
                    <td className="px-3 text-right">{pct(percent)}</td>
                    <td className="px-3 text-right">{drift ? pct(drift.driftPercent) : '—'}</td>
                    <td className={inBand ? 'px-3 text-good' : 'px-3 text-danger'}>{inBand ? 'inside' : percent < 100 ? 'below the band' : 'above the band'}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </section>

      {header.tensionerRule && transfers.length ? <TensionerPanel transfers={transfers} rule={header.tensionerRule} units={units} /> : null}

      <HoldPanel relaxation={relaxation} units={units} action={holdAction} />

      {header.joint.gasket ? <GasketStressPanel gasket={header.joint.gasket} passes={analysis.passes} finalLoadsN={analysis.finalLoadsN} units={units} /> : null}

      {role === 'researcher' ? null : <CommentPanel comments={comments} action={commentAction} />}
      <PrintSignature roles={['Trainee', 'Instructor']} />
    </article>
  );
}

function Item({ term, value, detail }: { term: string; value: string; detail?: string }) {
  return (
    <div>
      <dt className="text-muted">{term}</dt>
      <dd className="font-medium">{value}</dd>
      {detail ? <dd className="num text-xs text-muted">{detail}</dd> : null}
    </div>
  );
}
