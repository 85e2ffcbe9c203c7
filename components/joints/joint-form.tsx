'use client';

import Link from 'next/link';
import { useActionState, useMemo, useState } from 'react';
import { CautionBlock } from '@/components/caution-block';
import { GRADES } from '@/lib/calc/grades';
import { TARGET_PERCENT_HINT } from '@/lib/calc/preload';
import { STANDARD_THREADS } from '@/lib/calc/thread';
import { formatArea, formatForce, formatInputValue, formatPercent, formatStress, INPUT_UNIT, toInputUnit, type UnitSystem } from '@/lib/calc/units';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { FormMessage } from '../ui/form-message';
import { useFieldErrors } from '../ui/use-field-errors';
import { CUSTOM_THREAD, jointTarget, numberFromText, STUD_COUNT_RANGE, targetInputFromForm, threadChoiceOf, type TargetMode } from '@/lib/joints/joint-input';
import type { JointDetail } from '@/lib/data/joints';
import { FlangeDiagram } from './flange-diagram';
import { GasketSection } from './gasket-section';
import { LoggerLineSection } from './logger-line-section';
import { FieldMessage, INPUT_CLASS, Section, SelectField, TextField } from './form-controls';

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

interface PositionRow {
  factor: string;
  note: string;
  channel: string;
}

const PRESSURE_CLASSES = ['Class 150', 'Class 300', 'Class 600', 'Class 900', 'Class 1500', 'Class 2500'];

function initialValues(joint: JointDetail | undefined, units: UnitSystem) {
  if (!joint) {
    return {
      name: '', nominalSize: '', pressureClass: 'Class 150', studCount: '8', threadChoice: '3/4-10', threadSystem: 'inch', threadDiameter: '0.75',
      threadPitch: '10', studGrade: 'A193-B7', nutGrade: 'ASTM A194 2H', washer: '', gasketType: '', bandPercent: '10', notes: '',
      targetMode: 'percentOfYield' as TargetMode, targetLoad: '', targetPercent: '50', targetStress: '',
    };
  }
  const t = joint.thread;
  return {
    name: joint.name, nominalSize: joint.nominalSize, pressureClass: joint.pressureClass, studCount: String(joint.studCount),
    threadChoice: threadChoiceOf(t), threadSystem: t.system, threadDiameter: String(t.system === 'inch' ? t.diameterIn : t.diameterMm),
    threadPitch: String(t.system === 'inch' ? t.threadsPerInch : t.pitchMm), studGrade: joint.gradeId ?? '', nutGrade: joint.nutGrade ?? '',
    washer: joint.washer ?? '', gasketType: joint.gasketType, bandPercent: String(joint.bandPercent), notes: joint.notes ?? '',
    targetMode: 'load' as TargetMode, targetLoad: formatInputValue(toInputUnit('force', joint.targetLoadN, units)), targetPercent: '50', targetStress: '',
  };
}

/**
 * The joint form: flange and studs, target stud load (direct, % of yield or target stress, worked
 * out with lib/calc as you type), band, and the positions table with calibration factors and notes.
 * The server recomputes the target from the same inputs; what is shown here is a preview.
 */
