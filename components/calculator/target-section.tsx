'use client';

import type { Dispatch } from 'react';
import type { CalculatorResult } from '@/lib/calc/calculate';
import { TARGET_PERCENT_HINT } from '@/lib/calc/preload';
import { INPUT_UNIT } from '@/lib/calc/units';
import type { CalculatorAction, CalculatorState } from './calculator-state';
import { RadioChoice, Section } from './form-parts';
import { NumberField } from './number-field';

const TARGET_KINDS = [
  ['percentOfYield', '% of yield'],
  ['stress', 'Stud stress'],
] as const;

/** The target preload, as a share of yield or as a stud stress. */
export function TargetSection({ id, state, dispatch, errors }: { id: string; state: CalculatorState; dispatch: Dispatch<CalculatorAction>; errors: CalculatorResult['errors'] }) {
  return (
    <Section title="Target preload">
      <RadioChoice
        name={`${id}-target`}
        legend="Set the target as"
        options={TARGET_KINDS}
        value={state.targetKind}
        onChange={(targetKind) => dispatch({ type: 'choose', patch: { targetKind } })}
      />
      {state.targetKind === 'percentOfYield' ? (
        <NumberField
          label="Target, % of yield"
          unit="%"
          value={state.percentText}
          onChange={(text) => dispatch({ type: 'text', field: 'percentText', text })}
          error={errors.targetPercent}
          hint={TARGET_PERCENT_HINT}
        />
      ) : (
        <NumberField
          label="Target stud stress (on the tensile stress area)"
          unit={INPUT_UNIT.stress[state.units]}
          value={state.stress.text}
          onChange={(text) => dispatch({ type: 'quantity', field: 'stress', text })}
          error={errors.targetStress}
        />
      )}
    </Section>
  );
}
