'use client';

import { useState } from 'react';
import { studLoadForGasketStress } from '@/lib/calc/gasket';
import { formatArea, formatForce, formatStress, fromInputUnit, INPUT_UNIT, type UnitSystem } from '@/lib/calc/units';
import { parseNumberText } from '@/lib/format/parse-number';
import { FLANGE_FACINGS, GASKET_TRAINING_DEFAULTS, gasketAreaOf, gasketFormValues, TRAINING_DEFAULT_SOURCE, type JointGasket } from '@/lib/joints/gasket-input';
import { Section, SelectField, TextField } from './form-controls';

type FieldErrors = Record<string, string[] | undefined>;

/** Typed text in the form's units → SI, or null when empty or unreadable. */
const si = (text: string, quantity: 'length' | 'area' | 'stress', units: UnitSystem) => {
  const n = parseNumberText(text);
  return Number.isFinite(n) && n > 0 ? fromInputUnit(quantity, n, units) : null;
};

/**
 * The joint form's gasket and flange section (its own component, so the joint form stays small):
 * contact diameters or area, seating and maximum stress with their source, facing, clamped length,
 * and a preview of the contact area and the stud load that reaches the seating stress.
 */
export function GasketSection({ gasket, units, studCount, errors }: { gasket: JointGasket | null; units: UnitSystem; studCount: number; errors: FieldErrors }) {
  const [v, setV] = useState(() => gasketFormValues(gasket, units));
  const set = (key: string) => (value: string) => setV((old) => ({ ...old, [key]: value }));
  const length = INPUT_UNIT.length[units];
  const stress = INPUT_UNIT.stress[units];
  const area = gasketAreaOf({ innerMm: si(v.gasketInner ?? '', 'length', units), outerMm: si(v.gasketOuter ?? '', 'length', units), areaMm2: si(v.gasketArea ?? '', 'area', units) });
  const seating = si(v.gasketMinSeating ?? '', 'stress', units);
  const seatingLoad = area !== null && seating !== null && studCount > 0 ? studLoadForGasketStress(seating, area, studCount) : null;
  const num = (key: string, label: string, unit: string, hint?: string) => (
    <TextField label={label} name={key} value={v[key] ?? ''} onChange={set(key)} unit={unit} errors={errors[key]} width="w-28" inputMode="decimal" optional hint={hint} />
  );

  return (
    <Section title="Gasket and flange">
      <div className="flex flex-wrap items-start gap-4">
        <SelectField label="Flange facing" name="flangeFacing" value={v.flangeFacing ?? ''} onChange={set('flangeFacing')} errors={errors.flangeFacing}>
          <option value="">Not given</option>
          {FLANGE_FACINGS.map((f) => <option key={f} value={f}>{f}</option>)}
        </SelectField>
        {num('clampLength', 'Clamped length', length, 'Nut face to nut face; the tensioner rule uses it.')}
      </div>
      <div className="flex flex-wrap items-start gap-4">
        {num('gasketInner', 'Contact inner diameter', length)}
        {num('gasketOuter', 'Contact outer diameter', length)}
        {num('gasketArea', 'or contact area', INPUT_UNIT.area[units], 'Used when the diameters are not given.')}
      </div>
      <div className="flex flex-wrap items-start gap-4">
        {num('gasketMinSeating', 'Minimum seating stress', stress)}
        {num('gasketMax', 'Maximum stress', stress)}
        <TextField
          label="Source of these stresses"
          name="gasketStressSource"
          value={v.gasketStressSource ?? ''}
          onChange={set('gasketStressSource')}
          errors={errors.gasketStressSource}
          width="w-72"
          optional
          hint={`The gasket maker's data sheet or your procedure. The form starts from ${formatStress(GASKET_TRAINING_DEFAULTS.minSeatingMpa, units)} and ${formatStress(GASKET_TRAINING_DEFAULTS.maxMpa, units)} (${TRAINING_DEFAULT_SOURCE}).`}
        />
      </div>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2" aria-label="Gasket worked out">
        <div>
          <dt className="text-muted">Contact area</dt>
          <dd className="num text-lg font-semibold text-ink">{area === null ? '—' : formatArea(area, units)}</dd>
        </div>
        <div>
          <dt className="text-muted">Stud load for the seating stress</dt>
          <dd className="num text-lg font-semibold text-ink" data-testid="gasket-seating-load">{seatingLoad === null ? '—' : formatForce(seatingLoad, units)}</dd>
        </div>
      </dl>
      <p className="text-xs text-muted">
        Area of a ring: π/4 × (outer² − inner²); gasket stress = total stud load ÷ contact area. Going past the gasket&apos;s maximum stress crushes it:
        follow the gasket maker&apos;s data, the owner&apos;s procedures and qualified engineering judgement.
      </p>
    </Section>
  );
}
