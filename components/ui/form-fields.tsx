'use client';

import { useId, type ReactNode } from 'react';

/** Classes of every text input and select in the app's forms (theme tokens only). */
export const CONTROL_CLASS =
  'rounded border border-rule bg-paper px-2 py-1.5 text-ink aria-[invalid=true]:border-danger focus-visible:border-accent';

/** A field's label, with "(optional)" where it applies. */
export function FieldLabel({ htmlFor, label, optional }: { htmlFor: string; label: string; optional?: boolean }) {
  return (
    <label htmlFor={htmlFor} className="text-sm font-medium text-ink">
      {label}
      {optional ? <span className="font-normal text-muted"> (optional)</span> : null}
    </label>
  );
}

/** The message region beside a field: always present so screen readers hear new messages. */
export function FieldMessage({ id, messages }: { id: string; messages?: readonly string[] | string | null }) {
  const list = typeof messages === 'string' ? [messages] : (messages ?? []);
  return (
    <p id={id} aria-live="polite" className="text-sm text-danger">
      {list.join(' ')}
    </p>
  );
}

/** A labelled select with a hint and a message region beside it. */
export function SelectField({
  label,
  name,
  value,
  onChange,
  errors,
  children,
  hint,
  className = 'max-w-[min(28rem,100%)]',
}: {
  label: string;
  name?: string;
  value: string;
  onChange: (value: string) => void;
  errors?: readonly string[] | string;
  children: ReactNode;
  hint?: ReactNode;
  className?: string;
}) {
  const id = useId();
  const invalid = typeof errors === 'string' ? errors.length > 0 : Boolean(errors?.length);
  return (
    <div className="flex min-w-0 max-w-full flex-col gap-1">
      <FieldLabel htmlFor={id} label={label} />
      <select
        id={id}
        name={name}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={invalid || undefined}
        aria-describedby={`${id}-msg`}
        className={`${className} ${CONTROL_CLASS}`}
      >
        {children}
      </select>
      {hint ? <p className="text-xs text-muted">{hint}</p> : null}
      <FieldMessage id={`${id}-msg`} messages={errors} />
    </div>
  );
}
