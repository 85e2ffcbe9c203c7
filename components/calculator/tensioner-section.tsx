'use client';

import type { Dispatch } from 'react';
import type { CalculatorResult } from '@/lib/calc/calculate';
import { LTF_RULES } from '@/lib/calc/tensioner';
import { INPUT_UNIT } from '@/lib/calc/units';
import { SelectField } from '../ui/form-fields';
import type { CalculatorAction, CalculatorState, LtfMode } from './calculator-state';
import { Section } from './form-parts';
import { NumberField } from './number-field';

/** Hydraulic tensioner inputs: the load transfer factor (a rule with the clamped length, or one's own) and the tool's piston area. */
export function TensionerSection({ state, dispatch, errors }: { state: CalculatorState; dispatch: Dispatch<CalculatorAction>; errors: CalculatorResult['errors'] }) {
  const { ltfMode, units } = state;
  return (
    <Section title="Hydraulic tensioner">
      <SelectField label="Load transfer factor" value={ltfMode} onChange={(v) => dispatch({ type: 'choose', patch: { ltfMode: v as LtfMode } })} className="max-w-full">
        {LTF_RULES.map((r) => (
          <option key={r.id} value={r.id}>
            {r.label}
          </option>
        ))}
        <option value="custom">My own factor</option>
      </SelectField>
      <p className="text-xs text-muted">
        {ltfMode === 'custom'
          ? 'Use the factor from the tool maker or your procedure.'
          : `D is the stud diameter, L the clamped length. Source: ${LTF_RULES.find((r) => r.id === ltfMode)?.source}.`}
      </p>
      <div className="flex flex-wrap gap-4">
        {ltfMode === 'custom' ? (
          <NumberField label="Load transfer factor (own)" value={state.ltfText} onChange={(text) => dispatch({ type: 'text', field: 'ltfText', text })} error={errors.ltf} />
        ) : (
          <NumberField
            label="Clamped length (L)"
            unit={INPUT_UNIT.length[units]}
            value={state.clamp.text}
            onChange={(text) => dispatch({ type: 'quantity', field: 'clamp', text })}
            error={errors.clampLength}
          />
        )}
        <NumberField
          label="Tool piston area"
          optional
          unit={INPUT_UNIT.area[units]}
          value={state.piston.text}
          onChange={(text) => dispatch({ type: 'quantity', field: 'piston', text })}
          error={errors.pistonArea}
          hint="From the tool's data sheet; gives the pump pressure."
        />
      </div>
      <p className="text-xs text-caution" data-testid="tensioner-caution">
        Keep clear of the tool&apos;s line of action while it is pressurised, stay within the pressure limits of the tool maker, and follow the owner&apos;s procedures.
      </p>
    </Section>
  );
}
