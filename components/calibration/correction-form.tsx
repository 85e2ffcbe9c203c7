'use client';

import { useActionState, useState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { FormMessage } from '../ui/form-message';
import { FieldMessage, INPUT_CLASS } from '../joints/form-controls';

type Action = (state: FormState, form: FormData) => Promise<FormState>;

/** Corrects a session's table; the runs measured with it are recomputed from their kept files. */
export function CorrectionForm({ tableText, version, action }: { tableText: string; version: number; action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  const [table, setTable] = useState(tableText);
  const [reason, setReason] = useState('');
  const errors = state.fieldErrors ?? {};
  return (
    <details className="mt-2">
      <summary className="cursor-pointer text-sm underline decoration-rule underline-offset-4">Correct this session</summary>
      <form action={formAction} noValidate className="mt-2 flex flex-col gap-2" aria-label="Correct the calibration">
        <FormMessage status={state.status} message={state.message} />
        <input type="hidden" name="version" value={version} />
        <label className="flex flex-col gap-1 text-sm font-medium">
          <span>Readings (the file layout)</span>
          <textarea name="table" value={table} onChange={(e) => setTable(e.target.value)} rows={8} className={`max-w-2xl font-mono text-xs ${INPUT_CLASS}`} />
        </label>
        <FieldMessage id="correction-table-msg" messages={errors.table} />
        <label className="flex flex-col gap-1 text-sm font-medium">
          <span>Why it is corrected</span>
          <input name="reason" value={reason} onChange={(e) => setReason(e.target.value)} className={`max-w-2xl ${INPUT_CLASS}`} />
        </label>
        <FieldMessage id="correction-reason-msg" messages={errors.reason} />
        <p className="text-xs text-muted">Runs recorded with this calibration that kept their logger file are recomputed; their earlier figures are kept beside the new.</p>
        <div>
          <button type="submit" disabled={pending} className="rounded-md border border-rule px-3 py-1.5 text-sm font-medium disabled:opacity-60">{pending ? 'Correcting…' : 'Correct and recompute'}</button>
        </div>
      </form>
    </details>
  );
}
