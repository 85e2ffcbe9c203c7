'use client';

import Link from 'next/link';
import { useActionState, useState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { EQUIPMENT_KIND_LABELS, EQUIPMENT_KINDS } from '@/lib/equipment/equipment-kinds';
import type { EquipmentItem } from '@/lib/data/equipment';
import { FormMessage } from '../ui/form-message';
import { SelectField, TextField } from '../joints/form-controls';

type Action = (state: FormState, form: FormData) => Promise<FormState>;

/** One item of the equipment register (admin). */
export function EquipmentForm({ item, action }: { item: EquipmentItem | null; action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  const [kind, setKind] = useState<string>(item?.kind ?? 'torque_wrench');
  const [name, setName] = useState(item?.name ?? '');
  const [serial, setSerial] = useState(item?.serialNumber ?? '');
  const [certificate, setCertificate] = useState(item?.certificate ?? '');
  const [calibratedOn, setCalibratedOn] = useState(item?.calibratedOn ?? '');
  const [dueOn, setDueOn] = useState(item?.dueOn ?? '');
  const errors = state.fieldErrors ?? {};
  return (
    <form action={formAction} noValidate className="flex flex-col gap-4" aria-label={item ? `Edit ${item.name}` : 'New equipment'}>
      {item ? <input type="hidden" name="version" value={item.version} /> : null}
      <FormMessage status={state.status} message={state.message} />
      <div className="flex flex-wrap gap-4">
        <SelectField label="Kind" name="kind" value={kind} onChange={setKind} errors={errors.kind} className="max-w-xs">
          {EQUIPMENT_KINDS.map((k) => (
            <option key={k} value={k}>{EQUIPMENT_KIND_LABELS[k]}</option>
          ))}
        </SelectField>
        <TextField label="Name" name="name" value={name} onChange={setName} errors={errors.name} width="w-64" />
        <TextField label="Serial number" name="serialNumber" value={serial} onChange={setSerial} errors={errors.serialNumber} width="w-40" />
      </div>
      <div className="flex flex-wrap gap-4">
        <TextField label="Calibration certificate" name="certificate" value={certificate} onChange={setCertificate} errors={errors.certificate} width="w-40" optional />
        <TextField label="Calibrated on" name="calibratedOn" value={calibratedOn} onChange={setCalibratedOn} errors={errors.calibratedOn} width="w-36" optional hint="YYYY-MM-DD" />
        <TextField label="Calibration due" name="dueOn" value={dueOn} onChange={setDueOn} errors={errors.dueOn} width="w-36" optional hint="YYYY-MM-DD" />
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="inService" defaultChecked={item?.inService ?? true} /> In service
      </label>
      <div className="flex items-center gap-3">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">{pending ? 'Saving…' : 'Save'}</button>
        {item ? <Link href="/equipment" className="text-sm underline decoration-rule underline-offset-4">Back to the register</Link> : null}
      </div>
    </form>
  );
}
