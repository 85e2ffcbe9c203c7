'use client';

import type { Dispatch } from 'react';
import type { CalculatorResult } from '@/lib/calc/calculate';
import { gasketCalculation } from '@/lib/calc/gasket';
import { formatArea, formatForce, formatStress, INPUT_UNIT } from '@/lib/calc/units';
import { parseNumberText } from '@/lib/format/parse-number';
import type { CalculatorAction, CalculatorState } from './calculator-state';
import { Num, Section } from './form-parts';
import { NumberField } from './number-field';

/**
 * Gasket stress both ways: from a target average gasket stress to the stud load that gives it, and
 * from the target preload worked out above back to the gasket stress it gives.
 */
export function GasketSection({ state, dispatch, preload }: { state: CalculatorState; dispatch: Dispatch<CalculatorAction>; preload: CalculatorResult['preload'] }) {
  const { units } = state;
  const r = gasketCalculation({
    innerMm: state.gasketInner.si,
    outerMm: state.gasketOuter.si,
    studCount: parseNumberText(state.gasketStudsText),
    targetStressMpa: state.gasketStress.si,
    preloadN: preload?.forceN ?? null,
  });
  return (
    <Section title="Gasket stress">
      <div className="flex flex-wrap gap-4">
        <NumberField label="Gasket contact inner diameter" unit={INPUT_UNIT.length[units]} value={state.gasketInner.text} onChange={(text) => dispatch({ type: 'quantity', field: 'gasketInner', text })} error={r.errors.gasketInner} />
        <NumberField label="Gasket contact outer diameter" unit={INPUT_UNIT.length[units]} value={state.gasketOuter.text} onChange={(text) => dispatch({ type: 'quantity', field: 'gasketOuter', text })} error={r.errors.gasketOuter} />
        <NumberField label="Number of studs" inputMode="numeric" value={state.gasketStudsText} onChange={(text) => dispatch({ type: 'text', field: 'gasketStudsText', text })} error={r.errors.gasketStuds} />
        <NumberField
          label="Target gasket stress (average)"
          unit={INPUT_UNIT.stress[units]}
          value={state.gasketStress.text}
          onChange={(text) => dispatch({ type: 'quantity', field: 'gasketStress', text })}
          error={r.errors.gasketStress}
          hint="From the gasket maker's data; the example starts at the seating stress of a spiral-wound gasket (training default: set your own)."
        />
      </div>
      <dl className="grid gap-2 text-sm sm:grid-cols-3" aria-label="Gasket stress worked out">
        <div>
          <dt className="text-muted">Contact area</dt>
          <dd><Num>{r.areaMm2 === undefined ? '—' : formatArea(r.areaMm2, units)}</Num></dd>
        </div>
        <div>
          <dt className="text-muted">Stud load for this gasket stress</dt>
          <dd data-testid="gasket-stud-load"><Num>{r.studLoadN === undefined ? '—' : `${formatForce(r.studLoadN, units)} each`}</Num></dd>
        </div>
        <div>
          <dt className="text-muted">Gasket stress at the target preload</dt>
          <dd data-testid="gasket-stress-at-preload"><Num>{r.stressAtPreloadMpa === undefined ? '—' : formatStress(r.stressAtPreloadMpa, units)}</Num></dd>
        </div>
      </dl>
      <p className="text-xs text-muted">
        Area of a ring: π/4 × (outer² − inner²); average gasket stress = total stud load ÷ contact area. Going past the gasket&apos;s maximum stress
        crushes it: follow the gasket maker&apos;s data, the owner&apos;s procedures and qualified engineering judgement.
      </p>
    </Section>
  );
}
