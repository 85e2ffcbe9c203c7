'use client';

import { useState } from 'react';
import { BAUD_RATES, LINE_DELIMITERS, type LoggerLineFormat } from '@/lib/ingest/logger-line';
import { LOAD_UNITS } from '@/lib/ingest/units';
import { DELIMITER_LABELS, loggerLineFormValues } from '@/lib/joints/logger-line-input';
import { TRAINING_DEFAULT_SOURCE } from '@/lib/joints/gasket-input';
import { Section, SelectField, TextField } from './form-controls';

type FieldErrors = Record<string, string[] | undefined>;

/**
 * The joint form's logger line section: how the logger connected to this joint sends its live
 * lines (serial speed, delimiter, decimal separator, time field, channel fields, load unit), used by
 * "Connect logger" on Record → Stream live and by the bridge script.
 */
export function LoggerLineSection({ loggerLine, errors }: { loggerLine: LoggerLineFormat | null; errors: FieldErrors }) {
  const [v, setV] = useState(() => loggerLineFormValues(loggerLine));
  const set = (key: string) => (value: string) => setV((old) => ({ ...old, [key]: value }));
  const delimiter = LINE_DELIMITERS[v.lineDelimiter as keyof typeof LINE_DELIMITERS] ?? ',';
  const example = ['12.5', '0.0', '41.2', '38.9'].map((n) => (v.lineDecimal === 'comma' ? n.replace('.', ',') : n)).join(delimiter === '\t' ? ' ⇥ ' : delimiter);

  return (
    <Section title="Logger line (live capture)" aside={<span className="text-xs text-muted">New joints start from a {TRAINING_DEFAULT_SOURCE}.</span>}>
      <p className="text-sm text-muted">
        One line per moment: a time in seconds and one field per channel, channel 1 first, in the order of this joint&apos;s channels (the positions table
        above places each channel on its stud). For example <code className="num">{example}</code>.
      </p>
      <div className="flex flex-wrap items-start gap-4">
        <SelectField label="Baud rate" name="serialBaudRate" value={v.serialBaudRate ?? ''} onChange={set('serialBaudRate')} errors={errors.serialBaudRate}>
          {BAUD_RATES.map((b) => <option key={b} value={b}>{b}</option>)}
        </SelectField>
        <SelectField label="Fields separated by" name="lineDelimiter" value={v.lineDelimiter ?? ''} onChange={set('lineDelimiter')} errors={errors.lineDelimiter}>
          {Object.entries(DELIMITER_LABELS).map(([key, label]) => <option key={key} value={key}>{label}</option>)}
        </SelectField>
        <SelectField label="Decimal separator" name="lineDecimal" value={v.lineDecimal ?? ''} onChange={set('lineDecimal')} errors={errors.lineDecimal}>
          <option value="point">Point 12.5</option>
          <option value="comma">Comma 12,5</option>
        </SelectField>
        <SelectField label="Load unit" name="lineLoadUnit" value={v.lineLoadUnit ?? ''} onChange={set('lineLoadUnit')} errors={errors.lineLoadUnit}>
          {LOAD_UNITS.map((u) => <option key={u} value={u}>{u}</option>)}
        </SelectField>
      </div>
      <div className="flex flex-wrap items-start gap-4">
        <TextField label="Time field" name="lineTimeField" value={v.lineTimeField ?? ''} onChange={set('lineTimeField')} errors={errors.lineTimeField} width="w-20" inputMode="numeric" hint="Field number, the first is 1." />
        <TextField
          label="Channel fields"
          name="lineChannelFields"
          value={v.lineChannelFields ?? ''}
          onChange={set('lineChannelFields')}
          errors={errors.lineChannelFields}
          width="w-40"
          optional
          hint="Field numbers of channel 1, 2, … such as 2-9 or 2, 3, 5. Empty: every field after the time, one per stud."
        />
      </div>
    </Section>
  );
}
