'use client';

import { useId, type ReactNode } from 'react';
import { CONTROL_CLASS, FieldLabel, FieldMessage, SelectField } from '../ui/form-fields';

/** Classes shared by the library's inputs: the app's one control style. */
export const INPUT_CLASS = CONTROL_CLASS;

export { FieldMessage, SelectField };

export interface TextFieldProps {
  label: string;
  name: string;
  value: string;
  onChange: (value: string) => void;
  errors?: readonly string[];
  unit?: string;
  hint?: ReactNode;
  optional?: boolean;
  readOnly?: boolean;
  width?: string;
  list?: string;
  inputMode?: 'decimal' | 'numeric' | 'text';
}

/** A labelled text input with its unit, hint and message region beside it. */
export function TextField({ label, name, value, onChange, errors, unit, hint, optional, readOnly, width = 'w-56', list, inputMode = 'text' }: TextFieldProps) {
  const id = useId();
  const invalid = Boolean(errors?.length);
  return (
    <div className="flex min-w-0 max-w-full flex-col gap-1">
      <FieldLabel htmlFor={id} label={label} optional={optional} />
      <div className="flex min-w-0 items-center gap-2">
        <input
          id={id}
          name={name}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          readOnly={readOnly}
          list={list}
          inputMode={inputMode}
          autoComplete="off"
          aria-invalid={invalid || undefined}
          aria-describedby={`${id}-msg${hint ? ` ${id}-hint` : ''}`}
          className={`${width} min-w-0 max-w-full ${inputMode !== 'text' ? 'num font-mono' : ''} ${INPUT_CLASS} read-only:bg-rule/30`}
        />
        {unit ? <span className="text-sm text-muted">{unit}</span> : null}
      </div>
      {hint ? (
        <p id={`${id}-hint`} className="text-xs text-muted">
          {hint}
        </p>
      ) : null}
      <FieldMessage id={`${id}-msg`} messages={errors} />
    </div>
  );
}

export function Section({ title, children, aside }: { title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <section className="rounded-card border border-rule bg-panel p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="font-semibold text-ink">{title}</h2>
        {aside}
      </div>
      <div className="mt-3 flex flex-col gap-4">{children}</div>
    </section>
  );
}
