'use client';

import type { Dispatch } from 'react';
import type { CalculatorResult } from '@/lib/calc/calculate';
import { MEASURED_K_RANGE, NUT_FACTOR_SUGGESTIONS } from '@/lib/calc/nut-factors';
import { INPUT_UNIT } from '@/lib/calc/units';
import { SelectField } from '../ui/form-fields';
import { OWN_K, shownBearing, type CalculatorAction, type CalculatorState } from './calculator-state';
import { Section } from './form-parts';
import { NumberField } from './number-field';

/** Torque inputs: a nut factor for the short form; thread and nut-face friction and the bearing sizes for the long form. */
export function TorqueSection({ state, dispatch, errors }: { state: CalculatorState; dispatch: Dispatch<CalculatorAction>; errors: CalculatorResult['errors'] }) {
  const kSuggestion = NUT_FACTOR_SUGGESTIONS.find((s) => s.id === state.kChoice);
  const lengthUnit = INPUT_UNIT.length[state.units];
  const bearing = shownBearing(state);
  return (
    <Section title="Torque">
      <SelectField label="Lubricant or finish" value={state.kChoice} onChange={(choice) => dispatch({ type: 'nutFactorChoice', choice })} className="max-w-full">
        {NUT_FACTOR_SUGGESTIONS.map((s) => (
          <option key={s.id} value={s.id}>
            {s.label}: K {s.quoted}
          </option>
        ))}
        <option value={OWN_K}>My own nut factor</option>
      </SelectField>
      <NumberField
        label="Nut factor (K)"
        value={state.kText}
        onChange={(text) => dispatch({ type: 'nutFactor', text })}
        error={errors.nutFactor}
        hint={
          kSuggestion && state.kChoice !== OWN_K
            ? `${kSuggestion.label}: K ${kSuggestion.quoted}. Source: ${kSuggestion.source}.`
            : `Measured mean K across lubricants spans ${MEASURED_K_RANGE.min}–${MEASURED_K_RANGE.max} (${MEASURED_K_RANGE.source}).`
        }
      />
      <p className="text-sm text-muted">
        Long form: friction on the thread and under the nut, instead of one nut factor.
      </p>
      <div className="flex flex-wrap gap-4">
        <NumberField label="Thread friction (µ thread)" value={state.muThreadText} onChange={(text) => dispatch({ type: 'text', field: 'muThreadText', text })} error={errors.muThread} />
        <NumberField label="Nut face friction (µ bearing)" value={state.muBearingText} onChange={(text) => dispatch({ type: 'text', field: 'muBearingText', text })} error={errors.muBearing} />
      </div>
      <div className="flex flex-wrap gap-4">
        <NumberField
          label="Nut bearing diameter (across flats)"
          unit={lengthUnit}
          value={bearing.od.text}
          onChange={(text) => dispatch({ type: 'bearing', which: 'od', text })}
          error={errors.bearingOd}
        />
        <NumberField
          label="Hole diameter"
          unit={lengthUnit}
          value={bearing.hole.text}
          onChange={(text) => dispatch({ type: 'bearing', which: 'hole', text })}
          error={errors.holeDiameter}
        />
      </div>
      <p className="text-xs text-muted">
        {state.bearingAuto
          ? 'Estimated from the stud size: heavy-hex nut across flats 1.5 D + 1/8 in (ASME B18.2.2) and a hole 1/8 in over the stud (ASME B16.5, Table 7). Measure your own nut and flange where you can.'
          : 'Your own bearing values.'}{' '}
        {!state.bearingAuto ? (
          <button type="button" onClick={() => dispatch({ type: 'bearingAuto' })} className="text-accent underline underline-offset-2">
            Estimate from the stud size again
          </button>
        ) : null}
      </p>
    </Section>
  );
}
