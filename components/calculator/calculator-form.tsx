'use client';

import { useId, useReducer } from 'react';
import { CautionBlock } from '@/components/caution-block';
import { computeCalculator } from '@/lib/calc/calculate';
import type { UnitSystem } from '@/lib/calc/units';
import { CalculatorResults } from './calculator-results';
import { calculatorInputs, calculatorReducer, initialCalculatorState } from './calculator-state';
import { RadioChoice } from './form-parts';
import { GasketSection } from './gasket-section';
import { StudSection } from './stud-section';
import { TargetSection } from './target-section';
import { TensionerSection } from './tensioner-section';
import { TorqueSection } from './torque-section';

/**
 * The calculator page body: stud and grade, target preload, torque by the short and long forms,
 * and the hydraulic tensioner load, with warnings and a caution block. All arithmetic is in
 * `computeCalculator` (lib/calc/calculate.ts); this component only holds what the user typed, in
 * one reducer (`calculator-state.ts`), with a component per section.
 */

const UNIT_SYSTEMS: ReadonlyArray<readonly [UnitSystem, string]> = [
  ['si', 'SI (mm, kN, MPa, N·m)'],
  ['us', 'US customary (in, lbf, ksi, ft-lb)'],
];

export function CalculatorForm() {
  const id = useId();
  const [state, dispatch] = useReducer(calculatorReducer, undefined, initialCalculatorState);
  const result = computeCalculator(calculatorInputs(state));
  const { errors } = result;

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_24rem]">
      <form className="flex min-w-0 flex-col gap-6" onSubmit={(e) => e.preventDefault()} aria-label="Calculator inputs" noValidate>
        <RadioChoice
          name={`${id}-units`}
          legend="Units"
          options={UNIT_SYSTEMS}
          value={state.units}
          onChange={(units) => dispatch({ type: 'units', units })}
          legendClassName="mb-2 text-sm font-semibold text-ink"
        />
        <StudSection id={id} state={state} dispatch={dispatch} result={result} />
        <TargetSection id={id} state={state} dispatch={dispatch} errors={errors} />
        <TorqueSection state={state} dispatch={dispatch} errors={errors} />
        <TensionerSection state={state} dispatch={dispatch} errors={errors} />
        <GasketSection state={state} dispatch={dispatch} preload={result.preload} />
      </form>

      <div className="flex min-w-0 flex-col gap-4 lg:sticky lg:top-4 lg:self-start">
        <CalculatorResults result={result} units={state.units} nutFactorText={state.kText} />
        <CautionBlock variant="calculator" />
      </div>
    </div>
  );
}
