'use client';

import { useId, useMemo, useState, type ReactNode } from 'react';
import { CautionBlock } from '@/components/caution-block';
import { computeCalculator, type CalculatorInputs, type CalculatorResult } from '@/lib/calc/calculate';
import { GRADES, type GradeId } from '@/lib/calc/grades';
import { estimateNutBearing } from '@/lib/calc/nut-bearing';
import { MEASURED_K_RANGE, NUT_FACTOR_SUGGESTIONS } from '@/lib/calc/nut-factors';
import { TARGET_PERCENT_HINT } from '@/lib/calc/preload';
import { LTF_RULES, type LtfRule } from '@/lib/calc/tensioner';
import { STANDARD_THREADS, type ThreadSpec } from '@/lib/calc/thread';
import {
  formatArea,
  formatForce,
  formatInputValue,
  formatNumber,
  formatPercent,
  formatPressure,
  formatStress,
  formatTorque,
  fromInputUnit,
  INPUT_UNIT,
  inToMm,
  toInputUnit,
  type Quantity,
  type UnitSystem,
} from '@/lib/calc/units';
import type { CalcWarning } from '@/lib/calc/warnings';
import { SelectField } from '../ui/form-fields';
import { NumberField, parseNumberText } from './number-field';

/**
 * The calculator page body: stud and grade, target preload, torque by the short and long forms,
 * and the hydraulic tensioner load, with warnings and a caution block. All arithmetic is in
 * `computeCalculator` (lib/calc/calculate.ts); this component only holds what the user typed.
 *
 * Unit-bearing fields keep both the text shown and the value in calculation units (`si`). A unit
 * switch rewrites the text from `si`, so switching back and forth never drifts; typing sets `si`
 * from the text.
 */

/** A field whose unit depends on the unit system. */
interface QuantityField {
  text: string;
  /** The value in calculation units (mm, mm², MPa); NaN when the text is not a number. */
  si: number;
}

const quantityField = (quantity: Quantity, siValue: number, units: UnitSystem): QuantityField => ({
  text: formatInputValue(toInputUnit(quantity, siValue, units)),
  si: siValue,
});
const typed = (quantity: Quantity, text: string, units: UnitSystem): QuantityField => ({
  text,
  si: fromInputUnit(quantity, parseNumberText(text), units),
});
const switched = (quantity: Quantity, field: QuantityField, units: UnitSystem): QuantityField =>
  Number.isFinite(field.si) ? quantityField(quantity, field.si, units) : field;

const CUSTOM = 'custom';
const OWN_K = 'own';
const DEFAULT_THREAD = '3/4-10';
const defaultBearing = estimateNutBearing(inToMm(0.75));

type LtfMode = LtfRule | 'custom';

