'use client';

import { useId, type ReactNode } from 'react';
import { CONTROL_CLASS, FieldLabel } from '../ui/form-fields';

export { CONTROL_CLASS };

export interface NumberFieldProps {
  label: string;
  value: string;
  onChange: (text: string) => void;
  /** Unit shown beside the input and read as its description. */
  unit?: string;
  /** A short hint under the field. */
  hint?: ReactNode;
  /** A sentence saying what is wrong, shown beside the field. */
  error?: string;
  /** Marks the field optional in its label. */
  optional?: boolean;
  /** `inputMode` for on-screen keyboards. */
  inputMode?: 'decimal' | 'numeric';
}

/**
 * A labelled number input with its unit beside it, a hint and an error sentence. Text input (not
 * `type="number"`) so what the user typed is kept exactly and commas are accepted.
 */
export function NumberField({ label, value, onChange, unit, hint, error, optional, inputMode = 'decimal' }: NumberFieldProps) {
  const id = useId();
  const unitId = `${id}-unit`;
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [unit ? unitId : null, hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ');
  return (
    <div className="flex flex-col gap-1">
      <FieldLabel htmlFor={id} label={label} optional={optional} />
      <div className="flex items-center gap-2">
        <input
          id={id}
          type="text"
          inputMode={inputMode}
          autoComplete="off"
          spellCheck={false}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy || undefined}
          className={`num w-32 font-mono ${CONTROL_CLASS}`}
        />
        {unit ? (
          <span id={unitId} className="text-sm text-muted">
            {unit}
          </span>
        ) : null}
      </div>
      {hint ? (
        <p id={hintId} className="text-xs text-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="text-sm text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}
