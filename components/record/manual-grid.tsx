'use client';

import Link from 'next/link';
import { Fragment, useActionState, useMemo, useState } from 'react';
import { useSavedPayload } from './use-saved-payload';
import { saveManualRunAction } from '@/app/(lab)/record/actions';
import { formatForce, formatPercent } from '@/lib/calc/units';
import type { RecordJoint, RecordMethod } from '@/lib/data/record';
import { loadToN } from '@/lib/ingest/units';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import type { RecordFormState } from '@/app/(lab)/record/actions';
import { readNumber } from '@/lib/format/parse-number';
import { MANUAL_UNITS, type ManualUnit } from '@/lib/record/manual-entry-schema';
import { planSteps } from '@/lib/record/step-plan';
import { coefficientOfVariation } from '@/lib/stats/coefficient-of-variation';
import { mean } from '@/lib/stats/mean';
import { headerPayload, type HeaderErrors, type HeaderState } from './run-header-fields';
import { AppliedLoadsRow, StudsPulledInput, useTensionerPulls } from './tensioner-pulls';
import { CautionBlock } from '../caution-block';

/**
 * Enter by hand: one row per step in the method's order (the tightened stud is shown), one column
 * per stud: the loads of every stud the display shows after that step. Arrows move between cells,
 * Enter moves down, Tab moves on; a block pasted from a spreadsheet fills from the focused cell.
 * A tensioner method's step names the studs it pulled and takes their applied loads in a row
 * beneath (./tensioner-pulls.tsx); its own row holds the loads after release.
 */