export function CalculatorForm() {
  const id = useId();
  const [units, setUnits] = useState<UnitSystem>('si');
  const [threadId, setThreadId] = useState<string>(DEFAULT_THREAD);
  const [customSystem, setCustomSystem] = useState<'inch' | 'metric'>('inch');
  const [customInch, setCustomInch] = useState({ diameter: '0.75', tpi: '10' });
  const [customMetric, setCustomMetric] = useState({ diameter: '20', pitch: '2.5' });
  const [grade, setGrade] = useState<GradeId>('A193-B7');
  const [targetKind, setTargetKind] = useState<'percentOfYield' | 'stress'>('percentOfYield');
  const [percentText, setPercentText] = useState('50');
  const [stress, setStress] = useState<QuantityField>(() => quantityField('stress', 345, 'si'));
  const [kChoice, setKChoice] = useState<string>('unknown');
  const [kText, setKText] = useState('0.2');
  const [muThreadText, setMuThreadText] = useState('0.15');
  const [muBearingText, setMuBearingText] = useState('0.15');
  const [bearingAuto, setBearingAuto] = useState(true);
  const [bearingOd, setBearingOd] = useState<QuantityField>(() => quantityField('length', defaultBearing.bearingOdMm, 'si'));
  const [hole, setHole] = useState<QuantityField>(() => quantityField('length', defaultBearing.holeDiameterMm, 'si'));
  const [ltfMode, setLtfMode] = useState<LtfMode>('tens1');
  const [clamp, setClamp] = useState<QuantityField>(() => quantityField('length', inToMm(3), 'si'));
  const [ltfText, setLtfText] = useState('1.2');
  const [piston, setPiston] = useState<QuantityField>({ text: '', si: Number.NaN });

  const thread: ThreadSpec = useMemo(() => {
    if (threadId !== CUSTOM) {
      const std = STANDARD_THREADS.find((t) => t.id === threadId);
      if (std) return std.spec;
    }
    return customSystem === 'inch'
      ? { system: 'inch', diameterIn: parseNumberText(customInch.diameter), threadsPerInch: parseNumberText(customInch.tpi) }
      : { system: 'metric', diameterMm: parseNumberText(customMetric.diameter), pitchMm: parseNumberText(customMetric.pitch) };
  }, [threadId, customSystem, customInch, customMetric]);

  const diameterMm = thread.system === 'inch' ? inToMm(thread.diameterIn) : thread.diameterMm;
  // While the bearing fields follow the stud, they show the estimate for the current diameter.
  const autoBearing = bearingAuto && Number.isFinite(diameterMm) && diameterMm > 0 ? estimateNutBearing(diameterMm) : null;
  const shownBearingOd = autoBearing ? quantityField('length', autoBearing.bearingOdMm, units) : bearingOd;
  const shownHole = autoBearing ? quantityField('length', autoBearing.holeDiameterMm, units) : hole;

  const inputs: CalculatorInputs = {
    thread,
    grade,
    target:
      targetKind === 'percentOfYield'
        ? { kind: 'percentOfYield', percent: parseNumberText(percentText) }
        : { kind: 'stress', stressMpa: stress.si },
    nutFactor: parseNumberText(kText),
    longForm: {
      muThread: parseNumberText(muThreadText),
      muBearing: parseNumberText(muBearingText),
      bearingOdMm: shownBearingOd.si,
      holeDiameterMm: shownHole.si,
    },
    tensioner: {
      ltf:
        ltfMode === 'custom'
          ? { kind: 'custom', value: parseNumberText(ltfText) }
          : { kind: 'rule', rule: ltfMode, clampLengthMm: clamp.si },
      pistonAreaMm2: piston.text.trim() === '' ? null : piston.si,
    },
  };
  const result = computeCalculator(inputs);
  const errors = result.errors;

  function switchUnits(next: UnitSystem) {
    if (next === units) return;
    setStress((f) => switched('stress', f, next));
    setBearingOd((f) => switched('length', f, next));
    setHole((f) => switched('length', f, next));
    setClamp((f) => switched('length', f, next));
    setPiston((f) => switched('area', f, next));
    setUnits(next);
  }

  function chooseThread(next: string) {
    if (next === CUSTOM && threadId !== CUSTOM) {
      // Start the custom fields from the thread that was chosen.
      if (thread.system === 'inch') {
        setCustomSystem('inch');
        setCustomInch({ diameter: String(thread.diameterIn), tpi: String(thread.threadsPerInch) });
      } else {
        setCustomSystem('metric');
        setCustomMetric({ diameter: String(thread.diameterMm), pitch: String(thread.pitchMm) });
      }
    }
    setThreadId(next);
  }

  function chooseK(next: string) {
    setKChoice(next);
    const s = NUT_FACTOR_SUGGESTIONS.find((x) => x.id === next);
    if (s) setKText(String(s.k));
  }

  function editBearing(which: 'od' | 'hole', text: string) {
    // The first edit freezes both fields at what they showed, then changes the one edited.
    if (bearingAuto) {
      setBearingOd(shownBearingOd);
      setHole(shownHole);
      setBearingAuto(false);
    }
    if (which === 'od') setBearingOd(typed('length', text, units));
    else setHole(typed('length', text, units));
  }

  const kSuggestion = NUT_FACTOR_SUGGESTIONS.find((s) => s.id === kChoice);
  const lengthUnit = INPUT_UNIT.length[units];

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_24rem]">
      <form className="flex flex-col gap-6" onSubmit={(e) => e.preventDefault()} aria-label="Calculator inputs" noValidate>
        <fieldset className="flex flex-wrap gap-4">
          <legend className="mb-2 text-sm font-semibold text-ink">Units</legend>
          {(
            [
              ['si', 'SI (mm, kN, MPa, N·m)'],
              ['us', 'US customary (in, lbf, ksi, ft-lb)'],
            ] as const
          ).map(([value, label]) => (
            <label key={value} className="flex items-center gap-2 text-sm text-ink">
              <input
                type="radio"
                name={`${id}-units`}
                value={value}
                checked={units === value}
                onChange={() => switchUnits(value)}
                className="accent-accent"
              />
              {label}
            </label>
          ))}
        </fieldset>

        <Section title="Stud">
          <SelectField label="Thread" value={threadId} onChange={chooseThread} className="max-w-full">
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
            <option value={CUSTOM}>Other size (enter diameter and pitch)</option>
          </SelectField>

          {threadId === CUSTOM ? (
            <div className="flex flex-col gap-3 rounded-card border border-rule p-3">
              <fieldset className="flex gap-4">
                <legend className="mb-1 text-sm font-medium text-ink">Thread system</legend>
                {(
                  [
                    ['inch', 'Inch (threads per inch)'],
                    ['metric', 'Metric (pitch in mm)'],
                  ] as const
                ).map(([value, label]) => (
                  <label key={value} className="flex items-center gap-2 text-sm text-ink">
                    <input
                      type="radio"
                      name={`${id}-thread-system`}
                      value={value}
                      checked={customSystem === value}
                      onChange={() => setCustomSystem(value)}
                      className="accent-accent"
                    />
                    {label}
                  </label>
                ))}
              </fieldset>
              <div className="flex flex-wrap gap-4">
                {customSystem === 'inch' ? (
                  <>
                    <NumberField
                      label="Stud diameter"
                      unit="in"
                      value={customInch.diameter}
                      onChange={(v) => setCustomInch((c) => ({ ...c, diameter: v }))}
                      error={errors.diameter}
                    />
                    <NumberField
                      label="Threads per inch"
                      unit="TPI"
                      value={customInch.tpi}
                      onChange={(v) => setCustomInch((c) => ({ ...c, tpi: v }))}
                      error={errors.threadsPerInch}
                    />
                  </>
                ) : (
                  <>
                    <NumberField
                      label="Stud diameter"
                      unit="mm"
                      value={customMetric.diameter}
                      onChange={(v) => setCustomMetric((c) => ({ ...c, diameter: v }))}
                      error={errors.diameter}
                    />
                    <NumberField
                      label="Pitch"
                      unit="mm"
                      value={customMetric.pitch}
                      onChange={(v) => setCustomMetric((c) => ({ ...c, pitch: v }))}
                      error={errors.pitch}
                    />
                  </>
                )}
              </div>
            </div>
          ) : null}

          <SelectField label="Stud grade" value={grade} onChange={(v) => setGrade(v as GradeId)} errors={errors.grade} className="max-w-full">
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

        <Section title="Target preload">
          <fieldset className="flex flex-wrap gap-4">
            <legend className="mb-1 text-sm font-medium text-ink">Set the target as</legend>
            {(
              [
                ['percentOfYield', '% of yield'],
                ['stress', 'Stud stress'],
              ] as const
            ).map(([value, label]) => (
              <label key={value} className="flex items-center gap-2 text-sm text-ink">
                <input
                  type="radio"
                  name={`${id}-target`}
                  value={value}
                  checked={targetKind === value}
                  onChange={() => setTargetKind(value)}
                  className="accent-accent"
                />
                {label}
              </label>
            ))}
          </fieldset>
          {targetKind === 'percentOfYield' ? (
            <NumberField
              label="Target, % of yield"
              unit="%"
              value={percentText}
              onChange={setPercentText}
              error={errors.targetPercent}
              hint={TARGET_PERCENT_HINT}
            />
          ) : (
            <NumberField
              label="Target stud stress (on the tensile stress area)"
              unit={INPUT_UNIT.stress[units]}
              value={stress.text}
              onChange={(v) => setStress(typed('stress', v, units))}
              error={errors.targetStress}
            />
          )}
        </Section>

        <Section title="Torque">
          <SelectField label="Lubricant or finish" value={kChoice} onChange={chooseK} className="max-w-full">
            {NUT_FACTOR_SUGGESTIONS.map((s) => (
              <option key={s.id} value={s.id}>
                {s.label}: K {s.quoted}
              </option>
            ))}
            <option value={OWN_K}>My own nut factor</option>
          </SelectField>
          <NumberField
            label="Nut factor (K)"
            value={kText}
            onChange={(v) => {
              setKText(v);
              setKChoice(OWN_K);
            }}
            error={errors.nutFactor}
            hint={
              kSuggestion && kChoice !== OWN_K
                ? `${kSuggestion.label}: K ${kSuggestion.quoted}. Source: ${kSuggestion.source}.`
                : `Measured mean K across lubricants spans ${MEASURED_K_RANGE.min}–${MEASURED_K_RANGE.max} (${MEASURED_K_RANGE.source}).`
            }
          />
          <p className="text-sm text-muted">
            Long form: friction on the thread and under the nut, instead of one nut factor.
          </p>
          <div className="flex flex-wrap gap-4">
            <NumberField label="Thread friction (µ thread)" value={muThreadText} onChange={setMuThreadText} error={errors.muThread} />
            <NumberField label="Nut face friction (µ bearing)" value={muBearingText} onChange={setMuBearingText} error={errors.muBearing} />
          </div>
          <div className="flex flex-wrap gap-4">
            <NumberField
              label="Nut bearing diameter (across flats)"
              unit={lengthUnit}
              value={shownBearingOd.text}
              onChange={(v) => editBearing('od', v)}
              error={errors.bearingOd}
            />
            <NumberField
              label="Hole diameter"
              unit={lengthUnit}
              value={shownHole.text}
              onChange={(v) => editBearing('hole', v)}
              error={errors.holeDiameter}
            />
          </div>
          <p className="text-xs text-muted">
            {bearingAuto
              ? 'Estimated from the stud size: heavy-hex nut across flats 1.5 D + 1/8 in (ASME B18.2.2) and a hole 1/8 in over the stud (ASME B16.5, Table 7). Measure your own nut and flange where you can.'
              : 'Your own bearing values.'}{' '}
            {!bearingAuto ? (
              <button
                type="button"
                onClick={() => setBearingAuto(true)}
                className="text-accent underline underline-offset-2"
              >
                Estimate from the stud size again
              </button>
            ) : null}
          </p>
        </Section>

        <Section title="Hydraulic tensioner">
          <SelectField label="Load transfer factor" value={ltfMode} onChange={(v) => setLtfMode(v as LtfMode)} className="max-w-full">
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
              <NumberField label="Load transfer factor (own)" value={ltfText} onChange={setLtfText} error={errors.ltf} />
            ) : (
              <NumberField
                label="Clamped length (L)"
                unit={lengthUnit}
                value={clamp.text}
                onChange={(v) => setClamp(typed('length', v, units))}
                error={errors.clampLength}
              />
            )}
            <NumberField
              label="Tool piston area"
              optional
              unit={INPUT_UNIT.area[units]}
              value={piston.text}
              onChange={(v) => setPiston(typed('area', v, units))}
              error={errors.pistonArea}
              hint="From the tool's data sheet; gives the pump pressure."
            />
          </div>
        </Section>
      </form>

      <div className="flex flex-col gap-4 lg:sticky lg:top-4 lg:self-start">
        <Results result={result} units={units} nutFactorText={kText} />
        <CautionBlock variant="calculator" />
      </div>
    </div>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-3 rounded-card border border-rule bg-panel p-4">
      <legend className="px-1 text-base font-semibold text-ink">{title}</legend>
      {children}
    </fieldset>
  );
}

function Num({ children }: { children: ReactNode }) {
  return <span className="num whitespace-nowrap font-mono text-ink">{children}</span>;
}

function Row({ label, value, note }: { label: string; value: ReactNode; note?: ReactNode }) {
  return (
    <div className="flex flex-wrap items-baseline justify-between gap-x-4 border-b border-rule py-1.5 last:border-b-0">
      <dt className="text-sm text-muted">{label}</dt>
      <dd className="num text-right font-mono text-base text-ink">
        {value}
        {note ? <span className="block font-sans text-xs text-muted">{note}</span> : null}
      </dd>
    </div>
  );
}

const NOT_YET = <span className="font-sans text-sm text-muted">fix the inputs</span>;

function Results({ result: r, units, nutFactorText }: { result: CalculatorResult; units: UnitSystem; nutFactorText: string }) {
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
        Square brackets name the sources on the project reference sheet; ✓ means checked against a stored copy.
        Torque from a nut factor scatters widely on real joints.
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
