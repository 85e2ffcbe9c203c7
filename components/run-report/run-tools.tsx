'use client';

import { useActionState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { EQUIPMENT_KIND_LABELS } from '@/lib/equipment/equipment-kinds';
import type { EquipmentItem, RunToolView } from '@/lib/data/equipment';
import { FormMessage } from '../ui/form-message';

type Action = (state: FormState, form: FormData) => Promise<FormState>;

/**
 * The tools a run was made with, each flagged when its calibration was past due on the run's day;
 * instructors and admins choose them from the register (`register` and `action` given).
 */
export function RunTools({ tools, register, action }: { tools: RunToolView[]; register: EquipmentItem[] | null; action: Action | null }) {
  const [state, formAction, pending] = useActionState(action ?? (async () => IDLE_FORM_STATE), IDLE_FORM_STATE);
  const chosen = new Set(tools.map((t) => t.id));
  return (
    <section aria-labelledby="run-tools" className="rounded-card border border-rule bg-panel p-4 text-sm">
      <h2 id="run-tools" className="font-semibold">Tools used</h2>
      {tools.length === 0 ? <p className="mt-1 text-muted">No tools are recorded for this run.</p> : (
        <ul className="mt-1 space-y-1">
          {tools.map((t) => (
            <li key={t.id}>
              {EQUIPMENT_KIND_LABELS[t.kind]}: {t.name} ({t.serialNumber}){' '}
              {t.pastDue ? <strong className="text-caution">calibration past due on the day of this run{t.dueOn ? ` (due ${t.dueOn})` : ''}</strong> : null}
            </li>
          ))}
        </ul>
      )}
      {register && action ? (
        <details className="mt-2">
          <summary className="cursor-pointer underline decoration-rule underline-offset-4">Choose the tools</summary>
          <form action={formAction} className="mt-2 flex flex-col gap-1" aria-label="Tools used">
            <FormMessage status={state.status} message={state.message} />
            {register.filter((e) => e.inService || chosen.has(e.id)).map((e) => (
              <label key={e.id} className="flex items-center gap-2">
                <input type="checkbox" name="tool" value={e.id} defaultChecked={chosen.has(e.id)} /> {EQUIPMENT_KIND_LABELS[e.kind]}: {e.name} ({e.serialNumber})
              </label>
            ))}
            <div><button type="submit" disabled={pending} className="mt-1 rounded-md border border-rule px-3 py-1.5 font-medium disabled:opacity-60">{pending ? 'Saving…' : 'Save tools'}</button></div>
          </form>
        </details>
      ) : null}
    </section>
  );
}
