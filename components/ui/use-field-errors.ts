'use client';

import { useState, type FormEvent } from 'react';
import type { FormState } from '@/lib/http/form-state';

/**
 * The server's field errors of a form, each dropped as soon as the person edits that field (so a
 * fixed field no longer shows the old error; the next save answers afresh). Put `onEdit` on the
 * `<form>`'s `onChange`: the edited control's `name` is the field key the errors use.
 */
export function useFieldErrors(state: FormState<unknown>) {
  const [edited, setEdited] = useState<{ state: FormState<unknown>; keys: ReadonlySet<string> }>({ state, keys: new Set() });
  const keys = edited.state === state ? edited.keys : new Set<string>();
  const errors = Object.fromEntries(Object.entries(state.fieldErrors ?? {}).filter(([key]) => !keys.has(key)));
  function onEdit(event: FormEvent<HTMLFormElement>) {
    const name = (event.target as HTMLInputElement).name;
    if (name && state.fieldErrors?.[name] && !keys.has(name)) setEdited({ state, keys: new Set([...keys, name]) });
  }
  return { errors, onEdit };
}
