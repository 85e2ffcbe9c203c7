'use client';

import { useActionState } from 'react';
import { changeRoleAction, endSessionsAction, setActiveAction } from '@/app/(lab)/people/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import type { Role } from '@/models/user';
import { FormMessage } from '../ui/form-message';

const ROLE_OPTIONS: { value: Role; label: string }[] = [
  { value: 'trainee', label: 'Trainee' },
  { value: 'instructor', label: 'Instructor' },
  { value: 'researcher', label: 'Researcher' },
  { value: 'admin', label: 'Admin' },
];

export function PersonControls({ userId, name, role, isActive, isSelf }: { userId: number; name: string; role: Role; isActive: boolean; isSelf: boolean }) {
  const [roleState, roleAction, rolePending] = useActionState(changeRoleAction.bind(null, userId), IDLE_FORM_STATE);
  const [activeState, activeAction, activePending] = useActionState(setActiveAction.bind(null, userId, !isActive), IDLE_FORM_STATE);
  const [endState, endAction, endPending] = useActionState(endSessionsAction.bind(null, userId), IDLE_FORM_STATE);
  if (isSelf) return <span className="text-xs text-muted">Your own account: another admin changes its role.</span>;
  const state = endState.message ? endState : activeState.message ? activeState : roleState;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <form action={roleAction} onSubmit={keepValuesSubmit(roleAction)} className="flex items-center gap-2">
        <label htmlFor={`role-${userId}`} className="sr-only">Role of {name}</label>
        <select id={`role-${userId}`} name="role" defaultValue={role} className="rounded-md border border-rule bg-paper px-2 py-1 text-sm text-ink">
          {ROLE_OPTIONS.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
        </select>
        <button type="submit" disabled={rolePending} className="rounded-md border border-rule px-2 py-1 text-sm hover:bg-rule/60">Change role</button>
      </form>
      <form action={activeAction} onSubmit={keepValuesSubmit(activeAction)}>
        <button type="submit" disabled={activePending} className={`rounded-md border border-rule px-2 py-1 text-sm hover:bg-rule/60 ${isActive ? 'text-danger' : ''}`}>
          {isActive ? 'Deactivate' : 'Reactivate'}
        </button>
      </form>
      {isActive ? (
        <form action={endAction}>
          <button type="submit" disabled={endPending} className="rounded-md border border-rule px-2 py-1 text-sm hover:bg-rule/60">Sign out everywhere</button>
        </form>
      ) : null}
      <FormMessage status={state.status} message={state.message} />
    </div>
  );
}
