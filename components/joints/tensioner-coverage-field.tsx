import { CautionBlock } from '../caution-block';
import { SelectField } from './form-controls';
import { TENSIONER_COVERAGE_LABELS, TENSIONER_COVERAGES, type TensionerCoverage } from '@/lib/calc/tensioner-coverage';

/**
 * The method form's tensioner coverage: how many studs the tool set pulls at once. Shown for a
 * hydraulic tensioner only (a torque tool sends one stud per step), with the tensioner caution.
 */
export function TensionerCoverageField({ toolKind, value, onChange, errors }: { toolKind: string; value: TensionerCoverage; onChange: (value: TensionerCoverage) => void; errors?: readonly string[] }) {
  if (toolKind !== 'hydraulic_tensioner') return <input type="hidden" name="tensionerCoverage" value="one_stud" />;
  return (
    <div className="flex min-w-0 flex-col gap-3">
      <SelectField
        label="Tensioner coverage"
        name="tensionerCoverage"
        value={value}
        onChange={(v) => onChange(v as TensionerCoverage)}
        errors={errors}
        hint="How many studs the tool set pulls in one step: every stud, every second stud (the odd positions, then the even ones) or one at a time. New methods start at 100 %: training default: set your own."
      >
        {TENSIONER_COVERAGES.map((c) => <option key={c} value={c}>{TENSIONER_COVERAGE_LABELS[c]}</option>)}
      </SelectField>
      <CautionBlock variant="tensioner" />
    </div>
  );
}