export function ManualGrid({ joint, method, header, onHeaderErrors, units }: { joint: RecordJoint; method: RecordMethod; header: HeaderState; onHeaderErrors: (e: HeaderErrors) => void; units: 'si' | 'us' }) {
  const plan = useMemo(() => planSteps(method, joint.studCount), [method, joint.studCount]);
  const N = joint.studCount;
  const [unit, setUnit] = useState<ManualUnit>(units === 'us' ? 'lbf' : 'kN');
  const [cells, setCells] = useState<string[][]>(() => plan.steps.map(() => Array.from({ length: N }, () => '')));
  const [holds, setHolds] = useState('');
  const pulls = useTensionerPulls(plan.steps, N, method.toolKind === 'hydraulic_tensioner');
  const { isSaved, markSaved } = useSavedPayload();
  const [state, formAction, pending] = useActionState(async (prev: RecordFormState, formData: FormData) => {
    const result = await saveManualRunAction(prev, formData);
    if (result.status === 'ok') markSaved(formData);
    onHeaderErrors(result.fieldErrors ?? {});
    return result;
  }, IDLE_FORM_STATE);

  if (plan.problem) return <p className="text-sm text-danger">{plan.problem}</p>;

  const readings = cells.map((row) => row.map((text) => readNumber(text)));
  const values = readings.map((row) => row.map((r) => (r.kind === 'number' ? r.value : r.kind === 'empty' ? null : Number.NaN)));
  const focus = (r: number, c: number) => document.getElementById(`grid-${r}-${c}`)?.focus();

  function onKeyDown(e: React.KeyboardEvent<HTMLInputElement>, r: number, c: number) {
    const input = e.currentTarget;
    const atStart = input.selectionStart === 0 && input.selectionEnd === 0;
    const atEnd = input.selectionStart === input.value.length;
    if (e.key === 'ArrowUp' && r > 0) { e.preventDefault(); focus(r - 1, c); }
    else if ((e.key === 'ArrowDown' || (e.key === 'Enter' && !e.shiftKey)) && r < plan.steps.length - 1) { e.preventDefault(); focus(r + 1, c); }
    else if (e.key === 'Enter' && e.shiftKey && r > 0) { e.preventDefault(); focus(r - 1, c); }
    else if (e.key === 'ArrowLeft' && atStart && c > 0) { e.preventDefault(); focus(r, c - 1); }
    else if (e.key === 'ArrowRight' && atEnd && c < N - 1) { e.preventDefault(); focus(r, c + 1); }
    else if (e.key === 'Enter') e.preventDefault();
  }

  function onPaste(e: React.ClipboardEvent<HTMLInputElement>, r: number, c: number) {
    const text = e.clipboardData.getData('text/plain');
    if (!/[\t\n]/.test(text.trim())) return;
    e.preventDefault();
    const block = text.replace(/\r/g, '').replace(/\n+$/, '').split('\n').map((line) => line.split('\t'));
    setCells((old) => old.map((row, i) => row.map((v, j) => {
      const cell = block[i - r]?.[j - c];
      return i >= r && j >= c && cell !== undefined ? cell.trim() : v;
    })));
  }

  const complete = values.map((row) => row.every((v) => v !== null && Number.isFinite(v)));
  let lastComplete = -1;
  complete.forEach((ok, i) => { if (ok) lastComplete = i; });
  const rowStats = (i: number) => {
    if (!complete[i]) return null;
    const loadsN = values[i]!.map((v) => loadToN(v!, unit));
    const m = mean(loadsN);
    return { mean: m, cv: m > 0 ? coefficientOfVariation(loadsN) : null };
  };
  const latest = lastComplete >= 0 ? rowStats(lastComplete) : null;
  const payload = JSON.stringify({ header: headerPayload(header), unit, rows: cells.map((row) => row.map((text) => (text.trim() === '' ? null : text))), ...(pulls.payload ? { pulls: pulls.payload } : {}), ...(holds.trim() ? { holds } : {}) });
  const firstBad = readings.flatMap((row, i) => row.map((r, j) => ({ i, j, reason: r.kind === 'invalid' ? r.reason : null }))).find((x) => x.reason !== null);

  return (
    <form action={formAction} className="space-y-3">
      <input type="hidden" name="payload" value={payload} />
      <div className="flex flex-wrap items-end gap-4">
        <label className="text-sm">
          <span className="block font-medium">Unit on the display</span>
          <select value={unit} onChange={(e) => setUnit(e.target.value as ManualUnit)} className="mt-1 max-w-full rounded-md border border-rule bg-paper px-2 py-1.5">
            {MANUAL_UNITS.map((u) => <option key={u} value={u}>{u}</option>)}
          </select>
        </label>
        <p className="text-sm text-muted">
          {plan.steps.length} steps: {method.name} on {N} studs. After each step, type every stud&rsquo;s load (0 for a stud not yet loaded), or paste a block from a spreadsheet.
        </p>
      </div>
      {pulls.enabled ? (
        <>
          <p className="text-sm text-muted">For each step, name the studs the tool set pulled (e.g. &ldquo;1 3 5 7&rdquo;), type each one&rsquo;s load while the tool held it in the row beneath, and every stud&rsquo;s load after release in the step&rsquo;s row.</p>
          <CautionBlock variant="tensioner" />
        </>
      ) : null}
      <div aria-live="polite" className="rounded-md border border-rule bg-paper p-3 text-sm">
        {latest ? (
          <p>
            After step <span className="num">{lastComplete + 1}</span>: mean <span className="num font-medium">{formatForce(latest.mean, units)}</span>, CV{' '}
            <span className="num font-medium">{latest.cv === null ? '—' : formatPercent(latest.cv * 100)}</span> (target {formatForce(joint.targetLoadN, units)})
          </p>
        ) : <p className="text-muted">Mean and CV appear here as soon as one row is complete.</p>}
      </div>
      <div className="relative max-h-[32rem] overflow-auto rounded-md border border-rule">
        <table className="text-sm">
          <thead className="sticky top-0 z-10 bg-panel">
            <tr>
              <th className="px-2 py-1 text-left">Step</th><th className="px-2 py-1 text-left">Pass</th><th className="px-2 py-1 text-left">{pulls.enabled ? 'Studs pulled' : 'Tightened'}</th>
              {Array.from({ length: N }, (_, j) => <th key={j} scope="col" className="px-1 py-1 text-right">Stud {j + 1}</th>)}
              <th className="px-2 py-1 text-right">Mean</th><th className="px-2 py-1 text-right">CV</th>
            </tr>
          </thead>
          <tbody>
            {plan.steps.map((step, i) => {
              const s = rowStats(i);
              const pulled = pulls.enabled ? pulls.named(i) : [step.position];
              return (
                <Fragment key={step.order}>
                <tr className={`border-t border-rule ${step.pass % 2 === 0 ? 'bg-paper/60' : ''}`}>
                  <td className="num px-2 py-0.5">{step.order}</td>
                  <td className="num px-2 py-0.5">{step.pass}{step.check ? ' (check)' : ''} <span className="text-muted">{step.percentOfTarget} %</span></td>
                  <td className="num px-2 py-0.5 font-medium">{pulls.enabled ? <StudsPulledInput pulls={pulls} row={i} order={step.order} invalid={state.cell?.row === i + 1 && state.cell.column === 'Studs'} /> : step.position}</td>
                  {cells[i]!.map((v, j) => {
                    const invalid = readings[i]![j]!.kind === 'invalid' || (state.cell?.row === i + 1 && state.cell.column === `Stud ${j + 1}`);
                    return (
                      <td key={j} className={`px-0.5 py-0.5 ${pulled.includes(j + 1) ? 'bg-accent/10' : ''}`}>
                        <input id={`grid-${i}-${j}`} value={v} inputMode="decimal" autoComplete="off" aria-label={`Step ${step.order}, stud ${j + 1}, ${unit}`} aria-invalid={invalid || undefined}
                          onChange={(e) => setCells((old) => old.map((row, a) => (a === i ? row.map((x, b) => (b === j ? e.target.value : x)) : row)))}
                          onKeyDown={(e) => onKeyDown(e, i, j)} onPaste={(e) => onPaste(e, i, j)}
                          className="num w-20 rounded border border-rule bg-paper px-1 py-0.5 text-right aria-[invalid=true]:border-danger" />
                      </td>
                    );
                  })}
                  <td className="num px-2 py-0.5 text-right">{s ? formatForce(s.mean, units) : ''}</td>
                  <td className="num px-2 py-0.5 text-right">{s && s.cv !== null ? formatPercent(s.cv * 100) : ''}</td>
                </tr>
                {pulls.enabled ? <AppliedLoadsRow pulls={pulls} row={i} order={step.order} unit={unit} studCount={N} invalidColumn={state.cell?.row === i + 1 ? state.cell.column ?? null : null} /> : null}
                </Fragment>
              );
            })}
          </tbody>
        </table>
      </div>
      <label className="block text-sm">
        <span className="font-medium">Hold readings (optional)</span>
        <span className="block text-muted">After the last step, every stud&rsquo;s load at stated times, in {unit === 'lbf' ? 'lbf' : 'kN'}: a header line &ldquo;elapsed,after_pass,1,2,…,{N}&rdquo;, then one line per time, e.g. &ldquo;10 min,,80.1,79.8,…&rdquo; (the pass held after, or blank for the last).</span>
        <textarea name="holds" value={holds} onChange={(e) => setHolds(e.target.value)} rows={3} placeholder={`elapsed,after_pass,${Array.from({ length: N }, (_, j) => j + 1).join(',')}`}
          className="num mt-1 w-full rounded-md border border-rule bg-paper p-2 font-mono text-sm" />
      </label>
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" disabled={pending || lastComplete < 0 || !!firstBad || !!pulls.firstProblem || isSaved(payload)} className="rounded-md bg-accent px-4 py-2 text-sm font-medium text-accent-ink disabled:opacity-50">
          {pending ? 'Saving…' : isSaved(payload) ? 'Saved' : 'Save run'}
        </button>
        <div aria-live="polite" className="text-sm">
          {pulls.firstProblem && !firstBad ? <p className="text-danger">{pulls.firstProblem}</p> : null}
          {firstBad ? <p className="text-danger">Step {firstBad.i + 1}, stud {firstBad.j + 1}: &ldquo;{cells[firstBad.i]![firstBad.j]!.trim()}&rdquo; {firstBad.reason}. Type digits, with a point or comma for decimals (1,500 is fifteen hundred; 1,5 is one and a half).</p> : null}
          {state.message ? (
            <p className={state.status === 'ok' ? 'text-good' : 'text-danger'} role={state.status === 'ok' ? 'status' : 'alert'}>
              {state.message} {state.status === 'ok' && state.data?.runId ? <Link className="underline" href={`/runs/${state.data?.runId}`}>Open run {state.data?.runId}</Link> : null}
            </p>
          ) : null}
        </div>
      </div>
    </form>
  );
}
