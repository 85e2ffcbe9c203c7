'use client';

import { useActionState, useState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { FormMessage } from '../ui/form-message';
import { FieldMessage, Section, TextField } from '../joints/form-controls';
import { CalibrationGrid, emptyGrid, gridFromText, gridText, type GridRow } from './calibration-grid';

type Action = (state: FormState, form: FormData) => Promise<FormState>;

/**
 * A calibration session: the day, the load cell's certificate and the readings, typed into the grid
 * or loaded from a file in the layout shown (the file fills the grid; the server reads the same text).
 */
export function CalibrationForm({ studCount, action, today }: { studCount: number; action: Action; today: string }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  const [performedOn, setPerformedOn] = useState(today);
  const [dueOn, setDueOn] = useState('');
  const [certificate, setCertificate] = useState('');
  const [certifiedOn, setCertifiedOn] = useState('');
  const [certificateDue, setCertificateDue] = useState('');
  const [rows, setRows] = useState<GridRow[]>(() => emptyGrid(studCount));
  const [fileMessage, setFileMessage] = useState<string | null>(null);
  const errors = state.fieldErrors ?? {};

  const loadFile = async (file: File | undefined) => {
    if (!file) return;
    if (file.size > 20_000) return setFileMessage('The file is larger than a calibration table can be (20 kB).');
    const read = gridFromText(await file.text(), studCount);
    setFileMessage(read ? `Loaded ${read.length} rows from ${file.name}; check them below before saving.` : 'The file is empty.');
    if (read) setRows(read);
  };

  return (
    <form action={formAction} noValidate className="flex flex-col gap-5" aria-label="New calibration session">
      <FormMessage status={state.status} message={state.message} banner />
      <Section title="Session">
        <div className="flex flex-wrap gap-4">
          <TextField label="Day of the calibration" name="performedOn" value={performedOn} onChange={setPerformedOn} errors={errors.performedOn} width="w-36" hint="YYYY-MM-DD" />
          <TextField label="Next calibration due" name="dueOn" value={dueOn} onChange={setDueOn} errors={errors.dueOn} width="w-36" optional hint="Empty: the centre's interval after the calibration." />
        </div>
      </Section>
      <Section title="Reference load cell certificate">
        <div className="flex flex-wrap gap-4">
          <TextField label="Certificate number" name="loadCellCertificate" value={certificate} onChange={setCertificate} errors={errors.loadCellCertificate} width="w-48" />
          <TextField label="Certificate date" name="loadCellCertifiedOn" value={certifiedOn} onChange={setCertifiedOn} errors={errors.loadCellCertifiedOn} width="w-36" hint="YYYY-MM-DD" />
          <TextField label="Certificate due" name="loadCellDueOn" value={certificateDue} onChange={setCertificateDue} errors={errors.loadCellDueOn} width="w-36" hint="YYYY-MM-DD" />
        </div>
      </Section>
      <Section title="Readings">
        <p className="text-sm text-muted">
          Load the gauges at 4 to 6 levels, read every level again while unloading, and end at 0 kN (the zero return). Gauge readings are the load each gauge
          shows in kN with a calibration factor of 1.
        </p>
        <label className="flex flex-col gap-1 text-sm font-medium text-ink">
          <span>Load a file instead <span className="font-normal text-muted">(optional)</span></span>
          <input type="file" accept=".csv,.txt,text/csv,text/plain" onChange={(e) => void loadFile(e.target.files?.[0])} className="text-sm font-normal" />
        </label>
        <p className="text-xs text-muted">
          File layout: a first line <code>direction,load_cell_kN,p1,…,p{studCount}</code>, then one line per reading with <code>up</code> or <code>down</code>, the load cell in kN and
          each gauge in kN. Comma, semicolon or tab between cells.
        </p>
        <p aria-live="polite" className="text-sm text-muted">{fileMessage}</p>
        <CalibrationGrid rows={rows} studCount={studCount} onChange={setRows} />
        <input type="hidden" name="table" value={gridText(rows, studCount)} />
        <FieldMessage id="calibration-table-msg" messages={errors.table} />
      </Section>
      <div>
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">{pending ? 'Saving…' : 'Save calibration'}</button>
      </div>
    </form>
  );
}
