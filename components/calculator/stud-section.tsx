'use client';

import type { Dispatch } from 'react';
import type { CalculatorResult } from '@/lib/calc/calculate';
import { GRADES, type GradeId } from '@/lib/calc/grades';
import { STANDARD_THREADS } from '@/lib/calc/thread';
import { formatStress } from '@/lib/calc/units';
import { SelectField } from '../ui/form-fields';
import { CUSTOM_THREAD, type CalculatorAction, type CalculatorState } from './calculator-state';
import { Num, RadioChoice, Section } from './form-parts';
import { NumberField } from './number-field';

const THREAD_SYSTEMS = [
  ['inch', 'Inch (threads per inch)'],
  ['metric', 'Metric (pitch in mm)'],
] as const;

/** Stud size (a standard thread or one's own diameter and pitch) and stud grade. */
export function StudSection({ id, state, dispatch, result }: { id: string; state: CalculatorState; dispatch: Dispatch<CalculatorAction>; result: CalculatorResult }) {
  const { errors } = result;
  const { customInch, customMetric, units } = state;
  return (
    <Section title="Stud">
      <SelectField label="Thread" value={state.threadId} onChange={(threadId) => dispatch({ type: 'thread', threadId })} className="max-w-full">
        <optgroup label="Inch (UNC, and 8UN from 1 in)">
          {STANDARD_THREADS.filter((t) => t.spec.system === 'inch').map((t) => (
            <option key={t.id} value={t.id}>
              {t.label}
            </option>
          ))}
        </optgroup>
        <optgroup label="Metric coarse">
          {STANDARD_THREADS.filter((t) => t.spec.system === 'metric').map((t) => (
            <option key={t.id} value={t.id}>
              {t.label}
            </option>
          ))}
        </optgroup>
        <option value={CUSTOM_THREAD}>Other size (enter diameter and pitch)</option>
      </SelectField>

      {state.threadId === CUSTOM_THREAD ? (
        <div className="flex flex-col gap-3 rounded-card border border-rule p-3">
          <RadioChoice
            name={`${id}-thread-system`}
            legend="Thread system"
            options={THREAD_SYSTEMS}
            value={state.customSystem}
            onChange={(customSystem) => dispatch({ type: 'choose', patch: { customSystem } })}
            className="flex gap-4"
          />
          <div className="flex flex-wrap gap-4">
            {state.customSystem === 'inch' ? (
              <>
                <NumberField label="Stud diameter" unit="in" value={customInch.diameter} onChange={(diameter) => dispatch({ type: 'customInch', patch: { diameter } })} error={errors.diameter} />
                <NumberField label="Threads per inch" unit="TPI" value={customInch.tpi} onChange={(tpi) => dispatch({ type: 'customInch', patch: { tpi } })} error={errors.threadsPerInch} />
              </>
            ) : (
              <>
                <NumberField label="Stud diameter" unit="mm" value={customMetric.diameter} onChange={(diameter) => dispatch({ type: 'customMetric', patch: { diameter } })} error={errors.diameter} />
                <NumberField label="Pitch" unit="mm" value={customMetric.pitch} onChange={(pitch) => dispatch({ type: 'customMetric', patch: { pitch } })} error={errors.pitch} />
              </>
            )}
          </div>
        </div>
      ) : null}

      <SelectField label="Stud grade" value={state.grade} onChange={(v) => dispatch({ type: 'choose', patch: { grade: v as GradeId } })} errors={errors.grade} className="max-w-full">
        {GRADES.map((g) => (
          <option key={g.id} value={g.id}>
            {g.label}
          </option>
        ))}
      </SelectField>
      {result.grade ? (
        <p className="text-sm text-muted">
          Minimum yield <Num>{formatStress(result.grade.yieldMpa, units)}</Num>, minimum tensile{' '}
          <Num>{formatStress(result.grade.tensileMpa, units)}</Num> for {result.grade.rangeLabel}
          {result.grade.native.unit !== (units === 'us' ? 'ksi' : 'MPa')
            ? ` (tabulated as ${result.grade.native.yield}/${result.grade.native.tensile} ${result.grade.native.unit} yield/tensile)`
            : ''}
          . Source: {result.grade.source}.
        </p>
      ) : null}
    </Section>
  );
}