export function JointForm({ joint, units, action }: { joint?: JointDetail; units: UnitSystem; action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  const [v, setV] = useState(() => initialValues(joint, units));
  const [rows, setRows] = useState<PositionRow[]>(() =>
    (joint?.positions ?? []).map((p) => ({ factor: String(p.calibrationFactor), note: p.note ?? '', channel: p.channel ?? '' })),
  );
  const set = (key: keyof typeof v) => (value: string) => setV((old) => ({ ...old, [key]: value }));
  // A server error leaves its field as soon as the field is edited.
  const { errors, onEdit } = useFieldErrors(state);
  const hasRuns = (joint?.runCount ?? 0) > 0;

  const studCount = numberFromText(v.studCount);
  const shownCount = Number.isInteger(studCount) && studCount >= STUD_COUNT_RANGE.min && studCount <= STUD_COUNT_RANGE.max ? studCount : 0;
  const positions = useMemo(
    () => Array.from({ length: shownCount }, (_, i) => rows[i] ?? { factor: '1', note: '', channel: '' }),
    [rows, shownCount],
  );
  const setRow = (index: number, change: Partial<PositionRow>) =>
    setRows(() => positions.map((row, i) => (i === index ? { ...row, ...change } : row)));

  const preview = jointTarget(targetInputFromForm(v, units));
  const previewErrors = preview.errors;
  const forceUnit = INPUT_UNIT.force[units];
  const stressUnit = INPUT_UNIT.stress[units];
  const fieldErrors = (key: string) => errors[key] ?? previewErrors[key];

  return (
    <form action={formAction} onChange={onEdit} noValidate className="flex flex-col gap-5" aria-label={joint ? `Edit joint ${joint.name}` : 'New joint'}>
      <input type="hidden" name="units" value={units} />
      {joint ? <input type="hidden" name="version" value={joint.version} /> : null}
      <FormMessage status={state.status} message={state.message} banner />

      <Section title="Flange and studs">
        <div className="flex flex-wrap gap-4">
          <TextField label="Joint name" name="name" value={v.name} onChange={set('name')} errors={errors.name} width="w-72" />
          <TextField label="Nominal pipe size" name="nominalSize" value={v.nominalSize} onChange={set('nominalSize')} errors={errors.nominalSize} width="w-28" hint="e.g. NPS 4 or DN 100" />
          <TextField label="Pressure class" name="pressureClass" value={v.pressureClass} onChange={set('pressureClass')} errors={errors.pressureClass} width="w-36" list="joint-pressure-classes" />
          <datalist id="joint-pressure-classes">
            {PRESSURE_CLASSES.map((c) => <option key={c} value={c} />)}
          </datalist>
        </div>
        <div className="flex flex-wrap items-start gap-6">
          <TextField
            label="Number of studs"
            name="studCount"
            value={v.studCount}
            onChange={set('studCount')}
            errors={errors.studCount}
            width="w-20"
            inputMode="numeric"
            readOnly={hasRuns}
            hint={hasRuns ? `Fixed: ${joint?.runCount} runs are recorded on these studs. Create a new joint for another stud count.` : `${STUD_COUNT_RANGE.min} to ${STUD_COUNT_RANGE.max}; cross orders need a multiple of 4.`}
          />
          <SelectField label="Stud thread" name="threadChoice" value={v.threadChoice} onChange={set('threadChoice')}>
            <optgroup label="Inch (UNC, and 8UN from 1 in)">
              {STANDARD_THREADS.filter((t) => t.spec.system === 'inch').map((t) => <option key={t.id} value={t.id}>{t.label}</option>)}
            </optgroup>
            <optgroup label="Metric coarse">
              {STANDARD_THREADS.filter((t) => t.spec.system === 'metric').map((t) => (
                <option key={t.id} value={t.id}>{t.label}</option>
              ))}
            </optgroup>
            <option value={CUSTOM_THREAD}>Other size (enter diameter and pitch)</option>
          </SelectField>
        </div>
        {v.threadChoice === CUSTOM_THREAD ? (
          <div className="flex flex-wrap items-start gap-4 rounded-card border border-rule p-3">
            <SelectField label="Thread system" name="threadSystem" value={v.threadSystem} onChange={set('threadSystem')}>
              <option value="inch">Inch (threads per inch)</option>
              <option value="metric">Metric (pitch in mm)</option>
            </SelectField>
            <TextField label="Stud diameter" name="threadDiameter" value={v.threadDiameter} onChange={set('threadDiameter')} unit={v.threadSystem === 'inch' ? 'in' : 'mm'} errors={fieldErrors('threadDiameter')} width="w-24" inputMode="decimal" />
            <TextField label={v.threadSystem === 'inch' ? 'Threads per inch' : 'Pitch'} name="threadPitch" value={v.threadPitch} onChange={set('threadPitch')} unit={v.threadSystem === 'inch' ? 'TPI' : 'mm'} errors={fieldErrors('threadPitch')} width="w-24" inputMode="decimal" hint={v.threadSystem === 'inch' ? 'Studs of 1 in and larger: 8 threads per inch (8UN).' : undefined} />
          </div>
        ) : null}
        <div className="flex flex-wrap gap-4">
          <SelectField label="Stud grade" name="studGrade" value={v.studGrade} onChange={set('studGrade')} errors={fieldErrors('studGrade')}>
            {v.studGrade === '' ? <option value="">Choose a grade (stored: {joint?.studGrade})</option> : null}
            {GRADES.map((g) => <option key={g.id} value={g.id}>{g.label}</option>)}
          </SelectField>
          <TextField label="Nut grade" name="nutGrade" value={v.nutGrade} onChange={set('nutGrade')} errors={errors.nutGrade} optional hint="ASTM A194 2H heavy hex nuts (ASME B18.2.2) are the usual nuts for B7." />
          <TextField label="Washer" name="washer" value={v.washer} onChange={set('washer')} errors={errors.washer} optional />
          <TextField label="Gasket type" name="gasketType" value={v.gasketType} onChange={set('gasketType')} errors={errors.gasketType} width="w-72" hint="e.g. spiral-wound, graphite filled, with inner ring" />
        </div>
      </Section>

      <GasketSection gasket={joint?.gasket ?? null} units={units} studCount={shownCount} errors={errors} />

      <Section title="Target stud load">
        {hasRuns ? <p className="text-sm text-muted">A new target applies to new runs only: the {joint?.runCount} runs already recorded keep the target they were recorded with.</p> : null}
        <fieldset className="flex min-w-0 flex-wrap gap-4">
          <legend className="mb-1 text-sm font-medium text-ink">Set the target as</legend>
          {([['load', 'Stud load'], ['percentOfYield', '% of yield'], ['stress', 'Stud stress']] as const).map(([value, label]) => (
            <label key={value} className="flex items-center gap-2 text-sm text-ink">
              <input type="radio" name="targetMode" value={value} checked={v.targetMode === value} onChange={() => set('targetMode')(value)} className="accent-accent" />
              {label}
            </label>
          ))}
        </fieldset>
        <div className="flex flex-wrap items-start gap-6">
          {v.targetMode === 'load' ? (
            <TextField label="Target stud load" name="targetLoad" value={v.targetLoad} onChange={set('targetLoad')} unit={forceUnit} errors={fieldErrors('targetLoad')} width="w-32" inputMode="decimal" />
          ) : null}
          {v.targetMode === 'percentOfYield' ? (
            <TextField label="Target, % of yield" name="targetPercent" value={v.targetPercent} onChange={set('targetPercent')} unit="%" errors={fieldErrors('targetPercent')} width="w-24" inputMode="decimal" hint={TARGET_PERCENT_HINT} />
          ) : null}
          {v.targetMode === 'stress' ? (
            <TextField label="Target stress (on the stress area)" name="targetStress" value={v.targetStress} onChange={set('targetStress')} unit={stressUnit} errors={fieldErrors('targetStress')} width="w-28" inputMode="decimal" />
          ) : null}
          <TextField label="Band (target ±)" name="bandPercent" value={v.bandPercent} onChange={set('bandPercent')} unit="%" errors={errors.bandPercent} width="w-20" inputMode="decimal" />
        </div>
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2 lg:grid-cols-4" aria-label="Target worked out">
          <Figure term="Tensile stress area" value={preview.thread ? formatArea(preview.thread.tensileStressAreaMm2, units) : '—'} />
          <Figure term="Minimum yield" value={preview.grade ? formatStress(preview.grade.yieldMpa, units) : '—'} />
          <Figure term="Target stud load" value={preview.target ? formatForce(preview.target.loadN, units) : '—'} testId="joint-target-load" />
          <Figure term="% of yield reached" value={preview.target ? formatPercent(preview.target.percentOfYield) : '—'} />
        </dl>
        {preview.grade ? <p className="text-xs text-muted">Yield for {preview.grade.rangeLabel}; source: {preview.grade.source}. Stress area: ASME B1.1 / ISO 898-1 formulas.</p> : null}
        <div aria-live="polite">
          {preview.warnings.length ? (
            <ul className="space-y-1 text-sm">
              {preview.warnings.map((w) => (
                <li key={w.code} className={w.severity === 'danger' ? 'text-danger' : 'text-caution'}>
                  {w.message} <span className="text-xs text-muted">({w.source})</span>
                </li>
              ))}
            </ul>
          ) : null}
        </div>
        <CautionBlock variant="joint" />
      </Section>

      <Section title="Positions" aside={<span className="text-xs text-muted">Numbered clockwise from 1 at the top</span>}>
        {shownCount === 0 ? (
          <p className="text-sm text-muted">Enter the number of studs above to list the positions.</p>
        ) : (
          <div className="flex flex-wrap items-start gap-6">
            <FlangeDiagram studCount={shownCount} />
            <div className="relative max-h-96 min-w-[min(100%,24rem)] flex-1 overflow-auto rounded border border-rule">
              <table className="w-full text-sm">
                <thead className="sticky top-0 bg-panel text-left text-muted">
                  <tr><th className="px-2 py-1.5">Position</th><th className="px-2 py-1.5">Logger channel</th><th className="px-2 py-1.5">Gauge calibration factor</th><th className="px-2 py-1.5">Note</th></tr>
                </thead>
                <tbody className="num">
                  {positions.map((row, i) => {
                    const p = i + 1;
                    const factorErr = errors[`position-${p}-factor`];
                    const noteErr = errors[`position-${p}-note`];
                    const channelErr = errors[`position-${p}-channel`];
                    return (
                      <tr key={p} className="border-t border-rule align-top">
                        <th scope="row" className="px-2 py-2.5 text-left font-medium">{p}</th>
                        <td className="px-2 py-1">
                          <input name={`position-${p}-channel`} value={row.channel} onChange={(e) => setRow(i, { channel: e.target.value })} placeholder={`CH${p}`} aria-label={`Logger channel, position ${p}`} aria-invalid={channelErr ? true : undefined} aria-describedby={`pos-${p}-msg`} className={`w-28 font-mono ${INPUT_CLASS}`} />
                        </td>
                        <td className="px-2 py-1">
                          <input name={`position-${p}-factor`} value={row.factor} onChange={(e) => setRow(i, { factor: e.target.value })} inputMode="decimal" aria-label={`Calibration factor, position ${p}`} aria-invalid={factorErr ? true : undefined} aria-describedby={`pos-${p}-msg`} className={`w-24 font-mono ${INPUT_CLASS}`} />
                        </td>
                        <td className="px-2 py-1">
                          <input name={`position-${p}-note`} value={row.note} onChange={(e) => setRow(i, { note: e.target.value })} aria-label={`Note, position ${p}`} aria-invalid={noteErr ? true : undefined} aria-describedby={`pos-${p}-msg`} className={`w-full min-w-40 ${INPUT_CLASS}`} />
                          <FieldMessage id={`pos-${p}-msg`} messages={[...(channelErr ?? []), ...(factorErr ?? []), ...(noteErr ?? [])]} />
                        </td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
            </div>
          </div>
        )}
        <p className="text-xs text-muted">The logger channel wired to each position (CH3, AI2 or a gauge&rsquo;s serial name); left blank, channel k is position k and AI0 is position 1. The factor multiplies the gauge reading (1 = as calibrated); between 0.5 and 1.5.</p>
      </Section>

      <LoggerLineSection loggerLine={joint?.loggerLine ?? null} errors={errors} />

      <Section title="Notes">
        <label className="flex flex-col gap-1 text-sm font-medium text-ink">
          <span>Notes <span className="font-normal text-muted">(optional)</span></span>
          <textarea name="notes" value={v.notes} onChange={(e) => set('notes')(e.target.value)} rows={3} className={`max-w-2xl font-normal ${INPUT_CLASS}`} aria-describedby="joint-notes-msg" />
        </label>
        <FieldMessage id="joint-notes-msg" messages={errors.notes} />
      </Section>

      <div className="flex items-center gap-3">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">
          {pending ? 'Saving…' : 'Save joint'}
        </button>
        <Link href="/joints" className="text-sm underline decoration-rule underline-offset-4">Back to the library</Link>
      </div>
    </form>
  );
}

function Figure({ term, value, testId }: { term: string; value: string; testId?: string }) {
  return (
    <div>
      <dt className="text-muted">{term}</dt>
      <dd className="num text-lg font-semibold text-ink" data-testid={testId}>{value}</dd>
    </div>
  );
}
